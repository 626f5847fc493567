import type { D } from './decimal.ts';
import type { Severity } from './policy.ts';
import type { Rule } from './policy.ts';
import type { Bag } from './compute/bag.ts';
import type { Policy } from './policy.ts';

/** A finding code (exchange format v1 table; more may be added). */
export type FindingCode =
  | 'osmolarity-peripheral' | 'dextrose-peripheral' | 'potassium-peripheral' | 'calcium-phosphate'
  | 'tna-stability' | 'gir' | 'dose-range' | 'aluminum' | 'volume-overflow' | 'volume-shortfall'
  | 'missing-label-osmolarity' | 'empty-bag'
  | 'ion-order' | 'measurable-volume';

/** What a check found: severity, the value against its limit, why, and where the limit comes from. */
export interface Finding {
  code: FindingCode;
  severity: Severity;
  value: D | null;
  limit: D | null;
  unit: string | null;
  /** Decimals the value and limit are shown with. */
  decimals: number;
  message: string;
  source: string;
  nutrient?: string;
  /** Which screen of a check this is, when a check has several (e.g. `product`, `sum` for calcium–phosphate). */
  screen?: string;
  /** Order line indexes the finding concerns (for highlighting). */
  lines: number[];
  /** Order fields the finding concerns, e.g. `volumeMl`, `route`. */
  fields: string[];
}

/** A release check: a pure function from the computed bag and the policy to findings. */
export type Check = (bag: Bag, policy: Policy) => Finding[];

/** The overall verdict: block if any finding blocks, else warn if any warns, else pass. */
export type Verdict = 'pass' | 'warn' | 'block';

export function verdictOf(findings: readonly Finding[]): Verdict {
  if (findings.some((f) => f.severity === 'block')) return 'block';
  if (findings.some((f) => f.severity === 'warn')) return 'warn';
  return 'pass';
}

/** What a finding built from a policy rule says beyond the rule itself (see fromRule). */
export interface FindingParts {
  value: D | null;
  limit: D | null;
  decimals: number;
  message: string;
  lines?: number[];
  fields?: string[];
  nutrient?: string;
  screen?: string;
  /** True when the value was screened and is within its limit: the finding is information, not the rule's severity. */
  within?: boolean;
  /** The unit of the value and limit, when not the rule's. */
  unit?: string;
  /** Where the limit comes from, when more than the rule's source. */
  source?: string;
}

/**
 * A finding built from a policy rule: its severity (or `info` when `within`), unit and source come from
 * the policy. The fields are always set in the same order, `nutrient` and `screen` only when given.
 */
export function fromRule(code: FindingCode, rule: Rule, parts: FindingParts): Finding {
  const f: Finding = {
    code, severity: parts.within === true ? 'info' : rule.severity, unit: parts.unit ?? rule.unit, source: parts.source ?? rule.source,
    value: parts.value, limit: parts.limit, decimals: parts.decimals, message: parts.message,
    lines: parts.lines ?? [], fields: parts.fields ?? [],
  };
  if (parts.nutrient !== undefined) f.nutrient = parts.nutrient;
  if (parts.screen !== undefined) f.screen = parts.screen;
  return f;
}
