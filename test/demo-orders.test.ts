// The demo orders (invented scenario) still evaluate, their reports are valid, and the release
// checks say what the user journeys expect of them.
import { describe, expect, it } from 'vitest';
import { DEFAULT_CATALOG, DEFAULT_POLICY, DEMO_ORDERS } from '../src/defaults.ts';
import { checkOrder, type Evaluation } from '../src/core/evaluate.ts';
import { reportSchema } from '../src/core/report.ts';
import { one, pick } from './helpers/orders.ts';

function demo(key: string): Evaluation {
  const file = DEMO_ORDERS.find((d) => d.key === key)?.file;
  const r = checkOrder(file, DEFAULT_CATALOG, DEFAULT_POLICY);
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return r.value;
}

describe('demo orders', () => {
  it.each(DEMO_ORDERS.map((d) => d.key))('%s evaluates and its report validates', (key) => {
    const e = demo(key);
    expect(reportSchema.safeParse(e.report).success).toBe(true);
    expect(e.report.findings.every((f) => f.source.trim().length > 0)).toBe(true);
    expect(e.report.information.predictedOsmolality?.estimates.length).toBeGreaterThan(0);
  });

  it('adult peripheral 3-in-1 just passes 900 mOsm/L but warns: dextrose 7.5% is under the 10% 3-in-1 minimum (ASPEN 2014)', () => {
    const e = demo('adult-peripheral');
    expect(e.report.osmolarity.reported).toBe(897);
    expect(pick(e.findings, 'osmolarity-peripheral')).toEqual([]);
    const dextrose = one(e.findings, 'tna-stability', { nutrient: 'dextrose' });
    expect(dextrose.severity).toBe('warn');
    expect(dextrose.value?.toNumber()).toBe(7.5);
    expect(dextrose.limit?.toNumber()).toBe(10);
    expect(one(e.findings, 'tna-stability', { nutrient: 'amino-acids' }).severity).toBe('info'); // 4.00% meets 4%
    expect(e.verdict).toBe('warn');
    expect(e.suggestions).toEqual([]);
  });

  it('adult central 2-in-1 needs its central line (the reverse check says so)', () => {
    const e = demo('adult-central');
    expect(e.report.suggestions?.[0]).toMatchObject({ kind: 'peripheral-route', status: 'unavailable' });
    expect(pick(e.findings, 'tna-stability')).toEqual([]);
    // Calcium gluconate 10 mEq is exactly the adult minimum of 10 mEq/day (ASPEN 2004, from memory): within.
    expect(one(e.findings, 'dose-range', { nutrient: 'Ca' }).severity).toBe('info');
  });

  it('preterm neonate: organic phosphate only, GIR 8.33 in 4-12 (ESPGHAN 2018), aluminum over 5 µg/kg/day (21 CFR 201.323)', () => {
    const e = demo('preterm-neonate');
    expect(pick(e.findings, 'calcium-phosphate', { screen: 'product' })).toEqual([]);
    expect(one(e.findings, 'calcium-phosphate', { screen: 'organic-phosphate' }).message).toContain('inorganic screens are not triggered');
    const gir = one(e.findings, 'gir');
    expect(gir.value?.toDecimalPlaces(2).toNumber()).toBe(8.33);
    expect(gir.severity).toBe('info');
    const al = one(e.findings, 'aluminum');
    expect(al.severity).toBe('warn');
    expect(al.message).toContain('Calcium gluconate');
    expect(e.report.information.predictedOsmolality?.estimates.map((x) => x.method)).toEqual(['osmotic-coefficient', 'pereira-da-silva-2004']);
  });
});
