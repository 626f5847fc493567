import { describe, expect, it } from 'vitest';
import { D } from '../decimal.ts';
import { DEFAULT_POLICY } from '../../defaults.ts';
import type { DoseNutrient } from '../policy.ts';
import type { LineUnit } from '../order.ts';
import { doseRange, doseIn } from './doseRange.ts';
import { bagOf, one, pick, policyWith, type OrderSpec } from '../../../test/helpers/orders.ts';

type Age = OrderSpec['age'];
const WEIGHT: Record<Age, string> = { adult: '50', child: '20', 'term-neonate': '3.5', 'preterm-neonate': '1.2' };

/** An order whose only source of the nutrient delivers `value` in the range's unit. */
function orderAt(age: Age, nutrient: DoseNutrient, value: D, perKg: boolean): OrderSpec {
  const w = WEIGHT[age];
  const unit = (base: 'mL' | 'g' | 'mmol' | 'mEq'): LineUnit => (perKg ? `${base}/kg` : base);
  const line = (product: string, amount: D, u: LineUnit, species?: string) => ({ product, amount: amount.toString(), unit: u, ...(species ? { species } : {}) });
  const base = { age, weightKg: w, route: 'central' as const };
  switch (nutrient) {
    case 'fluid': return { ...base, volumeMl: value.times(w).toString(), lines: [{ product: 'sterile-water', fill: true }] };
    // Lipid emulsion 20% carries 2.0 kcal/mL (US labels, field guide D19): kcal/kg ÷ 2 = mL/kg.
    case 'energy': return { ...base, lines: [line('lipid-20', value.div(2), 'mL/kg')] };
    case 'protein': return { ...base, lines: [line('amino-acids-10', value, 'g/kg')] };
    case 'lipid': return { ...base, lines: [line('lipid-20', value, 'g/kg')] };
    case 'lipidRate': return { ...base, hours: 24, lines: [line('lipid-20', value.times(24), 'g/kg')] };
    case 'Na': return { ...base, lines: [line('sodium-chloride-4', value, unit('mmol'), 'Na')] };
    case 'K': return { ...base, lines: [line('potassium-chloride-2', value, unit('mmol'), 'K')] };
    case 'Ca': return { ...base, lines: [line('calcium-gluconate-10', value, unit(perKg ? 'mmol' : 'mEq'), 'Ca')] };
    case 'Mg': return { ...base, lines: [line('magnesium-sulfate-50', value, unit(perKg ? 'mmol' : 'mEq'), 'Mg')] };
    case 'phosphate': return { ...base, lines: [line('potassium-phosphates-3', value, unit('mmol'), 'phosphate')] };
    case 'npcToN': throw new Error('NPC:N is tested on its own');
  }
}

function severityAt(age: Age, nutrient: DoseNutrient, value: D, perKg: boolean): string | undefined {
  const findings = pick(doseRange(bagOf(orderAt(age, nutrient, value, perKg)), DEFAULT_POLICY), 'dose-range', { nutrient });
  expect(findings.length).toBeLessThanOrEqual(1);
  return findings[0]?.severity;
}

