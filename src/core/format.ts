import { D } from './decimal.ts';

const ZERO_TEXT = new D(0);

/** A decimal as display text with fixed decimals (half-even); thousands are not grouped; never "-0.00". */
export function fmt(value: D, places: number): string {
  const rounded = value.toDecimalPlaces(places);
  return (rounded.isZero() ? ZERO_TEXT : rounded).toFixed(places);
}

/** Like fmt, but drops trailing zeros (for amounts as the user typed them). */
export function fmtTrim(value: D, maxPlaces: number): string {
  const rounded = value.toDecimalPlaces(maxPlaces);
  return rounded.isZero() ? '0' : rounded.toString();
}
