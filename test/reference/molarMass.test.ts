// Molar masses in the species table and the shipped catalog, checked against a reference chemistry
// library (mf-parser, IUPAC atomic weights). Hydrates are written `A . nB` for the library.
import { describe, expect, test } from 'vitest';
import { SPECIES, SPECIES_IDS } from '../../src/core/species.ts';
import { DEFAULT_CATALOG } from '../../src/defaults.ts';
import { molarMass } from '../support/mf.ts';

describe('molar masses', () => {
  test.each(SPECIES_IDS.map((s) => [s]))('species %s matches the reference library within 0.01%', (id) => {
    const s = SPECIES[id];
    const ref = molarMass(s.formula);
    expect(Math.abs(s.molarMass.toNumber() - ref) / ref).toBeLessThan(1e-4);
  });

  test('every salt in the shipped catalog matches the reference library within 0.05%', () => {
    const salts = DEFAULT_CATALOG.products.flatMap((p) => p.salts.map((s) => ({ id: p.id, s })));
    expect(salts.length).toBeGreaterThan(10);
    for (const { id, s } of salts) {
      const ref = molarMass(s.formula);
      expect(Math.abs(s.molarMass.toNumber() - ref) / ref, `${id}: ${s.formula}`).toBeLessThan(5e-4);
    }
  });

  test('dextrose osmolar factor 5.046 mOsm/g = 1000 / MW of glucose monohydrate (field guide D1)', () => {
    const factor = 1000 / molarMass('C6H12O6 . H2O');
    for (const p of DEFAULT_CATALOG.products.filter((x) => x.role === 'dextrose')) {
      expect(Math.abs((p.nutrient?.mOsmPerGram.toNumber() ?? 0) - factor)).toBeLessThan(0.001);
    }
  });
});
