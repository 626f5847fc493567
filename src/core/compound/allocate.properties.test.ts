import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { DEFAULT_CATALOG, DEFAULT_POLICY } from '../../defaults.ts';
import { D, ZERO, sum } from '../decimal.ts';
import { parseOrder, type IonOrder, type Order } from '../order.ts';
import { formatProblem } from '../problems.ts';
import { SPECIES, type SpeciesId } from '../species.ts';
import { computeBag } from '../compute/bag.ts';
import { compoundOrder, compoundTargets, hasIons, type CompoundResult, type CompoundedLine } from './compoundOrder.ts';
import { toCompoundReport, compoundReportSchema } from './compoundReport.ts';
import { incrementFor } from './measure.ts';
import { ionsOfProduct } from './ions.ts';

// Laws of the allocator, over generated ion orders against the shipped catalog and policy.

const compounding = DEFAULT_POLICY.compounding;
if (!compounding) throw new Error('the shipped policy has a compounding section');

/** A decimal string with `places` decimals in [min, max]. */
const amount = (min: number, max: number, places: number) =>
  fc.integer({ min: min * 10 ** places, max: max * 10 ** places }).map((n) => new D(n).div(10 ** places).toString());

const anions = fc.oneof(
  fc.constantFrom('chloride', 'acetate', 'balanced'),
  amount(0, 300, 1).map((v) => ({ acetate: v })),
  amount(0, 300, 1).map((v) => ({ chloride: v })),
  amount(0, 3, 2).map((v) => ({ chlorideToAcetate: v })),
);

const perDayIons = fc.record({
  Na: fc.option(amount(0, 250, 1), { nil: undefined }),
  K: fc.option(amount(0, 150, 1), { nil: undefined }),
  Ca: fc.option(amount(0, 30, 1), { nil: undefined }),
  Mg: fc.option(amount(0, 40, 1), { nil: undefined }),
  phosphate: fc.option(amount(0, 50, 1), { nil: undefined }),
  phosphateSalt: fc.option(fc.constantFrom('auto', 'sodium', 'potassium', 'organic'), { nil: undefined }),
  anions: fc.option(anions, { nil: undefined }),
}, { requiredKeys: [] });

const orderArb = fc.record({
  weightKg: amount(1, 120, 1),
  ageGroup: fc.constantFrom('adult', 'child', 'term-neonate', 'preterm-neonate'),
  aminoAcids: fc.option(fc.record({ product: fc.constantFrom('amino-acids-10', 'amino-acids-15'), grams: amount(0, 150, 0) }), { nil: undefined }),
  dextroseGrams: amount(0, 300, 0),
  ions: perDayIons,
});

type Generated = fc.Arbitrary<typeof orderArb extends fc.Arbitrary<infer T> ? T : never> extends fc.Arbitrary<infer U> ? U : never;

function clean(o: Record<string, unknown>): Record<string, unknown> {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined));
}

function toOrder(g: Generated, per: 'day' | 'kg' = 'day'): Order & { ions: IonOrder } {
  const lines: Record<string, unknown>[] = [];
  if (g.aminoAcids) lines.push({ product: g.aminoAcids.product, amount: g.aminoAcids.grams, unit: 'g' });
  lines.push({ product: 'dextrose-70', amount: g.dextroseGrams, unit: 'g' }, { product: 'sterile-water', fill: true });
  const parsed = parseOrder({
    id: 'PROP', patient: { id: 'P', weightKg: g.weightKg, ageGroup: g.ageGroup }, route: 'central', volumeMl: 5000,
    lines, ions: { per, ...clean(g.ions) },
  }, DEFAULT_CATALOG);
  if (!parsed.ok) throw new Error(parsed.problems.map(formatProblem).join('\n'));
  if (!hasIons(parsed.value)) throw new Error('no ions');
  return parsed.value;
}

function compound(g: Generated): CompoundResult {
  return compoundOrder(toOrder(g), DEFAULT_CATALOG, DEFAULT_POLICY);
}

/** Half a measuring increment times what one mL of each line brings of an ion: the most rounding can move it. */
function roundingBound(lines: readonly CompoundedLine[], ion: 'Na' | 'K' | 'Ca' | 'Mg' | 'phosphate'): D {
  return sum(lines.map((l) => (incrementFor(l.exactVolumeMl, compounding?.volumeIncrements ?? { steps: [], source: '' }) ?? ZERO).div(2).times(ionsOfProduct(l.product, new D(1))[ion])));
}

/** Σ charge × mmol of the species a line brings (0 for a salt in its own stoichiometry). */
function netCharge(l: CompoundedLine, volumeMl: D): D {
  let net = ZERO;
  for (const s of Object.keys(l.product.perMl) as SpeciesId[]) {
    const charge = SPECIES[s].charge;
    if (charge !== null) net = net.plus((l.product.perMl[s] ?? ZERO).times(volumeMl).times(charge));
  }
  return net;
}

// Far below any measurable dose (0.001 mEq); the engine keeps 15 significant digits, about 1e-12 here.
const TINY = new D('1e-9');

