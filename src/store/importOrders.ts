// Import and export of order files (one order, a JSON array, or NDJSON). Import is two steps: plan
// (every order through restore and the zod schema, every problem listed, nothing written) and commit
// (the valid orders in one transaction, and only with the user's consent when some were invalid).
import type { Catalog } from '../core/catalog.ts';
import type { Problem, Result } from '../core/problems.ts';
import { ordersFromText } from '../cli/inputs.ts';
import { sameOrder } from './diff.ts';
import { checkAndStamp, type CheckEnv } from './check.ts';
import { read, write, type Store } from './db.ts';
import { otherPatient, summaryOf } from './orders.ts';
import type { Layout } from './restore.ts';
import type { JsonObject, OrderRecord, OrderVersion } from './types.ts';
import { validOrderFile } from './validate.ts';

/** The largest import read (a design bound: thousands of orders fit; a mistaken video file does not). */
export const MAX_IMPORT_CHARS = 20_000_000;

/** A valid order of the batch and what importing it will do. */
export interface ImportItem {
  /** Where it is in the file: '' (the whole file), `[3]`, `line 4`. */
  where: string;
  orderId: string;
  file: JsonObject;
  from: Layout;
  notes: string[];
  /** `new` order, `new-version` of a saved order with this id, or `unchanged` (equals its latest version). */
  action: 'new' | 'new-version' | 'unchanged';
}

/** An order of the batch that cannot be imported, with every problem. */
export interface ImportRejected {
  where: string;
  /** The order id when the file has one, for the message. */
  orderId: string | null;
  problems: Problem[];
}

/** What an import would do. Nothing has been written yet. */
export interface ImportPlan {
  valid: ImportItem[];
  invalid: ImportRejected[];
}

/** What the planner needs to know about the store: the catalog to validate with, the saved ids. */
export interface ImportContext {
  catalog: Catalog;
  /** Latest version file of every saved order, by order id. */
  latestById: ReadonlyMap<string, JsonObject>;
}

