import Decimal from 'decimal.js';

/** A report number as display text with fixed decimals (the report is already rounded at its edge). */
export function show(value: number, places: number): string {
  return new Decimal(value).toFixed(places);
}

/** Display text for an optional number: an em dash when there is none. */
export function showOr(value: number | null, places: number): string {
  return value === null ? '—' : show(value, places);
}

export const AGE_GROUP_TEXT = {
  adult: 'Adult',
  child: 'Child',
  'term-neonate': 'Term neonate',
  'preterm-neonate': 'Preterm neonate',
} as const;

export const VERDICT_TEXT = {
  pass: { word: 'Pass', detail: 'No finding holds this bag.' },
  warn: { word: 'Review', detail: 'Warnings need a pharmacist’s review before release.' },
  block: { word: 'Hold', detail: 'Do not compound as ordered.' },
} as const;

export const SEVERITY_TEXT = { block: 'Hold', warn: 'Review', info: 'Note' } as const;

/** An amount with decimals that suit its size (3 below 10, 2 below 100, else 1): per-kg doses stay readable. */
export function showAmount(value: number): string {
  const size = Math.abs(value);
  return show(value, size < 10 ? 3 : size < 100 ? 2 : 1);
}

/** A report number with thousands grouped by a thin space, for large figures read at a glance. */
export function showGrouped(value: number, places: number): string {
  const [whole = '', frac] = show(value, places).split('.');
  const grouped = whole.replace(/\B(?=(\d{3})+(?!\d))/g, '\u2009');
  return frac === undefined ? grouped : `${grouped}.${frac}`;
}

export const ROLE_TEXT = {
  dextrose: 'Dextrose',
  'amino-acids': 'Amino acids',
  lipid: 'Lipid emulsions',
  electrolyte: 'Electrolytes',
  additive: 'Additives',
  water: 'Water',
} as const;

export const ROUTE_TEXT = { peripheral: 'Peripheral line', central: 'Central line' } as const;

/** The gap between two report numbers (a − b), exact in decimal, for "N over/under the limit" text. */
export function showGap(a: number, b: number, places: number): string {
  return new Decimal(a).minus(b).toFixed(places);
}
