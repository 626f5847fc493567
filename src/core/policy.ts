import { z } from 'zod';
import { D } from './decimal.ts';
import { optionalDecimal, parseWith } from './schema.ts';
import { AGE_GROUPS, type AgeGroup } from './order.ts';
import type { Result } from './problems.ts';
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
  }),
  reference: z.strictObject({
    gramsAminoAcidPerGramNitrogen: referenceSchema,
    plasmaOsmolality: referenceSchema,
    osmoticPressureTemperatureC: referenceSchema,
  }),
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
  reference: {
    gramsAminoAcidPerGramNitrogen: { value: D; source: string };
    plasmaOsmolality: { min: D; max: D; unit: string; source: string };
    osmoticPressureTemperatureC: { value: D; source: string };
  };
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
      reference: {
        gramsAminoAcidPerGramNitrogen: { value: ref.gramsAminoAcidPerGramNitrogen.value as D, source: ref.gramsAminoAcidPerGramNitrogen.source },
        plasmaOsmolality: { min: ref.plasmaOsmolality.min as D, max: ref.plasmaOsmolality.max as D, unit: ref.plasmaOsmolality.unit, source: ref.plasmaOsmolality.source },
        osmoticPressureTemperatureC: { value: ref.osmoticPressureTemperatureC.value as D, source: ref.osmoticPressureTemperatureC.source },
      },
      beyondUse: p.beyondUse ? toBeyondUsePolicy(p.beyondUse) : null,
    },
  };
}
