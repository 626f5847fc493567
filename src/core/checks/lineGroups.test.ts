import { describe, expect, it } from 'vitest';
import { DEFAULT_CATALOG } from '../../defaults.ts';
import { GROUP, groupsOf } from './lineGroups.ts';

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
    expect(groupNames('calcium-chloride-10')).toEqual(['Ca', 'Cl']);
    expect(groupNames('sodium-glycerophosphate-1')).toEqual(['Na', 'glycerophosphate', 'noAluminum']);
  });

  it('groups the nutrient stocks by role and energy: dextrose 3.4 kcal/g and lipid emulsion 2.0 kcal/mL bring kcal, water none (US labels)', () => {
    expect(groupNames('dextrose-50')).toEqual(['dextrose', 'energy']);
    expect(groupNames('lipid-20')).toEqual(['lipid', 'energy']);
    expect(groupNames('sterile-water')).toEqual([]);
  });
});
