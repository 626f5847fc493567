import type { D } from '../decimal.ts';
import type { Bag } from '../compute/bag.ts';
import type { Finding, Verdict } from '../findings.ts';
import type { LineUnit, Order, Route } from '../order.ts';

/** What the solver may propose. */
export type SuggestionKind = 'final-volume' | 'dextrose' | 'peripheral-route';

/** The one change a proposal makes to the order, in the order's own terms. */
export type Change =
  | { field: 'volumeMl'; from: D | null; to: D; unit: 'mL'; addsFillLine: string | null }
  | { field: 'amount'; line: number; product: string; from: D; to: D; unit: LineUnit; gramsPerDayFrom: D; gramsPerDayTo: D }
  | { field: 'route'; from: Route; to: Route };

/** The figures a pharmacist weighs a proposal by, before or after it. */
export interface Snapshot {
  osmolarity: D;
  osmolarityLimit: D | null;
  verdict: Verdict;
  volumeMl: D;
  fluidMlPerKgPerDay: D;
  kcal: D;
  kcalPerKgPerDay: D;
  girMgPerKgPerMin: D;
  dextroseG: D;
}

/**
 * A proposal: the modified order, re-checked through every check, with what it changes. The
 * engine never applies it; the pharmacist does (or not).
 */
export interface Proposal {
  kind: SuggestionKind;
  status: 'proposal';
  message: string;
  change: Change;
  order: Order;
  before: Snapshot;
  after: Snapshot;
  passesOsmolarity: boolean;
  /** Warnings and holds the change would bring (by code, screen, nutrient and severity). */
  appears: Finding[];
  /** Warnings and holds the change would clear. */
  disappears: Finding[];
  notes: string[];
}

/** A kind of proposal the solver looked for but cannot make, and why. */
export interface Unavailable {
  kind: SuggestionKind;
  status: 'unavailable';
  message: string;
  notes: string[];
}

export type Suggestion = Proposal | Unavailable;

/** What the solver needs from an evaluation: the bag, its findings and verdict. */
export interface Checked {
  order: Order;
  bag: Bag;
  findings: Finding[];
  verdict: Verdict;
}

/**
 * Runs every check on a bag the solver computed for a modified order (the engine's checks, without
 * suggestions). `change: 'route'` says the bag is the evaluated one with its order on another route
 * (the bag does not depend on the route): the engine then runs again only the checks that read the
 * route and keeps the others' findings.
 */
export type Evaluate = (bag: Bag, change?: 'route') => Checked;
