import { describe, expect, it } from 'vitest';
import { DEFAULT_CATALOG, DEFAULT_POLICY, DEMO_ORDERS } from '../../defaults.ts';
import { parseOrder } from '../order.ts';
import { mixGroupOf, mixingSequence, type SequenceStep } from './sequence.ts';

const steps = DEFAULT_POLICY.compounding?.mixingSequence ?? [];

function sequenceOf(key: string): SequenceStep[] {
  const demo = DEMO_ORDERS.find((d) => d.key === key);
  const r = parseOrder(demo?.file, DEFAULT_CATALOG);
  if (!r.ok) throw new Error('demo order invalid');
  return mixingSequence(r.value.lines, steps);
}

const stepOf = (seq: SequenceStep[], product: string): number => seq.find((s) => s.lines.some((l) => l.product === product))?.step ?? -1;

describe('mixing sequence (FDA Safety Alert 1994; ASPEN Safe Practices 2004)', () => {
  it('3-in-1 demo bag: phosphate early, calcium late with mixing in between, lipid last', () => {
    const seq = sequenceOf('adult-peripheral');
    const phosphate = stepOf(seq, 'potassium-phosphates-3');
    const calcium = stepOf(seq, 'calcium-gluconate-10');
    const lipid = stepOf(seq, 'lipid-20');
    expect(stepOf(seq, 'dextrose-70')).toBe(1);
    expect(phosphate).toBeLessThan(stepOf(seq, 'sodium-chloride-4'));
    expect(phosphate).toBeLessThan(calcium);
    expect(seq.slice(phosphate - 1, calcium - 1).some((s) => s.mixAfter)).toBe(true);
    expect(calcium).toBeLessThan(lipid);
    expect(lipid).toBe(seq.length);
    expect(seq.find((s) => s.step === phosphate)?.source).toContain('FDA Safety Alert 1994');
    expect(seq.find((s) => s.step === calcium)?.source).toContain('FDA Safety Alert 1994');
    // Every line appears exactly once.
    expect(seq.flatMap((s) => s.lines).length).toBe(11);
  });

  it('numbers only the steps that have lines (no lipid in a 2-in-1, organic phosphate counts as phosphate)', () => {
    const seq = sequenceOf('preterm-neonate');
    expect(seq.map((s) => s.step)).toEqual(seq.map((_, i) => i + 1));
    expect(seq.some((s) => s.groups.includes('lipid'))).toBe(false);
    expect(seq.find((s) => s.groups.includes('phosphate'))?.lines.map((l) => l.product)).toEqual(['sodium-glycerophosphate-1']);
  });

  it('classifies stocks by role and composition', () => {
    const group = (id: string) => { const p = DEFAULT_CATALOG.byId.get(id); if (!p) throw new Error(id); return mixGroupOf(p); };
    expect(group('sodium-phosphates-3')).toBe('phosphate');
    expect(group('calcium-chloride-10')).toBe('calcium');
    expect(group('magnesium-sulfate-50')).toBe('magnesium');
    expect(group('potassium-acetate-2')).toBe('sodium-potassium');
    expect(group('trace-elements-adult')).toBe('additives');
    expect(group('sterile-water')).toBe('water');
  });
});
