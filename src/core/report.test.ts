import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import Decimal from 'decimal.js';
import { D, roundDivided } from './decimal.ts';
import { toReport } from './report.ts';
import { SPECIES_IDS } from './species.ts';
import { DEFAULT_CATALOG, DEFAULT_POLICY } from '../defaults.ts';
import { parseOrder } from './order.ts';
import { evaluateOrder } from './evaluate.ts';
import { batch } from '../../test/bench/generate.ts';
import { evaluate, policyWith } from '../../test/helpers/orders.ts';
import { checkOrder } from './evaluate.ts';
import { DEMO_ORDERS } from '../defaults.ts';

// decimal.js as the reference: quotients rounded to 15 significant digits, half-even (the engine's rule).
const Dec = Decimal.clone({ precision: 15, rounding: Decimal.ROUND_HALF_EVEN });

/** round(a ÷ b × 10^shift, places) by decimal.js, as the float the report writes (no negative zero). */
function expected(a: string, b: string, shift: number, places: number): number {
  const n = Number(new Dec(a).div(b).times(new Dec(10).pow(shift)).toDecimalPlaces(places, Decimal.ROUND_HALF_EVEN).toString());
  return n === 0 ? 0 : n;
}

const decimalText = fc.record({
  coefficient: fc.bigInt({ min: 1n, max: 9_007_199_254_740_991n }),
  exponent: fc.integer({ min: -14, max: 10 }),
  negative: fc.boolean(),
}).map(({ coefficient, exponent, negative }) => `${negative ? '-' : ''}${coefficient}e${exponent}`);

describe('roundDivided (against decimal.js)', () => {
  it('rounds the 15-digit quotient, not the exact one: 0.1234999999999999 ÷ 1 → 0.1235 → 0.124 at 3 places', () => {
    expect(roundDivided(new D('0.1234999999999999'), new D(1), 0, 3)).toBe(0.124);
    expect(expected('0.1234999999999999', '1', 0, 3)).toBe(0.124);
  });

  it('breaks exact ties half-even: 1 ÷ 8 → 0.12, 3 ÷ 8 → 0.38; 1 ÷ 3 × 100 → 33.3', () => {
    expect(roundDivided(new D(1), new D(8), 0, 2)).toBe(0.12);
    expect(roundDivided(new D(3), new D(8), 0, 2)).toBe(0.38);
    expect(roundDivided(new D(1), new D(3), 2, 1)).toBe(33.3);
  });

  it('gives decimal.js\'s figure for any operands, shift and places', () => {
    fc.assert(fc.property(decimalText, decimalText, fc.constantFrom(0, 2, 3), fc.integer({ min: 0, max: 4 }), (a, b, shift, places) => {
      expect(roundDivided(new D(a), new D(b), shift, places)).toBe(expected(a, b, shift, places));
    }), { numRuns: 3000 });
  });

  it('gives decimal.js\'s figure for quotients within 10⁻¹⁶ of a half-way point', () => {
    // a = (k + ½)·10^−places × b, to 16 digits: the quotient sits on, or a last digit off, a tie.
    const nearTie = fc.record({
      k: fc.integer({ min: 0, max: 99_999 }),
      b: fc.integer({ min: 1, max: 99_999_999 }),
      places: fc.integer({ min: 0, max: 4 }),
      nudge: fc.constantFrom(-1, 0, 1),
    });
    fc.assert(fc.property(nearTie, ({ k, b, places, nudge }) => {
      const Wide = Decimal.clone({ precision: 16, rounding: Decimal.ROUND_DOWN });
      const exact = new Wide(k).plus('0.5').div(new Wide(10).pow(places)).times(b);
      const a = exact.plus(exact.times(`${nudge}e-16`)).toString();
      expect(roundDivided(new D(a), new D(b), 0, places)).toBe(expected(a, String(b), 0, places));
    }), { numRuns: 3000 });
  });
});

