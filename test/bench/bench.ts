// Engine benchmarks: prints figures, asserts nothing. Run with `npm run bench`.
import { performance } from 'node:perf_hooks';
import { DEFAULT_CATALOG, DEFAULT_POLICY } from '../../src/defaults.ts';
import { checkOrder } from '../../src/core/evaluate.ts';

/** A deterministic pseudo-random generator (mulberry32), so every run benches the same orders. */
function rng(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const products = DEFAULT_CATALOG.products.filter((p) => p.role !== 'water');

/** A realistic generated order of `n` lines (repeating stocks past the catalog size, as split additions do). */
function makeOrder(n: number, rand: () => number, i: number) {
  const neonate = rand() < 0.3;
  const lines: unknown[] = [];
  for (let k = 0; k < n - 1; k++) {
    const p = products[Math.floor(rand() * products.length)]!;
    const unit = p.nutrient ? 'g' : p.orderSpecies ? (p.orderSpecies === 'phosphate' || p.orderSpecies === 'glycerophosphate' ? 'mmol' : 'mEq') : 'mL';
    const amount = (Math.round(rand() * (neonate ? 20 : 200) * 100) / 100).toString();
    lines.push({ product: p.id, amount, unit });
  }
  lines.push({ product: 'sterile-water', fill: true });
  return {
    id: `BENCH-${i}`,
    patient: { id: `P-${i}`, weightKg: neonate ? '1.2' : '70', ageGroup: neonate ? 'preterm-neonate' : 'adult' },
    route: rand() < 0.5 ? 'peripheral' : 'central',
    volumeMl: neonate ? 200 : 3000,
    lines,
  };
}

function percentile(sorted: number[], p: number) {
  return sorted[Math.min(sorted.length - 1, Math.floor(p * sorted.length))] ?? 0;
}

function run() {
  const rand = rng(42);
  // 1. Median time to evaluate one 40-line order (validation + bag + checks + report).
  const forty = Array.from({ length: 2000 }, (_, i) => makeOrder(40, rand, i));
  for (const o of forty.slice(0, 200)) checkOrder(o, DEFAULT_CATALOG, DEFAULT_POLICY); // warm-up
  const times: number[] = [];
  for (const o of forty) {
    const t0 = performance.now();
    const r = checkOrder(o, DEFAULT_CATALOG, DEFAULT_POLICY);
    if (r.ok) void r.value.report.osmolarity.reported; // the report is part of the work
    times.push(performance.now() - t0);
    if (!r.ok) throw new Error(`bench order invalid: ${JSON.stringify(r.problems)}`);
  }
  times.sort((a, b) => a - b);
  console.log(`40-line order: median ${(percentile(times, 0.5) * 1000).toFixed(0)} µs, p99 ${(percentile(times, 0.99) * 1000).toFixed(0)} µs (target: median under 1000 µs)`);

  // 2. Throughput over a generated batch of 10,000 orders of 10-40 lines, one core.
  const batch = Array.from({ length: Number(process.env.BENCH_N ?? 10000) }, (_, i) => makeOrder(10 + Math.floor(rand() * 31), rand, i));
  const t0 = performance.now();
  let held = 0;
  for (const o of batch) {
    const r = checkOrder(o, DEFAULT_CATALOG, DEFAULT_POLICY);
    if (r.ok && r.value.report.verdict === 'block') held += 1;
  }
  const seconds = (performance.now() - t0) / 1000;
  console.log(`batch of ${batch.length} orders (10-40 lines): ${(batch.length / seconds).toFixed(0)} orders/s on one core, ${seconds.toFixed(2)} s, ${held} held (target: at least 20,000 orders/s)`);
  const mem = process.memoryUsage();
  console.log(`memory after the batch: heap ${(mem.heapUsed / 1048576).toFixed(1)} MB, rss ${(mem.rss / 1048576).toFixed(1)} MB`);
}

run();
