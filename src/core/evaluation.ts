import type { Bag } from './compute/bag.ts';
import type { Finding, Verdict } from './findings.ts';
import type { Order } from './order.ts';
import { toReport, type Report } from './report.ts';
import type { Catalog } from './catalog.ts';
import type { Policy } from './policy.ts';
import type { Suggestion } from './solve/index.ts';

/** Everything the engine knows about one bag. */
export interface Evaluation {
  order: Order;
  bag: Bag;
  findings: Finding[];
  verdict: Verdict;
  /** The rounded report; built on first read (the solver's re-checks never need one). */
  readonly report: Report;
  /** What would make the bag fit its route (proposals, never applied); also in `report.suggestions`. */
  suggestions: Suggestion[];
}

/**
 * An evaluation whose report is built once, when first read. A class, not an object literal with a
 * getter: a literal's getter is a new closure each time, which gives every evaluation its own hidden
 * class — every reader of evaluations then slows down, and a batch spends its time collecting garbage.
 */
class LazyEvaluation implements Evaluation {
  readonly order: Order;
  readonly bag: Bag;
  readonly findings: Finding[];
  readonly verdict: Verdict;
  readonly suggestions: Suggestion[];
  #report: Report | null = null;
  readonly #catalog: Catalog;
  readonly #policy: Policy;

  constructor(parts: { order: Order; bag: Bag; findings: Finding[]; verdict: Verdict; suggestions: Suggestion[] }, catalog: Catalog, policy: Policy) {
    this.order = parts.order;
    this.bag = parts.bag;
    this.findings = parts.findings;
    this.verdict = parts.verdict;
    this.suggestions = parts.suggestions;
    this.#catalog = catalog;
    this.#policy = policy;
  }

  get report(): Report {
    if (this.#report === null) {
      this.#report = toReport(this.bag, this.findings, this.verdict, this.#catalog, this.#policy, this.suggestions);
    }
    return this.#report;
  }
}

/** Assemble an evaluation whose report is built once, when first read. */
export function makeEvaluation(
  parts: { order: Order; bag: Bag; findings: Finding[]; verdict: Verdict; suggestions: Suggestion[] },
  catalog: Catalog,
  policy: Policy,
): Evaluation {
  return new LazyEvaluation(parts, catalog, policy);
}
