// Laws the engine must obey whatever the order (fast-check properties).
import { describe, expect, test } from 'vitest';
import fc from 'fast-check';
import { D } from '../../src/core/decimal.ts';
import { DEFAULT_CATALOG, DEFAULT_POLICY } from '../../src/defaults.ts';
import { checkOrder } from '../../src/core/evaluate.ts';
import { reportSchema } from '../../src/core/report.ts';
import type { Product } from '../../src/core/catalog.ts';

const products = DEFAULT_CATALOG.products.filter((p) => p.role !== 'water');
const decimalText = (min: number, max: number, places: number) =>
  fc.integer({ min: Math.round(min * 10 ** places), max: Math.round(max * 10 ** places) }).map((n) => new D(n).div(10 ** places).toString());

/** A line in a unit the product accepts. */
function lineFor(p: Product) {
  const units: string[] = ['mL'];
  if (p.nutrient) units.push('g');
  if (p.orderSpecies) units.push('mmol');
  return fc.record({ unit: fc.constantFrom(...units), amount: decimalText(0, 300, 3) }).map((l) => ({ product: p.id, ...l }));
}

const lineArb = fc.constantFrom(...products).chain(lineFor);
const orderArb = fc.record({
  lines: fc.array(lineArb, { minLength: 1, maxLength: 12 }),
  weight: decimalText(0.1, 150, 2),
  route: fc.constantFrom('peripheral', 'central'),
  ageGroup: fc.constantFrom('adult', 'child', 'term-neonate', 'preterm-neonate'),
  fill: fc.boolean(),
  extraMl: decimalText(0, 2000, 1),
}).map((o) => ({
  id: 'PROP-1',
  patient: { id: 'P', weightKg: o.weight, ageGroup: o.ageGroup },
  route: o.route,
  lines: o.fill ? [...o.lines, { product: 'sterile-water', fill: true }] : o.lines,
  ...(o.fill ? { volumeMl: o.extraMl === '0' ? '1' : o.extraMl } : {}),
}));

function evaluate(order: unknown) {
  const r = checkOrder(order, DEFAULT_CATALOG, DEFAULT_POLICY);
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return r.value;
}

function scale(order: ReturnType<typeof orderArb.generate> extends never ? never : Record<string, unknown>, k: string) {
  const o = structuredClone(order) as { volumeMl?: string; lines: { amount?: string }[] };
  for (const l of o.lines) if (l.amount !== undefined) l.amount = new D(l.amount).times(k).toString();
  if (o.volumeMl !== undefined) o.volumeMl = new D(o.volumeMl).times(k).toString();
  return o;
}

// Equal to 12 significant digits: the engine rounds each step to 15, so a chain of steps may differ in the last ones.
const close = (a: D, b: D) => a.minus(b).abs().lte(new D('1e-12').times(D.max(a.abs(), 1)));

describe('engine laws', () => {
  test('scaling every amount and the volume by k leaves osmolarity unchanged', () => {
    fc.assert(fc.property(orderArb, decimalText(0.1, 5, 2), (order, k) => {
      fc.pre(!new D(k).isZero());
      const a = evaluate(order).bag;
      const b = evaluate(scale(order, k)).bag;
      expect(close(a.osmolarity.particle, b.osmolarity.particle)).toBe(true);
      expect(close(a.osmolarity.labelSum, b.osmolarity.labelSum)).toBe(true);
    }), { numRuns: 150 });
  });

  test('line order does not matter', () => {
    fc.assert(fc.property(orderArb, fc.integer(), (order, seed) => {
      const lines = [...order.lines];
      const shuffled = lines.map((l, i) => ({ l, r: (Math.imul(i + 1, 2654435761) ^ seed) >>> 0 })).sort((x, y) => x.r - y.r).map((x) => x.l);
      const a = evaluate(order);
      const b = evaluate({ ...order, lines: shuffled });
      // Equal to the engine's 40 significant digits (only the summation order differs).
      expect(close(a.bag.osmolarity.particle, b.bag.osmolarity.particle)).toBe(true);
      expect(close(a.bag.osmolarity.labelSum, b.bag.osmolarity.labelSum)).toBe(true);
      expect(close(a.bag.finalVolumeMl, b.bag.finalVolumeMl)).toBe(true);
      expect(a.report.osmolarity).toEqual(b.report.osmolarity);
    }), { numRuns: 150 });
  });

  test('per-kg × weight equals per-day', () => {
    fc.assert(fc.property(orderArb, (order) => {
      const w = new D(order.patient.weightKg);
      const perKg = { ...order, lines: order.lines.map((l) => ('amount' in l && l.unit ? { ...l, unit: `${l.unit}/kg`, amount: new D(l.amount).div(w).toString() } : l)) };
      const a = evaluate(order).bag;
      const b = evaluate(perKg).bag;
      a.lines.forEach((line, i) => expect(close(line.volumeMl, b.lines[i]?.volumeMl ?? new D(-1))).toBe(true));
      expect(close(a.osmolarity.particle, b.osmolarity.particle)).toBe(true);
    }), { numRuns: 150 });
  });

  test('particle osmolarity equals the volume-weighted mean of the stocks\' own particle osmolarities', () => {
    fc.assert(fc.property(orderArb, (order) => {
      const bag = evaluate(order).bag;
      fc.pre(bag.finalVolumeMl.gt(0));
      let weighted = new D(0);
      for (const l of bag.lines) weighted = weighted.plus(l.volumeMl.div(bag.finalVolumeMl).times(l.product.particlePerMl.times(1000)));
      expect(close(weighted, bag.osmolarity.particle)).toBe(true);
    }), { numRuns: 150 });
  });

  test('no input the schema accepts yields NaN or Infinity in the report', () => {
    fc.assert(fc.property(orderArb, (order) => {
      const report = evaluate(order).report;
      expect(reportSchema.safeParse(report).success).toBe(true);
      expect(JSON.stringify(report)).not.toMatch(/NaN|Infinity|null,"limit":null,"unit":null,"message":""/);
    }), { numRuns: 200 });
  });

  test('extreme but valid numbers stay finite (all-zero bag, tiny weight, huge decimal strings)', () => {
    const cases = [
      { id: 'Z', patient: { id: 'P', weightKg: '0.000001', ageGroup: 'preterm-neonate' }, route: 'peripheral', lines: [{ product: 'dextrose-70', amount: 0, unit: 'g' }] },
      { id: 'Z', patient: { id: 'P', weightKg: '0.1', ageGroup: 'adult' }, route: 'peripheral', volumeMl: '0.001', hours: 1, lines: [{ product: 'dextrose-70', amount: '1000000', unit: 'g' }, { product: 'sterile-water', fill: true }] },
    ];
    for (const c of cases) {
      const r = checkOrder(c, DEFAULT_CATALOG, DEFAULT_POLICY);
      if (r.ok) expect(reportSchema.safeParse(r.value.report).success).toBe(true);
      else expect(r.problems.length).toBeGreaterThan(0);
    }
    // Beyond the schema's bounds the input is refused with its path, never computed into Infinity.
    const absurd = { ...cases[1], patient: { id: 'P', weightKg: '1e-300', ageGroup: 'adult' }, lines: [{ product: 'dextrose-70', amount: '1e300', unit: 'g' }] };
    const r = checkOrder(absurd, DEFAULT_CATALOG, DEFAULT_POLICY);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems.map((p) => p.path)).toEqual(['patient.weightKg', 'lines[0].amount']);
  });
});
