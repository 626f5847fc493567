import { D, round } from './decimal.ts';

/** A decimal as display text with fixed decimals (half-even); thousands are not grouped. */
export function fmt(value: D, places: number): string {
  return new D(round(value, places)).toFixed(places);
}

/** Like fmt, but drops trailing zeros (for amounts as the user typed them). */
export function fmtTrim(value: D, maxPlaces: number): string {
  return new D(round(value, maxPlaces)).toString();
}
