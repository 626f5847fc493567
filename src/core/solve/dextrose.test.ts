import { describe, expect, it } from 'vitest';
import { D } from '../decimal.ts';
import type { Order } from '../order.ts';
import type { Proposal, Suggestion } from './suggestion.ts';
import { evaluate, type OrderSpec, HELD_ADULT_PERIPHERAL, osmolarityFails } from '../../../test/helpers/orders.ts';

function dextroseProposal(suggestions: Suggestion[]): Proposal {
  const s = suggestions.find((x) => x.kind === 'dextrose');
  if (s?.status !== 'proposal') throw new Error(`no dextrose proposal: ${JSON.stringify(s)}`);
  return s;
}

function withAmount(order: Order, index: number, amount: D): Order {
  return { ...order, lines: order.lines.map((l) => (l.index === index && l.kind === 'amount' ? { ...l, amount } : l)) };
}

// The adult peripheral 3-in-1 with 250 g dextrose at 1149.3 mOsm/L (see finalVolume.test.ts for its
// label arithmetic). At 2000 mL the limit allows 1800 mOsm: 498.6 mOsm too many, and each gram of
// dextrose 70% brings 3532/700 = 5.046 mOsm (label), so 98.8 g less: 151.2 g, rounded down to 5 g → 150 g.
const spec: OrderSpec = HELD_ADULT_PERIPHERAL;

describe('dextrose suggestion', () => {
  const e = evaluate(spec);
  const p = dextroseProposal(e.suggestions);

  it('proposes 150 g at 2000 mL: it passes, and one 5 g step more fails', () => {
    expect(p.change).toMatchObject({ field: 'amount', line: 1, product: 'dextrose-70', from: new D(250), to: new D(150), unit: 'g' });
    expect(p.after.volumeMl.toNumber()).toBe(2000);
    expect(osmolarityFails(p.order)).toBe(false);
    expect(osmolarityFails(withAmount(p.order, 1, new D(155)))).toBe(true);
  });

  it('reports GIR and energy before and after: GIR 2.55 → 1.53 mg/kg/min, energy 1670 → 1330 kcal', () => {
    // GIR = g × 1000 ÷ (68 kg × 1440 min); energy: dextrose 3.4 kcal/g (label).
    expect(p.before.girMgPerKgPerMin.toDecimalPlaces(2).toNumber()).toBe(2.55);
    expect(p.after.girMgPerKgPerMin.toDecimalPlaces(2).toNumber()).toBe(1.53);
    expect(p.before.kcal.minus(p.after.kcal).toNumber()).toBe(340);
    expect(p.appears.map((f) => `${f.code}:${f.nutrient ?? ''}`)).toEqual(['tna-stability:dextrose', 'dose-range:energy']);
  });

  it('works in the line\'s own unit: g/kg rounded down to 0.1 g/kg for a neonate', () => {
    const ev = evaluate({ age: 'term-neonate', route: 'peripheral', weightKg: '3.2', volumeMl: 480, lines: [
      { product: 'amino-acids-10', amount: 3, unit: 'g/kg' },
      // 80 g dextrose 50% (160 mL × 2.523) + 9.6 g amino acids (96 mL × 0.84) in 480 mL: 1009 mOsm/L
      { product: 'dextrose-50', amount: 25, unit: 'g/kg' },
      { product: 'sterile-water', fill: true },
    ] });
    const q = dextroseProposal(ev.suggestions);
    expect(q.change.field === 'amount' && q.change.unit).toBe('g/kg');
    const to = q.change.field === 'amount' ? q.change.to : new D(0);
    expect(to.times(10).isInteger()).toBe(true);
    expect(osmolarityFails(q.order)).toBe(false);
    expect(osmolarityFails(withAmount(q.order, 1, to.plus('0.1')))).toBe(true);
  });

  it('without a fill line the bag shrinks with the dextrose, and a note says so', () => {
    const ev = evaluate({ age: 'adult', route: 'peripheral', weightKg: 70, lines: [
      { product: 'amino-acids-10', amount: 500, unit: 'mL' }, { product: 'dextrose-70', amount: 300, unit: 'mL' }, { product: 'dextrose-10', amount: 100, unit: 'mL' },
    ] });
    expect(ev.suggestions.find((s) => s.kind === 'dextrose')?.message).toContain('several dextrose lines');
    // 500 mL amino acids 10% (420 mOsm) + 300 mL dextrose 70% (1059.6 mOsm) = 1849 mOsm/L in 800 mL.
    const single = evaluate({ age: 'adult', route: 'peripheral', weightKg: 70, lines: [
      { product: 'amino-acids-10', amount: 500, unit: 'mL' }, { product: 'dextrose-70', amount: 300, unit: 'mL' },
    ] });
    const q = dextroseProposal(single.suggestions);
    expect(q.notes.join(' ')).toContain('shrinks');
    expect(q.change.field === 'amount' && q.change.unit).toBe('mL');
    const to = q.change.field === 'amount' ? q.change.to : new D(0);
    expect(osmolarityFails(q.order)).toBe(false);
    expect(osmolarityFails(withAmount(q.order, 1, to.plus(10)))).toBe(true);
  });

  it('says when no amount of dextrose can fix the bag', () => {
    const ev = evaluate({ age: 'adult', route: 'peripheral', weightKg: 70, volumeMl: 500, lines: [
      // sodium chloride 23.4% 62.5 mL × 8.008 = 500.5 mOsm in 500 mL: 1001 mOsm/L before any dextrose.
      { product: 'sodium-chloride-4', amount: 250, unit: 'mEq' }, { product: 'dextrose-70', amount: 20, unit: 'g' }, { product: 'sterile-water', fill: true },
    ] });
    const s = ev.suggestions.find((x) => x.kind === 'dextrose');
    expect(s?.status).toBe('unavailable');
    expect(s?.message).toContain('Even with no dextrose');
    const zero = evaluate({ age: 'adult', route: 'peripheral', weightKg: 70, volumeMl: 500, lines: [
      { product: 'sodium-chloride-4', amount: 250, unit: 'mEq' }, { product: 'dextrose-70', amount: 0, unit: 'g' }, { product: 'sterile-water', fill: true },
    ] });
    expect(zero.suggestions.find((x) => x.kind === 'dextrose')?.message).toContain('already at zero');
  });
});
