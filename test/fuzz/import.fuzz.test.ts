// Fuzz of every import door: random and damaged order, catalog and policy files (over 10,000 across
// this file) never crash the import, every rejection names at least one path, and a rejected file
// leaves IndexedDB exactly as it was.
import { afterAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { Problem, Result } from '../../src/core/problems.ts';
import { DEFAULT_CATALOG, DEFAULT_FILES, DEMO_ORDERS } from '../../src/defaults.ts';
import { loadEnv, saveRefFile } from '../../src/store/files.ts';
import { commitImport, planImport, planImportWith, type ImportPlan } from '../../src/store/importOrders.ts';
import { saveVersion } from '../../src/store/orders.ts';
import { restoreFile } from '../../src/store/restore.ts';
import { freshIndexedDb, openTestStore, snapshot } from '../../src/store/test-support.ts';
import type { JsonObject } from '../../src/store/types.ts';
import { validCatalogFile, validOrderFile, validPolicyFile } from '../../src/store/validate.ts';
import { mutated } from './mutate.ts';

let generated = 0;
const count = <T>(a: fc.Arbitrary<T>) => a.map((v) => { generated += 1; return v; });

const ORDERS = DEMO_ORDERS.map((d) => d.file);
const anyOrder = fc.constantFrom(...ORDERS).chain(mutated);
const randomJson = fc.jsonValue({ maxDepth: 4 });

/** A rejection must list at least one problem, each with a path and a message. */
function assertProblems(problems: readonly Problem[]): void {
  expect(problems.length).toBeGreaterThan(0);
  for (const p of problems) {
    expect(typeof p.path).toBe('string');
    expect(p.path.length).toBeGreaterThan(0);
    expect(typeof p.message).toBe('string');
    expect(p.message.length).toBeGreaterThan(0);
  }
}

function assertResult<T>(r: Result<T>): void {
  if (!r.ok) assertProblems(r.problems);
}

function assertPlan(plan: ImportPlan): void {
  for (const item of plan.invalid) assertProblems(item.problems);
  for (const item of plan.valid) {
    // a planned order is valid on its own, and restoring it again changes nothing
    expect(validOrderFile(item.file, DEFAULT_CATALOG).ok).toBe(true);
    const again = restoreFile(item.file, 'order');
    expect(again.ok && again.value.file).toEqual(item.file);
  }
}

/**
 * A catalog of one product per role (and one with salts) taken from the shipped catalog: it exercises
 * every branch of the catalog schema at a sixth of the full file's validation time.
 */
const SMALL_CATALOG = (() => {
  const full = DEFAULT_FILES.catalog as JsonObject;
  const keep = new Set(['dextrose-70', 'amino-acids-10', 'lipid-20', 'potassium-phosphates-3', 'calcium-gluconate-10', 'sterile-water']);
  return { ...full, products: (full.products as JsonObject[]).filter((p) => keep.has(String(p.id))) };
})();

const ctx = { catalog: DEFAULT_CATALOG, latestById: new Map<string, JsonObject>() };
const plan = (value: unknown) => planImportWith(JSON.stringify(value) ?? 'undefined', ctx);

describe('fuzz: order import never crashes and explains every rejection', { timeout: 30_000 }, () => {
  it('damaged order files (2,500)', () => {
    fc.assert(fc.property(count(anyOrder), (file) => {
      const p = plan(file);
      expect(p.valid.length + p.invalid.length).toBeGreaterThan(0);
      assertPlan(p);
    }), { numRuns: 2500 });
  });

  it('arbitrary JSON as an order file (1,500)', () => {
    fc.assert(fc.property(count(randomJson), (value) => {
      assertPlan(plan(value));
      assertResult(validOrderFile(value, DEFAULT_CATALOG));
    }), { numRuns: 1500 });
  });

  it('batches: JSON arrays and NDJSON of damaged orders and junk lines (800)', () => {
    const line = fc.oneof(anyOrder.map((o) => JSON.stringify(o) ?? ''), fc.string({ maxLength: 20 }), fc.constant(''));
    const batch = fc.oneof(
      fc.array(anyOrder, { maxLength: 5 }).map((orders) => JSON.stringify(orders)),
      fc.array(line, { minLength: 1, maxLength: 6 }).map((lines) => lines.join('\n')),
      fc.string({ maxLength: 60 }),
    );
    fc.assert(fc.property(count(batch), (text) => {
      const p = planImportWith(text, ctx);
      assertPlan(p);
      const ids = p.valid.map((v) => v.orderId);
      expect(new Set(ids).size).toBe(ids.length);
    }), { numRuns: 800 });
  });
});

describe('fuzz: catalog and policy files', { timeout: 30_000 }, () => {
  it('damaged catalogs (2,000 small, 150 full) and arbitrary JSON as a catalog (500)', () => {
    expect(validCatalogFile(SMALL_CATALOG).ok).toBe(true);
    fc.assert(fc.property(count(mutated(SMALL_CATALOG)), (file) => assertResult(validCatalogFile(file))), { numRuns: 2000 });
    fc.assert(fc.property(count(mutated(DEFAULT_FILES.catalog)), (file) => assertResult(validCatalogFile(file))), { numRuns: 150 });
    fc.assert(fc.property(count(randomJson), (value) => assertResult(validCatalogFile(value))), { numRuns: 500 });
  });

  it('damaged policies (2,000) and arbitrary JSON as a policy (500)', () => {
    fc.assert(fc.property(count(mutated(DEFAULT_FILES.policy)), (file) => assertResult(validPolicyFile(file))), { numRuns: 2000 });
    fc.assert(fc.property(count(randomJson), (value) => assertResult(validPolicyFile(value))), { numRuns: 500 });
  });
});

describe('fuzz: a rejected file changes nothing stored', () => {
  it('order batches, catalogs and policies against a real (in-memory) IndexedDB (3 × 50)', { timeout: 60_000 }, async () => {
    freshIndexedDb();
    const store = await openTestStore();
    const { env } = await loadEnv(store);
    await saveVersion(store, env, { orderKey: null, file: structuredClone(ORDERS[0]) as JsonObject, by: 'AB' });
    await saveRefFile(store, 'catalog', DEFAULT_FILES.catalog, 'imported');
    const small = { policy: DEFAULT_FILES.policy, catalog: SMALL_CATALOG };
    const batch = fc.array(anyOrder, { minLength: 1, maxLength: 3 }).map((orders) => JSON.stringify(orders));
    await fc.assert(fc.asyncProperty(count(batch), async (text) => {
      const before = await snapshot(store);
      const p = await planImport(store, env, text);
      if (!p.ok) throw new Error('plan failed');
      if (p.value.invalid.length > 0) {
        // not confirmed: nothing written
        const r = await commitImport(store, env, p.value, { acceptPartial: false, by: null });
        expect(r.ok).toBe(false);
        expect(await snapshot(store)).toEqual(before);
      }
    }), { numRuns: 50 });
    for (const kind of ['catalog', 'policy'] as const) {
      await fc.assert(fc.asyncProperty(count(mutated(small[kind])), async (file) => {
        const before = await snapshot(store);
        const r = await saveRefFile(store, kind, file, 'imported');
        if (!r.ok) {
          assertProblems(r.problems);
          expect(await snapshot(store)).toEqual(before);
        }
      }), { numRuns: 50 });
    }
  });
});

afterAll(() => {
  // The suite's promise: at least 10,000 generated files.
  expect(generated).toBeGreaterThanOrEqual(10000);
});