describe('allocation properties (fast-check)', () => {
  it('feasible orders: delivered Na, K, Ca, Mg and P (each ordered) equal ordered exactly before rounding, within the rounding of volumes after', () => {
    let feasible = 0;
    let runs = 0;
    fc.assert(fc.property(orderArb, (g) => {
      runs += 1;
      const r = compound(g);
      if (!r.feasible) return;
      feasible += 1;
      for (const ion of ['Na', 'K', 'Ca', 'Mg', 'phosphate'] as const) {
        if (!r.targets?.given[ion]) continue;
        expect(r.deliveredExact[ion].minus(r.ordered[ion]).abs().lte(TINY), `${ion} before rounding`).toBe(true);
        const bound = roundingBound(r.lines, ion);
        expect(r.delivered[ion].minus(r.ordered[ion]).abs().lte(bound.plus(TINY)), `${ion}: |${r.delivered[ion]} − ${r.ordered[ion]}| ≤ ${bound}`).toBe(true);
      }
    }), { numRuns: 300 });
    // The generator must reach feasible orders often enough for the law to mean something.
    expect(feasible / runs).toBeGreaterThan(0.2);
  });

  it('anions balance cations within each salt\'s own stoichiometry, and the chloride/acetate salts carry exactly the Na and K left', () => {
    fc.assert(fc.property(orderArb, (g) => {
      const r = compound(g);
      for (const l of r.lines.filter((x) => x.purpose !== 'phosphate')) {
        expect(netCharge(l, l.exactVolumeMl).abs().lte(TINY), `${l.product.id} exact`).toBe(true);
        expect(netCharge(l, l.volumeMl).abs().lte(TINY), `${l.product.id} measured`).toBe(true);
      }
      const salts = r.lines.filter((l) => l.purpose === 'sodium-potassium');
      const anionsAdded = sum(salts.map((l) => l.ionsExact.Cl.plus(l.ionsExact.acetate)));
      const phosphateCations = sum(r.lines.filter((l) => l.purpose === 'phosphate').map((l) => l.ionsExact.Na.plus(l.ionsExact.K)));
      const left = r.deliveredExact.Na.plus(r.deliveredExact.K).minus(r.otherLines.Na).minus(r.otherLines.K).minus(phosphateCations);
      expect(anionsAdded.minus(left).abs().lte(TINY)).toBe(true);
      // A ratio met without any anion problem holds over the whole bag before rounding.
      const a = r.amended?.anions;
      const anionProblem = r.problems.some((p) => p.path.startsWith('ions.anions'));
      if (a?.kind === 'ratio' && !anionProblem && salts.length > 0) {
        expect(r.deliveredExact.Cl.minus(a.chlorideToAcetate.times(r.deliveredExact.acetate)).abs().lte(TINY)).toBe(true);
      }
      if (a?.kind === 'acetate-amount' && !anionProblem) expect(r.deliveredExact.acetate.minus(a.mEq).abs().lte(TINY)).toBe(true);
      if (a?.kind === 'chloride-amount' && !anionProblem) expect(r.deliveredExact.Cl.minus(a.mEq).abs().lte(TINY)).toBe(true);
    }), { numRuns: 300 });
  });

  it('never a negative amount or volume, and the report holds only finite numbers', () => {
    fc.assert(fc.property(orderArb, (g) => {
      const r = compound(g);
      for (const l of r.lines) {
        for (const v of [l.amount, l.exactVolumeMl, l.volumeMl, l.measuredAmount]) expect(v.gte(0)).toBe(true);
      }
      for (const l of computeBag(r.compounded, DEFAULT_POLICY).lines) expect(l.volumeMl.gte(0)).toBe(true);
      expect(compoundReportSchema.safeParse(toCompoundReport(r)).success).toBe(true);
    }), { numRuns: 300 });
  });

  it('the nearest feasible order a proposal describes is feasible', () => {
    fc.assert(fc.property(orderArb, (g) => {
      const r = compound(g);
      if (r.feasible || !r.amended) return;
      const again = compoundTargets(r.order, r.amended, DEFAULT_CATALOG, DEFAULT_POLICY);
      expect(again.problems.filter((p) => p.severity === 'block').map((p) => p.message)).toEqual([]);
    }), { numRuns: 300 });
  });

  it('per kg × weight = per day: the same lines either way', () => {
    const perKgIons = fc.record({
      Na: amount(0, 5, 2), K: amount(0, 4, 2), Ca: amount(0, 4, 2), Mg: amount(0, 1, 2), phosphate: amount(0, 2, 2),
      anions: fc.constantFrom('chloride', 'acetate', 'balanced'),
    });
    fc.assert(fc.property(orderArb, perKgIons, (g, ions) => {
      const perKg = toOrder({ ...g, ions }, 'kg');
      const w = perKg.patient.weightKg;
      const perDayJson = Object.fromEntries(Object.entries(ions).map(([k, v]) => [k, k === 'anions' ? v : new D(v).times(w).toString()]));
      const perDay = toOrder({ ...g, ions: perDayJson }, 'day');
      const a = compoundOrder(perKg, DEFAULT_CATALOG, DEFAULT_POLICY);
      const b = compoundOrder(perDay, DEFAULT_CATALOG, DEFAULT_POLICY);
      expect(a.lines.map((l) => `${l.product.id} ${l.amount.toString()} ${l.volumeMl.toString()}`))
        .toEqual(b.lines.map((l) => `${l.product.id} ${l.amount.toString()} ${l.volumeMl.toString()}`));
    }), { numRuns: 200 });
  });
});
