import { describe, expect, it } from 'vitest';
import { DEFAULT_CATALOG } from '../../defaults.ts';
import { D } from '../decimal.ts';
import { makeCatalog, parseCatalog, type Catalog } from '../catalog.ts';
import { pickStock, stocksOf } from './stocks.ts';

function catalog(products: object[]): Catalog {
  const r = parseCatalog({ format: 'osmocount-catalog', version: 1, products });
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return r.value;
}

// Sodium acetate injection comes as 2 and 4 mEq/mL (US labels, field guide §6.1).
const acetate2 = { id: 'na-ac-a', name: 'Sodium acetate injection 2 mEq/mL', role: 'electrolyte', perMl: { Na: 2, acetate: 2 } };
const acetate4 = { id: 'na-ac-b', name: 'Sodium acetate injection 4 mEq/mL', role: 'electrolyte', perMl: { Na: 4, acetate: 4 } };

describe('stocksOf (salts found by composition, never by id)', () => {
  it('finds each salt of the shipped catalog by its species', () => {
    expect(stocksOf(DEFAULT_CATALOG, ['K', 'phosphate']).map((p) => p.id)).toEqual(['potassium-phosphates-3']);
    expect(stocksOf(DEFAULT_CATALOG, ['Na', 'glycerophosphate']).map((p) => p.id)).toEqual(['sodium-glycerophosphate-1']);
    expect(stocksOf(DEFAULT_CATALOG, ['Ca', 'gluconate']).map((p) => p.id)).toEqual(['calcium-gluconate-10']);
    expect(stocksOf(DEFAULT_CATALOG, ['Mg', 'sulfate']).map((p) => p.id)).toEqual(['magnesium-sulfate-50']);
  });

  it('does not take the amino-acid product for sodium acetate, although it holds only Na and acetate', () => {
    // Amino acids 10%: Na 38, acetate 71.8 mEq/L (US label) — a nutrient, not a salt.
    expect(stocksOf(DEFAULT_CATALOG, ['Na', 'acetate']).map((p) => p.id)).toEqual(['sodium-acetate-2']);
  });

  it('works whatever the ids are, and leaves out a "salt" whose charges do not balance', () => {
    const c = catalog([acetate2, { id: 'odd', name: 'Mislabelled sodium chloride', role: 'electrolyte', perMl: { Na: 4, Cl: 3 } }]);
    expect(stocksOf(c, ['Na', 'acetate']).map((p) => p.id)).toEqual(['na-ac-a']);
    expect(stocksOf(c, ['Na', 'Cl'])).toEqual([]);
  });
});

describe('pickStock', () => {
  const c = catalog([acetate2, acetate4]);
  const stocks = stocksOf(c, ['Na', 'acetate']);
  const smallest = new D('0.1');

  it('takes the most concentrated stock when its volume is measurable', () => {
    // 20 mEq: 5 mL of 4 mEq/mL.
    expect(pickStock(stocks, 'Na', new D(20), smallest)?.id).toBe('na-ac-b');
  });

  it('takes a more dilute stock when the concentrated one would need less than the smallest measurable volume', () => {
    // 0.3 mEq: 0.075 mL of 4 mEq/mL (< 0.1 mL) but 0.15 mL of 2 mEq/mL.
    expect(pickStock(stocks, 'Na', new D('0.3'), smallest)?.id).toBe('na-ac-a');
    // 0.1 mEq: neither is measurable; the most dilute gives the largest volume (0.05 mL).
    expect(pickStock(stocks, 'Na', new D('0.1'), smallest)?.id).toBe('na-ac-a');
  });

  it('returns null when there is no stock', () => {
    expect(pickStock(stocksOf(makeCatalog([]), ['K', 'Cl']), 'K', new D(10), smallest)).toBeNull();
  });
});
