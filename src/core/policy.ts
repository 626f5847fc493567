import { z } from 'zod';
import { D } from './decimal.ts';
import { decimal, optionalDecimal, parseWith } from './schema.ts';
import { AGE_GROUPS, type AgeGroup } from './order.ts';
import type { Problem, Result } from './problems.ts';
import { compoundingSchema, type CompoundingPolicy } from './compound/compoundingPolicy.ts';
import { beyondUseSchema, toBeyondUsePolicy, type BeyondUsePolicy } from './beyondUse.ts';

export const SEVERITIES = ['block', 'warn', 'info'] as const;
/** How much a finding holds the bag back: `block` stops it, `warn` needs a look, `info` informs. */
export type Severity = (typeof SEVERITIES)[number];

const ruleSchema = z.strictObject({
  min: optionalDecimal(),
  max: optionalDecimal(),
  unit: z.string().min(1),
  severity: z.enum(SEVERITIES),
  source: z.string().trim().min(1, 'must name the source of the limit (or "common practice")'),
  enabled: z.boolean().optional(),
  note: z.string().optional(),
});

/** One limit of the policy: a bound (or none, for a pure severity rule), its unit, severity and source. */
export interface Rule {
  min: D | null;
  max: D | null;
  unit: string;
  severity: Severity;
  source: string;
  note: string | null;
}

const byAgeSchema = z.strictObject({
  all: ruleSchema.optional(),
  adult: ruleSchema.optional(),
  child: ruleSchema.optional(),
  'term-neonate': ruleSchema.optional(),
  'preterm-neonate': ruleSchema.optional(),
});

const referenceSchema = z.strictObject({
  value: optionalDecimal(),
  min: optionalDecimal(),
  max: optionalDecimal(),
  unit: z.string().min(1),
  source: z.string().trim().min(1),
});

// Sections the release checks and the solver read (dose ranges, GIR weight bands, solubility curves, solver steps).

export const DOSE_NUTRIENTS = ['fluid', 'energy', 'protein', 'lipid', 'lipidRate', 'Na', 'K', 'Ca', 'Mg', 'phosphate', 'npcToN'] as const;
/** A nutrient whose daily dose the `dose-range` check screens (the finding's `nutrient` field). */
export type DoseNutrient = (typeof DOSE_NUTRIENTS)[number];

const ION_DOSE_UNITS = ['mmol/kg/day', 'mEq/kg/day', 'mmol/day', 'mEq/day'] as const;
/** The units a dose range may be written in: per kg per day, or per day (the check converts to it). */
export const DOSE_UNITS: Readonly<Record<DoseNutrient, readonly string[]>> = {
  fluid: ['mL/kg/day', 'mL/day'],
  energy: ['kcal/kg/day', 'kcal/day'],
  protein: ['g/kg/day', 'g/day'],
  lipid: ['g/kg/day', 'g/day'],
  lipidRate: ['g/kg/h'],
  Na: ION_DOSE_UNITS,
  K: ION_DOSE_UNITS,
  Ca: ION_DOSE_UNITS,
  Mg: ION_DOSE_UNITS,
  phosphate: ['mmol/kg/day', 'mmol/day'],
  npcToN: ['kcal/g N'],
};

const doseRangesSchema = z.strictObject({
  fluid: byAgeSchema, energy: byAgeSchema, protein: byAgeSchema, lipid: byAgeSchema, lipidRate: byAgeSchema,
  Na: byAgeSchema, K: byAgeSchema, Ca: byAgeSchema, Mg: byAgeSchema, phosphate: byAgeSchema, npcToN: byAgeSchema,
});

const weightBandSchema = ruleSchema.extend({ upToKg: optionalDecimal({ gt: 0 }) });
const bandListSchema = z.array(weightBandSchema).min(1, 'must hold at least one band');
const girWeightBandsSchema = z.strictObject({
  all: bandListSchema.optional(),
  adult: bandListSchema.optional(),
  child: bandListSchema.optional(),
  'term-neonate': bandListSchema.optional(),
  'preterm-neonate': bandListSchema.optional(),
});

const solubilityCurveSchema = z.strictObject({
  id: z.string().trim().min(1, 'must not be empty'),
  aminoAcidProduct: z.string().trim().min(1, 'must name a catalog amino-acid product id'),
  aminoAcidPercent: decimal({ gt: 0 }),
  temperatureC: optionalDecimal(),
  hours: optionalDecimal({ gt: 0 }),
  points: z.array(z.strictObject({ calciumMEqPerL: decimal({ min: 0 }), maxPhosphateMmolPerL: decimal({ min: 0 }) })).min(2, 'needs at least two points'),
  source: z.string().trim().min(1, 'must name the source of the curve'),
});

