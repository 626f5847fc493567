import { fmt } from '../format.ts';
import { bagOnRoute } from '../compute/bag.ts';
import { ruleFor, type Policy } from '../policy.ts';
import { propose, appearsText, failsOsmolarity } from './consequences.ts';
import type { Checked, Evaluate, Suggestion } from './suggestion.ts';

/**
 * The reverse question for a central bag: would it already pass peripherally? The order is
 * re-checked with the peripheral route; a proposal when the osmolarity screen passes (with any
 * other peripheral findings it would bring), else the reason it needs the central line.
 */
export function peripheralRouteSuggestion(current: Checked, policy: Policy, evaluate: Evaluate): Suggestion | null {
  const { order } = current;
  if (order.route !== 'central' || current.bag.finalVolumeMl.isZero()) return null;
  const limit = ruleFor(policy, 'osmolarity-peripheral', order.patient.ageGroup)?.max ?? null;
  if (!limit) return { kind: 'peripheral-route', status: 'unavailable', message: 'The policy sets no peripheral osmolarity limit for this age group.', notes: [] };
  // The bag does not depend on the route: over the limit now means over it peripherally, with no re-check.
  const over = current.bag.osmolarity.reported.gt(limit);
  const next = over ? null : evaluate(bagOnRoute(current.bag, 'peripheral'), 'route');
  const osm = current.bag.osmolarity.reported;
  if (next === null || failsOsmolarity(next.findings)) {
    return {
      kind: 'peripheral-route', status: 'unavailable',
      message: `Needs the central line: reported osmolarity ${fmt(osm, 1)} mOsm/L is over the peripheral limit of ${limit.toString()} by ${fmt(osm.minus(limit), 1)}.`,
      notes: [],
    };
  }
  const p = propose('peripheral-route', '', { field: 'route', from: 'central', to: 'peripheral' }, current, next, policy);
  p.message = `This bag would also pass the peripheral osmolarity screen: ${fmt(osm, 1)} mOsm/L against ${limit.toString()}.${appearsText(p.appears)} Whether to use a peripheral vein is the prescriber's and pharmacist's decision.`;
  return p;
}
