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

/**
 * No lines, or no fields: one shared empty list for every finding that names none. It is frozen, as
 * findings and the reports built from them only read these lists (a report writes them out as `[]`).
 */
export const NO_LINES: number[] = Object.freeze([]) as unknown as number[];
export const NO_FIELDS: string[] = NO_LINES as unknown as string[];

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
  const severity = parts.within === true ? 'info' : rule.severity;
  const unit = parts.unit ?? rule.unit;
  const source = parts.source ?? rule.source;
  const { value, limit, decimals, message, nutrient, screen } = parts;
  const lines = parts.lines ?? NO_LINES;
  const fields = parts.fields ?? NO_FIELDS;
  // One object literal for each set of fields: a field added to an object after it is made takes a
  // second allocation for it, and every finding of a dose range has a nutrient.
  if (nutrient !== undefined) {
    return screen !== undefined
      ? { code, severity, unit, source, value, limit, decimals, message, lines, fields, nutrient, screen }
      : { code, severity, unit, source, value, limit, decimals, message, lines, fields, nutrient };
  }
  return screen !== undefined
    ? { code, severity, unit, source, value, limit, decimals, message, lines, fields, screen }
    : { code, severity, unit, source, value, limit, decimals, message, lines, fields };
}
