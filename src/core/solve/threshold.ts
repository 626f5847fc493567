import type { D } from '../decimal.ts';
import type { Bag } from '../compute/bag.ts';
import type { Policy } from '../policy.ts';

type Method = 'particle' | 'labelSum';

/** The osmolarity methods the route check reads: both for "higher", else the one the policy names. */
export function methodsOf(policy: Policy): Method[] {
  return policy.reportedOsmolarity === 'higher' ? ['particle', 'labelSum'] : [policy.reportedOsmolarity];
}

/** The bag's mOsm by one method (the bag's own sum of its lines). */
function totalMOsm(bag: Bag, method: Method): D {
  return method === 'particle' ? bag.totalMOsm.particle : bag.totalMOsm.labelSum;
}

/**
 * Where a bag's osmolarity meets a limit as one amount x of the order changes, when the bag's
 * mOsm and volume are both straight lines in x (true for the final volume with a fill line, and
 * for one line's amount): from two bags, at x0 and x1, solve (T(x) × 1000) = limit × V(x).
 * Returns per method the crossing point and whether osmolarity falls as x rises, or null when
 * the two do not cross (osmolarity does not change with x).
 *
 * Example: T = 2298.6 mOsm at V = 2000 mL and 2298.6 mOsm at 3000 mL (water fill), limit 900 →
 * x = 2554 mL, falling.
 */
export function crossings(policy: Policy, limit: D, x0: D, bag0: Bag, x1: D, bag1: Bag): { method: Method; x: D; falling: boolean }[] | null {
  const dx = x1.minus(x0);
  if (dx.isZero()) return null;
  const out: { method: Method; x: D; falling: boolean }[] = [];
  for (const method of methodsOf(policy)) {
    // f(x) = 1000·T(x) − limit·V(x) is ≤ 0 where the bag passes; it is linear in x.
    const f0 = totalMOsm(bag0, method).times(1000).minus(limit.times(bag0.finalVolumeMl));
    const f1 = totalMOsm(bag1, method).times(1000).minus(limit.times(bag1.finalVolumeMl));
    const slope = f1.minus(f0).div(dx);
    if (slope.isZero()) return null;
    out.push({ method, x: x0.minus(f0.div(slope)), falling: slope.lt(0) });
  }
  return out;
}

/** x rounded up to a whole number of steps. Example: 2554 mL, step 10 → 2560. */
export function ceilToStep(x: D, step: D): D {
  return x.div(step).toDecimalPlaces(12).ceil().times(step);
}

/** x rounded down to a whole number of steps. Example: 151.2 g, step 5 → 150. */
export function floorToStep(x: D, step: D): D {
  return x.div(step).toDecimalPlaces(12).floor().times(step);
}
