import { describe, expect, it } from 'vitest';
import { DEFAULT_CATALOG } from '../../defaults.ts';
import { product } from '../../../test/support/build.ts';
import { stockFigures } from './stock.ts';

function stock(id: string) {
  const p = DEFAULT_CATALOG.byId.get(id);
  if (!p) throw new Error(`no ${id} in the catalog`);
  return p;
}

describe('stockFigures', () => {
  it('potassium phosphates injection holds potassium and phosphate (label: 4.4 mEq K and 3 mmol P per mL), nothing else', () => {
    const p = stock('potassium-phosphates-3');
    expect([...stockFigures(p).holds].sort()).toEqual(['K', 'phosphate']);
    expect(stockFigures(p).holds.has('K')).toBe(true);
    expect(stockFigures(p).holds.has('Na')).toBe(false);
    expect(stockFigures(p).perMl.map(([s, v]) => [s, v.toNumber()])).toEqual([['K', 4.4], ['phosphate', 3]]);
  });

  it('takes the labelled kcal per mL: lipid emulsion 20%, 2.0 kcal/mL (US labels)', () => {
    expect(stockFigures(stock('lipid-20')).kcalPerMl?.toNumber()).toBe(2);
  });

  it('without a labelled kcal per mL, works it out from the nutrient: dextrose 3.4 kcal/g × 0.7 g/mL = 2.38 kcal/mL (US label)', () => {
    const d70 = product({ id: 'dextrose-70', role: 'dextrose', nutrient: { gramsPerMl: '0.7', mOsmPerGram: '5.046', kcalPerGram: '3.4' } });
    expect(stockFigures(d70).kcalPerMl?.toString()).toBe('2.38');
    expect(stockFigures(product({ id: 'water', role: 'water' })).kcalPerMl).toBeNull();
  });

  it('gives the nutrient\'s own particles: dextrose 70% at 5.046 mOsm/g → 3.5322 mOsm/mL (label 3532 mOsm/L)', () => {
    expect(stockFigures(stock('dextrose-70')).nutrientMOsmPerMl.toString()).toBe('3.5322');
    expect(stockFigures(stock('sodium-chloride-4')).nutrientMOsmPerMl.isZero()).toBe(true);
  });

  it('gives aluminum per mL when µg/L ÷ 1000 is exact: 25 µg/L (the 21 CFR 201.323 large-volume limit) → 0.025 µg/mL', () => {
    expect(stockFigures(stock('dextrose-70')).aluminumMcgPerMl?.toString()).toBe('0.025');
    expect(stockFigures(stock('sodium-chloride-4')).aluminumMcgPerMl).toBeNull();
    // 30 significant digits: ÷ 1000 would round at 28, so there is no per-mL figure and the bag divides after multiplying.
    const long = product({ id: 'long', aluminumMcgPerL: '25.0000000000000000000000000001' });
    expect(stockFigures(long).aluminumMcgPerMl).toBeNull();
  });

  it('works each product out once: a second read gives the same figures', () => {
    const p = stock('calcium-gluconate-10');
    expect(stockFigures(p)).toBe(stockFigures(p));
  });
});
