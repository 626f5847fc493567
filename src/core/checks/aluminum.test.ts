import { describe, expect, it } from 'vitest';
import { DEFAULT_POLICY } from '../../defaults.ts';
import { aluminum } from './aluminum.ts';
import { AGES, bagOf } from '../../../test/helpers/orders.ts';

// 21 CFR 201.323: more than 4-5 µg/kg/day accumulates; the policy flags at or above 5.
// The shipped catalog's calcium gluconate 10% carries 5000 µg/L (from memory; replace with the
// vial's label): 1 mL for a 1 kg patient = 5 µg/kg/day.
describe('aluminum', () => {
  describe.each(AGES)('%s', (age) => {
    it.each([
      ['1', 'warn'], ['1.002', 'warn'], ['0.998', 'info'],
    ])('%s mL calcium gluconate for 1 kg (5 µg/kg/day per mL) is %s', (mL, severity) => {
      const bag = bagOf({ age, weightKg: 1, lines: [{ product: 'calcium-gluconate-10', amount: mL, unit: 'mL' }] });
      const findings = aluminum(bag, DEFAULT_POLICY);
      expect(findings).toHaveLength(1);
      expect(findings[0]?.severity).toBe(severity);
      expect(findings[0]?.limit?.toNumber()).toBe(5);
      expect(findings[0]?.source).toContain('21 CFR 201.323');
    });
  });

  it('sums each stock\'s µg/L × volume ÷ weight and names the top contributors', () => {
    // 21 CFR 201.323(a): large-volume parenterals ≤ 25 µg/L. 100 mL dextrose 10% = 2.5 µg; 10 mL potassium phosphates
    // at 25000 µg/L (from memory) = 250 µg; 5 mL calcium gluconate = 25 µg → 277.5 µg for 2 kg = 138.75 µg/kg/day.
    const bag = bagOf({ age: 'term-neonate', weightKg: 2, lines: [
      { product: 'dextrose-10', amount: 100, unit: 'mL' },
      { product: 'potassium-phosphates-3', amount: 10, unit: 'mL' },
      { product: 'calcium-gluconate-10', amount: 5, unit: 'mL' },
      { product: 'sodium-chloride-4', amount: 1, unit: 'mL' },
    ] });
    const [f] = aluminum(bag, DEFAULT_POLICY);
    expect(f?.value?.toNumber()).toBe(138.75);
    expect(f?.message).toMatch(/Largest contributors: Potassium phosphates[^;]* 250\.0 µg \(90%\); Calcium gluconate[^;]* 25\.0 µg \(9%\); Dextrose 10%[^;]* 2\.5 µg \(1%\)/);
    expect(f?.lines).toEqual([1, 2, 0]);
  });

  it('names the three largest contributors, equal ones in the order of their lines', () => {
    // 21 CFR 201.323(a): large-volume parenterals ≤ 25 µg/L: 100 mL dextrose 10% = 2.5 µg. Phosphates at 25000 µg/L and
    // calcium gluconate at 5000 µg/L (from memory): 2 mL sodium phosphates = 50 µg, 10 mL calcium gluconate = 50 µg,
    // 4 mL potassium phosphates = 100 µg; 202.5 µg in all, 100 µg is 49%, 50 µg 25%.
    const bag = bagOf({ age: 'term-neonate', weightKg: 2, lines: [
      { product: 'dextrose-10', amount: 100, unit: 'mL' },
      { product: 'sodium-phosphates-3', amount: 2, unit: 'mL' },
      { product: 'calcium-gluconate-10', amount: 10, unit: 'mL' },
      { product: 'potassium-phosphates-3', amount: 4, unit: 'mL' },
    ] });
    const [f] = aluminum(bag, DEFAULT_POLICY);
    expect(f?.value?.toNumber()).toBe(101.25);
    expect(f?.message).toMatch(/Largest contributors: Potassium phosphates[^;]* 100\.0 µg \(49%\); Sodium phosphates[^;]* 50\.0 µg \(25%\); Calcium gluconate[^;]* 50\.0 µg \(25%\)\./);
    expect(f?.lines).toEqual([3, 1, 2]);
  });

  it('says which stocks have no aluminum value: the figure is then a lower bound', () => {
    const bag = bagOf({ age: 'adult', weightKg: 70, lines: [
      { product: 'calcium-gluconate-10', amount: 10, unit: 'mL' },
      { product: 'sodium-chloride-4', amount: 15, unit: 'mL' },
      { product: 'magnesium-sulfate-50', amount: 4, unit: 'mL' },
    ] });
    const [f] = aluminum(bag, DEFAULT_POLICY);
    expect(f?.severity).toBe('info');
    expect(f?.message).toContain('No aluminum value in the catalog for: Sodium chloride 23.4% injection (4 mEq/mL); Magnesium sulfate 50% injection (4.06 mEq Mg per mL)');
    expect(f?.message).toContain('lower bound');
  });

  it('cannot estimate when no stock in the bag has a value', () => {
    const [f] = aluminum(bagOf({ age: 'adult', weightKg: 70, lines: [{ product: 'sodium-chloride-4', amount: 15, unit: 'mL' }] }), DEFAULT_POLICY);
    expect(f?.value).toBeNull();
    expect(f?.message).toContain('cannot be estimated');
  });
});
