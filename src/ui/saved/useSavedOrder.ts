// The open order's life in the browser, for the workspace: autosave on every committed edit, restore on
// load, save as a version, sign off, open a saved order, copy it, and whether the catalog or policy
// changed since it was checked. Storage errors are shown, never thrown; the edit on screen stays.
import { useCallback, useEffect, useRef, useState } from 'react';
import type { Problem, Result } from '../../core/problems.ts';
import { sameOrder } from '../../store/diff.ts';
import { changedSince, type RefChange } from '../../store/changes.ts';
import { copyOrder, getOrder, nextOrderId, normaliseInitials, saveDraft, saveVersion, signOff, allOrders, type SavedOrder } from '../../store/orders.ts';
import type { JsonObject, OrderVersion } from '../../store/types.ts';
import { useSavedWork } from './SavedWorkProvider.tsx';

/** Where the autosave stands: idle before the first edit, then saving, kept, or refused. */
export type AutosaveState = { kind: 'idle' } | { kind: 'saving' } | { kind: 'kept'; at: string } | { kind: 'failed' };

export interface SavedOrderApi {
  ready: boolean;
  /** The saved order the open one belongs to (null: never saved). */
  saved: SavedOrder | null;
  latest: OrderVersion | null;
  /** The order file as last edited, opened or restored (null before any). */
  current: JsonObject | null;
  /** The file on screen differs from the latest saved version. */
  unsaved: boolean;
  autosave: AutosaveState;
  /** Catalog/policy changes since the latest version was checked. */
  changes: RefChange[];
  /** Call with the order file after every committed edit. */
  edited(file: JsonObject): void;
  /** Save the file on screen as the next version. */
  save(file: JsonObject, by: string | null): Promise<Result<OrderVersion>>;
  /** Save if needed, then sign the latest version. */
  sign(file: JsonObject, initials: string): Promise<Result<OrderVersion>>;
  /**
   * A saved order's latest file, for the workspace to load. The draft is not attached yet: the app calls
   * follow(orderKey) when the opened document is on screen.
   */
  open(orderKey: string): Promise<JsonObject | null>;
  /**
   * The workspace opened an unsaved order (new, demo, file): detach from any saved one. With `file`, it
   * is also kept as the draft (the workspace's autosave effect does that itself).
   */
  detach(file?: JsonObject): void;
  /**
   * The document on screen belongs to this saved order (null: to none). Undo and redo can step back
   * across an "open": the app says whose document is on screen, and the draft follows.
   */
  follow(orderKey: string | null): void;
  /** A saved order was deleted: if it is the open one, the order on screen becomes unsaved. */
  forget(orderKey: string): void;
  /** Copy a saved order to a new saved order; returns the copy's file and storage key (open it like a saved order). */
  copy(orderKey: string, newId: string, by: string | null): Promise<Result<{ file: JsonObject; orderKey: string }>>;
  /** A free id for the next day's copy of an order id. */
  suggestId(orderId: string): Promise<string>;
}

