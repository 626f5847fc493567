import { describe, expect, test } from 'vitest';
import { parseCatalog } from './catalog.ts';
import { DEFAULT_FILES } from '../defaults.ts';

function problems(input: unknown): string[] {
  const r = parseCatalog(input);
  return r.ok ? [] : r.problems.map((p) => `${p.path}: ${p.message}`);
}

const good = { format: 'osmocount-catalog', version: 1, products: [{ id: 'nacl-4', name: 'Sodium chloride 23.4% injection', role: 'electrolyte', perMl: { Na: 4, Cl: 4 }, mOsmPerMl: 8.008 }] };

describe('parseCatalog', () => {
  test('the shipped catalog is valid', () => {
    expect(problems(DEFAULT_FILES.catalog)).toEqual([]);
  });

  test('a negative composition is named with its path', () => {
    expect(problems({ ...good, products: [{ ...good.products[0], perMl: { Na: -4, Cl: 4 } }] })).toEqual(['products[0].perMl.Na: must be a number ≥ 0 and ≤ 100']);
  });

  test('an unknown species is an error, not a zero', () => {
    expect(problems({ ...good, products: [{ ...good.products[0], perMl: { Na: 4, Chloride: 4 } }] })[0]).toMatch(/^products\[0\]\.perMl\.Chloride: unknown species "Chloride"/);
  });

  test('a nutrient product needs its nutrient, dextrose needs its basis', () => {
    const out = problems({ ...good, products: [{ id: 'd', name: 'Dextrose', role: 'dextrose' }, { id: 'd2', name: 'Dextrose', role: 'dextrose', nutrient: { gramsPerMl: 0.7, mOsmPerGram: 5.046 } }] });
    expect(out).toEqual(['products[0].nutrient: is required for a dextrose product', 'products[1].nutrient.basis: is required for dextrose: "hydrous" or "anhydrous"']);
  });

  test('duplicate ids and a wrong format are refused', () => {
    expect(problems({ ...good, products: [good.products[0], good.products[0]] })).toEqual(['products[1].id: duplicate id "nacl-4"']);
    expect(problems({ ...good, format: 'something-else' })[0]).toMatch(/^format: /);
  });

  test('orderSpecies must be in the composition', () => {
    expect(problems({ ...good, products: [{ ...good.products[0], orderSpecies: 'K' }] })).toEqual(['products[0].orderSpecies: "K" is not in this product\'s perMl']);
  });

  test('every problem is reported, not just the first', () => {
    const out = problems({ format: 'osmocount-catalog', version: 1, products: [{ id: 'Bad Id', name: '', role: 'salt', perMl: { Na: 'x' } }] });
    expect(out.length).toBeGreaterThanOrEqual(4);
  });
});
