import { D, round } from '../decimal.ts';
import { fmt } from '../format.ts';
import { ION_INFO, type IonKey, type IonTargets, type IonsJson } from './ions.ts';

/** Why an ion order cannot be compounded exactly as written (or needs a look). */
export type IonProblemCode =
  | 'no-compounding-policy'
  | 'ordered-below-other-lines'
  | 'phosphate-cation-exceeds-order'
  | 'no-stock'
  | 'acetate-above-cations'
  | 'chloride-above-cations'
  | 'acetate-below-other-lines'
  | 'chloride-below-other-lines'
  | 'anion-ratio-unreachable'
  | 'below-measurable-volume';

/** The nearest feasible change to the ion order: what to tell the prescriber, and the changed fields. */
export interface IonProposal {
  text: string;
  change: Partial<IonsJson>;
}

/**
 * A problem with an ion order. `block`: an ordered amount cannot be delivered as written (the
 * lines added are the proposal, not the order). `warn`: a preference could not be met in full, or
 * a volume is too small to measure.
 */
export interface IonProblem {
  code: IonProblemCode;
  severity: 'block' | 'warn';
  ion: IonKey | null;
  /** Where in the order the problem sits, e.g. `ions.Na`. */
  path: string;
  message: string;
  /** Where the rule or the figure comes from. */
  source: string;
  proposal: IonProposal | null;
}

/** Closing words of every proposal: the engine proposes, people decide. */
export const CONFIRM = 'Confirm any change with the prescriber; local policy and the pharmacist decide.';

/** An amount as text in the ion's unit, with the per-kg figure for per-kg orders: "26.67 mEq (1.778 mEq/kg)". */
export function amountText(t: IonTargets, ion: IonKey, perBag: D): string {
  const unit = ION_INFO[ion].unit;
  const base = `${fmt(perBag, 2)} ${unit}`;
  return t.per === 'kg' ? `${base} (${fmt(perBag.div(t.weightKg), 3)} ${unit}/kg)` : base;
}

/** A proposed amount as the order would write it: "7.5 mEq", or "1.363 mmol/kg (2.04 mmol per bag)". */
export function proposedText(t: IonTargets, ion: IonKey, perBag: D, direction: 'up' | 'down'): string {
  const unit = ION_INFO[ion].unit;
  const v = inOrderTerms(t, perBag, direction);
  return t.per === 'kg' ? `${v} ${unit}/kg (${fmt(perBag, 2)} ${unit} per bag)` : `${v} ${unit}`;
}

/**
 * A per-bag amount in the order's own terms (0.01 per day, 0.001 per kg), for a proposal's changed
 * field. `up` for a least amount, `down` for a most, so that the rounded proposal stays feasible.
 */
export function inOrderTerms(t: IonTargets, perBag: D, direction: 'up' | 'down'): number {
  const value = t.per === 'kg' ? perBag.div(t.weightKg) : perBag;
  const places = t.per === 'kg' ? 3 : 2;
  return round(value.toDecimalPlaces(places, direction === 'up' ? D.ROUND_UP : D.ROUND_DOWN), places);
}
