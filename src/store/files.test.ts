import { beforeEach, describe, expect, it } from 'vitest';
import { DEFAULT_FILES, DEMO_ORDERS } from '../defaults.ts';
import { changedSince, describeCatalogChange, describePolicyChange } from './changes.ts';
import type { Store } from './db.ts';
import { exportRefFile, fileByHash, loadEnv, resetRefFile, saveRefFile, shippedFile } from './files.ts';
import { saveVersion } from './orders.ts';
import { freshIndexedDb, openTestStore, snapshot } from './test-support.ts';
import type { JsonObject } from './types.ts';

const catalog = () => structuredClone(DEFAULT_FILES.catalog) as JsonObject;
const policy = () => structuredClone(DEFAULT_FILES.policy) as JsonObject;
const products = (f: JsonObject) => f.products as JsonObject[];

let store: Store;
beforeEach(async () => {
  freshIndexedDb();
  store = await openTestStore();
});

/** Journey 6: the pharmacy's amino-acid stock now has another labelled osmolarity (an edit for the test). */
function editedCatalog(): JsonObject {
  const c = catalog();
  const aa = products(c).find((p) => p.id === 'amino-acids-10')!;
  aa.mOsmPerMl = 1.03;
  return c;
}

describe('catalog and policy kept in the browser', () => {
  it('uses the shipped defaults until something is saved, and names them by content hash', async () => {
    const { env, problems } = await loadEnv(store);
    expect(problems).toEqual([]);
    expect(env.catalogFrom).toBe('shipped');
    expect(env.catalogRef).toEqual((await shippedFile('catalog')).ref);
    expect(env.policyRef.id).toBe((DEFAULT_FILES.policy as JsonObject).id);
  });

  it('saves an edited catalog, puts it in force, exports it as the v1 file, and resets to the default', async () => {
    const saved = await saveRefFile(store, 'catalog', editedCatalog(), 'edited');
    expect(saved.ok).toBe(true);
    const { env } = await loadEnv(store);
    expect(env.catalogFrom).toBe('edited');
    expect(env.catalog.byId.get('amino-acids-10')?.mOsmPerMl?.toString()).toBe('1.03');
    const exported = await exportRefFile(store, 'catalog');
    expect(exported.ok && JSON.parse(exported.value)).toEqual(editedCatalog());
    await resetRefFile(store, 'catalog');
    const after = await loadEnv(store);
    expect(after.env.catalogFrom).toBe('shipped');
    expect(after.env.catalogRef).toEqual((await shippedFile('catalog')).ref);
    // the edited file stays in the library for orders checked against it
    expect(saved.ok && (await fileByHash(store, 'catalog', saved.value.ref.hash))).toEqual(editedCatalog());
  });

  it('rejects an invalid catalog or policy with every problem listed, and changes nothing stored', async () => {
    await saveRefFile(store, 'policy', policy(), 'imported');
    const before = await snapshot(store);
    const bad = catalog();
    products(bad)[0]!.role = 'sugar';
    products(bad)[1]!.perMl = { Xx: 1 };
    const r = await saveRefFile(store, 'catalog', bad, 'imported');
    expect(r.ok).toBe(false);
    expect(!r.ok && r.problems.map((p) => p.path)).toEqual(['products[0].role']);
    const badPolicy = { ...policy(), version: 3 };
    expect(await saveRefFile(store, 'policy', badPolicy, 'imported')).toMatchObject({ ok: false, problems: [{ path: 'version' }] });
    expect(await saveRefFile(store, 'policy', DEFAULT_FILES.catalog, 'imported')).toMatchObject({ ok: false, problems: [{ path: 'format' }] });
    expect(await snapshot(store)).toEqual(before);
  });

  it('journey 6: an order checked against the previous catalog says so when reopened, and what changed', async () => {
    const { env } = await loadEnv(store);
    const saved = await saveVersion(store, env, { orderKey: null, file: structuredClone(DEMO_ORDERS[0]!.file) as JsonObject, by: 'AB' });
    if (!saved.ok) throw new Error('save');
    expect(await changedSince(store, env, saved.value.version.check)).toEqual([]);
    await saveRefFile(store, 'catalog', editedCatalog(), 'edited');
    const later = (await loadEnv(store)).env;
    const changes = await changedSince(store, later, saved.value.version.check);
    expect(changes).toHaveLength(1);
    expect(changes[0]).toMatchObject({ kind: 'catalog', then: env.catalogRef, now: later.catalogRef });
    const shippedAa = products(catalog()).find((p) => p.id === 'amino-acids-10')!.mOsmPerMl;
    expect(changes[0]!.details).toEqual([`amino-acids-10 mOsmPerMl: ${String(shippedAa)} → 1.03`]);
  });

  it('describes catalog changes product by product and policy changes rule by rule', () => {
    const a = catalog();
    const b = catalog();
    b.products = products(b).filter((p) => p.id !== 'dextrose-5');
    products(b).push({ id: 'amino-acids-8-5', name: 'Amino acids 8.5% injection', role: 'amino-acids' });
    expect(describeCatalogChange(a, b)).toEqual(['amino-acids-8-5: added (Amino acids 8.5% injection)', 'dextrose-5: removed (Dextrose 5% injection)']);
    const p = policy();
    const q = policy();
    ((q.rules as JsonObject)['osmolarity-peripheral'] as Record<string, JsonObject>).all!.max = 850;
    expect(describePolicyChange(p, q)).toEqual(['osmolarity-peripheral.all.max: 900 → 850']);
  });
});
