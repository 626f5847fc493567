import { describe, expect, it } from 'vitest';
import { DEFAULT_CATALOG } from '../../defaults.ts';
import { NO_LINES } from '../findings.ts';
import { anyIn, GROUP, groupsOf, inBagGroups, linesIn } from './lineGroups.ts';
import { bagOf } from '../../../test/helpers/orders.ts';

function groupNames(id: string): string[] {
  const p = DEFAULT_CATALOG.byId.get(id);
  if (!p) throw new Error(`no ${id} in the catalog`);
  const groups = groupsOf(p);
  return (Object.keys(GROUP) as (keyof typeof GROUP)[]).filter((g) => (groups & GROUP[g]) !== 0);
}

describe('groupsOf', () => {
  it('potassium phosphates injection is in the potassium and phosphate groups (label: 4.4 mEq K and 3 mmol P per mL)', () => {
    expect(groupNames('potassium-phosphates-3')).toEqual(['K', 'phosphate']);
  });

  it('calcium chloride 10% is in the calcium and chloride groups (label: 0.68 mmol Ca, 1.36 mmol Cl per mL), without an aluminum value in the catalog', () => {
    expect(groupNames('calcium-chloride-10')).toEqual(['Ca', 'Cl', 'calciumChloride']);
    expect(groupNames('sodium-glycerophosphate-1')).toEqual(['Na', 'glycerophosphate', 'noAluminum']);
  });

  it('groups the nutrient stocks by role and energy: dextrose 3.4 kcal/g and lipid emulsion 2.0 kcal/mL bring kcal, water none (US labels)', () => {
    expect(groupNames('dextrose-50')).toEqual(['dextrose', 'energy']);
    expect(groupNames('lipid-20')).toEqual(['lipid', 'energy']);
    expect(groupNames('sterile-water')).toEqual([]);
  });
});

describe('linesIn', () => {
  // Potassium phosphates holds K and phosphate, calcium chloride Ca and Cl (labels as above); a line at zero is not in the bag.
  const bag = bagOf({
    age: 'adult', weightKg: 70, volumeMl: 1000, lines: [
      { product: 'potassium-phosphates-3', amount: 15, unit: 'mmol', species: 'phosphate' },
      { product: 'calcium-chloride-10', amount: 5, unit: 'mmol', species: 'Ca' },
      { product: 'calcium-gluconate-10', amount: 0, unit: 'mmol', species: 'Ca' },
      { product: 'potassium-chloride-2', amount: 20, unit: 'mmol', species: 'K' },
      { product: 'sterile-water', fill: true },
    ],
  });

  it('names the lines in the bag of each group in line order, one group after the other, a line in two twice', () => {
    const lines = inBagGroups(bag);
    expect(linesIn(lines, GROUP.K)).toEqual([0, 3]);
    expect(linesIn(lines, GROUP.Ca, GROUP.phosphate)).toEqual([1, 0]);
    expect(linesIn(lines, GROUP.Cl, GROUP.K, GROUP.calciumChloride)).toEqual([1, 3, 0, 3, 1]);
    expect(anyIn(lines, GROUP.calciumChloride)).toBe(true);
  });

  it('names no line with the shared empty list, and nothing of a line at zero', () => {
    const lines = inBagGroups(bag);
    expect(linesIn(lines, GROUP.lipid)).toBe(NO_LINES);
    expect(linesIn(lines, GROUP.Mg, GROUP.glycerophosphate)).toBe(NO_LINES);
    expect(anyIn(lines, GROUP.lipid | GROUP.dextrose)).toBe(false);
  });
});
