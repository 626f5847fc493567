import { describe, expect, it } from 'vitest';
import { D } from './decimal.ts';
import { DEFAULT_FILES, DEFAULT_POLICY } from '../defaults.ts';
import { doseRangeFor, girRuleFor, parsePolicy, ruleFor, volumeStepFor, DOSE_NUTRIENTS } from './policy.ts';
import { formatProblem } from './problems.ts';
import { AGES, policyJson, policyWith, type PolicyJson } from '../../test/helpers/orders.ts';

function problemsOf(edit: (p: PolicyJson) => void): string[] {
  const json = policyJson();
  edit(json);
  const r = parsePolicy(json);
  return r.ok ? [] : r.problems.map(formatProblem);
}

describe('policy: release-check sections', () => {
  it('the shipped policy parses, and every age group has each release-check limit', () => {
    expect(parsePolicy(DEFAULT_FILES.policy).ok).toBe(true);
    for (const age of AGES) {
      for (const code of ['potassium-peripheral', 'calcium-phosphate-product-central', 'calcium-phosphate-product-peripheral', 'calcium-phosphate-sum', 'tna-amino-acids-min', 'tna-dextrose-min', 'tna-lipid-min', 'tna-divalent', 'tna-can', 'aluminum'] as const) {
        expect(ruleFor(DEFAULT_POLICY, code, age), `${code} for ${age}`).not.toBeNull();
      }
      expect(girRuleFor(DEFAULT_POLICY, age, new D(20)), `gir for ${age}`).not.toBeNull();
      for (const n of DOSE_NUTRIENTS) expect(doseRangeFor(DEFAULT_POLICY, n, age), `${n} for ${age}`).not.toBeNull();
    }
  });

  it('keeps each value\'s status in its source text', () => {
    expect(ruleFor(DEFAULT_POLICY, 'calcium-phosphate-sum', 'adult')?.source).toContain('common practice (from memory');
    expect(ruleFor(DEFAULT_POLICY, 'tna-can', 'adult')?.source).toContain('from memory');
    expect(ruleFor(DEFAULT_POLICY, 'potassium-peripheral', 'child')?.source).toContain('derived from label limits');
    expect(doseRangeFor(DEFAULT_POLICY, 'K', 'adult')?.source).toContain('(from memory)');
  });

  it('picks the child GIR band by dosing weight (bands up to 10, 30, 45 kg, then the rest)', () => {
    const band = (kg: string) => girRuleFor(DEFAULT_POLICY, 'child', new D(kg));
    expect(band('10')?.max?.toString()).toBe('10');
    expect(band('10.01')?.max?.toString()).toBe('6');
    expect(band('30')?.max?.toString()).toBe('6');
    expect(band('45')?.max?.toString()).toBe('4');
    expect(band('45.1')?.max?.toString()).toBe('3');
    expect(girRuleFor(DEFAULT_POLICY, 'adult', new D(70))?.max?.toString()).toBe('5');
  });

  it('falls back to `all` for a dose range and to 1 mL for a missing volume step', () => {
    const p = policyWith((j) => {
      j.doseRanges.protein = { all: { min: 1, max: 2, unit: 'g/kg/day', severity: 'warn', source: 'test: one range for every age (common practice)' } };
      j.solver.volumeStepMl = { adult: 25 };
    });
    expect(doseRangeFor(p, 'protein', 'term-neonate')?.source).toContain('test: one range');
    expect(volumeStepFor(p, 'adult').toNumber()).toBe(25);
    expect(volumeStepFor(p, 'child').toNumber()).toBe(1);
    expect(volumeStepFor(DEFAULT_POLICY, 'preterm-neonate').toNumber()).toBe(1);
    expect(volumeStepFor(DEFAULT_POLICY, 'adult').toNumber()).toBe(10);
  });

  it('an invalid policy is rejected whole, every problem as `path: message`', () => {
    const problems = problemsOf((p) => {
      p.doseRanges.K.adult = { min: 1, max: 2, unit: 'mEq/L', severity: 'warn', source: 'x' };
      p.rules.gir.adult = { min: 6, max: 5, unit: 'mg/kg/min', severity: 'warn', source: 'x' };
      p.solver.dextroseStep.g = 0;
    });
    expect(problems).toEqual(expect.arrayContaining([
      'solver.dextroseStep.g: must be a number > 0',
    ]));
    // Schema problems come first; when the schema passes, the cross-field problems are listed together.
    const semantic = problemsOf((p) => {
      p.doseRanges.K.adult = { min: 1, max: 2, unit: 'mEq/L', severity: 'warn', source: 'x' };
      p.rules.gir.adult = { min: 6, max: 5, unit: 'mg/kg/min', severity: 'warn', source: 'x' };
    });
    expect(semantic).toEqual([
      'rules.gir.adult.min: must not be above max (5)',
      'doseRanges.K.adult.unit: must be one of mmol/kg/day, mEq/kg/day, mmol/day, mEq/day',
    ]);
  });

  it('rejects weight bands out of order or without an upper weight before the last', () => {
    const band = (upToKg: number | undefined) => ({ ...(upToKg === undefined ? {} : { upToKg }), min: 1, max: 2, unit: 'mg/kg/min', severity: 'warn' as const, source: 'x' });
    expect(problemsOf((p) => { p.girWeightBands.child = [band(30), band(10), band(undefined)]; })).toEqual(['girWeightBands.child[1].upToKg: must be above the previous band\'s 30 kg']);
    expect(problemsOf((p) => { p.girWeightBands.child = [band(undefined), band(10)]; })).toEqual(['girWeightBands.child[0].upToKg: is required on every band but the last']);
    expect(problemsOf((p) => { p.girWeightBands.child = [{ ...band(10), unit: 'g/kg/day' }]; })).toEqual(['girWeightBands.child[0].unit: must be mg/kg/min']);
  });

  it('rejects a solubility curve whose phosphate rises with calcium, or whose calcium does not rise', () => {
    const curve = (points: [number, number][]) => ({ id: 'c', aminoAcidProduct: 'amino-acids-10', aminoAcidPercent: 2, source: 'x', points: points.map(([ca, p]) => ({ calciumMEqPerL: ca, maxPhosphateMmolPerL: p })) });
    expect(problemsOf((p) => { p.solubilityCurves = [curve([[10, 20], [20, 25]])]; })).toEqual(['solubilityCurves[0].points[1].maxPhosphateMmolPerL: must not rise as calcium rises (a solubility curve falls)']);
    expect(problemsOf((p) => { p.solubilityCurves = [curve([[10, 20], [10, 15]])]; })).toEqual(['solubilityCurves[0].points[1].calciumMEqPerL: must rise from point to point']);
    expect(problemsOf((p) => { p.solubilityCurves = [curve([[10, 20]])]; })).toEqual(['solubilityCurves[0].points: needs at least two points']);
    expect(problemsOf((p) => { p.solubilityCurves = [curve([[10, 20], [20, 10]]), curve([[10, 20], [20, 10]])]; })).toEqual(['solubilityCurves[1].id: duplicate id "c"']);
  });

  it('requires the new sections and rejects unknown rule codes', () => {
    expect(problemsOf((p) => { delete (p as Partial<PolicyJson>).solver; })).toEqual(['solver: is required (object)']);
    expect(problemsOf((p) => { (p.rules as Record<string, unknown>)['ca-p'] = {}; })).toEqual(['rules: unknown field ca-p']);
    expect(problemsOf((p) => { p.doseRanges.Na = { adult: { min: 1, unit: 'mmol/kg/day', severity: 'warn', source: ' ' } }; })).toEqual(['doseRanges.Na.adult.source: must name the source of the limit (or "common practice")']);
  });

  it('a rule with enabled: false is not applied', () => {
    const p = policyWith((j) => { j.rules.aluminum = { all: { max: 5, unit: 'µg/kg/day', severity: 'warn', source: '21 CFR 201.323', enabled: false } }; });
    expect(ruleFor(p, 'aluminum', 'adult')).toBeNull();
  });
});
