import { describe, expect, it } from 'vitest';
import { DEFAULT_CATALOG, DEFAULT_POLICY, DEMO_ORDERS } from '../../defaults.ts';
import { checkOrder } from '../evaluate.ts';
import { formatProblem } from '../problems.ts';

function check(json: unknown) {
  const r = checkOrder(json, DEFAULT_CATALOG, DEFAULT_POLICY);
  if (!r.ok) throw new Error(r.problems.map(formatProblem).join('\n'));
  return r.value;
}

const base = { id: 'T-CHK', patient: { id: 'P', weightKg: 70, ageGroup: 'adult' }, route: 'central', volumeMl: 2000 };

describe('checkOrder on an order with an ions block: allocate, then check the bag', () => {
  it('the demo ion order: the allocated lines are in the report, the bag is checked, and an info finding sums up', () => {
    const demo = DEMO_ORDERS.find((d) => d.key === 'adult-ions');
    const e = check(demo?.file);
    const products = e.report.lines.map((l) => l.product);
    for (const id of ['potassium-phosphates-3', 'calcium-gluconate-10', 'magnesium-sulfate-50', 'sodium-chloride-4', 'sodium-acetate-2', 'potassium-chloride-2', 'potassium-acetate-2']) {
      expect(products).toContain(id);
    }
    // 20 mmol potassium phosphates measured as 6.7 mL (20 ÷ 3 = 6.667 → 6.7; 6.7 × 3 = 20.1 mmol).
    const kp = e.report.lines.find((l) => l.product === 'potassium-phosphates-3');
    expect(kp?.volumeMl).toBe(6.7);
    expect(kp?.amount).toBe(20.1);
    expect(e.report.totals.mmolPerDay.phosphate).toBe(20.1);
    // The fill line absorbs the measured volumes: the bag is still 2000 mL.
    expect(e.report.volumeMl).toBe(2000);
    const info = e.findings.find((f) => f.code === 'ion-order');
    expect(info?.severity).toBe('info');
    expect(info?.message).toContain('7 electrolyte lines allocated');
    // No ion-order or measuring problem holds or warns: the allocation met the order.
    expect(e.findings.filter((f) => (f.code === 'ion-order' || f.code === 'measurable-volume') && f.severity !== 'info')).toEqual([]);
    expect(e.verdict).not.toBe('block');
  });

  it('an infeasible ion order holds the bag and says the lines are the proposal', () => {
    const e = check({ ...base, lines: [{ product: 'sterile-water', fill: true }], ions: { per: 'day', Na: 20, K: 80, phosphate: 20, phosphateSalt: 'sodium' } });
    const hold = e.findings.find((f) => f.code === 'ion-order' && f.severity === 'block');
    expect(hold?.message).toContain('Sodium ordered 20.00 mEq is below what Sodium phosphates');
    expect(hold?.message).toContain('Proposal: Potassium phosphates');
    expect(hold?.message).toContain('meet the proposal, not the order as written');
    expect(hold?.fields).toEqual(['ions.Na']);
    expect(e.verdict).toBe('block');
  });

  it('a volume below the smallest measurable volume is a measurable-volume warning', () => {
    const e = check({ ...base, lines: [{ product: 'sterile-water', fill: true }], ions: { per: 'day', Mg: '0.2' } });
    const warn = e.findings.find((f) => f.code === 'measurable-volume');
    expect(warn?.severity).toBe('warn');
    expect(warn?.source).toContain('common practice');
    expect(e.verdict).toBe('warn');
  });

  it('orders without an ions block are checked as before (no ion finding)', () => {
    const demo = DEMO_ORDERS.find((d) => d.key === 'adult-central');
    expect(check(demo?.file).findings.some((f) => f.code === 'ion-order')).toBe(false);
  });
});
