import { describe, expect, test } from 'vitest';
import { checkOrder } from '../../core/evaluate.ts';
import { DEFAULT_CATALOG, DEFAULT_POLICY } from '../../defaults.ts';
import { labelIngredients, labelName } from './ingredients.ts';

describe('labelName', () => {
  test('the generic name without strength, dosage form and details', () => {
    expect(labelName('Sodium chloride 23.4% injection (4 mEq/mL)', 'electrolyte')).toBe('Sodium chloride');
    expect(labelName('Potassium chloride injection concentrate 2 mEq/mL', 'electrolyte')).toBe('Potassium chloride');
    expect(labelName('Amino acids 15% injection, pharmacy bulk package (without added electrolytes)', 'amino-acids')).toBe('Amino acids');
    expect(labelName('Dextrose 70% injection', 'dextrose')).toBe('Dextrose');
    expect(labelName('Multiple vitamins injection, adult (10 mL daily dose)', 'additive')).toBe('Multiple vitamins, adult');
    expect(labelName('Lipid injectable emulsion 20% (soybean oil)', 'lipid')).toBe('Lipid emulsion (soybean oil)');
    expect(labelName('Heparin', 'additive')).toBe('Heparin');
  });
});

describe('labelIngredients', () => {
  test('the label sequence of field guide §8.1 (ASPEN): macronutrients, salts by cation then anion, vitamins, trace elements; no water', () => {
    // Lines deliberately out of order.
    const r = checkOrder({
      id: 'SEQ-1', patient: { id: 'P', weightKg: 70, ageGroup: 'adult' }, route: 'central', volumeMl: 2500,
      lines: [
        { product: 'trace-elements-adult', amount: 1, unit: 'mL' },
        { product: 'calcium-gluconate-10', amount: 10, unit: 'mEq' },
        { product: 'sterile-water', fill: true },
        { product: 'potassium-phosphates-3', amount: 15, unit: 'mmol', species: 'phosphate' },
        { product: 'lipid-20', amount: 250, unit: 'mL' },
        { product: 'multivitamin-adult', amount: 10, unit: 'mL' },
        { product: 'magnesium-sulfate-50', amount: 16, unit: 'mEq' },
        { product: 'dextrose-70', amount: 300, unit: 'g' },
        { product: 'potassium-chloride-2', amount: 40, unit: 'mEq' },
        { product: 'sodium-acetate-2', amount: 40, unit: 'mEq' },
        { product: 'amino-acids-10', amount: 100, unit: 'g' },
        { product: 'sodium-phosphates-3', amount: 10, unit: 'mmol', species: 'phosphate' },
        { product: 'sodium-chloride-4', amount: 60, unit: 'mEq' },
      ],
    }, DEFAULT_CATALOG, DEFAULT_POLICY);
    if (!r.ok) throw new Error(JSON.stringify(r.problems));
    const list = labelIngredients(r.value.report, DEFAULT_CATALOG);
    expect(list.map((i) => `${i.group}: ${i.name}`)).toEqual([
      'macronutrients: Amino acids',
      'macronutrients: Dextrose',
      'macronutrients: Lipid emulsion (soybean oil)',
      'electrolytes: Sodium chloride',
      'electrolytes: Sodium acetate',
      'electrolytes: Sodium phosphates',
      'electrolytes: Potassium chloride',
      'electrolytes: Potassium phosphates',
      'electrolytes: Magnesium sulfate',
      'electrolytes: Calcium gluconate',
      'vitamins: Multiple vitamins, adult',
      'trace-elements: Trace elements, adult',
    ]);
    // Lipid 20% is 20 g oil per 100 mL (label): 250 mL → 50 g. Phosphates stay in mmol.
    expect(list[2]?.amount.amount).toMatchObject({ perDay: 50, unit: 'g' });
    expect(list[5]?.amount.amount).toMatchObject({ perDay: 10, unit: 'mmol', species: 'phosphate' });
  });
});