function isRecord(value: unknown): value is JsonObject {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/** Plan an import from the file's text: a pure function of the text and the context; never throws. */
export function planImportWith(text: string, ctx: ImportContext): ImportPlan {
  if (text.length > MAX_IMPORT_CHARS) {
    return { valid: [], invalid: [{ where: '', orderId: null, problems: [{ path: '(file)', message: `is larger than ${MAX_IMPORT_CHARS.toLocaleString('en')} characters; split it` }] }] };
  }
  const found = ordersFromText('', text);
  if (found.orders.length === 0 && found.problems.length === 0) {
    return { valid: [], invalid: [{ where: '', orderId: null, problems: [{ path: '(file)', message: 'holds no orders (an empty list)' }] }] };
  }
  const invalid: ImportRejected[] = found.problems.map((p) => ({ where: p.where, orderId: null, problems: [p.problem] }));
  const valid: ImportItem[] = [];
  const seen = new Map<string, string>();
  for (const { where, value } of found.orders) {
    const orderId = isRecord(value) && typeof value.id === 'string' && value.id.trim() !== '' ? value.id.trim() : null;
    const checked = validOrderFile(value, ctx.catalog);
    if (!checked.ok) {
      invalid.push({ where, orderId, problems: checked.problems });
      continue;
    }
    const id = summaryOf(checked.value.file).orderId;
    const twice = seen.get(id);
    if (twice !== undefined) {
      invalid.push({ where, orderId: id, problems: [{ path: 'id', message: `"${id}" appears twice in this file (also at ${twice || 'the top'}); keep one` }] });
      continue;
    }
    seen.set(id, where);
    const latest = ctx.latestById.get(id);
    const patientChange = latest ? otherPatient(summaryOf(latest), summaryOf(checked.value.file).patientId) : null;
    if (patientChange) {
      invalid.push({ where, orderId: id, problems: [{ path: 'patient.id', message: patientChange }] });
      continue;
    }
    const action = latest === undefined ? 'new' : sameOrder(latest, checked.value.file) ? 'unchanged' : 'new-version';
    valid.push({ where, orderId: id, file: checked.value.file, from: checked.value.from, notes: checked.value.notes, action });
  }
  return { valid, invalid };
}

async function latestFiles(store: Store): Promise<Result<Map<string, JsonObject>>> {
  return read(async () => {
    const tx = store.db.transaction(['orders', 'versions']);
    const out = new Map<string, JsonObject>();
    for (const record of await tx.objectStore('orders').getAll()) {
      const v = await tx.objectStore('versions').get([record.key, record.latest]);
      if (v) out.set(record.orderId, v.file);
    }
    return out;
  });
}

/** Plan an import against what is stored now (reads only). */
export async function planImport(store: Store, env: CheckEnv, text: string): Promise<Result<ImportPlan>> {
  const latest = await latestFiles(store);
  if (!latest.ok) return latest;
  return { ok: true, value: planImportWith(text, { catalog: env.catalog, latestById: latest.value }) };
}

/** What an import wrote. */
export interface ImportDone {
  created: number;
  newVersions: number;
  unchanged: number;
}

/**
 * Write the plan's valid orders in one transaction (all or none). When the plan holds invalid orders
 * the user must confirm (`acceptPartial`); without it nothing is written. A saved order with the same
 * id gets a new version (a signed version stays as it was).
 */
export async function commitImport(store: Store, env: CheckEnv, plan: ImportPlan, options: { acceptPartial: boolean; by: string | null }): Promise<Result<ImportDone>> {
  if (plan.valid.length === 0) return { ok: false, problems: [{ path: '(import)', message: 'no valid order to import' }] };
  if (plan.invalid.length > 0 && !options.acceptPartial) {
    const total = plan.valid.length + plan.invalid.length;
    return { ok: false, problems: [{ path: '(import)', message: `${plan.invalid.length} of ${total} orders are invalid; confirm to import the ${plan.valid.length} valid ones` }] };
  }
  const at = store.now();
  const stamped = plan.valid.map((item) => ({ item, stamp: checkAndStamp(item.file, env, at).stamp }));
  return write(store, ['orders', 'versions'], async (tx) => {
    const orders = tx.objectStore('orders');
    const versions = tx.objectStore('versions');
    const done: ImportDone = { created: 0, newVersions: 0, unchanged: 0 };
    for (const { item, stamp } of stamped) {
      const [existing] = await orders.index('orderId').getAll(item.orderId);
      if (existing) {
        const latest = await versions.get([existing.key, existing.latest]);
        if (latest && sameOrder(latest.file, item.file)) { done.unchanged += 1; continue; }
        const patientChange = otherPatient(existing, summaryOf(item.file).patientId);
        if (patientChange) return { ok: false, problems: [{ path: `${item.where} patient.id`.trim(), message: patientChange }] };
      }
      const key = existing?.key ?? store.newKey();
      const n = (existing?.latest ?? 0) + 1;
      const version: OrderVersion = { orderKey: key, n, file: item.file, savedAt: at, savedBy: options.by, origin: 'imported', check: stamp, signOff: null };
      const record: OrderRecord = {
        key, ...summaryOf(item.file),
        createdAt: existing?.createdAt ?? at, updatedAt: at, latest: n,
        verdict: stamp.verdict, signOff: null, copiedFrom: existing?.copiedFrom ?? null,
      };
      await versions.put(version);
      await orders.put(record);
      if (existing) done.newVersions += 1;
      else done.created += 1;
    }
    return { ok: true, value: done };
  });
}

/** How exported orders are written: one JSON file (an object for one order, an array for several) or NDJSON. */
export type ExportLayout = 'json' | 'ndjson';

/** The latest version of each named order as v1 order files, in the order given. */
export async function exportOrders(store: Store, orderKeys: readonly string[], layout: ExportLayout): Promise<Result<string>> {
  const files = await read(async () => {
    const tx = store.db.transaction(['orders', 'versions']);
    const out: JsonObject[] = [];
    for (const key of orderKeys) {
      const record = await tx.objectStore('orders').get(key);
      const v = record ? await tx.objectStore('versions').get([key, record.latest]) : undefined;
      if (v) out.push(v.file);
    }
    return out;
  });
  if (!files.ok) return files;
  if (layout === 'ndjson') return { ok: true, value: files.value.map((f) => JSON.stringify(f)).join('\n') + '\n' };
  const body = files.value.length === 1 ? files.value[0] : files.value;
  return { ok: true, value: `${JSON.stringify(body, null, 2)}\n` };
}
