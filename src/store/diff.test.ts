import { describe, expect, it } from 'vitest';
import { DEMO_ORDERS } from '../defaults.ts';
import { diffOrders, historyOf } from './diff.ts';
import type { JsonObject, OrderVersion } from './types.ts';

const base = () => structuredClone(DEMO_ORDERS[0]!.file) as JsonObject;
const lines = (f: JsonObject) => f.lines as JsonObject[];

describe('diffOrders: who changed what, from what to what', () => {
  it('finds nothing between a file and itself, nor when only the spelling of a number differs', () => {
    const a = base();
    const b = base();
    lines(b)[7]!.amount = 9.3; // "9.3" in the file
    b.volumeMl = '2000.0';
    expect(diffOrders(a, b)).toEqual([]);
  });

  it('reports the journey-2 edit: dextrose raised to 250 g and the bag made 2,560 mL', () => {
    const a = base();
    const b = base();
    lines(b)[1]!.amount = 250;
    b.volumeMl = 2560;
    expect(diffOrders(a, b)).toEqual([
      { kind: 'changed', path: 'volumeMl', field: 'Bag volume (mL)', from: '2000', to: '2560' },
      { kind: 'changed', path: 'lines[1].amount', field: 'amount', product: 'dextrose-70', lineFrom: 2, lineTo: 2, from: '150', to: '250' },
    ]);
  });

  it('matches lines by product, so a removed line does not make every later line look changed', () => {
    const a = base();
    const b = base();
    b.lines = lines(b).filter((l) => l.product !== 'potassium-chloride-2');
    lines(b).splice(2, 0, { product: 'sodium-acetate-2', amount: 20, unit: 'mEq' });
    const changes = diffOrders(a, b);
    expect(changes).toEqual([
      { kind: 'removed', path: 'lines[4]', field: 'line', product: 'potassium-chloride-2', lineFrom: 5, from: '40 mEq', to: null },
      { kind: 'added', path: 'lines[2]', field: 'line', product: 'sodium-acetate-2', lineTo: 3, from: null, to: '20 mEq' },
    ]);
  });

  it('reports header, patient and line-field changes, added and removed fields', () => {
    const a = base();
    const b = base();
    (b.patient as JsonObject).weightKg = 64;
    (b.patient as JsonObject).ageGroup = 'child';
    b.route = 'central';
    delete b.note;
    lines(b)[5]!.species = 'K';
    lines(b)[10] = { product: 'sterile-water', amount: 500, unit: 'mL' };
    b.ions = { per: 'day', Na: 100 };
    const fields = diffOrders(a, b).map((c) => [c.kind, c.path, c.from, c.to]);
    expect(fields).toEqual([
      ['changed', 'patient.weightKg', '68', '64'],
      ['changed', 'patient.ageGroup', 'adult', 'child'],
      ['changed', 'route', 'peripheral', 'central'],
      ['added', 'ions', null, '{"Na":100,"per":"day"}'],
      ['removed', 'note', 'Demo order, Marren Point Hospital (fictional). Invented figures.', null],
      ['changed', 'lines[5].species', 'phosphate', 'K'],
      ['added', 'lines[10].amount', null, '500'],
      ['added', 'lines[10].unit', null, 'mL'],
      ['removed', 'lines[10].fill', 'true', null],
    ]);
  });

  it('builds a history newest first, each version with its changes from the one before', () => {
    const v = (n: number, file: JsonObject, by: string): OrderVersion => ({
      orderKey: 'k', n, file, savedAt: `2026-12-0${n}T08:00:00.000Z`, savedBy: by, origin: 'saved', signOff: null,
      check: { verdict: 'pass', problems: 0, catalog: { id: 'c', hash: 'h' }, policy: { id: 'p', hash: 'h' }, checkedAt: '' },
    });
    const b = base();
    b.hours = 20;
    const h = historyOf([v(2, b, 'CD'), v(1, base(), 'AB')]);
    expect(h.map((e) => [e.version.n, e.version.savedBy, e.changes.map((c) => `${c.field}: ${c.from} → ${c.to}`)])).toEqual([
      [2, 'CD', ['Duration (h): 24 → 20']],
      [1, 'AB', []],
    ]);
  });
});
