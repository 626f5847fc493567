// Helpers for the store's tests: a fresh in-memory IndexedDB per test and a clock that ticks.
import 'fake-indexeddb/auto'; // IDBRequest, IDBKeyRange… as globals, as idb expects
import { IDBFactory } from 'fake-indexeddb';
import { openStore, type Store } from './db.ts';

/** Minutes after `start`, one per call: 08:00, 08:01, … (UTC). */
export function tickingClock(start = '2026-12-01T08:00:00.000Z'): () => string {
  let t = Date.parse(start);
  return () => {
    const at = new Date(t).toISOString();
    t += 60_000;
    return at;
  };
}

/** Keys k1, k2, … so tests can name records. */
export function countingKeys(prefix = 'k'): () => string {
  let n = 0;
  return () => `${prefix}${(n += 1)}`;
}

/** A fresh, isolated in-memory IndexedDB installed as the global one; returns it. */
export function freshIndexedDb(): IDBFactory {
  const factory = new IDBFactory();
  globalThis.indexedDB = factory;
  return factory;
}

/** Open the store on the current global IndexedDB, failing the test on a storage problem. */
export async function openTestStore(options: Partial<Pick<Store, 'now' | 'newKey'>> = {}): Promise<Store> {
  const r = await openStore('osmocount-test', { now: options.now ?? tickingClock(), newKey: options.newKey ?? countingKeys() });
  if (!r.ok) throw new Error(r.problems.map((p) => `${p.path}: ${p.message}`).join('\n'));
  return r.value;
}

/** Everything in every store, for "nothing changed" comparisons. */
export async function snapshot(store: Store): Promise<Record<string, unknown[]>> {
  const out: Record<string, unknown[]> = {};
  for (const name of ['orders', 'versions', 'drafts', 'active', 'library', 'qa'] as const) out[name] = await store.db.getAll(name);
  return out;
}
