import { describe, expect, it } from 'vitest';
import { checkOrder } from '../../core/evaluate.ts';
import { DEFAULT_CATALOG, DEFAULT_POLICY, DEMO_ORDERS } from '../../defaults.ts';
import { docFromFile, newOrderDoc, toOrderFile } from './draft.ts';

describe('the order document', () => {
  it('holds every value as the text typed, and gives the engine the same order back', () => {
    for (const demo of DEMO_ORDERS) {
      const doc = docFromFile(demo.file);
      if (!doc.ok) throw new Error(demo.key);
      expect(typeof doc.value.order.patient.weightKg).toBe('string');
      const direct = checkOrder(demo.file, DEFAULT_CATALOG, DEFAULT_POLICY);
      const viaDoc = checkOrder(toOrderFile(doc.value.order), DEFAULT_CATALOG, DEFAULT_POLICY);
      if (!direct.ok || !viaDoc.ok) throw new Error(`${demo.key} did not check`);
      expect(viaDoc.value.report).toEqual(direct.value.report);
    }
  });

  it('keeps "9.3" as typed (no binary float on the way)', () => {
    const doc = docFromFile({ id: 'A', patient: { id: 'P', weightKg: '1.1', ageGroup: 'preterm-neonate' }, route: 'central', lines: [{ product: 'x', amount: '0.1', unit: 'mL' }] });
    if (!doc.ok) throw new Error('not opened');
    expect(doc.value.order.lines[0]?.amount).toBe('0.1');
    expect(toOrderFile(doc.value.order)).toMatchObject({ patient: { weightKg: '1.1' }, lines: [{ amount: '0.1' }] });
  });

  it('leaves empty text out, so the engine says what is required', () => {
    const r = checkOrder(toOrderFile(newOrderDoc().order), DEFAULT_CATALOG, DEFAULT_POLICY);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    const paths = r.problems.map((p) => p.path);
    expect(paths).toEqual(expect.arrayContaining(['id', 'patient.id', 'patient.weightKg']));
    expect(r.problems.find((p) => p.path === 'patient.weightKg')?.message).toMatch(/^is required/);
  });

  it('carries fields it does not edit (an ion block) through unchanged', () => {
    const ions = { per: 'day', Na: 100 };
    const doc = docFromFile({ id: 'A', patient: { id: 'P', weightKg: 70, ageGroup: 'adult' }, route: 'central', lines: [], ions });
    if (!doc.ok) throw new Error('not opened');
    expect(toOrderFile(doc.value.order).ions).toEqual(ions);
  });

  it('refuses a batch or a non-object with a path: message problem', () => {
    expect(docFromFile([{}, {}])).toEqual({ ok: false, problems: [{ path: '(file)', message: 'holds 2 orders; open one order at a time (the command line checks batches)' }] });
    expect(docFromFile('text')).toMatchObject({ ok: false, problems: [{ path: '(file)' }] });
    expect(docFromFile({ format: 'osmocount-catalog' })).toMatchObject({ ok: false, problems: [{ path: 'format' }] });
  });
});