const stepsByAgeSchema = z.strictObject({
  all: optionalDecimal({ gt: 0 }),
  adult: optionalDecimal({ gt: 0 }),
  child: optionalDecimal({ gt: 0 }),
  'term-neonate': optionalDecimal({ gt: 0 }),
  'preterm-neonate': optionalDecimal({ gt: 0 }),
});

const solverSchema = z.strictObject({
  volumeStepMl: stepsByAgeSchema,
  dextroseStep: z.strictObject({ g: decimal({ gt: 0 }), 'g/kg': decimal({ gt: 0 }), mL: decimal({ gt: 0 }), 'mL/kg': decimal({ gt: 0 }) }),
  source: z.string().trim().min(1, 'must say where the steps come from (or "common practice")'),
});

/** A GIR limit that applies up to a dosing weight (the last band, without `upToKg`, has no upper weight). */
export interface WeightBand extends Rule {
  upToKg: D | null;
}

/** Points of a product's calcium–phosphate solubility curve: the most inorganic phosphate (mmol/L) at a calcium (mEq/L). */
export interface SolubilityCurve {
  id: string;
  aminoAcidProduct: string;
  aminoAcidPercent: D;
  temperatureC: D | null;
  hours: D | null;
  points: { calciumMEqPerL: D; maxPhosphateMmolPerL: D }[];
  source: string;
}

/** How the solver rounds what it proposes: volume up to a step per age group, dextrose down to a step per line unit. */
export interface SolverSteps {
  volumeStepMl: Partial<Record<AgeGroup | 'all', D>>;
  dextroseStep: Record<'g' | 'g/kg' | 'mL' | 'mL/kg', D>;
  source: string;
}

type SectionsInput = Pick<z.output<typeof policyFileSchema>, 'rules' | 'doseRanges' | 'girWeightBands' | 'solubilityCurves'>;

/** Checks a parsed policy's sections beyond what the schema can say; each problem has its path. */
function sectionProblems(p: SectionsInput): Problem[] {
  const problems: Problem[] = [];
  const checkBounds = (path: string, r: { min?: D | undefined; max?: D | undefined }) => {
    if (r.min && r.max && r.min.gt(r.max)) problems.push({ path: `${path}.min`, message: `must not be above max (${r.max.toString()})` });
  };
  for (const [code, byAge] of Object.entries(p.rules)) {
    for (const [age, r] of Object.entries(byAge)) if (r) checkBounds(`rules.${code}.${age}`, r);
  }
  for (const n of DOSE_NUTRIENTS) {
    for (const [age, r] of Object.entries(p.doseRanges[n])) {
      if (!r) continue;
      const at = `doseRanges.${n}.${age}`;
      checkBounds(at, r);
      if (!DOSE_UNITS[n].includes(r.unit)) problems.push({ path: `${at}.unit`, message: `must be one of ${DOSE_UNITS[n].join(', ')}` });
    }
  }
  for (const [age, bands] of Object.entries(p.girWeightBands)) {
    bands?.forEach((b, i) => {
      const at = `girWeightBands.${age}[${i}]`;
      checkBounds(at, b);
      if (b.unit !== 'mg/kg/min') problems.push({ path: `${at}.unit`, message: 'must be mg/kg/min' });
      const last = i === bands.length - 1;
      if (!last && b.upToKg === undefined) problems.push({ path: `${at}.upToKg`, message: 'is required on every band but the last' });
      const prev = i > 0 ? bands[i - 1]?.upToKg : undefined;
      if (b.upToKg && prev && !b.upToKg.gt(prev)) problems.push({ path: `${at}.upToKg`, message: `must be above the previous band's ${prev.toString()} kg` });
    });
  }
  const ids = new Set<string>();
  (p.solubilityCurves ?? []).forEach((c, i) => {
    const at = `solubilityCurves[${i}]`;
    if (ids.has(c.id)) problems.push({ path: `${at}.id`, message: `duplicate id "${c.id}"` });
    ids.add(c.id);
    c.points.forEach((pt, j) => {
      const prev = j > 0 ? c.points[j - 1] : undefined;
      if (!prev) return;
      if (!pt.calciumMEqPerL.gt(prev.calciumMEqPerL)) problems.push({ path: `${at}.points[${j}].calciumMEqPerL`, message: 'must rise from point to point' });
      if (pt.maxPhosphateMmolPerL.gt(prev.maxPhosphateMmolPerL)) problems.push({ path: `${at}.points[${j}].maxPhosphateMmolPerL`, message: 'must not rise as calcium rises (a solubility curve falls)' });
    });
  });
  return problems;
}