// Each range as the shipped policy writes it, with its source (field guide §5.2–5.4).
const RANGES: { age: Age; nutrient: DoseNutrient; min: string | null; max: string; unit: string; source: string }[] = [
  { age: 'adult', nutrient: 'fluid', min: '25', max: '40', unit: 'mL/kg/day', source: "Harrison's 30 mL/kg/24 h; ESPEN home PN 2020 25-35 mL/kg (span: common practice)" },
  { age: 'adult', nutrient: 'energy', min: '20', max: '35', unit: 'kcal/kg/day', source: 'ESPEN home PN 2020: 20-35 kcal/kg/day' },
  { age: 'adult', nutrient: 'protein', min: '0.8', max: '2', unit: 'g/kg/day', source: 'ESPEN home PN 2020 0.8-1.4; ASPEN/SCCM 2016 1.2-2.0 g/kg/day' },
  { age: 'adult', nutrient: 'lipid', min: null, max: '2.5', unit: 'g/kg/day', source: 'lipid emulsion labels 2.5 g/kg/day (from memory)' },
  { age: 'adult', nutrient: 'lipidRate', min: null, max: '0.125', unit: 'g/kg/h', source: 'lipid emulsion labels 0.11-0.125 g/kg/h (from memory)' },
  { age: 'adult', nutrient: 'Na', min: '1', max: '2', unit: 'mmol/kg/day', source: 'ASPEN Safe Practices 2004 adult table (from memory)' },
  { age: 'adult', nutrient: 'K', min: '1', max: '2', unit: 'mmol/kg/day', source: 'ASPEN Safe Practices 2004 adult table (from memory)' },
  { age: 'adult', nutrient: 'Ca', min: '10', max: '15', unit: 'mEq/day', source: 'ASPEN Safe Practices 2004 adult table (from memory)' },
  { age: 'adult', nutrient: 'Mg', min: '8', max: '20', unit: 'mEq/day', source: 'ASPEN Safe Practices 2004 adult table (from memory)' },
  { age: 'adult', nutrient: 'phosphate', min: '20', max: '40', unit: 'mmol/day', source: 'sodium glycerophosphate monograph: 20-40 mmol/day' },
  { age: 'child', nutrient: 'fluid', min: '50', max: '150', unit: 'mL/kg/day', source: 'ESPGHAN 2018 fluid, span of the age bands (from memory)' },
  { age: 'child', nutrient: 'energy', min: '20', max: '90', unit: 'kcal/kg/day', source: 'ESPGHAN 2018 energy, span of ages and phases (from memory)' },
  { age: 'child', nutrient: 'protein', min: '1', max: '2.5', unit: 'g/kg/day', source: 'ESPGHAN 2018 amino acids (from memory)' },
  { age: 'child', nutrient: 'lipid', min: null, max: '3', unit: 'g/kg/day', source: 'ESPGHAN 2018 lipids: children ≤ 3 g/kg/day' },
  { age: 'child', nutrient: 'lipidRate', min: null, max: '0.13', unit: 'g/kg/h', source: 'Koletzko, Pediatric Nutrition in Practice: 0.08-0.13 g/kg/h' },
  { age: 'child', nutrient: 'Na', min: '1', max: '5', unit: 'mmol/kg/day', source: 'ASPEN 2004 infants/children 2-5; ESPGHAN 2018 1-3 (from memory)' },
  { age: 'child', nutrient: 'K', min: '1', max: '4', unit: 'mmol/kg/day', source: 'ASPEN 2004 infants/children 2-4; ESPGHAN 2018 1-3 (from memory)' },
  { age: 'child', nutrient: 'Ca', min: '0.25', max: '2', unit: 'mmol/kg/day', source: 'ASPEN 2004 infants/children 0.25-2 mmol/kg' },
  { age: 'child', nutrient: 'Mg', min: '0.1', max: '0.25', unit: 'mmol/kg/day', source: 'ASPEN 2004 0.15-0.25; ESPGHAN 2018 0.1 (from memory)' },
  { age: 'child', nutrient: 'phosphate', min: '0.5', max: '2', unit: 'mmol/kg/day', source: 'ASPEN 2004 infants/children 0.5-2 mmol/kg' },
  { age: 'term-neonate', nutrient: 'fluid', min: '40', max: '170', unit: 'mL/kg/day', source: 'ESPGHAN 2018 fluid: term day 1 40-60, stable up to 170' },
  { age: 'term-neonate', nutrient: 'energy', min: '50', max: '120', unit: 'kcal/kg/day', source: 'Bolisetty 2020 Australasian consensus: minimum 50-60, up to 100-120' },
  { age: 'term-neonate', nutrient: 'protein', min: '1.5', max: '3', unit: 'g/kg/day', source: 'ESPGHAN 2018 amino acids, term 1.5-3.0 (from memory)' },
  { age: 'term-neonate', nutrient: 'lipid', min: null, max: '4', unit: 'g/kg/day', source: 'ESPGHAN 2018 lipids: ≤ 4 g/kg/day' },
  { age: 'term-neonate', nutrient: 'lipidRate', min: null, max: '0.17', unit: 'g/kg/h', source: 'Koletzko: infants 0.13-0.17 g/kg/h' },
  { age: 'term-neonate', nutrient: 'Na', min: '2', max: '5', unit: 'mmol/kg/day', source: 'ASPEN 2004 2-5 mEq/kg/day' },
  { age: 'term-neonate', nutrient: 'K', min: '1.5', max: '4', unit: 'mmol/kg/day', source: 'ASPEN 2004 2-4; ESPGHAN 2018 term 1.5-3' },
  { age: 'term-neonate', nutrient: 'Ca', min: '0.25', max: '2', unit: 'mmol/kg/day', source: 'ASPEN 2004 infants/children 0.25-2 mmol/kg' },
  { age: 'term-neonate', nutrient: 'Mg', min: '0.1', max: '0.25', unit: 'mmol/kg/day', source: 'ASPEN 2004 0.15-0.25; ESPGHAN 2018 0.1-0.2 (from memory)' },
  { age: 'term-neonate', nutrient: 'phosphate', min: '0.5', max: '2', unit: 'mmol/kg/day', source: 'ASPEN 2004 0.5-2; sodium phosphates label infants 1.5-2' },
  { age: 'preterm-neonate', nutrient: 'fluid', min: '60', max: '180', unit: 'mL/kg/day', source: 'ESPGHAN 2018 fluid: preterm day 1 60-100, up to 180 by day 5' },
  { age: 'preterm-neonate', nutrient: 'energy', min: '50', max: '120', unit: 'kcal/kg/day', source: 'Bolisetty 2020 Australasian consensus' },
  { age: 'preterm-neonate', nutrient: 'protein', min: '1.5', max: '4', unit: 'g/kg/day', source: 'ESPGHAN 2018 day 1 ≥ 1.5; Bolisetty 2020 up to 4' },
  { age: 'preterm-neonate', nutrient: 'lipid', min: null, max: '4', unit: 'g/kg/day', source: 'ESPGHAN 2018 lipids: ≤ 4 g/kg/day' },
  { age: 'preterm-neonate', nutrient: 'lipidRate', min: null, max: '0.17', unit: 'g/kg/h', source: 'Koletzko: infants 0.13-0.17 g/kg/h' },
  { age: 'preterm-neonate', nutrient: 'Na', min: '2', max: '5', unit: 'mmol/kg/day', source: 'ASPEN 2004 preterm 2-5 mEq/kg/day' },
  { age: 'preterm-neonate', nutrient: 'K', min: '2', max: '5', unit: 'mmol/kg/day', source: 'ASPEN 2004 2-4; ESPGHAN 2018 2-5' },
  { age: 'preterm-neonate', nutrient: 'Ca', min: '0.8', max: '3.5', unit: 'mmol/kg/day', source: 'ESPGHAN 2018 first days 0.8-2.0 (from memory), growing 1.6-3.5' },
  { age: 'preterm-neonate', nutrient: 'Mg', min: '0.1', max: '0.3', unit: 'mmol/kg/day', source: 'ASPEN 2004 0.15-0.25; ESPGHAN 2018 0.1-0.3 (from memory)' },
  { age: 'preterm-neonate', nutrient: 'phosphate', min: '1', max: '3.5', unit: 'mmol/kg/day', source: 'ESPGHAN 2018 first days 1.0-2.0, growing 1.6-3.5' },
];

