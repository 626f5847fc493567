import { describe, expect, it } from 'vitest';
import { D, ZERO } from '../decimal.ts';
import { SPECIES_IDS, type SpeciesId } from '../species.ts';
import { ionsFromSpecies, orderedTable, resolveIonOrder, targetsToJson } from './ions.ts';

function species(values: Partial<Record<SpeciesId, string>>): Record<SpeciesId, D> {
  const out = {} as Record<SpeciesId, D>;
  for (const s of SPECIES_IDS) out[s] = new D(values[s] ?? 0);
  return out;
}

describe('ion table', () => {
  it('counts divalent cations in mEq and both phosphate species as phosphate (exchange format species table)', () => {
    // 5 mmol Ca = 10 mEq; 2.03 mmol Mg = 4.06 mEq (magnesium sulfate 50% per mL, label);
    // 2 mmol phosphate + 1.5 mmol glycerophosphate = 3.5 mmol P; sulfate and gluconate are not listed.
    const t = ionsFromSpecies(species({ Ca: '5', Mg: '2.03', phosphate: '2', glycerophosphate: '1.5', Na: '38', acetate: '71.8', sulfate: '2.03' }));
    expect(t.Ca.toString()).toBe('10');
    expect(t.Mg.toString()).toBe('4.06');
    expect(t.phosphate.toString()).toBe('3.5');
    expect(t.Na.toString()).toBe('38');
    expect(t.acetate.toString()).toBe('71.8');
    expect(t.Cl.toString()).toBe('0');
  });
});

describe('resolveIonOrder', () => {
  it('multiplies per-kg amounts by the dosing weight, amounts of anions included', () => {
    const t = resolveIonOrder({ per: 'kg', Na: new D(3), phosphate: new D('1.5'), anions: { acetate: new D(2) } }, new D('1.1'), 'balanced');
    expect(t.Na.toString()).toBe('3.3');
    expect(t.phosphate.toString()).toBe('1.65');
    expect(t.K.eq(ZERO)).toBe(true);
    expect(t.anions).toEqual({ kind: 'acetate-amount', mEq: new D('2.2') });
    expect(t.phosphateSalt).toBe('auto');
    const { ordered, unordered } = orderedTable(t);
    expect(ordered.acetate.toString()).toBe('2.2');
    expect(unordered).toEqual(['K', 'Ca', 'Mg', 'Cl']);
  });

  it('takes the policy default when no anion preference is ordered', () => {
    const t = resolveIonOrder({ per: 'day', Na: new D(100) }, new D(70), 'balanced');
    expect(t.anionsFromPolicy).toBe(true);
    expect(t.anions).toEqual({ kind: 'ratio', chlorideToAcetate: new D(1), balanced: true });
  });

  it('writes targets back in the order\'s terms, absent ions absent', () => {
    const t = resolveIonOrder({ per: 'kg', Na: new D(3), anions: { chloride: new D(1) } }, new D('1.1'), 'balanced');
    expect(targetsToJson(t)).toEqual({ per: 'kg', Na: 3, phosphateSalt: 'auto', anions: { chloride: 1 } });
  });
});
