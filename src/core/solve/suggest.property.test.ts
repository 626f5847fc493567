import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { D } from '../decimal.ts';
import { DEFAULT_CATALOG, DEFAULT_POLICY } from '../../defaults.ts';
import { evaluateOrder } from '../evaluate.ts';
import { reportSchema } from '../report.ts';
import type { Order } from '../order.ts';
import { orderOf, type OrderSpec } from '../../../test/helpers/orders.ts';

const check = (order: Order) => evaluateOrder(order, DEFAULT_CATALOG, DEFAULT_POLICY, { suggestions: false });
const osmolarityFails = (order: Order) => check(order).findings.some((f) => f.code === 'osmolarity-peripheral');

const peripheralOrder = fc.record({
  age: fc.constantFrom('adult', 'child', 'term-neonate', 'preterm-neonate'),
  weightKg: fc.integer({ min: 1, max: 120 }),
  volumeMl: fc.integer({ min: 100, max: 3000 }),
  fill: fc.boolean(),
  aa: fc.integer({ min: 0, max: 150 }),
  // 0 g of everything and no fill gives an empty bag: it must still report cleanly.
  dextrose: fc.integer({ min: 0, max: 450 }),
  lipidMl: fc.integer({ min: 0, max: 400 }),
  naMEq: fc.integer({ min: 0, max: 150 }),
  kMEq: fc.integer({ min: 0, max: 100 }),
}).map((r): OrderSpec => {
  const lines: OrderSpec['lines'] = [
    { product: 'amino-acids-10', amount: r.aa, unit: 'g' },
    { product: 'dextrose-70', amount: r.dextrose, unit: 'g' },
    { product: 'lipid-20', amount: r.lipidMl, unit: 'mL' },
    { product: 'sodium-chloride-4', amount: r.naMEq, unit: 'mEq' },
    { product: 'potassium-chloride-2', amount: r.kMEq, unit: 'mEq' },
  ];
  const spec: OrderSpec = { age: r.age, route: 'peripheral', weightKg: r.weightKg, lines };
  if (r.fill) return { ...spec, volumeMl: r.volumeMl, lines: [...lines, { product: 'sterile-water', fill: true }] };
  return spec;
});

describe('suggest (property)', () => {
  it('an empty peripheral bag reports cleanly: no figures to screen, nothing to suggest', () => {
    const e = evaluateOrder(orderOf({ age: 'preterm-neonate', route: 'peripheral', weightKg: 1, lines: [{ product: 'dextrose-50', amount: 0, unit: 'g' }] }), DEFAULT_CATALOG, DEFAULT_POLICY);
    expect(e.findings.map((f) => f.code)).toEqual(['empty-bag']);
    expect(e.suggestions).toEqual([]);
    expect(reportSchema.safeParse(e.report).success).toBe(true);
  });

  it('applying a proposal and re-evaluating never gives a worse osmolarity verdict, and each proposal is the tightest step', () => {
    let proposals = 0;
    fc.assert(fc.property(peripheralOrder, (spec) => {
      const order = orderOf(spec);
      const e = evaluateOrder(order, DEFAULT_CATALOG, DEFAULT_POLICY);
      // Every figure in the report, suggestions included, is a finite number (the schema refuses NaN and Infinity).
      expect(reportSchema.safeParse(e.report).success).toBe(true);
      const failedBefore = e.findings.some((f) => f.code === 'osmolarity-peripheral');
      if (!failedBefore) expect(e.suggestions).toEqual([]);
      for (const s of e.suggestions) {
        if (s.status !== 'proposal') continue;
        proposals++;
        // Never worse: the bag failed, and the re-evaluated proposal passes the osmolarity screen.
        expect(osmolarityFails(s.order)).toBe(false);
        expect(s.passesOsmolarity).toBe(true);
        expect(s.after.osmolarity.lte(s.before.osmolarity)).toBe(true);
        if (s.change.field === 'volumeMl') {
          const step = order.patient.ageGroup.endsWith('neonate') ? new D(1) : new D(10);
          expect(s.change.to.div(step).isInteger()).toBe(true);
          expect(osmolarityFails({ ...s.order, volumeMl: s.change.to.minus(step) })).toBe(true);
        }
        if (s.change.field === 'amount') {
          const { line, to } = s.change;
          const more = { ...s.order, lines: s.order.lines.map((l) => (l.index === line && l.kind === 'amount' ? { ...l, amount: to.plus(5) } : l)) };
          expect(osmolarityFails(more)).toBe(true);
        }
      }
    }), { numRuns: 60, seed: 20261202 });
    expect(proposals).toBeGreaterThan(15);
  }, 60_000);
});
