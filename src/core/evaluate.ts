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
import { suggest, type Evaluate } from './solve/index.ts';

export type { Evaluation } from './evaluation.ts';

/** Options of one evaluation. */
export interface EvaluateOptions {
  /** Look for suggestions (default true; the solver re-checks its proposals without them). */
  suggestions?: boolean;
}

/** Compute a validated order's bag, run every check, look for suggestions, and build its report. */
export function evaluateOrder(order: Order, catalog: Catalog, policy: Policy, options: EvaluateOptions = {}): Evaluation {
  const bag = computeBag(order, policy);
  return evaluated(bag, CHECKS.map((check) => check(bag, policy)), catalog, policy, options);
}

/**
 * The evaluation of a bag whose checks have run (`byCheck`: each check's findings, in CHECKS order).
 * Its solver re-checks a route change on the same bag (the bag does not depend on the route),
 * running again only the checks that read the route.
 */
function evaluated(bag: Bag, byCheck: readonly Finding[][], catalog: Catalog, policy: Policy, options: EvaluateOptions): Evaluation {
  const order = bag.order;
  const findings = byCheck.flat();
  const verdict = verdictOf(findings);
  const recheck: Evaluate = (modified, change) => {
    if (change !== 'route') return evaluateOrder(modified, catalog, policy, { suggestions: false });
    const rerouted: Bag = { ...bag, order: modified };
    const again = CHECKS.map((check, i) => (ROUTE_CHECKS.has(check) ? check(rerouted, policy) : byCheck[i] ?? []));
    return evaluated(rerouted, again, catalog, policy, { suggestions: false });
  };
  const suggestions = options.suggestions === false ? [] : suggest({ order, bag, findings, verdict }, catalog, policy, recheck);
  return makeEvaluation({ order, bag, findings, verdict, suggestions }, catalog, policy);
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
