import { ruleFor, type Policy } from '../policy.ts';
import type { Catalog } from '../catalog.ts';
import { finalVolumeSuggestion } from './finalVolume.ts';
import { dextroseSuggestion } from './dextrose.ts';
import { peripheralRouteSuggestion } from './peripheralRoute.ts';
import { failsOsmolarity } from './consequences.ts';
import type { Checked, Evaluate, Suggestion } from './suggestion.ts';

export type { Suggestion, Proposal, Unavailable, Change, Snapshot, Checked, Evaluate } from './suggestion.ts';

/**
 * What would make the bag fit its route, each re-checked through every check by `evaluate`:
 * for a peripheral bag over the osmolarity limit, the smallest final volume and the largest
 * dextrose that bring it to the limit; for a central bag, whether it would already pass
 * peripherally. Proposals only: nothing is applied.
 */
export function suggest(current: Checked, catalog: Catalog, policy: Policy, evaluate: Evaluate): Suggestion[] {
  const { order } = current;
  if (order.route === 'central') {
    const s = peripheralRouteSuggestion(current, policy, evaluate);
    return s ? [s] : [];
  }
  // A peripheral bag gets proposals only when it fails the osmolarity screen (most do not).
  if (!failsOsmolarity(current.findings)) return [];
  const limit = ruleFor(policy, 'osmolarity-peripheral', order.patient.ageGroup)?.max ?? null;
  if (!limit) return [];
  const out: Suggestion[] = [finalVolumeSuggestion(current, catalog, policy, limit, evaluate)];
  const dextrose = dextroseSuggestion(current, policy, limit, evaluate);
  if (dextrose) out.push(dextrose);
  return out;
}
