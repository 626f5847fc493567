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
