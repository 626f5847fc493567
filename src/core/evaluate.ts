import { computeBag } from './compute/bag.ts';
import { CHECKS, ROUTE_CHECKS } from './checks/index.ts';
import { verdictOf, type Finding } from './findings.ts';
import { parseOrder, type Order } from './order.ts';
import { makeEvaluation, type Evaluation } from './evaluation.ts';
import type { Bag } from './compute/bag.ts';
import type { Catalog } from './catalog.ts';
import type { Policy } from './policy.ts';
import type { Result } from './problems.ts';
import { compoundOrder, hasIons } from './compound/compoundOrder.ts';
import { withIonFindings } from './compound/ionFindings.ts';
import { suggest, type Checked } from './solve/index.ts';

export type { Evaluation } from './evaluation.ts';

/** Options of one evaluation. */
export interface EvaluateOptions {
  /** Look for suggestions (default true; the solver re-checks its proposals without them). */
  suggestions?: boolean;
}

/** The positions in CHECKS of the checks that read the route (ROUTE_CHECKS). */
const ROUTE_CHECK_POSITIONS: readonly number[] = CHECKS.flatMap((check, i) => (ROUTE_CHECKS.has(check) ? [i] : []));

/** Compute a validated order's bag, run every check, look for suggestions, and build its report. */
export function evaluateOrder(order: Order, catalog: Catalog, policy: Policy, options: EvaluateOptions = {}): Evaluation {
  const bag = computeBag(order, policy);
  const byCheck = runChecks(bag, policy);
  const findings = flatten(byCheck);
  const verdict = verdictOf(findings);
  const suggestions = options.suggestions === false
    ? []
    // The solver's re-checks: a route change keeps this bag and the findings of the checks that do not read the route.
    : suggest({ order, bag, findings, verdict }, catalog, policy, (modified, change) => recheck(modified, change === 'route' ? byCheck : null, policy));
  return makeEvaluation({ order, bag, findings, verdict, suggestions }, catalog, policy);
}

/** Each check's findings on a bag, in CHECKS order. */
function runChecks(bag: Bag, policy: Policy): Finding[][] {
  const byCheck: Finding[][] = [];
  for (const check of CHECKS) byCheck.push(check(bag, policy));
  return byCheck;
}

/** Each check's findings, one list after another (what `byCheck.flat()` gives, without its generic walk). */
function flatten(byCheck: readonly Finding[][]): Finding[] {
  const findings: Finding[] = [];
  for (const list of byCheck) for (const f of list) findings.push(f);
  return findings;
}

/**
 * A bag the solver computed, checked without suggestions. `evaluated`: the findings by check of the
 * evaluated bag when this one is that bag on another route; only the checks that read the route run again.
 */
function recheck(bag: Bag, evaluated: readonly Finding[][] | null, policy: Policy): Checked {
  let byCheck: Finding[][];
  if (evaluated === null) byCheck = runChecks(bag, policy);
  else {
    byCheck = evaluated.slice();
    for (const i of ROUTE_CHECK_POSITIONS) byCheck[i] = CHECKS[i]!(bag, policy);
  }
  const findings = flatten(byCheck);
  return { order: bag.order, bag, findings, verdict: verdictOf(findings) };
}

/**
 * Validate an order file against the catalog (allocating its ion block, if any), then evaluate it; invalid
 * input returns its problems. `options.suggestions: false` skips the solver (the workspace does, while a
 * number is being typed).
 */
export function checkOrder(input: unknown, catalog: Catalog, policy: Policy, options: EvaluateOptions = {}): Result<Evaluation> {
  const order = parseOrder(input, catalog);
  if (!order.ok) return order;
  if (!hasIons(order.value)) return { ok: true, value: evaluateOrder(order.value, catalog, policy, options) };
  // An ion order: allocate its electrolyte lines, then check the bag they make.
  const compounded = compoundOrder(order.value, catalog, policy);
  return { ok: true, value: withIonFindings(evaluateOrder(compounded.compounded, catalog, policy, options), compounded, catalog, policy) };
}
