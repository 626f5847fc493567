import Decimal from 'decimal.js';

// Printed figures. Amounts drop trailing zeros and keep a leading zero ("0.5 mL", never "5.0 mL" or
// ".5 mL": ISMP list of error-prone dose designations); measured figures keep fixed decimals.

/** A number with at most `places` decimals, trailing zeros dropped (half-even). */
export function trimmed(value: number, places: number): string {
  const s = new Decimal(value).toDecimalPlaces(places, Decimal.ROUND_HALF_EVEN).toFixed(places);
  const t = s.includes('.') ? s.replace(/\.?0+$/, '') : s;
  return t === '-0' ? '0' : t;
}

/** A number with exactly `places` decimals (half-even). */
export function fixed(value: number, places: number): string {
  const t = new Decimal(value).toDecimalPlaces(places, Decimal.ROUND_HALF_EVEN).toFixed(places);
  return /^-0(\.0+)?$/.test(t) ? t.slice(1) : t;
}

/** Decimals an amount is printed with: more for small amounts (3 below 1, 2 below 100, else 1). */
function amountPlaces(value: number): number {
  const a = Math.abs(value);
  if (a < 1) return 3;
  if (a < 100) return 2;
  return 1;
}

/** An ordered amount with its unit, e.g. "9.3 mEq", "0.857 mEq/kg", "2000 mL". */
export function amount(value: number, unit: string): string {
  return `${trimmed(value, amountPlaces(value))} ${unit}`;
}

/** A figure with fixed decimals and its unit, e.g. "214.29 mL". */
export function figure(value: number, places: number, unit: string): string {
  return `${fixed(value, places)} ${unit}`;
}

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'] as const;

/**
 * A date and 24-hour time in a time zone, written so no reader can swap day and month:
 * "4 Dec 2026 01:00". An invalid date prints as text saying so, never "Invalid Date".
 */
export function dateTime(date: Date, timeZone: string): string {
  if (!Number.isFinite(date.getTime())) return '(no valid date and time)';
  const parts = new Intl.DateTimeFormat('en-GB', {
    timeZone, year: 'numeric', month: 'numeric', day: 'numeric', hour: '2-digit', minute: '2-digit', hourCycle: 'h23',
  }).formatToParts(date);
  const get = (type: Intl.DateTimeFormatPartTypes) => parts.find((p) => p.type === type)?.value ?? '';
  const month = MONTHS[Number(get('month')) - 1] ?? get('month');
  return `${get('day')} ${month} ${get('year')} ${get('hour')}:${get('minute')}`;
}
