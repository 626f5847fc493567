import { beforeEach, describe, expect, it } from 'vitest';
import { DEMO_ORDERS } from '../defaults.ts';
import type { CheckEnv } from './check.ts';
import type { Store } from './db.ts';
import { loadEnv } from './files.ts';
import { commitImport, exportOrders, planImport } from './importOrders.ts';
import { listOrders, saveVersion, signOff } from './orders.ts';
import { freshIndexedDb, openTestStore, snapshot } from './test-support.ts';
import type { JsonObject } from './types.ts';

const demo = (i: number) => structuredClone(DEMO_ORDERS[i]!.file) as JsonObject;

let store: Store;
let env: CheckEnv;
beforeEach(async () => {
  freshIndexedDb();
  store = await openTestStore();
  env = (await loadEnv(store)).env;
});

async function plan(text: string) {
  const r = await planImport(store, env, text);
  if (!r.ok) throw new Error('plan');
  return r.value;
}

describe('importing orders', () => {
  it('imports one valid order file as a new saved order', async () => {
    const p = await plan(JSON.stringify(demo(0)));
    expect(p.invalid).toEqual([]);
    expect(p.valid.map((v) => [v.where, v.orderId, v.action, v.from])).toEqual([['', 'MPH-2026-0412', 'new', 'v1']]);
    expect(await commitImport(store, env, p, { acceptPartial: false, by: 'AB' })).toEqual({ ok: true, value: { created: 1, newVersions: 0, unchanged: 0 } });
    const listed = await listOrders(store);
    expect(listed.ok && listed.value.map((r) => r.orderId)).toEqual(['MPH-2026-0412']);
    expect((await store.db.get('versions', [listed.ok ? listed.value[0]!.key : '', 1]))?.origin).toBe('imported');
  });

  it('lists every problem of every invalid order in a batch, and imports the valid ones only when confirmed', async () => {
    await saveVersion(store, env, { orderKey: null, file: demo(2), by: 'AB' });
    const bad = demo(1);
    bad.id = 'BAD-1';
    bad.route = 'sideways';
    (bad.patient as JsonObject).weightKg = 0;
    (bad.lines as JsonObject[])[0]!.product = 'no-such-stock';
    const p = await plan(JSON.stringify([demo(0), bad, 'not an order']));
    expect(p.valid.map((v) => v.where)).toEqual(['[0]']);
    expect(p.invalid.map((x) => [x.where, x.orderId, x.problems.map((q) => q.path)])).toEqual([
      ['[1]', 'BAD-1', ['patient.weightKg', 'route']],
      ['[2]', null, ['(file)']],
    ]);
    const before = await snapshot(store);
    const refused = await commitImport(store, env, p, { acceptPartial: false, by: null });
    expect(refused).toEqual({ ok: false, problems: [{ path: '(import)', message: '2 of 3 orders are invalid; confirm to import the 1 valid ones' }] });
    expect(await snapshot(store)).toEqual(before);
    expect(await commitImport(store, env, p, { acceptPartial: true, by: null })).toEqual({ ok: true, value: { created: 1, newVersions: 0, unchanged: 0 } });
    expect(await store.db.count('orders')).toBe(2);
  });

  it('rejects a file that is not JSON, changing nothing', async () => {
    await saveVersion(store, env, { orderKey: null, file: demo(0), by: 'AB' });
    const before = await snapshot(store);
    const p = await plan('{"format": "osmocount-order", "id": ');
    expect(p.valid).toEqual([]);
    expect(p.invalid).toMatchObject([{ where: '', problems: [{ path: '(file)', message: expect.stringContaining('is not valid JSON') }] }]);
    expect(await commitImport(store, env, p, { acceptPartial: true, by: null })).toMatchObject({ ok: false, problems: [{ path: '(import)' }] });
    expect(await snapshot(store)).toEqual(before);
  });

  it('rejects an empty list of orders', async () => {
    expect(await plan('[]')).toEqual({ valid: [], invalid: [{ where: '', orderId: null, problems: [{ path: '(file)', message: 'holds no orders (an empty list)' }] }] });
  });

  it('reads NDJSON, naming the line of each problem', async () => {
    const text = [JSON.stringify(demo(0)), '{ broken', JSON.stringify(demo(1))].join('\n');
    const p = await plan(text);
    expect(p.valid.map((v) => v.where)).toEqual(['line 1', 'line 3']);
    expect(p.invalid).toMatchObject([{ where: 'line 2', problems: [{ path: '(line)' }] }]);
  });

  it('adds a new version to a saved order with the same id (a signed version stays locked), and skips identical ones', async () => {
    const saved = await saveVersion(store, env, { orderKey: null, file: demo(0), by: 'AB' });
    if (!saved.ok) throw new Error('save');
    await signOff(store, env, saved.value.record.key, 1, 'AB');
    const changed = demo(0);
    changed.hours = 20;
    const p = await plan(JSON.stringify([changed, demo(1)]));
    expect(p.valid.map((v) => [v.orderId, v.action])).toEqual([['MPH-2026-0412', 'new-version'], [demo(1).id, 'new']]);
    expect(await commitImport(store, env, p, { acceptPartial: false, by: 'CD' })).toEqual({ ok: true, value: { created: 1, newVersions: 1, unchanged: 0 } });
    const v1 = await store.db.get('versions', [saved.value.record.key, 1]);
    const v2 = await store.db.get('versions', [saved.value.record.key, 2]);
    expect(v1?.signOff?.by).toBe('AB');
    expect(v2).toMatchObject({ savedBy: 'CD', signOff: null, origin: 'imported' });
    const again = await plan(JSON.stringify(changed));
    expect(again.valid.map((v) => v.action)).toEqual(['unchanged']);
    expect(await commitImport(store, env, again, { acceptPartial: false, by: null })).toEqual({ ok: true, value: { created: 0, newVersions: 0, unchanged: 1 } });
  });

  it('refuses a file that would give a saved order another patient', async () => {
    await saveVersion(store, env, { orderKey: null, file: demo(0), by: 'AB' });
    const other = demo(0);
    (other.patient as JsonObject).id = 'MRN-000001';
    const p = await plan(JSON.stringify(other));
    expect(p.valid).toEqual([]);
    expect(p.invalid).toMatchObject([{ where: '', orderId: 'MPH-2026-0412', problems: [{ path: 'patient.id', message: expect.stringContaining('saved order MPH-2026-0412 is for patient "MRN-448210"') }] }]);
  });

  it('refuses the same order id twice in one file', async () => {
    const p = await plan(JSON.stringify([demo(0), demo(0)]));
    expect(p.valid).toHaveLength(1);
    expect(p.invalid).toMatchObject([{ where: '[1]', problems: [{ path: 'id', message: expect.stringContaining('appears twice') }] }]);
  });

  it('migrates unversioned and v0 orders on import and says so', async () => {
    const { format: _f, version: _v, ...bare } = demo(0);
    const v0: JsonObject = { ...demo(1), version: 0, bagMl: demo(1).volumeMl, items: demo(1).lines };
    delete v0.volumeMl;
    delete v0.lines;
    const p = await plan(JSON.stringify([bare, v0]));
    expect(p.invalid).toEqual([]);
    expect(p.valid.map((v) => v.from)).toEqual(['unversioned', 'v0']);
    expect(p.valid[1]!.file).toEqual(demo(1));
  });
});

describe('exporting orders', () => {
  it('writes one order as an object, several as an array or NDJSON, and they import back unchanged', async () => {
    const keys: string[] = [];
    for (const i of [0, 1, 2]) {
      const r = await saveVersion(store, env, { orderKey: null, file: demo(i), by: null });
      if (r.ok) keys.push(r.value.record.key);
    }
    const one = await exportOrders(store, [keys[0]!], 'json');
    expect(one.ok && JSON.parse(one.value)).toEqual(demo(0));
    const many = await exportOrders(store, keys, 'json');
    expect(many.ok && JSON.parse(many.value)).toEqual([demo(0), demo(1), demo(2)]);
    const nd = await exportOrders(store, keys, 'ndjson');
    expect(nd.ok && nd.value.trim().split('\n').map((l) => JSON.parse(l))).toEqual([demo(0), demo(1), demo(2)]);
    for (const text of [many, nd]) {
      const p = await plan(text.ok ? text.value : '');
      expect(p.valid.map((v) => v.action)).toEqual(['unchanged', 'unchanged', 'unchanged']);
    }
  });
});
