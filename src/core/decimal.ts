import Decimal from 'decimal.js';

/**
 * The engine's one decimal configuration: 28 significant digits (a dose of 10⁵ units is still exact to
 * 10⁻²² of a unit), half-even at the display edge.
 */
export const D = Decimal.clone({ precision: 28, rounding: Decimal.ROUND_HALF_EVEN });
export type D = InstanceType<typeof D>;

export const ZERO = new D(0);
export const ONE = new D(1);
export const THOUSAND = new D(1000);

/** Read a JSON number or decimal string into a decimal; null when it is not a finite number. */
export function toDecimal(value: unknown): D | null {
  if (typeof value === 'number') return Number.isFinite(value) ? new D(value) : null;
  if (typeof value === 'string') {
    const text = value.trim();
    if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(text)) return null;
    const d = new D(text);
    return d.isFinite() ? d : null;
  }
  return null;
}

/** Sum of decimals. */
export function sum(values: Iterable<D>): D {
  let total = ZERO;
  for (const v of values) total = total.plus(v);
  return total;
}

/**
 * Round for display or for the report: a finite JSON number with `places` decimals (half-even).
 * Never returns NaN or Infinity: a non-finite input is a programming error and throws.
 */
export function round(value: D, places: number): number {
  if (value.isZero()) return 0;
  if (!value.isFinite()) throw new Error('non-finite value reached the display edge');
  const n = value.toDecimalPlaces(places, Decimal.ROUND_HALF_EVEN).toNumber();
  return Object.is(n, -0) ? 0 : n;
}

/** Ratio a ÷ b, or null when b is zero (callers decide what an undefined ratio means). */
export function ratio(a: D, b: D): D | null {
  return b.isZero() ? null : a.div(b);
}
