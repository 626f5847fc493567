// The IndexedDB database (through idb 8): one place that names the stores, their keys and indexes.
import { openDB, type DBSchema, type IDBPDatabase, type IDBPTransaction, type StoreNames } from 'idb';
import type { Problem, Result } from '../core/problems.ts';
import type { ActiveFile, Draft, LibraryEntry, OrderRecord, OrderVersion, QaEntry } from './types.ts';
import { guard, storageProblem } from './storageErrors.ts';

export interface OsmoSchema extends DBSchema {
  orders: { key: string; value: OrderRecord; indexes: { orderId: string; updatedAt: string } };
  versions: { key: [string, number]; value: OrderVersion; indexes: { order: string } };
  drafts: { key: 'open'; value: Draft };
  active: { key: 'catalog' | 'policy'; value: ActiveFile };
  library: { key: string; value: LibraryEntry };
  qa: { key: string; value: QaEntry; indexes: { order: string } };
}

export type OsmoDb = IDBPDatabase<OsmoSchema>;

/** The database and the clock (injected, so tests can fix the time). */
export interface Store {
  db: OsmoDb;
  now: () => string;
  newKey: () => string;
}

export const DB_NAME = 'osmocount';
/** Bump with a new `upgrade` step; never edit a step that has shipped. */
export const DB_VERSION = 1;

/**
 * Open (or create) the database. Failure — storage disabled, a private window that refuses it, a
 * newer version open in another tab — is a problem, never a throw.
 */
export async function openStore(name = DB_NAME, options: Partial<Pick<Store, 'now' | 'newKey'>> = {}): Promise<Result<Store>> {
  try {
    const db = await openDB<OsmoSchema>(name, DB_VERSION, {
      upgrade(database, oldVersion) {
        if (oldVersion < 1) {
          const orders = database.createObjectStore('orders', { keyPath: 'key' });
          orders.createIndex('orderId', 'orderId');
          orders.createIndex('updatedAt', 'updatedAt');
          const versions = database.createObjectStore('versions', { keyPath: ['orderKey', 'n'] });
          versions.createIndex('order', 'orderKey');
          database.createObjectStore('drafts', { keyPath: 'slot' });
          database.createObjectStore('active', { keyPath: 'kind' });
          database.createObjectStore('library', { keyPath: 'hash' });
          const qa = database.createObjectStore('qa', { keyPath: 'id' });
          qa.createIndex('order', 'orderKey');
        }
      },
    });
    return {
      ok: true,
      value: { db, now: options.now ?? (() => new Date().toISOString()), newKey: options.newKey ?? (() => crypto.randomUUID()) },
    };
  } catch (error) {
    const problem: Problem = storageProblem(error, 'open');
    return { ok: false, problems: [problem] };
  }
}

/** A read-write transaction over the named stores. */
export type WriteTx<Names extends StoreNames<OsmoSchema>[]> = IDBPTransaction<OsmoSchema, Names, 'readwrite'>;

function abortQuietly(tx: { abort(): void }): void {
  try {
    tx.abort();
  } catch {
    // already finished or aborted by the browser: nothing was committed either way
  }
}

/**
 * Run `body` in one read-write transaction: all of its writes land, or none do. The body refuses by
 * returning problems (the transaction is then aborted); a storage error (quota, a closed database)
 * aborts it too and comes back as a `(storage)` problem. Never throws.
 */
export async function write<Names extends StoreNames<OsmoSchema>[], T>(
  store: Store,
  names: Names,
  body: (tx: WriteTx<Names>) => Promise<Result<T>>,
): Promise<Result<T>> {
  let tx: WriteTx<Names>;
  try {
    tx = store.db.transaction(names, 'readwrite');
  } catch (error) {
    return { ok: false, problems: [storageProblem(error, 'save')] };
  }
  let outcome: Result<T>;
  try {
    outcome = await body(tx);
  } catch (error) {
    abortQuietly(tx);
    await tx.done.catch(() => undefined);
    // A request that failed because the browser aborted the transaction reports AbortError; the
    // transaction's own error names the cause (QuotaExceededError when storage is full).
    return { ok: false, problems: [storageProblem(tx.error ?? error, 'save')] };
  }
  if (!outcome.ok) {
    abortQuietly(tx);
    await tx.done.catch(() => undefined);
    return outcome;
  }
  try {
    await tx.done;
  } catch (error) {
    return { ok: false, problems: [storageProblem(error, 'save')] };
  }
  return outcome;
}

/** Read from the database; a storage error is a problem. */
export async function read<T>(step: () => Promise<T>): Promise<Result<T>> {
  return guard('read', step);
}
