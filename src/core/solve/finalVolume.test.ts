import { describe, expect, it } from 'vitest';
import { D } from '../decimal.ts';
import type { Proposal, Suggestion } from './suggestion.ts';
import { evaluate, orderOf, type OrderSpec, HELD_ADULT_PERIPHERAL, osmolarityFails } from '../../../test/helpers/orders.ts';

function volumeProposal(suggestions: Suggestion[]): Proposal {
  const s = suggestions.find((x) => x.kind === 'final-volume');
  if (s?.status !== 'proposal') throw new Error(`no final-volume proposal: ${JSON.stringify(s)}`);
  return s;
}

// An adult peripheral 3-in-1 with 250 g dextrose. With the catalog's label values (dextrose 70%
// 3532 mOsm/L, amino acids 10% 840, lipid emulsion 20% 260, sodium chloride 23.4% 8008, potassium
// chloride 4000, potassium phosphates 7.4/mL, magnesium sulfate 4060, calcium gluconate 680,
// multivitamin 4.11/mL, trace elements 0.36/mL) the label sum is 2298.6 mOsm: 1149.3 mOsm/L in
// 2000 mL, over ASPEN 2014's 900. 2298.6 ÷ 0.9 = 2554 mL, rounded up to the 10 mL step: 2560.
const spec: OrderSpec = HELD_ADULT_PERIPHERAL;

describe('final-volume suggestion', () => {
  const e = evaluate(spec);
  const p = volumeProposal(e.suggestions);

  it('starts from a bag over the limit', () => {
    expect(e.bag.osmolarity.reported.toDecimalPlaces(1).toNumber()).toBe(1149.3);
  });

  it('proposes 2560 mL: the limit is met after rounding up, and one 10 mL step less fails', () => {
    expect(p.change).toMatchObject({ field: 'volumeMl', to: new D(2560), from: new D(2000), addsFillLine: null });
    expect(osmolarityFails(p.order)).toBe(false);
    expect(p.after.osmolarity.lte(900)).toBe(true);
    expect(osmolarityFails({ ...p.order, volumeMl: new D(2550) })).toBe(true);
    expect(p.passesOsmolarity).toBe(true);
  });

  it('reports its consequences: fluid 29.4 → 37.6 mL/kg/day, energy unchanged, and what appears or clears', () => {
    expect(p.before.fluidMlPerKgPerDay.toDecimalPlaces(1).toNumber()).toBe(29.4);
    expect(p.after.fluidMlPerKgPerDay.toDecimalPlaces(1).toNumber()).toBe(37.6);
    expect(p.after.kcal.eq(p.before.kcal)).toBe(true);
    expect(p.disappears.map((f) => f.code)).toContain('osmolarity-peripheral');
    // Diluting the 3-in-1 takes it under the ASPEN 2014 minimums (amino acids 3.1%, dextrose 9.8%, lipid 1.95%).
    expect(p.appears.map((f) => f.nutrient)).toEqual(['amino-acids', 'dextrose', 'lipid']);
    expect(p.message).toContain('2560 mL');
  });

  it('is never applied: the evaluated order keeps its volume', () => {
    expect(e.order.volumeMl?.toNumber()).toBe(2000);
    expect(e.report.suggestions?.[0]).toMatchObject({ kind: 'final-volume', status: 'proposal', applied: false, change: { field: 'volumeMl', to: 2560 } });
  });

  it('re-checks the dose ranges: for 50 kg, 2560 mL is over the 40 mL/kg/day adult fluid range (common practice)', () => {
    const small = volumeProposal(evaluate({ ...spec, weightKg: 50 }).suggestions);
    expect(small.appears.map((f) => f.nutrient)).toContain('fluid');
    expect(small.after.fluidMlPerKgPerDay.toNumber()).toBe(51.2);
  });

  it('without a fill line it says the volume needs one, and adds the water stock as the fill', () => {
    const { volumeMl: _ordered, ...rest } = spec;
    const noFill: OrderSpec = { ...rest, lines: spec.lines.slice(0, -1) };
    const ev = evaluate(noFill);
    const q = volumeProposal(ev.suggestions);
    expect(q.change).toMatchObject({ field: 'volumeMl', from: null, addsFillLine: 'sterile-water' });
    expect(q.notes.join(' ')).toContain('no fill line');
    expect(q.order.lines.at(-1)).toMatchObject({ kind: 'fill', product: { id: 'sterile-water' } });
    expect(osmolarityFails(q.order)).toBe(false);
    const step = new D(10);
    const to = q.change.field === 'volumeMl' ? q.change.to : new D(0);
    expect(osmolarityFails({ ...q.order, volumeMl: to.minus(step) })).toBe(true);
  });

  it('rounds to the neonatal 1 mL step (policy solver.volumeStepMl)', () => {
    const ev = evaluate({ age: 'preterm-neonate', route: 'peripheral', weightKg: 1, volumeMl: 100, lines: [
      // dextrose 50% 28 mL × 2.523 + amino acids 10% 30 mL × 0.84 = 95.8 mOsm in 100 mL: 958 mOsm/L
      { product: 'dextrose-50', amount: 14, unit: 'g/kg' }, { product: 'amino-acids-10', amount: 3, unit: 'g/kg' },
      { product: 'sterile-water', fill: true },
    ] });
    const q = volumeProposal(ev.suggestions);
    const to = q.change.field === 'volumeMl' ? q.change.to : new D(0);
    expect(to.isInteger()).toBe(true);
    expect(osmolarityFails(q.order)).toBe(false);
    expect(osmolarityFails({ ...q.order, volumeMl: to.minus(1) })).toBe(true);
  });

  it('cannot help when the fill stock itself is over the limit (dextrose 50%: 2523 mOsm/L, label)', () => {
    const ev = evaluate({ age: 'adult', route: 'peripheral', weightKg: 70, volumeMl: 1000, lines: [
      { product: 'amino-acids-10', amount: 50, unit: 'g' }, { product: 'dextrose-50', fill: true },
    ] });
    const s = ev.suggestions.find((x) => x.kind === 'final-volume');
    expect(s?.status).toBe('unavailable');
    expect(s?.message).toContain('fill stock');
  });

  it('makes no suggestion for a peripheral bag that passes', () => {
    const ok = evaluate({ ...spec, lines: spec.lines.map((l) => (l.product === 'dextrose-70' ? { ...l, amount: 100 } : l)) });
    expect(ok.suggestions).toEqual([]);
    expect(ok.report.suggestions).toBeUndefined();
  });

  it('the order given to evaluate is the same catalog-bound order', () => {
    expect(p.order.lines[1]?.product).toBe(orderOf(spec).lines[1]?.product);
  });
});