describe('report figures (against decimal.js on generated orders)', () => {
  const orders = [...batch(60)].flatMap((o) => {
    const r = parseOrder(o, DEFAULT_CATALOG);
    return r.ok ? [r.value] : [];
  });

  it('each line\'s share of the mOsm and dose per kg, each species per litre and per kg', () => {
    for (const order of orders) {
      const e = evaluateOrder(order, DEFAULT_CATALOG, DEFAULT_POLICY, { suggestions: false });
      const report = toReport(e.bag, e.findings, e.verdict, DEFAULT_CATALOG, DEFAULT_POLICY);
      const bag = e.bag;
      const w = bag.order.patient.weightKg.toString();
      const total = (bag.osmolarity.method === 'particle' ? bag.totalMOsm.particle : bag.totalMOsm.labelSum).toString();
      bag.lines.forEach((l, i) => {
        const line = report.lines[i]!;
        const mOsm = (bag.osmolarity.method === 'particle' ? l.particleMOsm : l.labelMOsm).toString();
        expect(line.sharePercent).toBe(expected(mOsm, total, 2, 1));
        expect(line.perKgPerDay?.amount ?? null).toBe(l.perDay ? expected(l.perDay.amount.toString(), w, 0, 4) : null);
      });
      const V = bag.finalVolumeMl.toString();
      for (const s of SPECIES_IDS) {
        const mmol = bag.speciesMmol[s].toString();
        expect(report.totals.mmolPerL[s]).toBe(expected(mmol, V, 3, 2));
        expect(report.totals.mmolPerKgPerDay[s]).toBe(expected(mmol, w, 0, 3));
      }
    }
  });

  it('a line ordered per kg reports its ordered amount per kg: 3.5 g/kg at 1.1 kg is 3.85 g a day', () => {
    const e = evaluate({ age: 'preterm-neonate', weightKg: '1.1', volumeMl: 154, lines: [
      { product: 'amino-acids-10', amount: '3.5', unit: 'g/kg' }, { product: 'sterile-water', fill: true },
    ] });
    expect(e.report.lines[0]?.perDay).toEqual({ amount: 3.85, unit: 'g' });
    expect(e.report.lines[0]?.perKgPerDay).toEqual({ amount: 3.5, unit: 'g/kg' });
  });

  it('a per-kg dose whose day amount had to be rounded is worked out from that amount (decimal.js)', () => {
    // 2.79785000000001 g/kg × 3.729064 kg = 10.43336171240003… g, 10.4333617124000 at 15 digits; ÷ 3.729064
    // gives 2.79785 exactly, 2.7978 at 4 places (half-even), where the ordered amount shows 2.7979.
    const e = evaluate({ age: 'term-neonate', weightKg: '3.729064', volumeMl: 500, lines: [
      { product: 'amino-acids-10', amount: '2.79785000000001', unit: 'g/kg' }, { product: 'sterile-water', fill: true },
    ] });
    expect(e.report.lines[0]?.amount).toBe(2.7979);
    expect(e.report.lines[0]?.perKgPerDay?.amount).toBe(expected(new Dec('2.79785000000001').times('3.729064').toString(), '3.729064', 0, 4));
    expect(e.report.lines[0]?.perKgPerDay?.amount).toBe(2.7978);
  });
});

describe('report shape', () => {
  // The adult peripheral demo with dextrose 250 g: over the 900 mOsm/L peripheral limit (ASPEN 2014), so the
  // solver proposes changes.
  const file = structuredClone(DEMO_ORDERS.find((d) => d.key === 'adult-peripheral')?.file) as { lines: { amount?: unknown }[] };
  file.lines[1]!.amount = 250;

  it('writes suggestions last, and leaves the key out (not undefined) when there are none', () => {
    const full = checkOrder(file, DEFAULT_CATALOG, DEFAULT_POLICY);
    const quick = checkOrder(file, DEFAULT_CATALOG, DEFAULT_POLICY, { suggestions: false });
    if (!full.ok || !quick.ok) throw new Error('demo did not check');
    expect(full.value.suggestions.length).toBeGreaterThan(0);
    expect(Object.keys(full.value.report).slice(-2)).toEqual(['verdict', 'suggestions']);
    expect(Object.keys(quick.value.report).at(-1)).toBe('verdict');
    expect('suggestions' in quick.value.report).toBe(false);
    const e = full.value;
    expect(toReport(e.bag, e.findings, e.verdict, DEFAULT_CATALOG, DEFAULT_POLICY, e.suggestions)).toStrictEqual(e.report);
  });

  it('shows the peripheral limit of the patient\'s age group under each policy', () => {
    // Adults 900 mOsm/L (ASPEN 2014, Boullata et al.); neonates 1000 mOsm/L (Dugan 2014: more infiltration above
    // it); children none. The shipped policy has 900 mOsm/L for every age group (ASPEN 2014).
    const policy = policyWith((json) => {
      json.rules['osmolarity-peripheral'] = {
        adult: { max: 900, unit: 'mOsm/L', severity: 'block', source: 'ASPEN 2014 (Boullata et al.)' },
        'term-neonate': { max: 1000, unit: 'mOsm/L', severity: 'block', source: 'Dugan 2014' },
      };
    });
    const spec = { weightKg: '3', volumeMl: 100, lines: [{ product: 'dextrose-50', amount: '10', unit: 'g' as const }, { product: 'sterile-water', fill: true }] };
    expect(evaluate({ ...spec, age: 'adult' }, policy).report.osmolarity.peripheralLimit).toBe(900);
    expect(evaluate({ ...spec, age: 'term-neonate' }, policy).report.osmolarity.peripheralLimit).toBe(1000);
    expect(evaluate({ ...spec, age: 'child' }, policy).report.osmolarity.peripheralLimit).toBeNull();
    expect(evaluate({ ...spec, age: 'child' }).report.osmolarity.peripheralLimit).toBe(900);
  });
});
