// Did the catalog or policy change since an order was checked? Compare the hashes the version carries
// with the ones in force, and, when the old file is still in the library, say what changed.
import type { CheckEnv } from './check.ts';
import type { Store } from './db.ts';
import { fileByHash, type RefKind } from './files.ts';
import { valueText } from './diff.ts';
import type { CheckStamp, FileRef, JsonObject } from './types.ts';

/** A catalog or policy that is not the one the order was checked against. */
export interface RefChange {
  kind: RefKind;
  then: FileRef;
  now: FileRef;
  /** What changed, one line each ("amino-acids-10 mOsmPerMl: 0.998 → 1.03"); null when the old file is unknown. */
  details: string[] | null;
}

function isRecord(value: unknown): value is JsonObject {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/** Leaves of a JSON value by dotted path (arrays by index). */
function flatten(value: unknown, prefix: string, out: Map<string, string>): Map<string, string> {
  if (isRecord(value)) for (const [k, v] of Object.entries(value)) flatten(v, prefix === '' ? k : `${prefix}.${k}`, out);
  else if (Array.isArray(value)) value.forEach((v, i) => flatten(v, `${prefix}[${i}]`, out));
  else out.set(prefix, valueText(value) ?? '');
  return out;
}

function leafChanges(prefix: string, a: unknown, b: unknown): string[] {
  const fa = flatten(a, '', new Map());
  const fb = flatten(b, '', new Map());
  const paths = [...new Set([...fa.keys(), ...fb.keys()])].sort();
  const out: string[] = [];
  for (const p of paths) {
    const x = fa.get(p);
    const y = fb.get(p);
    if (x === y) continue;
    const label = `${prefix}${p === '' ? '' : ` ${p}`}`;
    out.push(x === undefined ? `${label}: added (${y})` : y === undefined ? `${label}: removed (was ${x})` : `${label}: ${x} → ${y}`);
  }
  return out;
}

function productsById(file: JsonObject): Map<string, JsonObject> {
  const list = Array.isArray(file.products) ? file.products : [];
  return new Map(list.filter(isRecord).map((p) => [String(p.id), p]));
}

/** What changed between two catalog files, product by product. */
export function describeCatalogChange(older: JsonObject, newer: JsonObject): string[] {
  const a = productsById(older);
  const b = productsById(newer);
  const out: string[] = [];
  for (const [id, p] of b) if (!a.has(id)) out.push(`${id}: added (${valueText(p.name) ?? id})`);
  for (const [id, p] of a) if (!b.has(id)) out.push(`${id}: removed (${valueText(p.name) ?? id})`);
  for (const [id, p] of a) {
    const q = b.get(id);
    if (q) out.push(...leafChanges(id, p, q));
  }
  const { products: _a, ...restA } = older;
  const { products: _b, ...restB } = newer;
  out.push(...leafChanges('catalog', restA, restB));
  return out;
}

/** What changed between two policy files, rule by rule. */
export function describePolicyChange(older: JsonObject, newer: JsonObject): string[] {
  return leafChanges('policy', older, newer).map((line) => line.replace(/^policy rules\./, '').replace(/^policy /, ''));
}

/**
 * The catalog and policy that changed since a version was checked (empty: both are the same).
 * Details come from the library of every file that was in force.
 */
export async function changedSince(store: Store, env: CheckEnv, stamp: CheckStamp): Promise<RefChange[]> {
  const out: RefChange[] = [];
  for (const kind of ['catalog', 'policy'] as const) {
    const then = stamp[kind];
    const now = kind === 'catalog' ? env.catalogRef : env.policyRef;
    if (then.hash === now.hash) continue;
    const [oldFile, newFile] = await Promise.all([fileByHash(store, kind, then.hash), fileByHash(store, kind, now.hash)]);
    const details = oldFile && newFile ? (kind === 'catalog' ? describeCatalogChange(oldFile, newFile) : describePolicyChange(oldFile, newFile)) : null;
    out.push({ kind, then, now, details });
  }
  return out;
}
