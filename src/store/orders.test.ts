import { beforeEach, describe, expect, it } from 'vitest';
import { checkOrder } from '../core/evaluate.ts';
import { DEFAULT_CATALOG, DEFAULT_POLICY, DEMO_ORDERS } from '../defaults.ts';
import { openStore, type Store } from './db.ts';
import { loadEnv } from './files.ts';
import type { CheckEnv } from './check.ts';
import { clearDraft, copyOrder, deleteOrder, getOrder, listOrders, loadDraft, nextOrderId, saveDraft, saveVersion, signOff } from './orders.ts';
import { freshIndexedDb, openTestStore, tickingClock } from './test-support.ts';
import type { JsonObject } from './types.ts';

const demo = (i: number) => structuredClone(DEMO_ORDERS[i]!.file) as JsonObject;
const engineVerdict = (file: unknown) => {
  const r = checkOrder(file, DEFAULT_CATALOG, DEFAULT_POLICY);
  return r.ok ? r.value.verdict : null;
};

let store: Store;
let env: CheckEnv;
beforeEach(async () => {
  freshIndexedDb();
  store = await openTestStore();
  env = (await loadEnv(store)).env;
});

async function mustSave(file: JsonObject, orderKey: string | null = null, by: string | null = 'AB') {
  const r = await saveVersion(store, env, { orderKey, file, by });
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return r.value;
}

describe('saving orders with every version', () => {
  it('saves a new order as version 1 with its verdict and the hashes of the catalog and policy it was checked against', async () => {
    const file = demo(0);
    const saved = await mustSave(file);
    expect(saved.created).toBe(true);
    expect(saved.version.n).toBe(1);
    expect(saved.version.file).toEqual(file);
    expect(saved.version.savedBy).toBe('AB');
    expect(saved.version.check.verdict).toBe(engineVerdict(file));
    expect(saved.version.check.catalog).toEqual(env.catalogRef);
    expect(saved.version.check.policy).toEqual(env.policyRef);
    expect(saved.version.check.catalog.hash).toMatch(/^[0-9a-f]{64}$/);
    expect(saved.record).toMatchObject({ orderId: 'MPH-2026-0412', patientId: 'MRN-448210', latest: 1, signOff: null, verdict: engineVerdict(file) });
    // the shipped catalog and policy are kept by hash, so a later comparison can name what changed
    expect(await store.db.get('library', env.catalogRef.hash)).toMatchObject({ kind: 'catalog' });
  });

  it('writes nothing new when the order is unchanged (key order and number spelling do not matter)', async () => {
    const first = await mustSave(demo(0));
    const reordered = Object.fromEntries(Object.entries(demo(0)).reverse());
    const again = await mustSave(reordered, first.record.key);
    expect(again.created).toBe(false);
    expect(again.version.n).toBe(1);
    // the workspace writes what was typed: "2000" is the same bag volume as 2000
    const typed = { ...demo(0), volumeMl: '2000', hours: '24.0' };
    expect((await mustSave(typed, first.record.key)).created).toBe(false);
    expect(await store.db.count('versions')).toBe(1);
  });

  it('keeps every version; a change is a new version and old ones are untouched', async () => {
    const first = await mustSave(demo(0));
    const changed = demo(0);
    (changed.lines as JsonObject[])[1]!.amount = 250;
    const second = await mustSave(changed, first.record.key, 'CD');
    expect(second.version.n).toBe(2);
    const got = await getOrder(store, first.record.key);
    expect(got.ok && got.value?.versions.map((v) => [v.n, v.savedBy, (v.file.lines as JsonObject[])[1]!.amount])).toEqual([[1, 'AB', 150], [2, 'CD', 250]]);
    expect(got.ok && got.value?.record.latest).toBe(2);
  });

  it('saves an incomplete order as work in progress, with no verdict and the count of its problems', async () => {
    const file = demo(0);
    delete (file.patient as JsonObject).weightKg;
    const saved = await mustSave(file);
    expect(saved.version.check.verdict).toBeNull();
    expect(saved.version.check.problems).toBe(1);
    expect(saved.problems).toEqual([{ path: 'patient.weightKg', message: expect.stringContaining('is required') }]);
  });

  it('refuses an order without an id, and an id another saved order already has', async () => {
    const noId = { ...demo(0), id: '' };
    expect(await saveVersion(store, env, { orderKey: null, file: noId, by: null })).toMatchObject({ ok: false, problems: [{ path: 'id' }] });
    await mustSave(demo(0));
    const clash = await saveVersion(store, env, { orderKey: null, file: demo(0), by: null });
    expect(clash).toMatchObject({ ok: false, problems: [{ path: 'id', message: expect.stringContaining('already a saved order') }] });
    expect(await store.db.count('orders')).toBe(1);
  });
});

