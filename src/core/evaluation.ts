import type { Bag } from './compute/bag.ts';
import type { Finding, Verdict } from './findings.ts';
import type { Order } from './order.ts';
import { toReport, type Report } from './report.ts';
import type { Catalog } from './catalog.ts';
import type { Policy } from './policy.ts';
import type { Suggestion } from './solve/index.ts';
import { suggestionReport } from './solve/report.ts';

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

/** Assemble an evaluation whose report is built once, when first read. */
export function makeEvaluation(
  parts: { order: Order; bag: Bag; findings: Finding[]; verdict: Verdict; suggestions: Suggestion[] },
  catalog: Catalog,
  policy: Policy,
): Evaluation {
  let report: Report | null = null;
  return {
    ...parts,
    get report(): Report {
      if (report === null) {
        report = toReport(parts.bag, parts.findings, parts.verdict, catalog, policy);
        if (parts.suggestions.length > 0) report.suggestions = parts.suggestions.map(suggestionReport);
      }
      return report;
    },
  };
}
