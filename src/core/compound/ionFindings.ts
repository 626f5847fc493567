import { fmt } from '../format.ts';
import { verdictOf, type Finding } from '../findings.ts';
import type { Catalog } from '../catalog.ts';
import type { Policy } from '../policy.ts';
import { makeEvaluation, type Evaluation } from '../evaluation.ts';
import { ION_INFO, ION_KEYS } from './ions.ts';
import type { CompoundResult } from './compoundOrder.ts';

/** One-line delivered-vs-ordered summary, e.g. "sodium 100.00/100.00 mEq, …". */
export function deliveredSummary(r: CompoundResult): string {
  return ION_KEYS.map((k) => {
    const ordered = r.unordered.includes(k) ? 'no amount ordered' : `ordered ${fmt(r.ordered[k], 2)}`;
    return `${ION_INFO[k].label} ${fmt(r.delivered[k], 2)} ${ION_INFO[k].unit} (${ordered})`;
  }).join(', ');
}

/**
 * The allocator's problems as findings of the bag (`ion-order`, `measurable-volume`), plus one
 * `info` finding that says which lines came from the ion order and what they deliver.
 */
export function ionFindings(r: CompoundResult): Finding[] {
  const lines = r.lines.filter((l) => l.volumeMl.gt(0)).map((l) => l.index);
  const findings: Finding[] = r.problems.map((p) => ({
    code: p.code === 'below-measurable-volume' ? 'measurable-volume' : 'ion-order',
    severity: p.severity,
    value: null, limit: null, unit: null, decimals: 2,
    message: `${p.message}${p.proposal ? ` Proposal: ${p.proposal.text}` : ''}${p.severity === 'block' && r.lines.length > 0 ? ' The lines added below meet the proposal, not the order as written.' : ''}`,
    source: p.source,
    lines: p.code === 'below-measurable-volume' ? r.lines.filter((l) => l.belowMeasurable).map((l) => l.index) : lines,
    fields: [p.path],
  }));
  findings.push({
    code: 'ion-order', severity: 'info', value: null, limit: null, unit: null, decimals: 2,
    message: `${lines.length} electrolyte line${lines.length === 1 ? '' : 's'} allocated from the ion order, volumes rounded to measurable increments. Delivered per bag: ${deliveredSummary(r)}.`,
    source: r.targets ? 'arithmetic: stock compositions from the catalog; measuring increments from the policy' : 'policy: compounding section missing',
    lines, fields: ['ions'],
  });
  return findings;
}

/** An evaluation with the allocator's findings added, its verdict and report rebuilt. */
export function withIonFindings(evaluation: Evaluation, r: CompoundResult, catalog: Catalog, policy: Policy): Evaluation {
  const findings = [...evaluation.findings, ...ionFindings(r)];
  const verdict = verdictOf(findings);
  return makeEvaluation({ order: evaluation.order, bag: evaluation.bag, findings, verdict, suggestions: evaluation.suggestions }, catalog, policy);
}

