import { describe, expect, test } from 'vitest';
import { labelAmount } from './labelAmount.ts';
import { checkOrder } from './evaluate.ts';
import { DEFAULT_CATALOG, DEFAULT_POLICY } from '../defaults.ts';

// Stock compositions from their US labels (field guide §0 and §6.1): potassium phosphates 3 mmol P +
// 4.4 mEq K per mL (D7); sodium phosphates 3 mmol P + 4 mEq Na per mL (D6); calcium gluconate 10%
// 0.465 mEq Ca per mL (D8, ASHP Handbook); lipid emulsion 20% = 20 g oil per 100 mL; sodium
// glycerophosphate 1 mmol P + 2 mmol Na per mL (D11).

function lineOf(order: Record<string, unknown>, line: Record<string, unknown>, weightKg = 70) {
  const r = checkOrder({ id: 'L-1', patient: { id: 'P', weightKg, ageGroup: weightKg < 10 ? 'preterm-neonate' : 'adult' }, route: 'central', volumeMl: 1000, ...order, lines: [line, { product: 'sterile-water', fill: true }] }, DEFAULT_CATALOG, DEFAULT_POLICY);
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  const l = r.value.report.lines[0];
  if (!l) throw new Error('no line');
  return { line: l, product: DEFAULT_CATALOG.byId.get(l.product), weight: r.value.report.patient.weightKg, report: r.value.report };
}

describe('labelAmount', () => {
  test('potassium phosphates ordered in mmol P: 15 mmol phosphate, bringing 22 mEq K', () => {
    const { line, product, weight } = lineOf({}, { product: 'potassium-phosphates-3', amount: 15, unit: 'mmol', species: 'phosphate' });
    const a = labelAmount(line, product, weight);
    expect(a?.amount).toMatchObject({ perDay: 15, unit: 'mmol', species: 'phosphate' });
    expect(a?.ordered).toBeNull();
    expect(a?.includes).toMatchObject({ perDay: 22, unit: 'mEq', species: 'K' });
  });

  test('potassium phosphates ordered as 22 mEq K is labelled as its phosphate: 15 mmol', () => {
    const { line, product, weight } = lineOf({}, { product: 'potassium-phosphates-3', amount: 22, unit: 'mEq', species: 'K' });
    const a = labelAmount(line, product, weight);
    expect(a?.amount).toMatchObject({ perDay: 15, unit: 'mmol', species: 'phosphate' });
    expect(a?.ordered).toMatchObject({ perDay: 22, unit: 'mEq', species: 'K' });
  });

  test('sodium phosphates ordered as 5 mL: 15 mmol phosphate and 20 mEq Na', () => {
    const { line, product, weight } = lineOf({}, { product: 'sodium-phosphates-3', amount: 5, unit: 'mL' });
    const a = labelAmount(line, product, weight);
    expect(a?.amount).toMatchObject({ perDay: 15, unit: 'mmol' });
    expect(a?.includes).toMatchObject({ perDay: 20, unit: 'mEq', species: 'Na' });
    expect(a?.ordered).toMatchObject({ perDay: 5, unit: 'mL' });
  });

  test('lipid emulsion 20% ordered as 250 mL is labelled 50 g', () => {
    const { line, product, weight } = lineOf({}, { product: 'lipid-20', amount: 250, unit: 'mL' });
    expect(labelAmount(line, product, weight)).toMatchObject({ amount: { perDay: 50, unit: 'g' }, ordered: { perDay: 250, unit: 'mL' } });
  });

  test('calcium gluconate 10% ordered as 20 mL is labelled 9.3 mEq Ca', () => {
    const { line, product, weight } = lineOf({}, { product: 'calcium-gluconate-10', amount: 20, unit: 'mL' });
    expect(labelAmount(line, product, weight)?.amount).toMatchObject({ perDay: 9.3, unit: 'mEq', species: 'Ca' });
  });

  test('per kg for a 1.1 kg neonate: sodium glycerophosphate 1.5 mmol/kg is 1.65 mmol/day with 3.3 mEq Na', () => {
    const { line, product, weight } = lineOf({}, { product: 'sodium-glycerophosphate-1', amount: '1.5', unit: 'mmol/kg' }, 1.1);
    const a = labelAmount(line, product, weight);
    expect(a?.amount).toMatchObject({ perDay: 1.65, perKgPerDay: 1.5, unit: 'mmol', species: 'glycerophosphate' });
    expect(a?.includes).toMatchObject({ perDay: 3.3, perKgPerDay: 3, unit: 'mEq', species: 'Na' });
  });

  test('salts ordered in mEq or mmol of their cation stay as ordered', () => {
    const na = lineOf({}, { product: 'sodium-chloride-4', amount: 60, unit: 'mEq' });
    expect(labelAmount(na.line, na.product, na.weight)).toEqual({ amount: { perDay: 60, perKgPerDay: 0.8571, unit: 'mEq', species: 'Na' }, ordered: null, includes: null });
    const ca = lineOf({}, { product: 'calcium-gluconate-10', amount: 2, unit: 'mmol/kg', species: 'Ca' }, 1.1);
    expect(labelAmount(ca.line, ca.product, ca.weight)?.amount).toEqual({ perDay: 2.2, perKgPerDay: 2, unit: 'mmol', species: 'Ca' });
  });

  test('the fill water has no label amount; an unknown product is shown as ordered', () => {
    const { report } = lineOf({}, { product: 'multivitamin-adult', amount: 10, unit: 'mL' });
    const water = report.lines[1];
    expect(water && labelAmount(water, DEFAULT_CATALOG.byId.get(water.product), 70)).toBeNull();
    const mvi = report.lines[0];
    expect(mvi && labelAmount(mvi, undefined, 70)).toEqual({ amount: { perDay: 10, perKgPerDay: 0.1429, unit: 'mL', species: null }, ordered: null, includes: null });
  });
});
