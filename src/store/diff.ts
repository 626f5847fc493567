// What changed between two versions of an order, field by field: the header fields, and the lines
// matched by product (the n-th line of a product in one version with the n-th in the other).
import { toDecimal } from '../core/decimal.ts';
import { canonicalJson } from './canonical.ts';
import type { JsonObject, OrderVersion } from './types.ts';

/** One field that changed: where, and from what to what (null = absent). */
export interface Change {
  kind: 'changed' | 'added' | 'removed';
  /** Path in the order file of the newer version (the older one for a removed line). */
  path: string;
  /** What the user calls the field: "Dosing weight (kg)", "amount", "line". */
  field: string;
  /** For line changes: the product id and the line's position (1-based) in the older/newer version. */
  product?: string;
  lineFrom?: number;
  lineTo?: number;
  from: string | null;
  to: string | null;
}

/** Header fields in the order they are shown, with their labels. */
export const HEADER_FIELDS: readonly (readonly [path: string, label: string])[] = [
  ['id', 'Order id'],
  ['patient.id', 'Patient id'],
  ['patient.name', 'Patient name'],
  ['patient.location', 'Location'],
  ['patient.weightKg', 'Dosing weight (kg)'],
  ['patient.ageGroup', 'Age group'],
  ['route', 'Route'],
  ['volumeMl', 'Bag volume (mL)'],
  ['hours', 'Duration (h)'],
  ['ions', 'Ion order'],
  ['note', 'Note'],
];

const LINE_FIELDS = ['amount', 'unit', 'species', 'fill', 'note'] as const;
const SKIP_TOP = new Set(['format', 'version', 'lines', 'patient', ...HEADER_FIELDS.map(([p]) => p)]);

function isRecord(value: unknown): value is JsonObject {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function at(file: JsonObject, path: string): unknown {
  let value: unknown = file;
  for (const part of path.split('.')) value = isRecord(value) ? value[part] : undefined;
  return value;
}

/** A value as the text a user reads: strings as they are, numbers in their JSON spelling, objects as JSON. */
export function valueText(value: unknown): string | null {
  if (value === undefined || value === null || value === '') return null;
  if (typeof value === 'string') return value;
  if (typeof value === 'number' || typeof value === 'boolean') return String(value);
  return canonicalJson(value);
}

/** Same value for the user: numbers compare by value ("150" = 150 = 150.0), everything else by content. */
function same(a: unknown, b: unknown): boolean {
  const ta = valueText(a);
  const tb = valueText(b);
  if (ta === tb) return true;
  if (ta === null || tb === null) return false;
  const da = typeof a === 'object' ? null : toDecimal(a);
  const db = typeof b === 'object' ? null : toDecimal(b);
  return da !== null && db !== null && da.eq(db);
}

function fieldChange(path: string, field: string, a: unknown, b: unknown, extra: Partial<Change> = {}): Change | null {
  if (same(a, b)) return null;
  const from = valueText(a);
  const to = valueText(b);
  const kind = from === null ? 'added' : to === null ? 'removed' : 'changed';
  return { kind, path, field, ...extra, from, to };
}

function lineText(line: unknown): string {
  if (!isRecord(line)) return valueText(line) ?? '';
  if (line.fill === true) return 'fill to volume';
  return [valueText(line.amount), valueText(line.unit), line.species ? `(${valueText(line.species)})` : null].filter(Boolean).join(' ');
}

function productOf(line: unknown): string {
  return isRecord(line) ? (valueText(line.product) ?? '') : '';
}

function diffLines(a: unknown[], b: unknown[]): Change[] {
  const changes: Change[] = [];
  const used = new Set<number>();
  const matchOf = (i: number): number | null => {
    const product = productOf(a[i]);
    const occurrence = a.slice(0, i).filter((l) => productOf(l) === product).length;
    let seen = 0;
    for (let j = 0; j < b.length; j += 1) {
      if (productOf(b[j]) !== product) continue;
      if (seen === occurrence) return j;
      seen += 1;
    }
    return null;
  };
  a.forEach((old, i) => {
    const j = matchOf(i);
    const product = productOf(old);
    if (j === null) {
      changes.push({ kind: 'removed', path: `lines[${i}]`, field: 'line', product, lineFrom: i + 1, from: lineText(old), to: null });
      return;
    }
    used.add(j);
    const neu = b[j];
    const keys = new Set<string>([...LINE_FIELDS, ...(isRecord(old) ? Object.keys(old) : []), ...(isRecord(neu) ? Object.keys(neu) : [])]);
    keys.delete('product');
    for (const key of keys) {
      const c = fieldChange(`lines[${j}].${key}`, key, isRecord(old) ? old[key] : undefined, isRecord(neu) ? neu[key] : undefined, { product, lineFrom: i + 1, lineTo: j + 1 });
      if (c) changes.push(c);
    }
  });
  b.forEach((neu, j) => {
    if (!used.has(j)) changes.push({ kind: 'added', path: `lines[${j}]`, field: 'line', product: productOf(neu), lineTo: j + 1, from: null, to: lineText(neu) });
  });
  return changes;
}

/**
 * Every field that differs between two order files: header fields first (in screen order), then any
 * other top-level or patient field, then the lines. Numbers equal in value are not a change.
 */
export function diffOrders(older: JsonObject, newer: JsonObject): Change[] {
  const changes: Change[] = [];
  for (const [path, label] of HEADER_FIELDS) {
    const c = fieldChange(path, label, at(older, path), at(newer, path));
    if (c) changes.push(c);
  }
  const extraKeys = (o: JsonObject, prefix: string, skip: (k: string) => boolean) => Object.keys(o).filter((k) => !skip(k)).map((k) => `${prefix}${k}`);
  const pa = isRecord(older.patient) ? older.patient : {};
  const pb = isRecord(newer.patient) ? newer.patient : {};
  const known = (k: string) => HEADER_FIELDS.some(([p]) => p === `patient.${k}`);
  const others = new Set([
    ...extraKeys(older, '', (k) => SKIP_TOP.has(k)), ...extraKeys(newer, '', (k) => SKIP_TOP.has(k)),
    ...extraKeys(pa, 'patient.', known), ...extraKeys(pb, 'patient.', known),
  ]);
  for (const path of [...others].sort()) {
    const c = fieldChange(path, path, at(older, path), at(newer, path));
    if (c) changes.push(c);
  }
  const la = Array.isArray(older.lines) ? older.lines : [];
  const lb = Array.isArray(newer.lines) ? newer.lines : [];
  changes.push(...diffLines(la, lb));
  return changes;
}

/**
 * The same order for a pharmacist: no field differs (numbers by value, so "2000" is 2000). Saving or
 * importing such a file adds no version.
 */
export function sameOrder(a: JsonObject, b: JsonObject): boolean {
  return diffOrders(a, b).length === 0;
}

/** One entry of an order's history: a version, who saved and signed it, and what it changed. */
export interface HistoryEntry {
  version: OrderVersion;
  /** Changes from the previous version (empty for the first). */
  changes: Change[];
}

/** The history of an order, newest first: each version with its changes from the one before. */
export function historyOf(versions: readonly OrderVersion[]): HistoryEntry[] {
  const sorted = [...versions].sort((x, y) => x.n - y.n);
  return sorted.map((version, i) => ({ version, changes: i === 0 ? [] : diffOrders(sorted[i - 1]!.file, version.file) })).reverse();
}