describe('dose-range', () => {
  describe.each(RANGES)('$age $nutrient $min-$max $unit ($source)', ({ age, nutrient, min, max, unit }) => {
    const perKg = unit.includes('/kg');
    // One step of the precision the dose is shown (and screened) at.
    const eps = new D(nutrient === 'lipidRate' ? '0.001' : nutrient === 'fluid' || nutrient === 'energy' ? '0.1' : '0.01');

    it('the shipped policy holds this range, with its source', () => {
      const f = one(doseRange(bagOf(orderAt(age, nutrient, new D(max), perKg)), DEFAULT_POLICY), 'dose-range', { nutrient });
      expect(f.unit).toBe(unit);
      expect(f.source.length).toBeGreaterThan(20);
    });

    it('at the maximum is information, just under too, just over warns', () => {
      expect(severityAt(age, nutrient, new D(max), perKg)).toBe('info');
      expect(severityAt(age, nutrient, new D(max).minus(eps), perKg)).toBe('info');
      expect(severityAt(age, nutrient, new D(max).plus(eps), perKg)).toBe('warn');
    });

    if (min !== null) {
      it('at the minimum is information, just over too, just under warns', () => {
        expect(severityAt(age, nutrient, new D(min), perKg)).toBe('info');
        expect(severityAt(age, nutrient, new D(min).plus(eps), perKg)).toBe('info');
        expect(severityAt(age, nutrient, new D(min).minus(eps), perKg)).toBe('warn');
      });
    }
  });

  it('one finding per nutrient, each naming its nutrient', () => {
    const bag = bagOf({
      age: 'preterm-neonate', weightKg: '1.1', volumeMl: 154, route: 'central',
      lines: [
        { product: 'amino-acids-10', amount: '3.5', unit: 'g/kg' },
        { product: 'dextrose-50', amount: 12, unit: 'g/kg' },
        { product: 'sodium-glycerophosphate-1', amount: '1.5', unit: 'mmol/kg' },
        { product: 'calcium-gluconate-10', amount: 2, unit: 'mmol/kg', species: 'Ca' },
        { product: 'potassium-acetate-2', amount: 2, unit: 'mEq/kg' },
        { product: 'sterile-water', fill: true },
      ],
    });
    const nutrients = doseRange(bag, DEFAULT_POLICY).map((f) => f.nutrient);
    // No lipid in the bag and no minimum for it: lipid and its rate are not screened.
    expect(nutrients).toEqual(['fluid', 'energy', 'protein', 'Na', 'K', 'Ca', 'Mg', 'phosphate', 'npcToN']);
  });

  it('counts organic phosphate in the phosphate dose (exchange format: glycerophosphate counts in dose totals)', () => {
    const bag = bagOf({ age: 'preterm-neonate', weightKg: 1, route: 'central', lines: [{ product: 'sodium-glycerophosphate-1', amount: 4, unit: 'mmol/kg' }] });
    const f = one(doseRange(bag, DEFAULT_POLICY), 'dose-range', { nutrient: 'phosphate' });
    expect(f.value?.toNumber()).toBe(4);
    expect(f.severity).toBe('warn');
  });

  it('a missing nutrient with a minimum warns (preterm magnesium 0 < 0.1 mmol/kg/day)', () => {
    const bag = bagOf({ age: 'preterm-neonate', weightKg: 1, route: 'central', lines: [{ product: 'dextrose-50', amount: 10, unit: 'g/kg' }] });
    expect(one(doseRange(bag, DEFAULT_POLICY), 'dose-range', { nutrient: 'Mg' }).severity).toBe('warn');
  });

  it('NPC:N is information whatever its value (Royal Marsden manual 150-200:1; 100-200 common)', () => {
    // 62.5 g amino acids = 10 g N (÷ 6.25); lipid 20% at 2.0 kcal/mL: 500 mL = 1000 kcal → 100:1, 495 mL → 99:1.
    const at = (mL: number) => one(doseRange(bagOf({ age: 'adult', weightKg: 70, lines: [
      { product: 'amino-acids-10', amount: '62.5', unit: 'g' }, { product: 'lipid-20', amount: mL, unit: 'mL' },
    ] }), DEFAULT_POLICY), 'dose-range', { nutrient: 'npcToN' });
    expect(at(500).value?.toNumber()).toBe(100);
    expect(at(500).severity).toBe('info');
    expect(at(500).message).toContain('within');
    expect(at(495).severity).toBe('info');
    expect(at(495).message).toContain('below');
  });

  it('converts to the unit the policy writes: 10 mEq calcium a day is 5 mmol (charge 2)', () => {
    const bag = bagOf({ age: 'adult', weightKg: 50, lines: [{ product: 'calcium-gluconate-10', amount: 10, unit: 'mEq', species: 'Ca' }] });
    expect(doseIn(bag, 'Ca', 'mEq/day')?.toDecimalPlaces(10).toNumber()).toBe(10);
    expect(doseIn(bag, 'Ca', 'mmol/day')?.toDecimalPlaces(10).toNumber()).toBe(5);
    expect(doseIn(bag, 'Ca', 'mmol/kg/day')?.toDecimalPlaces(10).toNumber()).toBe(0.1);
    const mmolPolicy = policyWith((p) => { p.doseRanges.Ca.adult = { min: 5, max: '7.5', unit: 'mmol/day', severity: 'warn', source: 'ASPEN 2004 adult 10-15 mEq/day written in mmol (from memory)' }; });
    const f = one(doseRange(bag, mmolPolicy), 'dose-range', { nutrient: 'Ca' });
    expect(f.unit).toBe('mmol/day');
    expect(f.severity).toBe('info');
  });

  it('lipid rate follows the infusion hours: 1.5 g/kg over 12 h is 0.125 g/kg/h (adult label maximum, from memory)', () => {
    const spec = (h: number, g: string): OrderSpec => ({ age: 'adult', weightKg: 60, hours: h, lines: [{ product: 'lipid-20', amount: g, unit: 'g/kg' }] });
    expect(one(doseRange(bagOf(spec(12, '1.5')), DEFAULT_POLICY), 'dose-range', { nutrient: 'lipidRate' }).severity).toBe('info');
    expect(one(doseRange(bagOf(spec(12, '1.52')), DEFAULT_POLICY), 'dose-range', { nutrient: 'lipidRate' }).severity).toBe('warn');
    expect(one(doseRange(bagOf(spec(24, '1.52')), DEFAULT_POLICY), 'dose-range', { nutrient: 'lipidRate' }).severity).toBe('info');
  });
});
