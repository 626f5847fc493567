import { z } from 'zod';
import type { D } from '../decimal.ts';
import { decimal } from '../schema.ts';
import { ionsSchema, type IonOrder, type AgeGroup } from '../order.ts';

export const PHOSPHATE_SALTS = ['potassium', 'sodium', 'organic'] as const;
/** Which phosphate stock carries an ordered phosphate: its cation counts toward Na or K. */
export type PhosphateSalt = (typeof PHOSPHATE_SALTS)[number];

export const CALCIUM_SALTS = ['gluconate', 'chloride'] as const;
/** The anion of the calcium stock. */
export type CalciumSalt = (typeof CALCIUM_SALTS)[number];

export const MIX_GROUPS = [
  'dextrose', 'amino-acids', 'water', 'phosphate', 'sodium-potassium', 'magnesium',
  'other-electrolytes', 'additives', 'calcium', 'lipid',
] as const;
/** A kind of line in the mixing sequence (a line belongs to exactly one group). */
export type MixGroup = (typeof MIX_GROUPS)[number];

/** The anion preference as an order writes it (`"balanced"`, `{ "acetate": 40 }`, …). */
export type AnionsInput = NonNullable<IonOrder['anions']>;

const sourced = z.string().trim().min(1, 'must name the source (or "common practice")');
const saltList = z.array(z.enum(PHOSPHATE_SALTS)).min(1, 'must list at least one salt');
const ageSalts = z.strictObject({ order: saltList, source: sourced }).optional();

const compoundingInput = z.strictObject({
  volumeIncrements: z.strictObject({
    steps: z.array(z.strictObject({ fromMl: decimal({ min: 0 }), stepMl: decimal({ gt: 0 }) })).min(1, 'must list at least one step'),
    source: sourced,
  }),
  smallestMeasurableMl: z.strictObject({ value: decimal({ gt: 0 }), source: sourced }),
  calciumSalts: z.strictObject({ order: z.array(z.enum(CALCIUM_SALTS)).min(1, 'must list at least one salt'), source: sourced }),
  autoPhosphateSalts: z.strictObject({
    order: saltList,
    byAgeGroup: z.strictObject({
      adult: ageSalts,
      child: ageSalts,
      'term-neonate': ageSalts,
      'preterm-neonate': ageSalts,
    }).optional(),
    source: sourced,
  }),
  defaultAnions: z.strictObject({ value: ionsSchema.shape.anions.unwrap(), source: sourced }),
  mixingSequence: z.array(z.strictObject({
    add: z.array(z.enum(MIX_GROUPS)).min(1, 'must name at least one group'),
    mixAfter: z.boolean(),
    reason: z.string().trim().min(1, 'must say why'),
    source: sourced,
  })).min(1, 'must list at least one step'),
});

type CompoundingInput = z.output<typeof compoundingInput>;

/** One step of the suggested addition order, with why and on whose authority. */
export interface MixStep {
  add: MixGroup[];
  /** Mix the bag thoroughly once this step is in. */
  mixAfter: boolean;
  reason: string;
  source: string;
}

/** The policy's compounding section: measurable volumes, salt choices and the mixing sequence. */
export interface CompoundingPolicy {
  /** Measuring increments, largest `fromMl` first: a volume ≥ fromMl is rounded to stepMl. */
  volumeIncrements: { steps: { fromMl: D; stepMl: D }[]; source: string };
  smallestMeasurableMl: { value: D; source: string };
  /** Calcium stocks the allocator may use, in order of preference ("chloride" absent = not allowed). */
  calciumSalts: { order: CalciumSalt[]; source: string };
  /** Phosphate salts `auto` tries, in order; an age group may have its own list. */
  autoPhosphateSalts: { order: PhosphateSalt[]; byAgeGroup: Partial<Record<AgeGroup, { order: PhosphateSalt[]; source: string }>>; source: string };
  /** The anion preference used when an ion order names none. */
  defaultAnions: { value: AnionsInput; source: string };
  mixingSequence: MixStep[];
}

function duplicates<T>(list: readonly T[]): T[] {
  return list.filter((v, i) => list.indexOf(v) !== i);
}

function checkCompounding(c: CompoundingInput, ctx: z.RefinementCtx): void {
  const froms = c.volumeIncrements.steps.map((s) => s.fromMl.toString());
  for (const d of duplicates(froms)) ctx.addIssue({ code: 'custom', path: ['volumeIncrements', 'steps'], message: `lists fromMl ${d} twice` });
  if (!c.volumeIncrements.steps.some((s) => s.fromMl.isZero())) {
    ctx.addIssue({ code: 'custom', path: ['volumeIncrements', 'steps'], message: 'needs a step with fromMl 0, so that every volume has an increment' });
  }
  for (const d of duplicates(c.calciumSalts.order)) ctx.addIssue({ code: 'custom', path: ['calciumSalts', 'order'], message: `lists "${d}" twice` });
  for (const d of duplicates(c.autoPhosphateSalts.order)) ctx.addIssue({ code: 'custom', path: ['autoPhosphateSalts', 'order'], message: `lists "${d}" twice` });
  for (const [age, entry] of Object.entries(c.autoPhosphateSalts.byAgeGroup ?? {})) {
    for (const d of duplicates(entry?.order ?? [])) ctx.addIssue({ code: 'custom', path: ['autoPhosphateSalts', 'byAgeGroup', age, 'order'], message: `lists "${d}" twice` });
  }
  const groups = c.mixingSequence.flatMap((s) => s.add);
  for (const d of duplicates(groups)) ctx.addIssue({ code: 'custom', path: ['mixingSequence'], message: `names group "${d}" in more than one step` });
  const missing = MIX_GROUPS.filter((g) => !groups.includes(g));
  if (missing.length > 0) ctx.addIssue({ code: 'custom', path: ['mixingSequence'], message: `must place every group; missing: ${missing.join(', ')}` });
}

function toCompounding(c: CompoundingInput): CompoundingPolicy {
  const byAgeGroup: CompoundingPolicy['autoPhosphateSalts']['byAgeGroup'] = {};
  for (const [age, entry] of Object.entries(c.autoPhosphateSalts.byAgeGroup ?? {})) if (entry) byAgeGroup[age as AgeGroup] = entry;
  return {
    volumeIncrements: {
      steps: [...c.volumeIncrements.steps].sort((a, b) => b.fromMl.comparedTo(a.fromMl)),
      source: c.volumeIncrements.source,
    },
    smallestMeasurableMl: c.smallestMeasurableMl,
    calciumSalts: c.calciumSalts,
    autoPhosphateSalts: { order: c.autoPhosphateSalts.order, byAgeGroup, source: c.autoPhosphateSalts.source },
    defaultAnions: c.defaultAnions,
    mixingSequence: c.mixingSequence,
  };
}

/** The policy file's `compounding` section: validated, then turned into engine form. */
export const compoundingSchema = compoundingInput.superRefine(checkCompounding).transform(toCompounding);

/** The phosphate salts `auto` tries for an age group, in order, with the source of that order. */
export function autoPhosphateOrder(c: CompoundingPolicy, ageGroup: AgeGroup): { order: PhosphateSalt[]; source: string } {
  return c.autoPhosphateSalts.byAgeGroup[ageGroup] ?? { order: c.autoPhosphateSalts.order, source: c.autoPhosphateSalts.source };
}
