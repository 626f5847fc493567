import { D, round } from './decimal.ts';

// A value rounded to `places` decimals and below 10^(15 − places) in size has at most 15 significant
// digits, which a JSON number holds exactly: its text is the decimal's own, with no number in between.
// Larger values go through the number, so the text always shows what the report holds.
const EXACT_LIMITS: D[] = [];

function exactLimit(places: number): D {
  let limit = EXACT_LIMITS[places];
  if (!limit) {
    limit = new D(`1e${15 - places}`);
    EXACT_LIMITS[places] = limit;
  }
  return limit;
}

/** A value rounded half-even to `places` decimals, exactly as the report's number (round()) holds it. */
function shown(value: D, places: number): D {
  if (!value.isFinite()) round(value, places); // throws: a non-finite value never reaches the display
  const rounded = value.toDecimalPlaces(places);
  const limit = exactLimit(places);
  return rounded.abs().lt(limit) ? rounded : new D(round(value, places));
}

// "0", "00", … for padding a scaled integer's digits (places are at most a handful).
const ZEROS: readonly string[] = Array.from({ length: 24 }, (_, i) => '0'.repeat(i));

/** A decimal as display text with fixed decimals (half-even); thousands are not grouped. */
export function fmt(value: D, places: number): string {
  // The common case, written straight from the rounded digits: the value rounded to `places` as a whole
  // number of 10^−places below 10¹⁵ (so the report's number holds it exactly, as shown() requires).
  const q = value.toScaledInteger(places);
  if (q < 1e15 && q > -1e15 && places < ZEROS.length) return fmtScaled(q, places);
  return shown(value, places).toFixed(places);
}

/**
 * fmt's text for a value whose `toScaledInteger(places)` is `q`, for a q below 10¹⁵ in size and fewer than
 * 24 places: for a caller that has q already. Example: 2941 at 2 places → "29.41".
 */
export function fmtScaled(q: number, places: number): string {
  const m = q < 0 ? -q : q;
  let text: string;
  if (places <= FRACTION_PLACES) text = written(m, places);
  else {
    text = String(m);
    if (text.length <= places) text = ZEROS[places + 1 - text.length]! + text;
    text = `${text.slice(0, text.length - places)}.${text.slice(text.length - places)}`;
  }
  return q < 0 ? `-${text}` : text;
}

// ".00" … ".99" and so on for 1–3 places, each written the first time it is shown and kept: display text
// is then the whole part's digits and a kept string.
const FRACTION_PLACES = 3;
const POWERS: readonly number[] = [1, 10, 100, 1000];
const FRACTIONS: (string | undefined)[][] = POWERS.map((n) => new Array<string | undefined>(n)); // sized: stays a plain array

function fraction(places: number, digits: number): string {
  const kept = FRACTIONS[places]!;
  let text = kept[digits];
  if (text === undefined) {
    const d = String(digits);
    text = `.${ZEROS[places - d.length]!}${d}`;
    kept[digits] = text;
  }
  return text;
}

/** The text of m whole 10^−places (0–3 places), without a sign. */
function written(m: number, places: number): string {
  if (places === 0) return String(m);
  const unit = POWERS[places]!;
  const whole = Math.floor(m / unit);
  return String(whole) + fraction(places, m - whole * unit);
}

/** Like fmt, but drops trailing zeros (for amounts as the user typed them). */
export function fmtTrim(value: D, maxPlaces: number): string {
  // As fmt: the rounded value's digits, here with its trailing zeros (and then the point) left off.
  let q = value.toScaledInteger(maxPlaces);
  if (q < 1e15 && q > -1e15 && maxPlaces < ZEROS.length) {
    let places = maxPlaces;
    // q ÷ 10 is whole exactly when q is a multiple of ten (below 10¹⁵, a tenth's remainder shows).
    for (let tenth = q / 10; places > 0 && q !== 0 && tenth === Math.floor(tenth); tenth = q / 10) {
      q = tenth;
      places--;
    }
    return fmtScaled(q, q === 0 ? 0 : places);
  }
  return shown(value, maxPlaces).toString();
}
