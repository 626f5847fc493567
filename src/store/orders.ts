// Saved orders: every version kept, the open draft autosaved, sign-off that locks a version, copies
// for the next day's bag, and deletion. Versions are append-only: a change after a sign-off (or any
// change at all) is a new version; only the latest unsigned version can be signed, once.
import type { Problem, Result } from '../core/problems.ts';
import { sameOrder } from './diff.ts';
import { checkAndStamp, type CheckEnv } from './check.ts';
import { read, write, type Store } from './db.ts';
import { remember, shippedFile } from './files.ts';
import { searchOrders, type OrderQuery } from './search.ts';
import type { Draft, JsonObject, OrderRecord, OrderVersion, SignOff, VersionOrigin } from './types.ts';

function text(value: unknown): string {
  return typeof value === 'string' ? value.trim() : typeof value === 'number' ? String(value) : '';
}

function isRecord(value: unknown): value is JsonObject {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/** The list fields of an order file (which may be incomplete: a draft in progress). */
export function summaryOf(file: JsonObject): Pick<OrderRecord, 'orderId' | 'patientId' | 'patientName' | 'ageGroup' | 'route'> {
  const patient = isRecord(file.patient) ? file.patient : {};
  const name = text(patient.name);
  const age = text(patient.ageGroup);
  const route = text(file.route);
  return { orderId: text(file.id), patientId: text(patient.id), patientName: name || null, ageGroup: age || null, route: route || null };
}

function fail<T>(path: string, message: string): Result<T> {
  return { ok: false, problems: [{ path, message }] };
}

/**
 * A saved order keeps its patient: a version for another patient id is refused (a different patient's
 * bag is a new order). Returns the message, or null when the patient is the same (or was never given).
 */
export function otherPatient(record: Pick<OrderRecord, 'orderId' | 'patientId'>, patientId: string): string | null {
  if (record.patientId === '' || patientId === record.patientId) return null;
  return `is "${patientId}", but saved order ${record.orderId} is for patient "${record.patientId}"; another patient's bag is a new order (new order id)`;
}

/** Initials as written on a sign-off: 1–5 letters, stored upper-case. */
export function normaliseInitials(input: string): Result<string> {
  const initials = input.trim().toUpperCase();
  if (!/^[A-Z]{1,5}$/.test(initials)) return fail('initials', 'must be 1 to 5 letters (e.g. "JMK")');
  return { ok: true, value: initials };
}

// ---- the draft slot ---------------------------------------------------------------------------

/** The open order's working copy, if any (restored on load). */
export async function loadDraft(store: Store): Promise<Result<Draft | null>> {
  const r = await read(() => store.db.get('drafts', 'open'));
  return r.ok ? { ok: true, value: r.value ?? null } : r;
}

/**
 * Autosave the open order (call on every committed edit). One slot: the latest call wins. On a
 * storage error nothing changes and the caller keeps its in-memory edit.
 */
export async function saveDraft(store: Store, draft: Omit<Draft, 'slot' | 'editedAt'>): Promise<Result<Draft>> {
  const value: Draft = { slot: 'open', ...draft, file: structuredClone(draft.file), editedAt: store.now() };
  return write(store, ['drafts'], async (tx) => {
    await tx.objectStore('drafts').put(value);
    return { ok: true, value };
  });
}

/** Close the open order (its saved versions stay). */
export async function clearDraft(store: Store): Promise<Result<void>> {
  return write(store, ['drafts'], async (tx) => {
    await tx.objectStore('drafts').delete('open');
    return { ok: true, value: undefined };
  });
}

// ---- versions ---------------------------------------------------------------------------------

/** What to save. */
export interface SaveInput {
  /** The saved order this belongs to; null for a new one. */
  orderKey: string | null;
  file: JsonObject;
  by: string | null;
  origin?: VersionOrigin;
  copiedFrom?: OrderRecord['copiedFrom'];
}

/** What a save did. */
export interface Saved {
  record: OrderRecord;
  version: OrderVersion;
  /** False when the file equals the latest version (nothing new was written). */
  created: boolean;
  /** Problems that kept the order from being checked (it is saved anyway, as work in progress). */
  problems: Problem[];
}

async function ensureShippedInLibrary(store: Store, env: CheckEnv): Promise<void> {
  // Orders checked against the shipped defaults point at their hash; keep a copy in the library so a
  // later build with other defaults can still say what changed.
  for (const kind of ['catalog', 'policy'] as const) {
    const from = kind === 'catalog' ? env.catalogFrom : env.policyFrom;
    if (from !== 'shipped') continue;
    const shipped = await shippedFile(kind);
    await remember(store, kind, shipped.file, shipped.ref);
  }
}

/**
 * Save the file as the order's next version (a new order gets version 1). The file is checked against
 * `env` and the version records the verdict and the catalog/policy hashes. An unchanged file writes
 * nothing. An order id already used by another saved order is refused.
 */
export async function saveVersion(store: Store, env: CheckEnv, input: SaveInput): Promise<Result<Saved>> {
  if (!isRecord(input.file)) return fail('(file)', 'must be an order object');
  const at = store.now();
  const summary = summaryOf(input.file);
  if (summary.orderId === '') return fail('id', 'is required before the order can be saved');
  const { stamp, problems } = checkAndStamp(input.file, env, at);
  await ensureShippedInLibrary(store, env);
  const file = structuredClone(input.file);
  return write(store, ['orders', 'versions'], async (tx) => {
    const orders = tx.objectStore('orders');
    const versions = tx.objectStore('versions');
    const sameId = await orders.index('orderId').getAll(summary.orderId);
    if (sameId.some((r) => r.key !== input.orderKey)) {
      return fail<Saved>('id', `"${summary.orderId}" is already a saved order; open that one, or give this order another id`);
    }
    const existing = input.orderKey === null ? undefined : await orders.get(input.orderKey);
    if (input.orderKey !== null && !existing) return fail<Saved>('(order)', 'this saved order no longer exists (deleted in another tab?)');
    if (existing) {
      const latest = await versions.get([existing.key, existing.latest]);
      if (latest && sameOrder(latest.file, file)) return { ok: true, value: { record: existing, version: latest, created: false, problems } };
      const patientChange = otherPatient(existing, summary.patientId);
      if (patientChange) return fail<Saved>('patient.id', patientChange);
    }
    const key = existing?.key ?? store.newKey();
    const n = (existing?.latest ?? 0) + 1;
    const version: OrderVersion = { orderKey: key, n, file, savedAt: at, savedBy: input.by?.trim().toUpperCase() || null, origin: input.origin ?? 'saved', check: stamp, signOff: null };
    const record: OrderRecord = {
      key, ...summary,
      createdAt: existing?.createdAt ?? at,
      updatedAt: at,
      latest: n,
      verdict: stamp.verdict,
      signOff: null,
      copiedFrom: existing?.copiedFrom ?? input.copiedFrom ?? null,
    };
    await versions.put(version);
    await orders.put(record);
    return { ok: true, value: { record, version, created: true, problems } };
  });
}

/**
 * Sign the latest version ("verified by"): re-checks it against `env` first, and refuses an order that
 * does not validate, an older version, or one already signed. The version is locked from then on.
 */
export async function signOff(store: Store, env: CheckEnv, orderKey: string, n: number, initials: string): Promise<Result<OrderVersion>> {
  const who = normaliseInitials(initials);
  if (!who.ok) return who;
  const at = store.now();
  const current = await read(() => store.db.get('versions', [orderKey, n]));
  if (!current.ok) return current;
  if (!current.value) return fail('(order)', `version ${n} does not exist`);
  const { stamp, problems } = checkAndStamp(current.value.file, env, at);
  if (stamp.verdict === null) {
    return { ok: false, problems: [{ path: '(order)', message: 'cannot be signed: it does not validate' }, ...problems] };
  }
  await ensureShippedInLibrary(store, env);
  return write(store, ['orders', 'versions'], async (tx) => {
    const record = await tx.objectStore('orders').get(orderKey);
    const version = await tx.objectStore('versions').get([orderKey, n]);
    if (!record || !version) return fail<OrderVersion>('(order)', 'this saved order no longer exists');
    if (record.latest !== n) return fail<OrderVersion>('(order)', `version ${n} is not the latest (${record.latest}); only the latest version can be signed`);
    if (version.signOff) return fail<OrderVersion>('(order)', `version ${n} is already signed by ${version.signOff.by} at ${version.signOff.at}`);
    const sign: SignOff = { by: who.value, at };
    const signed: OrderVersion = { ...version, check: stamp, signOff: sign };
    await tx.objectStore('versions').put(signed);
    await tx.objectStore('orders').put({ ...record, verdict: stamp.verdict, signOff: sign, updatedAt: at });
    return { ok: true, value: signed };
  });
}

/** A saved order with all its versions, oldest first. */
export interface SavedOrder {
  record: OrderRecord;
  versions: OrderVersion[];
}

/** Load a saved order and its versions; null when it does not exist. */
export async function getOrder(store: Store, orderKey: string): Promise<Result<SavedOrder | null>> {
  return read(async () => {
    const tx = store.db.transaction(['orders', 'versions']);
    const record = await tx.objectStore('orders').get(orderKey);
    if (!record) return null;
    const versions = await tx.objectStore('versions').index('order').getAll(orderKey);
    versions.sort((a, b) => a.n - b.n);
    return { record, versions };
  });
}

/** Every saved order's summary row. */
export async function allOrders(store: Store): Promise<Result<OrderRecord[]>> {
  return read(() => store.db.getAll('orders'));
}

/**
 * Suggest the id of the next day's bag: the trailing number counted up (keeping its width), or "-2"
 * appended, skipping ids already used. "MPH-2026-0412" → "MPH-2026-0413".
 */
export function nextOrderId(id: string, used: ReadonlySet<string>): string {
  const match = /^(.*?)(\d+)$/.exec(id);
  for (let step = 1; step < 100000; step += 1) {
    const [, head = '', digits = '0'] = match ?? [];
    const candidate = match ? `${head}${String(BigInt(digits) + BigInt(step)).padStart(digits.length, '0')}` : `${id}-${step + 1}`;
    if (!used.has(candidate)) return candidate;
  }
  return `${id}-copy`;
}

/**
 * Copy an order's latest version to a new order (the next day's bag): new id, same patient and
 * lines, version 1, unsigned, with a pointer to where it came from.
 */
export async function copyOrder(store: Store, env: CheckEnv, orderKey: string, newId: string, by: string | null): Promise<Result<Saved>> {
  const source = await getOrder(store, orderKey);
  if (!source.ok) return source;
  if (!source.value) return fail('(order)', 'the order to copy no longer exists');
  const latest = source.value.versions.at(-1);
  if (!latest) return fail('(order)', 'the order to copy has no saved version');
  const id = newId.trim();
  if (id === '') return fail('id', 'the copy needs an order id');
  const file: JsonObject = { ...structuredClone(latest.file), id };
  return saveVersion(store, env, {
    orderKey: null, file, by, origin: 'copied',
    copiedFrom: { key: source.value.record.key, orderId: source.value.record.orderId, n: latest.n },
  });
}

/**
 * Delete a saved order and all its versions (the UI asks for confirmation first). The open draft is
 * closed if it belonged to it; QA measurements stay (they carry their own figures).
 */
export async function deleteOrder(store: Store, orderKey: string): Promise<Result<void>> {
  return write(store, ['orders', 'versions', 'drafts'], async (tx) => {
    const versions = tx.objectStore('versions');
    for (const key of await versions.index('order').getAllKeys(orderKey)) await versions.delete(key);
    await tx.objectStore('orders').delete(orderKey);
    const draft = await tx.objectStore('drafts').get('open');
    if (draft?.orderKey === orderKey) await tx.objectStore('drafts').delete('open');
    return { ok: true, value: undefined };
  });
}

/** The saved orders that match a query, most recently changed first. */
export async function listOrders(store: Store, query: OrderQuery = {}): Promise<Result<OrderRecord[]>> {
  const all = await allOrders(store);
  return all.ok ? { ok: true, value: searchOrders(all.value, query) } : all;
}
