import { D } from '../decimal.ts';
import type { CompoundingPolicy } from './compoundingPolicy.ts';

/** Measured volumes go to the nearest increment, halves up (policy: volumeIncrements). */
const MEASURE_ROUNDING = D.ROUND_HALF_UP;

/** The increment that applies to a volume: the step of the largest `fromMl` it reaches. */
export function incrementFor(volumeMl: D, increments: CompoundingPolicy['volumeIncrements']): D | null {
  // Steps are sorted largest fromMl first and always include fromMl 0 (policy validation).
  return increments.steps.find((s) => volumeMl.gte(s.fromMl))?.stepMl ?? null;
}

/**
 * A volume rounded to what can be measured. With 0.1 mL at or above 1 mL and 0.01 mL below:
 * 6.6667 mL → 6.7 mL; 0.1478 mL → 0.15 mL; 7.25 mL → 7.3 mL (halves up).
 */
export function measurableVolume(volumeMl: D, increments: CompoundingPolicy['volumeIncrements']): D {
  const step = incrementFor(volumeMl, increments);
  return step ? volumeMl.toNearest(step, MEASURE_ROUNDING) : volumeMl;
}
