// The browser's saved work for the whole app: the database opened once, the catalog and policy in
// force, the draft found at start-up, and the storage problems to show. Components read it with
// useSavedWork(); nothing here renders UI of its own.
import { createContext, useCallback, useContext, useEffect, useMemo, useState, type ReactNode } from 'react';
import type { Problem, Result } from '../../core/problems.ts';
import type { CheckEnv } from '../../store/check.ts';
import { DB_NAME, openStore, type Store } from '../../store/db.ts';
import { loadEnv, resetRefFile, saveRefFile, type LoadedEnv, type RefKind } from '../../store/files.ts';
import { loadDraft } from '../../store/orders.ts';
import type { ActiveFile, Draft, FileOrigin } from '../../store/types.ts';

/** What the app knows about its saved work. */
export interface SavedWork {
  status: 'loading' | 'ready' | 'unavailable';
  store: Store | null;
  /** The catalog and policy in force (null until loaded). */
  env: CheckEnv | null;
  /** Their files as v1 JSON (null until loaded). */
  refFiles: LoadedEnv['files'] | null;
  /** The open order's working copy found when the app started (restore it), if any. */
  restored: Draft | null;
  /** Storage problems to show (a full disk, a stored file that no longer validates). */
  problems: Problem[];
  report(problems: Problem[]): void;
  dismiss(): void;
  /** Save a catalog or policy as the one in force (validated first); reloads `env`. */
  saveRef(kind: RefKind, file: unknown, origin: FileOrigin): Promise<Result<ActiveFile>>;
  /** Back to the shipped catalog or policy; reloads `env`. */
  resetRef(kind: RefKind): Promise<Result<void>>;
  /** Whether the browser promised not to clear this site's storage under pressure, and how much is used. */
  storage: StorageInfo;
  /** Bumped on every change to saved orders, so lists refresh. */
  revision: number;
  touch(): void;
}

/** What the browser says about this site's storage (null: it does not say). */
export interface StorageInfo {
  persisted: boolean | null;
  usage: number | null;
  quota: number | null;
}

/**
 * Ask the browser to keep this site's storage when the disk runs short (StorageManager.persist(); a
 * browser may decline), and read how much is used. Local only: no request leaves the machine.
 */
async function storageInfo(): Promise<StorageInfo> {
  const manager = typeof navigator === 'undefined' ? undefined : navigator.storage;
  if (!manager) return { persisted: null, usage: null, quota: null };
  try {
    const persisted = (await manager.persisted?.()) || (await manager.persist?.()) || false;
    const estimate = await manager.estimate?.();
    return { persisted, usage: estimate?.usage ?? null, quota: estimate?.quota ?? null };
  } catch {
    return { persisted: null, usage: null, quota: null };
  }
}

const NO_STORAGE: Problem[] = [{ path: '(storage)', message: 'the browser’s storage is not open' }];

/** Saved work outside a provider (component tests of other parts): nothing stored, nothing shown. */
const DETACHED: SavedWork = {
  status: 'unavailable', store: null, env: null, refFiles: null, restored: null, problems: [],
  report: () => undefined, dismiss: () => undefined,
  saveRef: async () => ({ ok: false, problems: NO_STORAGE }),
  resetRef: async () => ({ ok: false, problems: NO_STORAGE }),
  storage: { persisted: null, usage: null, quota: null }, revision: 0, touch: () => undefined,
};

const SavedWorkContext = createContext<SavedWork>(DETACHED);

/** Open the browser's storage once for the app below it. `dbName` lets tests use their own database. */
export function SavedWorkProvider({ dbName = DB_NAME, children }: { dbName?: string; children: ReactNode }) {
  const [store, setStore] = useState<Store | null>(null);
  const [status, setStatus] = useState<SavedWork['status']>('loading');
  const [env, setEnv] = useState<CheckEnv | null>(null);
  const [refFiles, setRefFiles] = useState<LoadedEnv['files'] | null>(null);
  const [restored, setRestored] = useState<Draft | null>(null);
  const [problems, setProblems] = useState<Problem[]>([]);
  const [revision, setRevision] = useState(0);
  const [storage, setStorage] = useState<StorageInfo>({ persisted: null, usage: null, quota: null });

  useEffect(() => {
    let live = true;
    let opened: Store | null = null;
    void (async () => {
      const r = await openStore(dbName);
      if (!live) { if (r.ok) r.value.db.close(); return; }
      if (!r.ok) { setProblems(r.problems); setStatus('unavailable'); return; }
      opened = r.value;
      const loaded = await loadEnv(r.value);
      const draft = await loadDraft(r.value);
      if (!live) return;
      setEnv(loaded.env);
      setRefFiles(loaded.files);
      setRestored(draft.ok ? draft.value : null);
      setProblems([...loaded.problems, ...(draft.ok ? [] : draft.problems)]);
      setStore(r.value);
      setStatus('ready');
      const info = await storageInfo();
      if (live) setStorage(info);
    })();
    return () => {
      live = false;
      opened?.db.close();
    };
  }, [dbName]);

  const report = useCallback((next: Problem[]) => setProblems(next), []);
  const dismiss = useCallback(() => setProblems([]), []);
  const touch = useCallback(() => {
    setRevision((n) => n + 1);
    void storageInfo().then(setStorage);
  }, []);
  const reload = useCallback(async (s: Store) => {
    const loaded = await loadEnv(s);
    setEnv(loaded.env);
    setRefFiles(loaded.files);
    if (loaded.problems.length > 0) setProblems(loaded.problems);
  }, []);
  const saveRef = useCallback(async (kind: RefKind, file: unknown, origin: FileOrigin): Promise<Result<ActiveFile>> => {
    if (!store) return { ok: false, problems: NO_STORAGE };
    const r = await saveRefFile(store, kind, file, origin);
    if (r.ok) await reload(store);
    return r;
  }, [store, reload]);
  const resetRef = useCallback(async (kind: RefKind): Promise<Result<void>> => {
    if (!store) return { ok: false, problems: NO_STORAGE };
    const r = await resetRefFile(store, kind);
    if (r.ok) await reload(store);
    return r;
  }, [store, reload]);

  const value = useMemo<SavedWork>(
    () => ({ status, store, env, refFiles, restored, problems, report, dismiss, saveRef, resetRef, storage, revision, touch }),
    [status, store, env, refFiles, restored, problems, report, dismiss, saveRef, resetRef, storage, revision, touch],
  );
  return <SavedWorkContext.Provider value={value}>{children}</SavedWorkContext.Provider>;
}

/** The saved work of the app; outside a SavedWorkProvider, a detached one (nothing is stored). */
export function useSavedWork(): SavedWork {
  return useContext(SavedWorkContext);
}
