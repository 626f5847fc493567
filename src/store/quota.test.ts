// Storage full: the browser refuses a write with QuotaExceededError. These tests make the in-memory
// IndexedDB refuse the same way and check that the user gets a clear message and that what was
// stored before is exactly as it was (IndexedDB transactions are all-or-nothing).
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { DEFAULT_FILES, DEMO_ORDERS } from '../defaults.ts';
import type { CheckEnv } from './check.ts';
import type { Store } from './db.ts';
import { loadEnv, saveRefFile } from './files.ts';
import { commitImport, planImport } from './importOrders.ts';
import { copyOrder, loadDraft, saveDraft, saveVersion, signOff } from './orders.ts';
import { freshIndexedDb, openTestStore, snapshot } from './test-support.ts';
import type { JsonObject } from './types.ts';

const demo = (i: number) => structuredClone(DEMO_ORDERS[i]!.file) as JsonObject;

type Mode = 'throw' | 'abort';
const originalPut = IDBObjectStore.prototype.put;
/** Make the n-th put from now on fail as a full disk does: thrown, or by the browser aborting the transaction. */
function fillStorageAfter(puts: number, mode: Mode): void {
  let left = puts;
  IDBObjectStore.prototype.put = function put(this: IDBObjectStore, ...args: Parameters<IDBObjectStore['put']>) {
    if (left > 0) { left -= 1; return originalPut.apply(this, args); }
    if (mode === 'throw') throw new DOMException('The quota has been exceeded.', 'QuotaExceededError');
    const request = originalPut.apply(this, args);
    // fake-indexeddb's own abort step (the spec's "abort a transaction" with an error name).
    (this.transaction as unknown as { _abort(name: string): void })._abort('QuotaExceededError');
    return request;
  };
}

let store: Store;
let env: CheckEnv;
beforeEach(async () => {
  freshIndexedDb();
  store = await openTestStore();
  env = (await loadEnv(store)).env;
});
afterEach(() => {
  IDBObjectStore.prototype.put = originalPut;
});

const QUOTA = { path: '(storage)', message: expect.stringContaining('storage for this site is full, so nothing was saved; what was saved before is unchanged') };

describe.each<Mode>(['throw', 'abort'])('storage full (%s)', (mode) => {
  it('a new version that fails half-way leaves the order exactly as it was', async () => {
    const first = await saveVersion(store, env, { orderKey: null, file: demo(0), by: 'AB' });
    if (!first.ok) throw new Error('save');
    await signOff(store, env, first.value.record.key, 1, 'AB');
    const before = await snapshot(store);
    fillStorageAfter(1, mode); // the version is written, the summary row is refused
    const changed = { ...demo(0), hours: 20 };
    const r = await saveVersion(store, env, { orderKey: first.value.record.key, file: changed, by: 'CD' });
    expect(r).toEqual({ ok: false, problems: [QUOTA] });
    IDBObjectStore.prototype.put = originalPut;
    expect(await snapshot(store)).toEqual(before);
    expect(changed.hours).toBe(20); // the caller's edit is untouched
  });

  it('autosave of the draft keeps the previous draft', async () => {
    await saveDraft(store, { orderKey: null, baseVersion: null, file: demo(0), editedBy: null });
    fillStorageAfter(0, mode);
    const r = await saveDraft(store, { orderKey: null, baseVersion: null, file: { ...demo(0), volumeMl: 2500 }, editedBy: null });
    expect(r).toEqual({ ok: false, problems: [QUOTA] });
    IDBObjectStore.prototype.put = originalPut;
    const draft = await loadDraft(store);
    expect(draft.ok && draft.value?.file.volumeMl).toBe(2000);
  });

  it('an import, a copy, a sign-off and a catalog save change nothing when storage is full', async () => {
    const first = await saveVersion(store, env, { orderKey: null, file: demo(0), by: 'AB' });
    if (!first.ok) throw new Error('save');
    const plan = await planImport(store, env, JSON.stringify([demo(1), demo(2)]));
    if (!plan.ok) throw new Error('plan');
    const before = await snapshot(store);
    fillStorageAfter(2, mode);
    expect(await commitImport(store, env, plan.value, { acceptPartial: false, by: null })).toEqual({ ok: false, problems: [QUOTA] });
    fillStorageAfter(1, mode);
    expect(await copyOrder(store, env, first.value.record.key, 'MPH-2026-0413', null)).toEqual({ ok: false, problems: [QUOTA] });
    fillStorageAfter(1, mode);
    expect(await signOff(store, env, first.value.record.key, 1, 'AB')).toEqual({ ok: false, problems: [QUOTA] });
    fillStorageAfter(0, mode);
    expect(await saveRefFile(store, 'policy', DEFAULT_FILES.policy, 'imported')).toEqual({ ok: false, problems: [QUOTA] });
    IDBObjectStore.prototype.put = originalPut;
    expect(await snapshot(store)).toEqual(before);
  });
});
