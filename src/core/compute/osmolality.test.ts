import { describe, expect, it } from 'vitest';
import { D } from '../decimal.ts';
import { osmoticCoefficientEstimate, pereiraDaSilvaEstimate, predictOsmolality } from './osmolality.ts';
import { bagOf, evaluate } from '../../../test/helpers/orders.ts';
import { reportSchema } from '../report.ts';

describe('osmotic-coefficient estimate', () => {
  it('0.9% sodium chloride: 308 ideal mOsm/L × φ 0.93 ≈ 286 (field guide §1.1, UBC coefficient table)', () => {
    // 38.5 mL of 4 mmol/mL sodium chloride = 154 mmol Na + 154 mmol Cl in 1000 mL.
    const bag = bagOf({ age: 'adult', weightKg: 70, volumeMl: 1000, lines: [
      { product: 'sodium-chloride-4', amount: '38.5', unit: 'mL' }, { product: 'sterile-water', fill: true },
    ] });
    const e = osmoticCoefficientEstimate(bag);
    expect(e.value.toDecimalPlaces(2).toNumber()).toBe(286.44);
    expect(e.notes.join(' ')).not.toContain('counted as ideal');
  });

  it('two lines of the same salt count as one line of their sum (φ × x + φ × y = φ × (x + y))', () => {
    // 10 mL + 28.5 mL of sodium chloride 4 mmol/mL: 154 mmol Na + 154 mmol Cl in 1000 mL, as above → 286.44.
    const bag = bagOf({ age: 'adult', weightKg: 70, volumeMl: 1000, lines: [
      { product: 'sodium-chloride-4', amount: 10, unit: 'mL' }, { product: 'sodium-chloride-4', amount: '28.5', unit: 'mL' },
      { product: 'sterile-water', fill: true },
    ] });
    expect(osmoticCoefficientEstimate(bag).value.toString()).toBe('286.44');
  });

  it('glucose counts at φ 1.01 and magnesium sulfate at 0.58 (table values)', () => {
    // dextrose 10%: 1000 mL × 0.1 g/mL × 5.046 mOsm/g = 504.6 ideal → × 1.01 = 509.646.
    const dextrose = bagOf({ age: 'adult', weightKg: 70, lines: [{ product: 'dextrose-10', amount: 1000, unit: 'mL' }] });
    expect(osmoticCoefficientEstimate(dextrose).value.toNumber()).toBe(509.646);
    // 10 mL magnesium sulfate 50% (2.03 + 2.03 mmol/mL) in 1000 mL: 40.6 ideal → × 0.58 = 23.548.
    const mg = bagOf({ age: 'adult', weightKg: 70, volumeMl: 1000, lines: [
      { product: 'magnesium-sulfate-50', amount: 10, unit: 'mL' }, { product: 'sterile-water', fill: true },
    ] });
    expect(osmoticCoefficientEstimate(mg).value.toNumber()).toBe(23.548);
  });

  it('splits a stock into its nutrient and its ions: each part at its own φ (UBC coefficient table)', () => {
    // 1000 mL (catalog per-mL figures): amino acids 10% 500 mL = 0.1 g/mL × 7.302 mOsm/g × 500 = 365.1 (ideal)
    // + its Na 0.038 and acetate 0.0718 mmol/mL × 500 = 54.9 (no salt in the table: ideal); dextrose 50%
    // 200 mL = 0.5 × 5.046 × 200 = 504.6 × 1.01 = 509.646; lipid 20% 100 mL: glycerol 0.2443 × 100 = 24.43
    // (ideal; the fat itself adds none); sodium chloride 10 mL = (4 + 4) × 10 = 80 × 0.93 = 74.4.
    // 365.1 + 54.9 + 509.646 + 24.43 + 74.4 = 1028.476 mOsm in 1 L.
    const bag = bagOf({ age: 'adult', weightKg: 70, volumeMl: 1000, lines: [
      { product: 'amino-acids-10', amount: 500, unit: 'mL' }, { product: 'dextrose-50', amount: 200, unit: 'mL' },
      { product: 'lipid-20', amount: 100, unit: 'mL' }, { product: 'sodium-chloride-4', amount: 10, unit: 'mL' },
      { product: 'sterile-water', fill: true },
    ] });
    const e = osmoticCoefficientEstimate(bag);
    expect(e.value.toString()).toBe('1028.476');
    expect(e.notes[1]).toBe('No coefficient in the table, counted as ideal (φ = 1): Amino acids 10% injection (without added electrolytes); Lipid injectable emulsion 20% (soybean oil).');
  });

  it('names the stocks it had no coefficient for (counted as ideal)', () => {
    const bag = bagOf({ age: 'adult', weightKg: 70, lines: [
      { product: 'amino-acids-10', amount: 500, unit: 'mL' }, { product: 'calcium-gluconate-10', amount: 10, unit: 'mL' },
    ] });
    expect(osmoticCoefficientEstimate(bag).notes.join(' ')).toContain('Amino acids 10% injection (without added electrolytes); Calcium gluconate 10% injection');
  });

  it('names the stocks counted as ideal in line order, once per line, for each bag on its own', () => {
    const aa = { product: 'amino-acids-10', amount: 500, unit: 'mL' as const };
    const ca = { product: 'calcium-gluconate-10', amount: 10, unit: 'mL' as const };
    const note = (lines: typeof aa[]) => osmoticCoefficientEstimate(bagOf({ age: 'adult', weightKg: 70, lines })).notes[1];
    const prefix = 'No coefficient in the table, counted as ideal (φ = 1): ';
    const A = 'Amino acids 10% injection (without added electrolytes)';
    const C = 'Calcium gluconate 10% injection (0.465 mEq Ca per mL)';
    const both = `${prefix}${A}; ${C}.`;
    expect(note([aa, ca])).toBe(both);
    expect(note([aa])).toBe(`${prefix}${A}.`);
    expect(note([ca, aa])).toBe(`${prefix}${C}; ${A}.`);
    expect(note([aa, ca, ca])).toBe(`${prefix}${A}; ${C}; ${C}.`);
    expect(note([aa, ca])).toBe(both);
  });
});