describe('a saved order keeps its patient', () => {
  it('refuses a version for another patient id, and changes nothing', async () => {
    const first = await mustSave(demo(0));
    const other = demo(0);
    (other.patient as JsonObject).id = 'MRN-000001';
    const r = await saveVersion(store, env, { orderKey: first.record.key, file: other, by: 'CD' });
    expect(r).toEqual({ ok: false, problems: [{ path: 'patient.id', message: 'is "MRN-000001", but saved order MPH-2026-0412 is for patient "MRN-448210"; another patient\'s bag is a new order (new order id)' }] });
    expect(await store.db.count('versions')).toBe(1);
  });
});

describe('sign-off locks a version', () => {
  it('signs the latest version with initials and time; a later change makes a new unsigned version', async () => {
    const first = await mustSave(demo(0));
    const signed = await signOff(store, env, first.record.key, 1, ' jmk ');
    expect(signed.ok && signed.value.signOff).toEqual({ by: 'JMK', at: expect.stringMatching(/^2026-12-01T08:/) });
    const record = await store.db.get('orders', first.record.key);
    expect(record?.signOff?.by).toBe('JMK');

    const changed = demo(0);
    changed.volumeMl = 2500;
    const next = await mustSave(changed, first.record.key, 'CD');
    expect(next.version.n).toBe(2);
    expect(next.version.signOff).toBeNull();
    expect(next.record.signOff).toBeNull();
    const v1 = await store.db.get('versions', [first.record.key, 1]);
    expect(v1?.signOff?.by).toBe('JMK');
    expect(v1?.file.volumeMl).toBe(2000);
  });

  it('refuses to sign twice, to sign an older version, bad initials, and an order that does not validate', async () => {
    const first = await mustSave(demo(0));
    expect((await signOff(store, env, first.record.key, 1, 'AB')).ok).toBe(true);
    expect(await signOff(store, env, first.record.key, 1, 'CD')).toMatchObject({ ok: false, problems: [{ message: expect.stringContaining('already signed by AB') }] });
    const changed = { ...demo(0), hours: 20 };
    await mustSave(changed, first.record.key);
    expect(await signOff(store, env, first.record.key, 1, 'CD')).toMatchObject({ ok: false, problems: [{ message: expect.stringContaining('not the latest') }] });
    expect(await signOff(store, env, first.record.key, 2, 'C.D.')).toMatchObject({ ok: false, problems: [{ path: 'initials' }] });
    const bad = demo(1);
    bad.route = 'sideways';
    const saved = await mustSave(bad);
    const refused = await signOff(store, env, saved.record.key, 1, 'AB');
    expect(refused).toMatchObject({ ok: false, problems: [{ path: '(order)', message: 'cannot be signed: it does not validate' }, { path: 'route' }] });
    expect((await store.db.get('versions', [saved.record.key, 1]))?.signOff).toBeNull();
  });
});

describe('the draft slot (autosave of the open order)', () => {
  it('survives closing the database and opening it again (a reload or a killed tab)', async () => {
    const factory = freshIndexedDb();
    const first = await openStore('osmocount-draft', { now: tickingClock() });
    if (!first.ok) throw new Error('open');
    const file = demo(0);
    await saveDraft(first.value, { orderKey: null, baseVersion: null, file, editedBy: 'AB' });
    file.volumeMl = 2400; // the caller's later in-memory change is not the stored draft
    first.value.db.close();
    globalThis.indexedDB = factory;
    const again = await openStore('osmocount-draft');
    if (!again.ok) throw new Error('reopen');
    const draft = await loadDraft(again.value);
    expect(draft.ok && draft.value?.file.volumeMl).toBe(2000);
    expect(draft.ok && draft.value?.editedBy).toBe('AB');
  });

  it('keeps only the latest edit, and clears', async () => {
    await saveDraft(store, { orderKey: null, baseVersion: null, file: { id: 'A' }, editedBy: null });
    await saveDraft(store, { orderKey: null, baseVersion: null, file: { id: 'B' }, editedBy: null });
    expect((await loadDraft(store)).ok && (await store.db.count('drafts'))).toBe(1);
    const d = await loadDraft(store);
    expect(d.ok && d.value?.file).toEqual({ id: 'B' });
    await clearDraft(store);
    expect(await loadDraft(store)).toEqual({ ok: true, value: null });
  });
});

