import { describe, expect, it } from 'vitest';
import { DEFAULT_FILES, DEFAULT_POLICY } from '../../defaults.ts';
import { parsePolicy } from '../policy.ts';
import { formatProblem } from '../problems.ts';
import { autoPhosphateOrder } from './compoundingPolicy.ts';

type Json = Record<string, unknown>;

function problemsOf(change: (c: Json) => void): string[] {
  const json = structuredClone(DEFAULT_FILES.policy) as Json;
  change(json.compounding as Json);
  const r = parsePolicy(json);
  return r.ok ? [] : r.problems.map(formatProblem);
}

describe('the policy compounding section', () => {
  it('ships with every value sourced', () => {
    const c = DEFAULT_POLICY.compounding;
    expect(c).not.toBeNull();
    if (!c) return;
    // Increments sorted largest first: 0.1 mL from 1 mL, 0.01 mL from 0 (common practice).
    expect(c.volumeIncrements.steps.map((s) => [s.fromMl.toString(), s.stepMl.toString()])).toEqual([['1', '0.1'], ['0', '0.01']]);
    expect(c.smallestMeasurableMl.value.toString()).toBe('0.1');
    expect(c.calciumSalts.order).toEqual(['gluconate']);
    const sources = [c.volumeIncrements.source, c.smallestMeasurableMl.source, c.calciumSalts.source, c.autoPhosphateSalts.source, c.defaultAnions.source, ...c.mixingSequence.map((s) => s.source)];
    for (const s of sources) expect(s).toMatch(/common practice|FDA|ASPEN|Bouchoud|Henry/);
  });

  it('lets an age group have its own auto phosphate order (neonates: organic first, Bouchoud 2010)', () => {
    const c = DEFAULT_POLICY.compounding;
    if (!c) throw new Error('no compounding');
    expect(autoPhosphateOrder(c, 'adult').order).toEqual(['potassium', 'sodium', 'organic']);
    expect(autoPhosphateOrder(c, 'preterm-neonate').order[0]).toBe('organic');
    expect(autoPhosphateOrder(c, 'preterm-neonate').source).toContain('Bouchoud 2010');
  });

  it('is optional: a policy without it still parses', () => {
    const json = structuredClone(DEFAULT_FILES.policy) as Json;
    delete json.compounding;
    const r = parsePolicy(json);
    expect(r.ok && r.value.compounding).toBeNull();
  });

  it('rejects a bad section with path: message problems', () => {
    expect(problemsOf((c) => { (c.volumeIncrements as Json).steps = [{ fromMl: 1, stepMl: '0.1' }]; }))
      .toEqual(['compounding.volumeIncrements.steps: needs a step with fromMl 0, so that every volume has an increment']);
    expect(problemsOf((c) => { (c.volumeIncrements as Json).steps = [{ fromMl: 0, stepMl: 0 }]; }))
      .toEqual(['compounding.volumeIncrements.steps[0].stepMl: must be a number > 0']);
    expect(problemsOf((c) => { (c.calciumSalts as Json).order = ['gluconate', 'lactate']; }))
      .toEqual(['compounding.calciumSalts.order[1]: must be one of "gluconate", "chloride"']);
    expect(problemsOf((c) => { (c.autoPhosphateSalts as Json).order = ['sodium', 'sodium']; }))
      .toEqual(['compounding.autoPhosphateSalts.order: lists "sodium" twice']);
    expect(problemsOf((c) => { (c.smallestMeasurableMl as Json).source = ' '; }))
      .toEqual(['compounding.smallestMeasurableMl.source: must name the source (or "common practice")']);
    expect(problemsOf((c) => { (c.mixingSequence as Json[]).pop(); }))
      .toEqual(['compounding.mixingSequence: must place every group; missing: lipid']);
  });
});
