import { computeBag } from './compute/bag.ts';
import { CHECKS } from './checks/index.ts';
import { verdictOf } from './findings.ts';
import { parseOrder, type Order } from './order.ts';
import { makeEvaluation, type Evaluation } from './evaluation.ts';
import type { Bag } from './compute/bag.ts';
import type { Catalog } from './catalog.ts';
import type { Policy } from './policy.ts';
import type { Result } from './problems.ts';
import { compoundOrder, hasIons } from './compound/compoundOrder.ts';
import { withIonFindings } from './compound/ionFindings.ts';
import { suggest } from './solve/index.ts';

export type { Evaluation } from './evaluation.ts';

/** Options of one evaluation. */
export interface EvaluateOptions {
  /** Look for suggestions (default true; the solver re-checks its proposals without them). */
  suggestions?: boolean;
}

/**
 * Compute a validated order's bag, run every check, look for suggestions, and build its report.
 * `bag`, when given, is this order's bag already computed (the solver passes it for a change that
 * cannot alter the bag, such as the route).
 */
export function evaluateOrder(order: Order, catalog: Catalog, policy: Policy, options: EvaluateOptions = {}, bag: Bag = computeBag(order, policy)): Evaluation {
  const findings = CHECKS.flatMap((check) => check(bag, policy));
  const verdict = verdictOf(findings);
  const suggestions = options.suggestions === false
    ? []
    : suggest({ order, bag, findings, verdict }, catalog, policy, (modified, sameBag) => evaluateOrder(modified, catalog, policy, { suggestions: false }, sameBag));
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