function toBands(bands: z.output<typeof weightBandSchema>[] | undefined): WeightBand[] | undefined {
  if (!bands) return undefined;
  return bands.flatMap((b) => {
    const rule = toRule(b);
    return rule ? [{ ...rule, upToKg: b.upToKg ?? null }] : [];
  });
}

function toSections(p: z.output<typeof policyFileSchema>): Pick<Policy, 'doseRanges' | 'girWeightBands' | 'solubilityCurves' | 'solver'> {
  const doseRanges = {} as Policy['doseRanges'];
  for (const n of DOSE_NUTRIENTS) doseRanges[n] = toByAge(p.doseRanges[n]);
  const girWeightBands: Policy['girWeightBands'] = {};
  for (const key of ['all', ...AGE_GROUPS] as const) {
    const bands = toBands(p.girWeightBands[key]);
    if (bands) girWeightBands[key] = bands;
  }
  const volumeStepMl: SolverSteps['volumeStepMl'] = {};
  for (const key of ['all', ...AGE_GROUPS] as const) {
    const step = p.solver.volumeStepMl[key];
    if (step) volumeStepMl[key] = step;
  }
  return {
    doseRanges,
    girWeightBands,
    solubilityCurves: (p.solubilityCurves ?? []).map((c) => ({
      id: c.id, aminoAcidProduct: c.aminoAcidProduct, aminoAcidPercent: c.aminoAcidPercent,
      temperatureC: c.temperatureC ?? null, hours: c.hours ?? null, points: c.points, source: c.source,
    })),
    solver: { volumeStepMl, dextroseStep: p.solver.dextroseStep, source: p.solver.source },
  };
}

/** The dose range in force for a nutrient and age group: its own, else `all`, else none. */
export function doseRangeFor(policy: Policy, nutrient: DoseNutrient, ageGroup: AgeGroup): Rule | null {
  const ranges = policy.doseRanges[nutrient];
  return ranges[ageGroup] ?? ranges.all ?? null;
}

/**
 * The GIR limit for a patient: the weight band of the age group (or of `all`) when the policy has
 * bands, else the `gir` rule. Example: a 12 kg child falls in the band with `upToKg` 30 when the
 * one before stops at 10.
 */
export function girRuleFor(policy: Policy, ageGroup: AgeGroup, weightKg: D): Rule | WeightBand | null {
  const bands = policy.girWeightBands[ageGroup] ?? policy.girWeightBands.all;
  if (bands && bands.length > 0) return bands.find((b) => b.upToKg === null || weightKg.lte(b.upToKg)) ?? null;
  return ruleFor(policy, 'gir', ageGroup);
}

/** The solver's volume step for an age group, mL (1 mL when the policy names none). */
export function volumeStepFor(policy: Policy, ageGroup: AgeGroup): D {
  return policy.solver.volumeStepMl[ageGroup] ?? policy.solver.volumeStepMl.all ?? new D(1);
}

export const policyFileSchema = z.object({
  format: z.literal('osmocount-policy'),
  version: z.literal(1),
  id: z.string().min(1),
  name: z.string().min(1),
  institution: z.string().optional(),
  reportedOsmolarity: z.enum(['higher', 'particle', 'labelSum']),
  reportedOsmolaritySource: z.string().min(1),
  rules: z.strictObject({
    'osmolarity-peripheral': byAgeSchema,
    'dextrose-peripheral': byAgeSchema,
    'volume-overflow': byAgeSchema,
    'volume-shortfall': byAgeSchema,
    'missing-label-osmolarity': byAgeSchema,
    'potassium-peripheral': byAgeSchema,
    'calcium-phosphate-product-central': byAgeSchema,
    'calcium-phosphate-product-peripheral': byAgeSchema,
    'calcium-phosphate-sum': byAgeSchema,
    'calcium-chloride-phosphate': byAgeSchema,
    'calcium-phosphate-in-lipid': byAgeSchema,
    'calcium-phosphate-organic': byAgeSchema,
    'calcium-phosphate-curve': byAgeSchema,
    'tna-amino-acids-min': byAgeSchema,
    'tna-dextrose-min': byAgeSchema,
    'tna-lipid-min': byAgeSchema,
    'tna-divalent': byAgeSchema,
    'tna-can': byAgeSchema,
    gir: byAgeSchema,
    aluminum: byAgeSchema,
  }),
  doseRanges: doseRangesSchema,
  girWeightBands: girWeightBandsSchema,
  solubilityCurves: z.array(solubilityCurveSchema).optional(),
  solver: solverSchema,
  reference: z.strictObject({
    gramsAminoAcidPerGramNitrogen: referenceSchema,
    plasmaOsmolality: referenceSchema,
    osmoticPressureTemperatureC: referenceSchema,
  }),
  compounding: compoundingSchema.optional(),
  beyondUse: beyondUseSchema.optional(),
});

