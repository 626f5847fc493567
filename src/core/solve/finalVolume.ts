import { D } from '../decimal.ts';
import { fmt, fmtTrim } from '../format.ts';
import { volumeStepFor, type Policy } from '../policy.ts';
import { computeBag } from '../compute/bag.ts';
import type { Catalog } from '../catalog.ts';
import type { Order } from '../order.ts';
import { propose, appearsText } from './consequences.ts';
import { crossings, ceilToStep } from './threshold.ts';
import type { Checked, Evaluate, Suggestion } from './suggestion.ts';

/** How many extra steps the solver tries when rounding meets the limit at full precision. */
const GUARD_STEPS = 5;

/**
 * The smallest final volume (rounded UP to the policy's volume step) that brings a failing
 * peripheral bag's reported osmolarity to the limit. A fill line grows; without one, the
 * proposal adds the catalog's water stock as the fill and says so. Re-checked through every
 * check; never applied. Example: 2298.6 mOsm in 2000 mL (1149.3 mOsm/L), limit 900, step 10 mL
 * → 2560 mL (2554 exactly).
 */
export function finalVolumeSuggestion(current: Checked, catalog: Catalog, policy: Policy, limit: D, evaluate: Evaluate): Suggestion {
  const { order, bag } = current;
  const fill = order.lines.find((l) => l.kind === 'fill');
  const fillProduct = fill?.product ?? catalog.products.find((p) => p.role === 'water') ?? null;
  if (!fillProduct) {
    return { kind: 'final-volume', status: 'unavailable', message: 'A larger volume needs a fill line: the order has none and the catalog has no water stock to add.', notes: [] };
  }
  const withVolume = (volumeMl: D): Order => ({
    ...order,
    volumeMl,
    lines: fill ? order.lines : [...order.lines, { kind: 'fill', index: order.lines.length, product: fillProduct, note: null }],
  });
  const x0 = bag.finalVolumeMl;
  const x1 = x0.plus(1000);
  // With a fill line and the ordered volume as the final one, the bag at x0 is the evaluated bag.
  const bag0 = fill && order.volumeMl?.eq(x0) ? bag : computeBag(withVolume(x0), policy, bag);
  const found = crossings(policy, limit, x0, bag0, x1, computeBag(withVolume(x1), policy, bag));
  if (!found || found.some((c) => !c.falling)) {
    return { kind: 'final-volume', status: 'unavailable', message: `More volume cannot bring this bag under ${limit.toString()} mOsm/L: the fill stock (${fillProduct.name}) is itself at or above the limit.`, notes: [] };
  }
  const step = volumeStepFor(policy, order.patient.ageGroup);
  let volume = ceilToStep(D.max(...found.map((c) => c.x)), step);
  let proposed = computeBag(withVolume(volume), policy, bag);
  for (let i = 0; i < GUARD_STEPS && proposed.osmolarity.reported.gt(limit); i++) {
    volume = volume.plus(step);
    proposed = computeBag(withVolume(volume), policy, bag);
  }
  const next = evaluate(proposed);
  const notes: string[] = [];
  if (!fill) notes.push(`The order has no fill line: a volume change needs one, so this proposal adds ${fillProduct.name} to make up the volume.`);
  const p = propose('final-volume', '', { field: 'volumeMl', from: order.volumeMl, to: volume, unit: 'mL', addsFillLine: fill ? null : fillProduct.id }, current, next, policy, notes);
  const added = volume.minus(bag.finalVolumeMl);
  const how = fill ? `the ${fillProduct.name} fill grows by ${fmtTrim(added, 1)} mL` : `adding ${fillProduct.name} as the fill (${fmtTrim(added, 1)} mL), as the order has no fill line`;
  p.message = `Final volume ${fmtTrim(volume, 1)} mL (from ${fmtTrim(bag.finalVolumeMl, 1)} mL, rounded up to ${fmtTrim(step, 1)} mL): ${how}; reported osmolarity ${fmt(p.after.osmolarity, 1)} mOsm/L against ${limit.toString()}. Fluid ${fmt(p.before.fluidMlPerKgPerDay, 1)} → ${fmt(p.after.fluidMlPerKgPerDay, 1)} mL/kg/day; rate ${fmt(next.bag.rateMlPerHour, 1)} mL/h.${appearsText(p.appears)} A proposal only: the pharmacist decides.`;
  return p;
}
