import { beforeEach, describe, expect, it } from 'vitest';
import { checkOrder } from '../../core/evaluate.ts';
import { DEFAULT_CATALOG, DEFAULT_FILES, DEFAULT_POLICY, DEMO_ORDERS } from '../../defaults.ts';
import type { CheckEnv } from '../check.ts';
import type { Store } from '../db.ts';
import { loadEnv, saveRefFile } from '../files.ts';
import { deleteOrder, saveVersion } from '../orders.ts';
import { freshIndexedDb, openTestStore } from '../test-support.ts';
import type { JsonObject, OrderVersion } from '../types.ts';
import { deleteMeasurement, listMeasurements, recordMeasurement, reportOfVersion } from './log.ts';

let store: Store;
let env: CheckEnv;
beforeEach(async () => {
  freshIndexedDb();
  store = await openTestStore();
  env = (await loadEnv(store)).env;
});

async function savedDemo(i: number): Promise<OrderVersion> {
  const r = await saveVersion(store, env, { orderKey: null, file: structuredClone(DEMO_ORDERS[i]!.file) as JsonObject, by: 'AB' });
  if (!r.ok) throw new Error('save');
  return r.value.version;
}

const reading = { measured: '952', method: 'freezing-point', instrument: 'Osmometer 1', measuredOn: '2026-12-01' };

describe('the osmolality QA log', () => {
  it('records a reading with the bag’s formula type and calculated figures from its report', async () => {
    const version = await savedDemo(0); // adult peripheral demo with lipid: adult 3-in-1
    const vr = await reportOfVersion(store, version, env);
    if (!vr.ok) throw new Error('report');
    expect(vr.value.against).toBe('checked');
    const engine = checkOrder(DEMO_ORDERS[0]!.file, DEFAULT_CATALOG, DEFAULT_POLICY);
    if (!engine.ok) throw new Error('engine');
    const r = await recordMeasurement(store, reading, version, vr.value.report, 'AB');
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value).toMatchObject({ orderId: 'MPH-2026-0412', version: 1, measured: '952', ageBand: 'adult', system: '3-in-1', recordedBy: 'AB' });
    const predicted = engine.value.report.information.predictedOsmolality?.estimates ?? [];
    expect(predicted.length).toBeGreaterThan(0);
    expect(r.value.calculated).toEqual([
      { key: 'particle', label: 'Particle count', value: engine.value.report.osmolarity.particle, unit: 'mOsm/L' },
      { key: 'labelSum', label: 'Label sum', value: engine.value.report.osmolarity.labelSum, unit: 'mOsm/L' },
      ...predicted.map((e) => ({ key: `predicted:${e.method}`, label: `Predicted: ${e.label}`, value: e.value, unit: 'mOsm/kg' })),
    ]);
    const neo = await savedDemo(2);
    const nr = await reportOfVersion(store, neo, env);
    const n = nr.ok ? await recordMeasurement(store, { ...reading, measured: '700' }, neo, nr.value.report, null) : null;
    // preterm demo: amino acids, dextrose, electrolytes, no lipid emulsion → neonatal 2-in-1
    expect(n?.ok && [n.value.ageBand, n.value.system]).toEqual(['neonatal', '2-in-1']);
    const all = await listMeasurements(store);
    expect(all.ok && all.value).toHaveLength(2);
  });

  it('uses the catalog the version was checked against, even after the catalog in force changed', async () => {
    const version = await savedDemo(0);
    const edited = structuredClone(DEFAULT_FILES.catalog) as JsonObject;
    const aa = (edited.products as JsonObject[]).find((p) => p.id === 'amino-acids-10')!;
    aa.mOsmPerMl = 1.5;
    await saveRefFile(store, 'catalog', edited, 'edited');
    const now = (await loadEnv(store)).env;
    const then = await reportOfVersion(store, version, now);
    const engine = checkOrder(DEMO_ORDERS[0]!.file, DEFAULT_CATALOG, DEFAULT_POLICY);
    expect(then.ok && then.value.against).toBe('checked');
    expect(then.ok && engine.ok && then.value.report.osmolarity.labelSum).toBe(engine.ok ? engine.value.report.osmolarity.labelSum : -1);
    // and the catalog in force really gives another label sum (the test would not tell them apart otherwise)
    const withNow = checkOrder(DEMO_ORDERS[0]!.file, now.catalog, now.policy);
    expect(withNow.ok && engine.ok && withNow.value.report.osmolarity.labelSum !== engine.value.report.osmolarity.labelSum).toBe(true);
  });

  it('rejects a bad reading with every problem listed and stores nothing', async () => {
    const version = await savedDemo(0);
    const vr = await reportOfVersion(store, version, env);
    if (!vr.ok) throw new Error('report');
    const r = await recordMeasurement(store, { measured: '-3', method: 'guess', instrument: 'x', measuredOn: '2026-02-30' }, version, vr.value.report, null);
    expect(r.ok).toBe(false);
    expect(!r.ok && r.problems.map((p) => p.path)).toEqual(['measured', 'method', 'measuredOn']);
    expect(await store.db.count('qa')).toBe(0);
    expect((await recordMeasurement(store, { ...reading, measured: '6000.1' }, version, vr.value.report, null)).ok).toBe(false);
  });

  it('keeps readings when their order is deleted, and deletes a mistyped reading', async () => {
    const version = await savedDemo(0);
    const vr = await reportOfVersion(store, version, env);
    if (!vr.ok) throw new Error('report');
    const r = await recordMeasurement(store, reading, version, vr.value.report, null);
    await deleteOrder(store, version.orderKey);
    expect(await store.db.count('qa')).toBe(1);
    if (r.ok) await deleteMeasurement(store, r.value.id);
    expect(await store.db.count('qa')).toBe(0);
  });
});
