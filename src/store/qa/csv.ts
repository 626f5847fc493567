// The QA log as CSV for a spreadsheet: RFC 4180 quoting (fields with a comma, quote or line break are
// quoted, quotes doubled, CRLF between records), and text that a spreadsheet would run as a formula
// neutralised (OWASP "CSV Injection": a leading = + - @ tab or CR gets a leading apostrophe).
import type { QaEntry } from '../types.ts';
import { qaComparisonRows } from './stats.ts';

/** One CSV field: quoted only when it must be (RFC 4180 §2.6–2.7). */
export function csvField(value: string): string {
  return /[",\r\n]/.test(value) ? `"${value.replace(/"/g, '""')}"` : value;
}

/** User-typed text made safe to open in a spreadsheet (numbers are written as numbers and never pass here). */
export function csvText(value: string): string {
  return csvField(/^[=+\-@\t\r]/.test(value) ? `'${value}` : value);
}

/** Records joined with CRLF, ending with CRLF. */
export function csvRecords(rows: readonly (readonly string[])[]): string {
  return rows.map((r) => r.join(',')).join('\r\n') + '\r\n';
}

function num(value: number | null | undefined): string {
  return value === null || value === undefined ? '' : String(value);
}

/**
 * The QA log as CSV: one row per measurement with its calculated figures and differences (rounded as
 * on screen). Predicted-osmolality columns appear for each method any entry has.
 */
export function qaCsv(entries: readonly QaEntry[]): string {
  const rows = qaComparisonRows(entries);
  const keys: { key: string; label: string }[] = [];
  for (const r of rows) for (const f of r.figures) if (!keys.some((k) => k.key === f.key)) keys.push({ key: f.key, label: f.label });
  const rank = (k: string) => (k === 'particle' ? 0 : k === 'labelSum' ? 1 : 2);
  keys.sort((a, b) => rank(a.key) - rank(b.key) || a.key.localeCompare(b.key));
  const header = [
    'measured_on', 'order_id', 'version', 'age_band', 'system', 'measured_mosm_per_kg', 'method', 'instrument',
    ...keys.map((k) => `${k.key}_calculated`), ...keys.map((k) => `${k.key}_difference`),
    'recorded_at', 'recorded_by',
  ];
  const body = rows.map((r) => {
    const byKey = new Map(r.figures.map((f) => [f.key, f]));
    return [
      r.entry.measuredOn, csvText(r.entry.orderId), String(r.entry.version), r.entry.ageBand, r.entry.system,
      num(r.measured), r.entry.method, csvText(r.entry.instrument),
      ...keys.map((k) => num(byKey.get(k.key)?.calculated)), ...keys.map((k) => num(byKey.get(k.key)?.difference)),
      r.entry.recordedAt, csvText(r.entry.recordedBy ?? ''),
    ];
  });
  return csvRecords([header, ...body]);
}