export type RuleCode = keyof z.output<typeof policyFileSchema>['rules'];
type RuleInput = z.output<typeof ruleSchema>;
type ByAgeInput = z.output<typeof byAgeSchema>;

/** A validated policy: the institution's limits, each with its source. */
export interface Policy {
  id: string;
  name: string;
  institution: string | null;
  reportedOsmolarity: 'higher' | 'particle' | 'labelSum';
  reportedOsmolaritySource: string;
  rules: Record<RuleCode, Partial<Record<AgeGroup | 'all', Rule>>>;
  doseRanges: Record<DoseNutrient, Partial<Record<AgeGroup | 'all', Rule>>>;
  girWeightBands: Partial<Record<AgeGroup | 'all', WeightBand[]>>;
  solubilityCurves: SolubilityCurve[];
  solver: SolverSteps;
  reference: {
    gramsAminoAcidPerGramNitrogen: { value: D; source: string };
    plasmaOsmolality: { min: D; max: D; unit: string; source: string };
    osmoticPressureTemperatureC: { value: D; source: string };
  };
  /** Measurable volumes, salt choices and mixing sequence for ion orders; null when the policy has none. */
  compounding: CompoundingPolicy | null;
  /** Beyond-use durations and storage for the bag label; null when the policy has none. */
  beyondUse: BeyondUsePolicy | null;
}

function toRule(r: RuleInput): Rule | null {
  if (r.enabled === false) return null;
  return { min: r.min ?? null, max: r.max ?? null, unit: r.unit, severity: r.severity, source: r.source, note: r.note ?? null };
}

function toByAge(input: ByAgeInput): Partial<Record<AgeGroup | 'all', Rule>> {
  const out: Partial<Record<AgeGroup | 'all', Rule>> = {};
  for (const key of ['all', ...AGE_GROUPS] as const) {
    const r = input[key];
    const rule = r ? toRule(r) : null;
    if (rule) out[key] = rule;
  }
  return out;
}

/** The rule in force for an age group: its own, else the `all` rule, else none (check not applied). */
export function ruleFor(policy: Policy, code: RuleCode, ageGroup: AgeGroup): Rule | null {
  const rules = policy.rules[code];
  return rules[ageGroup] ?? rules.all ?? null;
}

/** Validate a policy file; an invalid policy is rejected whole with every problem listed. */
export function parsePolicy(input: unknown): Result<Policy> {
  const parsed = parseWith(policyFileSchema, input);
  if (!parsed.ok) return parsed;
  const p = parsed.value;
  const problems = [];
  const ref = p.reference;
  if (ref.gramsAminoAcidPerGramNitrogen.value === undefined || !ref.gramsAminoAcidPerGramNitrogen.value.gt(0)) problems.push({ path: 'reference.gramsAminoAcidPerGramNitrogen.value', message: 'must be a number > 0' });
  if (ref.plasmaOsmolality.min === undefined || ref.plasmaOsmolality.max === undefined) problems.push({ path: 'reference.plasmaOsmolality', message: 'needs min and max' });
  if (ref.osmoticPressureTemperatureC.value === undefined) problems.push({ path: 'reference.osmoticPressureTemperatureC.value', message: 'is required' });
  problems.push(...sectionProblems(p));
  if (problems.length > 0) return { ok: false, problems };
  const rules = {} as Policy['rules'];
  for (const code of Object.keys(p.rules) as RuleCode[]) rules[code] = toByAge(p.rules[code]);
  return {
    ok: true,
    value: {
      id: p.id,
      name: p.name,
      institution: p.institution ?? null,
      reportedOsmolarity: p.reportedOsmolarity,
      reportedOsmolaritySource: p.reportedOsmolaritySource,
      rules,
      ...toSections(p),
      reference: {
        gramsAminoAcidPerGramNitrogen: { value: ref.gramsAminoAcidPerGramNitrogen.value as D, source: ref.gramsAminoAcidPerGramNitrogen.source },
        plasmaOsmolality: { min: ref.plasmaOsmolality.min as D, max: ref.plasmaOsmolality.max as D, unit: ref.plasmaOsmolality.unit, source: ref.plasmaOsmolality.source },
        osmoticPressureTemperatureC: { value: ref.osmoticPressureTemperatureC.value as D, source: ref.osmoticPressureTemperatureC.source },
      },
      compounding: p.compounding ?? null,
      beyondUse: p.beyondUse ? toBeyondUsePolicy(p.beyondUse) : null,
    },
  };
}
