import type { D } from '../decimal.ts';
import type { SolubilityCurve } from '../policy.ts';

/** Where a calcium concentration sits on a curve, and the most inorganic phosphate the curve allows there. */
export type CurveReading =
  | { where: 'on-curve'; maxPhosphateMmolPerL: D }
  /** Below the first point: the first point's phosphate applies (a solubility curve falls as calcium rises). */
  | { where: 'below-first-point'; maxPhosphateMmolPerL: D }
  /** Beyond the last point: the curve says nothing, so no phosphate is shown compatible. */
  | { where: 'beyond-last-point'; lastCalciumMEqPerL: D };

/**
 * Read a solubility curve at a calcium concentration (mEq/L) by linear interpolation between the
 * two points around it. Example: points (10 mEq/L → 30 mmol/L) and (20 → 20); at 15 mEq/L → 25 mmol/L.
 * The policy guarantees at least two points, calcium rising and phosphate not rising.
 */
export function readCurve(curve: Pick<SolubilityCurve, 'points'>, calciumMEqPerL: D): CurveReading {
  const points = curve.points;
  const first = points[0];
  const last = points[points.length - 1];
  if (!first || !last) throw new Error('a solubility curve needs points');
  if (calciumMEqPerL.lt(first.calciumMEqPerL)) return { where: 'below-first-point', maxPhosphateMmolPerL: first.maxPhosphateMmolPerL };
  if (calciumMEqPerL.gt(last.calciumMEqPerL)) return { where: 'beyond-last-point', lastCalciumMEqPerL: last.calciumMEqPerL };
  for (let i = 1; i < points.length; i++) {
    const a = points[i - 1];
    const b = points[i];
    if (!a || !b || calciumMEqPerL.gt(b.calciumMEqPerL)) continue;
    const t = calciumMEqPerL.minus(a.calciumMEqPerL).div(b.calciumMEqPerL.minus(a.calciumMEqPerL));
    return { where: 'on-curve', maxPhosphateMmolPerL: a.maxPhosphateMmolPerL.plus(b.maxPhosphateMmolPerL.minus(a.maxPhosphateMmolPerL).times(t)) };
  }
  return { where: 'on-curve', maxPhosphateMmolPerL: last.maxPhosphateMmolPerL };
}

/**
 * The curve that applies to a bag: one for its amino-acid product at the highest amino-acid %
 * not above the bag's (less amino acid holds less phosphate, so a lower curve is the cautious one).
 */
export function curveFor(curves: readonly SolubilityCurve[], aminoAcidProduct: string, aminoAcidPercent: D): SolubilityCurve | null {
  let best: SolubilityCurve | null = null;
  for (const c of curves) {
    if (c.aminoAcidProduct !== aminoAcidProduct || c.aminoAcidPercent.gt(aminoAcidPercent)) continue;
    if (!best || c.aminoAcidPercent.gt(best.aminoAcidPercent)) best = c;
  }
  return best;
}