describe('copy, list, search, delete', () => {
  it('suggests the next id by counting up the trailing number, keeping its width and skipping used ids', () => {
    expect(nextOrderId('MPH-2026-0412', new Set())).toBe('MPH-2026-0413');
    expect(nextOrderId('MPH-2026-0412', new Set(['MPH-2026-0413']))).toBe('MPH-2026-0414');
    expect(nextOrderId('B-099', new Set())).toBe('B-100');
    expect(nextOrderId('B-999', new Set())).toBe('B-1000');
    expect(nextOrderId('WARD', new Set())).toBe('WARD-2');
  });

  it('copies the latest version to a new order: new id, same patient and lines, version 1, unsigned', async () => {
    const first = await mustSave(demo(0));
    await signOff(store, env, first.record.key, 1, 'AB');
    const copy = await copyOrder(store, env, first.record.key, 'MPH-2026-0413', 'CD');
    expect(copy.ok).toBe(true);
    if (!copy.ok) return;
    expect(copy.value.record.key).not.toBe(first.record.key);
    expect(copy.value.version).toMatchObject({ n: 1, origin: 'copied', signOff: null, savedBy: 'CD' });
    expect(copy.value.version.file).toEqual({ ...demo(0), id: 'MPH-2026-0413' });
    expect(copy.value.record.copiedFrom).toEqual({ key: first.record.key, orderId: 'MPH-2026-0412', n: 1 });
    expect(await copyOrder(store, env, first.record.key, 'MPH-2026-0413', null)).toMatchObject({ ok: false, problems: [{ path: 'id' }] });
  });

  it('lists and searches by order id, patient id or name, date, verdict and sign-off', async () => {
    const a = await mustSave(demo(0)); // 08:xx on 2026-12-01
    const b = await mustSave(demo(1));
    const c = await mustSave(demo(2));
    await signOff(store, env, b.record.key, 1, 'AB');
    const ids = async (q: Parameters<typeof listOrders>[1]) => {
      const r = await listOrders(store, q);
      return r.ok ? r.value.map((x) => x.orderId).sort() : [];
    };
    expect(await ids({})).toHaveLength(3);
    expect(await ids({ text: a.record.orderId.toLowerCase() })).toEqual([a.record.orderId]);
    expect(await ids({ text: c.record.patientId })).toEqual([c.record.orderId]);
    expect(await ids({ from: '2026-12-01', to: '2026-12-01' })).toHaveLength(3);
    expect(await ids({ from: '2026-12-02' })).toEqual([]);
    expect(await ids({ signed: 'signed' })).toEqual([b.record.orderId]);
    expect(await ids({ signed: 'unsigned' })).toHaveLength(2);
    const verdictOfA = a.record.verdict!;
    const sameVerdict = [a, b, c].filter((x) => x.record.verdict === verdictOfA).map((x) => x.record.orderId).sort();
    expect(await ids({ verdict: verdictOfA })).toEqual(sameVerdict);
    expect(await ids({ verdict: 'unchecked' })).toEqual([]);
  });

  it('deletes an order with all its versions and closes the draft that belonged to it', async () => {
    const a = await mustSave(demo(0));
    await mustSave({ ...demo(0), hours: 20 }, a.record.key);
    const b = await mustSave(demo(1));
    await saveDraft(store, { orderKey: a.record.key, baseVersion: 2, file: demo(0), editedBy: null });
    expect((await deleteOrder(store, a.record.key)).ok).toBe(true);
    expect(await store.db.getAllKeys('orders')).toEqual([b.record.key]);
    expect(await store.db.count('versions')).toBe(1);
    expect(await loadDraft(store)).toEqual({ ok: true, value: null });
  });
});
