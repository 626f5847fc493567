import { describe, expect, test } from 'vitest';
import { labelFit, textWidthPt, type LabelParts } from './labelFit.ts';
import type { IngredientRow } from './model.ts';

const row = (name: string, perDay: string, note: string | null = null, perKg: string | null = null): IngredientRow =>
  ({ group: 'electrolytes', groupText: 'Electrolytes', name, perKg, perDay, note });
const parts = (ingredients: IngredientRow[], over: Partial<LabelParts> = {}): LabelParts =>
  ({ patientName: 'Ada Quillfeather (fictional)', emphaticRoute: false, threeInOne: false, hold: false, ingredients, ...over });
const inch = (w: number, h: number) => ({ id: 'custom', width: w, height: h, unit: 'in' as const });

describe('textWidthPt', () => {
  test('sums DejaVu Sans advances: digits are 0.636 em, a space 0.318 em; bold is wider', () => {
    expect(textWidthPt('10', 10)).toBeCloseTo(12.72, 2);
    expect(textWidthPt(' ', 10)).toBeCloseTo(3.18, 2);
    expect(textWidthPt('mEq', 10, true)).toBeGreaterThan(textWidthPt('mEq', 10));
  });
});

describe('labelFit', () => {
  const ten = Array.from({ length: 10 }, (_, i) => row(`Salt number ${i}`, `${i + 1}0 mEq/day`));

  test('the regular layout on a 4 × 6 in label, the compact one on 4 × 4 in', () => {
    expect(labelFit(parts(ten), inch(4, 6))).toMatchObject({ compact: false, fits: true });
    expect(labelFit(parts(ten), inch(4, 4))).toMatchObject({ compact: true, fits: true });
  });

  test('more rows, notes, a two-line name, the central-line banner and a hold banner all take room', () => {
    const base = labelFit(parts(ten), inch(4, 6)).estimatePx;
    expect(labelFit(parts([...ten, row('Extra', '1 mL/day')]), inch(4, 6)).estimatePx).toBeGreaterThan(base);
    expect(labelFit(parts(ten.map((r) => ({ ...r, note: 'as phosphate, with 22 mEq/day K' }))), inch(4, 6)).compact).toBe(true);
    expect(labelFit(parts(ten, { patientName: 'Alexandra Quillfeather-Montgomery of Marren Point (fictional)' }), inch(4, 6)).estimatePx).toBeGreaterThan(base);
    expect(labelFit(parts(ten, { emphaticRoute: true, hold: true }), inch(4, 6)).estimatePx).toBeGreaterThan(base);
  });

  test('a long child order does not fit 4 × 4 in and says so; 4 × 6 in takes it', () => {
    const kids = Array.from({ length: 15 }, (_, i) => row(`Potassium phosphates ${i}`, '1.65 mmol/day', 'as phosphate, with 3 mEq/kg/day K', '1.5 mmol/kg/day'));
    expect(labelFit(parts(kids), inch(4, 4))).toMatchObject({ compact: true, fits: false });
    expect(labelFit(parts(kids), inch(4, 6)).fits).toBe(true);
  });

  test('millimetre sizes are converted (100 × 150 mm is 5.9 in tall)', () => {
    expect(labelFit(parts(ten), { id: 'custom', width: 100, height: 150, unit: 'mm' }).pagePx).toBe(Math.round((150 / 25.4) * 96 - 4));
  });
});
