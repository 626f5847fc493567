import type { D } from '../decimal.ts';
import type { AgeGroup } from '../order.ts';
import type { Rule } from '../policy.ts';

/** Decimal places at which a value meets its bound (see `settled`). */
const COMPARE_PLACES = 9;

/**
 * A value as compared with a bound: at 9 decimal places, so a figure that went through a
 * division that cannot be exact (10 mEq calcium → 21.505… mL at 0.2325 mmol/mL → 9.99999999999999 mEq)
 * meets its bound instead of falling a hair short of it (or over it). The engine keeps 15 significant
 * digits, so a figure up to 10⁵ carries its rounding at most in the 10th decimal. Far below any clinical precision.
 */
export function settled(value: D): D {
  return value.toDecimalPlaces(COMPARE_PLACES);
}

/**
 * Which bound of a rule a value falls outside: `min` when below it, `max` when above it, null
 * within. A value equal to a bound is within. Example: 12 against min 4, max 12 → null.
 */
export function outside(value: D, rule: Pick<Rule, 'min' | 'max'>): 'min' | 'max' | null {
  const v = settled(value);
  if (rule.min && v.lt(rule.min)) return 'min';
  if (rule.max && v.gt(rule.max)) return 'max';
  return null;
}

/**
 * The value kept in `map` for `key`, made by `make` on first use: for texts and figures that depend on an
 * immutable policy value alone (a rule, a decimal), made once instead of for every bag.
 */
export function kept<K extends object, V>(map: WeakMap<K, V>, key: K, make: (key: K) => V): V {
  let value = map.get(key);
  if (value === undefined) {
    value = make(key);
    map.set(key, value);
  }
  return value;
}

/** The words of a screen's message after its figures: for a figure over the rule's bound, and within it. */
export interface ScreenWords { over: string; within: string }

// Each policy number's text, written once: a policy's decimals are immutable values, read for every bag.
const numberTexts = new WeakMap<D, string>();

/** A number of the policy (a bound, a curve's temperature) as text, as the policy writes it: "0.125", "4". */
export function numberText(x: D): string {
  return kept(numberTexts, x, writeNumber);
}

function writeNumber(x: D): string {
  return x.toString();
}

function rangeTextOf(rule: Pick<Rule, 'min' | 'max' | 'unit'>): string {
  if (rule.min && rule.max) return `${rule.min.toString()}–${rule.max.toString()} ${rule.unit}`;
  if (rule.max) return `≤ ${rule.max.toString()} ${rule.unit}`;
  if (rule.min) return `≥ ${rule.min.toString()} ${rule.unit}`;
  return `no limit set (${rule.unit})`;
}

// Each rule's range text, written once (a policy's rules are immutable values).
const rangeTexts = new WeakMap<Pick<Rule, 'min' | 'max' | 'unit'>, string>();

/** The rule's range as text, with the numbers as the policy writes them: "1–2 mmol/kg/day", "≤ 5 mg/kg/min". */
export function rangeText(rule: Pick<Rule, 'min' | 'max' | 'unit'>): string {
  return kept(rangeTexts, rule, rangeTextOf);
}

/** The bound a finding reports: the one crossed, else the upper bound, else the lower one. */
export function reportedLimit(rule: Pick<Rule, 'min' | 'max'>, crossed: 'min' | 'max' | null): D | null {
  if (crossed === 'min') return rule.min;
  if (crossed === 'max') return rule.max;
  return rule.max ?? rule.min;
}

/** How an age group reads in a message. */
export const AGE_LABEL: Readonly<Record<AgeGroup, string>> = {
  adult: 'an adult',
  child: 'a child',
  'term-neonate': 'a term neonate',
  'preterm-neonate': 'a preterm neonate',
};

/** A sentence every screening message ends with: the limits are the institution's, the decision the pharmacist's. */
export const DEFER = 'Local policy and the verifying pharmacist decide.';