describe('Pereira-da-Silva 2004 equation (field guide §1.5, from memory)', () => {
  it('AA g/L × 8 + glucose g/L × 7 + Na mmol/L × 2 + P mg/L × 0.2 − 50, glucose as anhydrous', () => {
    // 1000 mL: amino acids 10% 250 mL (25 g/L; its label Na 0.038 mmol/mL → 9.5 mmol/L),
    // dextrose 50% 200 mL (100 g hydrous = 100 × 180.16/198.17 = 90.9119... g anhydrous),
    // sodium glycerophosphate 10 mL (10 mmol P = 309.74 mg; 20 mmol Na).
    const bag = bagOf({ age: 'preterm-neonate', weightKg: 1, volumeMl: 1000, lines: [
      { product: 'amino-acids-10', amount: 250, unit: 'mL' },
      { product: 'dextrose-50', amount: 200, unit: 'mL' },
      { product: 'sodium-glycerophosphate-1', amount: 10, unit: 'mL' },
      { product: 'sterile-water', fill: true },
    ] });
    const glucose = new D(100).times('180.16').div('198.17');
    const expected = new D(25).times(8).plus(glucose.times(7)).plus(new D('29.5').times(2)).plus(new D('309.74').times('0.2')).minus(50);
    const e = pereiraDaSilvaEstimate(bag);
    expect(e?.value.toDecimalPlaces(6).toString()).toBe(expected.toDecimalPlaces(6).toString());
    // 200 + 636.38 + 59 + 61.95 − 50 = 907.33
    expect(e?.value.toDecimalPlaces(1).toNumber()).toBe(907.3);
    expect(e?.status).toContain('from memory');
  });

  it('is offered for neonatal bags only, and both estimates carry the under-estimate note', () => {
    const spec = { weightKg: 3, volumeMl: 100, lines: [{ product: 'dextrose-10', amount: 100, unit: 'mL' as const }] };
    expect(predictOsmolality(bagOf({ ...spec, age: 'term-neonate' }))?.estimates.map((x) => x.method)).toEqual(['osmotic-coefficient', 'pereira-da-silva-2004']);
    expect(predictOsmolality(bagOf({ ...spec, age: 'child' }))?.estimates.map((x) => x.method)).toEqual(['osmotic-coefficient']);
    expect(predictOsmolality(bagOf({ ...spec, age: 'adult' }))?.note).toContain('under-estimates measured osmolality');
  });

  it('says when the bag holds lipid, which the equation was not fitted on', () => {
    const bag = bagOf({ age: 'preterm-neonate', weightKg: 1, lines: [
      { product: 'dextrose-10', amount: 100, unit: 'mL' }, { product: 'lipid-20', amount: 10, unit: 'mL' },
    ] });
    expect(pereiraDaSilvaEstimate(bag)?.notes.join(' ')).toContain('lipid');
  });
});

describe('information.predictedOsmolality in the report', () => {
  it('is present, labelled as estimates with sources, and valid against the report schema', () => {
    const e = evaluate({ age: 'preterm-neonate', weightKg: '1.1', volumeMl: 154, lines: [
      { product: 'amino-acids-10', amount: '3.5', unit: 'g/kg' }, { product: 'dextrose-50', amount: 12, unit: 'g/kg' },
      { product: 'sterile-water', fill: true },
    ] });
    const p = e.report.information.predictedOsmolality;
    expect(p?.estimates).toHaveLength(2);
    expect(p?.estimates.every((x) => x.source.length > 0 && x.status.length > 0 && x.unit === 'mOsm/kg')).toBe(true);
    expect(reportSchema.safeParse(e.report).success).toBe(true);
  });
});