/** The open order's saved state and actions; `initials` marks autosaves and versions. */
export function useSavedOrder(initials: string | null): SavedOrderApi {
  const work = useSavedWork();
  const { store, env, restored, report, touch } = work;
  const [saved, setSaved] = useState<SavedOrder | null>(null);
  const [current, setCurrent] = useState<JsonObject | null>(restored?.file ?? null);
  const [autosave, setAutosave] = useState<AutosaveState>({ kind: 'idle' });
  const [changeState, setChangeState] = useState<{ version: OrderVersion | null; list: RefChange[] }>({ version: null, list: [] });
  const openKey = useRef<string | null>(restored?.orderKey ?? null);
  const baseVersion = useRef<number | null>(restored?.baseVersion ?? null);
  const pending = useRef<JsonObject | null>(null);
  const running = useRef(false);
  const latest = saved?.versions.at(-1) ?? null;

  const reloadSaved = useCallback(async (key: string | null) => {
    openKey.current = key;
    const r = store && key !== null ? await getOrder(store, key) : null;
    const value = r?.ok ? r.value : null;
    if (r && !r.ok) report(r.problems);
    if (!value) openKey.current = null;
    baseVersion.current = value?.record.latest ?? null;
    setSaved(value);
    return value;
  }, [store, report]);

  // The restored draft's saved order, once the store is open.
  const restoredKey = restored?.orderKey ?? null;
  useEffect(() => {
    if (!store || restoredKey === null) return;
    let live = true;
    void getOrder(store, restoredKey).then((r) => {
      if (!live || openKey.current !== restoredKey) return;
      if (!r.ok) report(r.problems);
      if (!r.ok || !r.value) openKey.current = null;
      baseVersion.current = r.ok && r.value ? r.value.record.latest : null;
      setSaved(r.ok ? r.value : null);
    });
    return () => { live = false; };
  }, [store, report, restoredKey]);

  useEffect(() => {
    let live = true;
    if (store && env && latest) void changedSince(store, env, latest.check).then((list) => { if (live) setChangeState({ version: latest, list }); });
    return () => { live = false; };
  }, [store, env, latest]);
  const changes = changeState.version === latest ? changeState.list : [];

  const flush = useCallback(async () => {
    if (!store || running.current) return;
    running.current = true;
    while (pending.current) {
      const file = pending.current;
      pending.current = null;
      setAutosave({ kind: 'saving' });
      const r = await saveDraft(store, { orderKey: openKey.current, baseVersion: baseVersion.current, file, editedBy: initials });
      if (r.ok) setAutosave({ kind: 'kept', at: r.value.editedAt });
      else { setAutosave({ kind: 'failed' }); report(r.problems); }
    }
    running.current = false;
  }, [store, initials, report]);

  const edited = useCallback((file: JsonObject) => {
    setCurrent(file);
    pending.current = file;
    void flush();
  }, [flush]);

  const save = useCallback(async (file: JsonObject, by: string | null): Promise<Result<OrderVersion>> => {
    if (!store || !env) return notReady();
    const r = await saveVersion(store, env, { orderKey: openKey.current, file, by });
    if (!r.ok) { if (r.problems.some((p) => p.path === '(storage)')) report(r.problems); return r; }
    await reloadSaved(r.value.record.key);
    edited(file);
    touch();
    return { ok: true, value: r.value.version };
  }, [store, env, report, reloadSaved, edited, touch]);

  const sign = useCallback(async (file: JsonObject, who: string): Promise<Result<OrderVersion>> => {
    if (!store || !env) return notReady();
    const initials = normaliseInitials(who);
    if (!initials.ok) return initials;
    const s = await save(file, initials.value);
    if (!s.ok) return s;
    const r = await signOff(store, env, s.value.orderKey, s.value.n, initials.value);
    if (!r.ok && r.problems.some((p) => p.path === '(storage)')) report(r.problems);
    await reloadSaved(s.value.orderKey);
    touch();
    return r;
  }, [store, env, save, report, reloadSaved, touch]);

  const open = useCallback(async (orderKey: string): Promise<JsonObject | null> => {
    if (!store) return null;
    const r = await getOrder(store, orderKey);
    if (!r.ok) { report(r.problems); return null; }
    return r.value?.versions.at(-1)?.file ?? null;
  }, [store, report]);

  const detach = useCallback((file?: JsonObject) => {
    openKey.current = null;
    baseVersion.current = null;
    setSaved(null);
    if (file) edited(file);
  }, [edited]);

  const follow = useCallback((orderKey: string | null) => {
    if (openKey.current === orderKey) return;
    void reloadSaved(orderKey);
  }, [reloadSaved]);

  const forget = useCallback((orderKey: string) => {
    if (openKey.current !== orderKey) return;
    openKey.current = null;
    baseVersion.current = null;
    setSaved(null);
  }, []);

  const copy = useCallback(async (orderKey: string, newId: string, by: string | null): Promise<Result<{ file: JsonObject; orderKey: string }>> => {
    if (!store || !env) return notReady();
    const r = await copyOrder(store, env, orderKey, newId, by);
    if (!r.ok) { if (r.problems.some((p) => p.path === '(storage)')) report(r.problems); return r; }
    touch();
    return { ok: true, value: { file: r.value.version.file, orderKey: r.value.record.key } };
  }, [store, env, report, touch]);

  const suggestId = useCallback(async (orderId: string) => {
    const all = store ? await allOrders(store) : null;
    return nextOrderId(orderId, new Set(all?.ok ? all.value.map((o) => o.orderId) : []));
  }, [store]);

  return {
    ready: store !== null && env !== null,
    saved, latest, current,
    unsaved: current !== null && (latest === null || !sameOrder(latest.file, current)),
    autosave, changes, edited, save, sign, open, detach, follow, forget, copy, suggestId,
  };
}

function notReady<T>(): Result<T> {
  const problem: Problem = { path: '(storage)', message: 'the browser’s storage is not open yet' };
  return { ok: false, problems: [problem] };
}
