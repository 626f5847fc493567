import type { SpeciesId } from '../species.ts';
import type { Product } from '../catalog.ts';
import type { OrderLine } from '../order.ts';
import type { MixGroup, MixStep } from './compoundingPolicy.ts';

/** One step of the suggested addition order for the verification sheet. */
export interface SequenceStep {
  /** 1, 2, 3… over the steps that have lines in this bag. */
  step: number;
  groups: MixGroup[];
  lines: { index: number; product: string; name: string }[];
  mixAfter: boolean;
  reason: string;
  source: string;
}

function has(p: Product, s: SpeciesId): boolean {
  return p.perMl[s]?.gt(0) ?? false;
}

/** The mixing group of a stock, from its role and, for electrolytes, its composition. */
export function mixGroupOf(p: Product): MixGroup {
  switch (p.role) {
    case 'dextrose': return 'dextrose';
    case 'amino-acids': return 'amino-acids';
    case 'lipid': return 'lipid';
    case 'water': return 'water';
    case 'additive': return 'additives';
    case 'electrolyte':
      if (has(p, 'phosphate') || has(p, 'glycerophosphate')) return 'phosphate';
      if (has(p, 'Ca')) return 'calcium';
      if (has(p, 'Mg')) return 'magnesium';
      if (has(p, 'Na') || has(p, 'K')) return 'sodium-potassium';
      return 'other-electrolytes';
  }
}

/**
 * The bag's lines in the policy's addition order (phosphate early, calcium late with mixing in
 * between, lipid last), each step with its reason and source. Steps without lines are left out.
 */
export function mixingSequence(lines: readonly OrderLine[], steps: readonly MixStep[]): SequenceStep[] {
  const out: SequenceStep[] = [];
  for (const step of steps) {
    const inStep = step.add.flatMap((group) =>
      lines.filter((l) => mixGroupOf(l.product) === group).sort((a, b) => a.index - b.index));
    if (inStep.length === 0) continue;
    out.push({
      step: out.length + 1,
      groups: step.add.filter((g) => inStep.some((l) => mixGroupOf(l.product) === g)),
      lines: inStep.map((l) => ({ index: l.index, product: l.product.id, name: l.product.name })),
      mixAfter: step.mixAfter,
      reason: step.reason,
      source: step.source,
    });
  }
  return out;
}
