// Engine and CLI benchmarks: print figures beside their targets, assert nothing. Run with `npm run bench`
// (it builds the CLI and this bundle first). Environment: BENCH_ORDERS (in-process batch, default 100,000),
// BENCH_STREAM_ORDERS (force the size of the big NDJSON run; by default 1,000,000 when it fits the time budget),
// BENCH_SECTIONS (which numbered sections to run, e.g. "2,3" for the engine alone while working on it; all by default).
import { once } from 'node:events';
import { createWriteStream, mkdtempSync, rmSync, statSync } from 'node:fs';
import { cpus, tmpdir } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { fileURLToPath } from 'node:url';
import { DEFAULT_CATALOG, DEFAULT_POLICY } from '../../src/defaults.ts';
import { checkOrder } from '../../src/core/evaluate.ts';
import { computeBag, type Bag } from '../../src/core/compute/bag.ts';
import { parseOrder } from '../../src/core/order.ts';
import { batch, ndjsonChunk, ndjsonPool, rng } from './generate.ts';
import { DecimalJs, exactOsmolarity, floatOsmolarity, prepare, toDecimalJs, toFloat } from './floatReference.ts';
import { D } from '../../src/core/decimal.ts';
import { SPECIES_IDS } from '../../src/core/species.ts';
import { floatBag, toFloatOrder, type FloatBag } from './floatBag.ts';
import { coldStartMs, runBuiltCli } from './cliRun.ts';

const TARGET = { ordersPerSecond: 20_000, decimalOverFloat: 10, memoryGrowthMb: 100, coldStartMs: 300 } as const;
const BATCH = Number(process.env.BENCH_ORDERS ?? 100_000);
const STREAM_FULL = 1_000_000;
const STREAM_SMALL = 10_000;
/** The whole bench should stay near ten minutes on a 2-core machine; the big stream gets what is left of this. */
const BUDGET_S = 540;

const D_ZERO = new D(0);
const D_THOUSAND = new D(1000);
const JS_ZERO = new DecimalJs(0);
const JS_THOUSAND = new DecimalJs(1000);

const CATALOG = DEFAULT_CATALOG;
const POLICY = DEFAULT_POLICY;
const root = fileURLToPath(new URL('../../', import.meta.url));
const CLI_BUNDLE = join(root, 'dist/cli/osmocount.mjs');
const LAUNCHER = join(root, 'src/cli/osmocount.mjs');
const began = performance.now();

const num = new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 });
const one = new Intl.NumberFormat('en-US', { minimumFractionDigits: 1, maximumFractionDigits: 1 });
const mb = (kb: number) => `${one.format(kb / 1024)} MB`;
const mark = (met: boolean) => (met ? 'met' : 'MISSED');
const line = (label: string, figure: string, target = '') => console.log(`  ${label.padEnd(46)} ${figure.padEnd(30)} ${target}`.trimEnd());
const percentile = (sorted: ArrayLike<number>, p: number) => sorted[Math.min(sorted.length - 1, Math.floor(p * sorted.length))] ?? 0;

/** The largest relative difference between the engine's bag and the float bag over figures a check reads. */
function bagDifference(bag: Bag, fb: FloatBag): number {
  const pairs: [D, number][] = [
    [bag.osmolarity.particle, fb.osmolarity.particle], [bag.osmolarity.labelSum, fb.osmolarity.labelSum], [bag.finalVolumeMl, fb.finalVolumeMl],
    [bag.speciesMmol.Na, fb.speciesMmol[NA]!], [bag.speciesMmol.K, fb.speciesMmol[K]!], [bag.speciesMmol.Ca, fb.speciesMmol[CA]!],
    [bag.kcal.total, fb.kcal.total], [bag.girMgPerKgPerMin, fb.girMgPerKgPerMin], [bag.aluminumMcg, fb.aluminumMcg],
  ];
  let worst = 0;
  for (const [exact, float] of pairs) {
    const e = exact.toNumber();
    if (e !== 0) worst = Math.max(worst, Math.abs(float - e) / Math.abs(e));
    else if (float !== 0) worst = Math.max(worst, Infinity);
  }
  if (bag.lines.length !== fb.lines.length) return Infinity;
  return worst;
}
const NA = SPECIES_IDS.indexOf('Na');
const K = SPECIES_IDS.indexOf('K');
const CA = SPECIES_IDS.indexOf('Ca');

function take<T>(it: Iterator<T>, n: number): T[] {
  const out: T[] = [];
  for (let i = 0; i < n; i++) {
    const r = it.next();
    if (r.done) break;
    out.push(r.value);
  }
  return out;
}

/** 2 and 3: the generated batch through the full engine, then through the float and decimal references. */
function batchFigures(): void {
  console.log(`\n2. A generated batch of ${num.format(BATCH)} orders through the full engine (validate, compute, checks, report), one core`);
  globalThis.gc?.();
  const BLOCK = 1000;
  const times = new Float64Array(BATCH);
  const verdicts = { pass: 0, warn: 0, block: 0 };
  const mix = { adult: 0, neonate: 0, tna: 0, peripheral: 0, lines: 0 };
  let invalid = 0;
  let engineMs = 0;
  let bagMs = 0;
  let floatMs = 0;
  let decimalMs = 0;
  let decimalJsMs = 0;
  let floatBagMs = 0;
  let clockMs = 0;
  let worstBag = 0;
  let validated = 0;
  let worstRelative = 0;
  let maxHeap = 0;
  let sink = 0;
  // First the throughput, as the CLI meets orders: one at a time, nothing of an order kept once it is checked.
  // (Keeping the engine's own objects across blocks, as the comparison below must, makes V8 allocate them
  // straight into the old generation from then on; a stream never does that, so the two passes are apart.)
  // Each order is generated just before it is checked and dropped after, as a stream reads them (a block of
  // generated orders kept alive would be copied by every young-generation collection in the engine's time).
  let i = 0;
  for (const o of batch(BATCH)) {
    const t0 = performance.now();
    const r = checkOrder(o, CATALOG, POLICY);
    if (r.ok) sink += r.value.report.osmolarity.reported; // the rounded report is part of the work
    const dt = performance.now() - t0;
    times[i] = dt;
    engineMs += dt;
    if (r.ok) verdicts[r.value.verdict] += 1;
    else invalid += 1;
    mix[o.patient.ageGroup === 'adult' ? 'adult' : 'neonate'] += 1;
    if (o.lines.some((l) => l.product.startsWith('lipid'))) mix.tna += 1;
    if (o.route === 'peripheral') mix.peripheral += 1;
    mix.lines += o.lines.length;
    i += 1;
    if (i % BLOCK === 0) maxHeap = Math.max(maxHeap, process.memoryUsage().heapUsed);
  }
  const peakRssKb = process.resourceUsage().maxRSS;
  // The price of exact arithmetic, like for like. First the engine's bag and the same bag in binary floats
  // (floatBag.ts: the same figures, rules and line objects), each order read, computed both ways and dropped,
  // as a stream meets it (a block of orders held alive would be copied by every young-generation collection
  // inside the timed calls). Which goes first alternates; the clock's own cost is measured and taken off both.
  const engineParticle = new Float64Array(BATCH);
  let n = 0;
  for (const o of batch(BATCH)) {
    const r = parseOrder(o, CATALOG);
    if (!r.ok) continue;
    const asFloats = toFloatOrder(r.value, POLICY);
    let bag: Bag;
    let fb: FloatBag;
    const t0 = performance.now();
    if (n % 2 === 0) {
      bag = computeBag(r.value, POLICY);
      const t1 = performance.now();
      fb = floatBag(asFloats);
      const t2 = performance.now();
      bagMs += t1 - t0;
      floatBagMs += t2 - t1;
    } else {
      fb = floatBag(asFloats);
      const t1 = performance.now();
      bag = computeBag(r.value, POLICY);
      const t2 = performance.now();
      floatBagMs += t1 - t0;
      bagMs += t2 - t1;
    }
    const t3 = performance.now();
    clockMs += performance.now() - t3;
    n += 1;
    engineParticle[validated] = bag.osmolarity.particle.toNumber();
    worstBag = Math.max(worstBag, bagDifference(bag, fb));
    validated += 1;
  }
  bagMs -= clockMs;
  floatBagMs -= clockMs;
  // Then the particle sum alone (the float-only reference the targets name): in the engine's decimal, order by
  // order as above; in floats, under 1 µs and allocating next to nothing, in blocks of prepared orders.
  for (const o of batch(BATCH)) {
    if (!parseOrder(o, CATALOG).ok) continue;
    const prepared = prepare(o, CATALOG);
    const t0 = performance.now();
    sink += exactOsmolarity(prepared, D_ZERO, D_THOUSAND).label.isZero() ? 0 : 1;
    decimalMs += performance.now() - t0;
  }
  decimalMs -= clockMs;
  const same = batch(BATCH);
  let at = 0;
  for (let start = 0; start < BATCH; start += BLOCK) {
    const asFloat = take(same, BLOCK).filter((o) => parseOrder(o, CATALOG).ok).map((o) => toFloat(prepare(o, CATALOG)));
    const floatParticle = new Float64Array(asFloat.length);
    const t0 = performance.now();
    for (let i = 0; i < asFloat.length; i++) floatParticle[i] = floatOsmolarity(asFloat[i]!).particle;
    floatMs += performance.now() - t0;
    for (let i = 0; i < floatParticle.length; i++, at++) {
      const e = engineParticle[at]!;
      if (e !== 0) worstRelative = Math.max(worstRelative, Math.abs(floatParticle[i]! - e) / e);
    }
  }
  // decimal.js last, over the same orders: run in the same blocks, it would make exactOsmolarity's
  // call sites see two kinds of number and slow the engine decimal's row down as well.
  const again = batch(BATCH);
  for (let start = 0; start < BATCH; start += BLOCK) {
    const asDecimalJs = take(again, BLOCK).filter((o) => parseOrder(o, CATALOG).ok).map((o) => toDecimalJs(prepare(o, CATALOG)));
    const t0 = performance.now();
    for (let i = 0; i < asDecimalJs.length; i++) sink += exactOsmolarity(asDecimalJs[i]!, JS_ZERO, JS_THOUSAND).label.isZero() ? 0 : 1;
    decimalJsMs += performance.now() - t0;
  }
  const sorted = Float64Array.from(times).sort();
  const rate = BATCH / (engineMs / 1000);
  const checked = verdicts.pass + verdicts.warn + verdicts.block;
  const share = (n: number) => `${Math.round((n / BATCH) * 100)}%`;
  console.log(`  mix: ${share(mix.adult)} adult, ${share(mix.neonate)} neonatal; ${share(mix.tna)} 3-in-1; ${share(mix.peripheral)} peripheral; ${one.format(mix.lines / BATCH)} lines per order on average`);
  console.log(`  verdicts: ${num.format(verdicts.pass)} pass, ${num.format(verdicts.warn)} warn, ${num.format(verdicts.block)} hold, ${num.format(invalid)} invalid (of ${num.format(checked + invalid)})`);
  line('throughput', `${num.format(rate)} orders/s`, `target ≥ ${num.format(TARGET.ordersPerSecond)} orders/s: ${mark(rate >= TARGET.ordersPerSecond)}`);
  line('time per order', `median ${num.format(percentile(sorted, 0.5) * 1000)} µs, p99 ${num.format(percentile(sorted, 0.99) * 1000)} µs`);
  line('peak memory of the bench process', `RSS ${mb(peakRssKb)}, heap ≤ ${mb(maxHeap / 1024)}`);

  console.log('\n3. The price of exact arithmetic: the same orders, already validated, the same work in exact decimals and in binary floats');
  const perOrder = (ms: number) => (ms * 1000) / validated;
  const against = (ms: number, by: number) => `${one.format(perOrder(ms))} µs/order (${one.format(ms / by)}× float)`;
  const target = (ratio: number) => `target ≤ ${TARGET.decimalOverFloat}×: ${mark(ratio <= TARGET.decimalOverFloat)}`;
  console.log('  the particle sum (volumes, fill, particle and label sums):');
  line('  float-only reference', `${one.format(perOrder(floatMs))} µs/order`);
  line('  the same in the engine\'s decimal', against(decimalMs, floatMs), target(decimalMs / floatMs));
  line('  the same in decimal.js (28 digits)', against(decimalJsMs, floatMs));
  console.log('  the whole bag (every figure computeBag works out: each line, every species, energy, GIR, both osmolarities):');
  line('  float-only (floatBag)', `${one.format(perOrder(floatBagMs))} µs/order`);
  line('  the engine, computeBag', against(bagMs, floatBagMs), target(bagMs / floatBagMs));
  line('computeBag against the particle-sum reference', `${one.format(bagMs / floatMs)}× (not like for like: the bag does far more)`);
  line('full engine per order (checkOrder)', `${one.format(perOrder(engineMs))} µs/order (${num.format(engineMs / floatMs)}× the particle sum)`);
  line('float vs engine, particle osmolarity', `largest relative difference ${worstRelative.toExponential(1)}`);
  line('float vs engine, bag figures', `largest relative difference ${worstBag.toExponential(1)}`);
  if (sink < 0) console.log(sink); // keeps the decimal loop's results alive
}

async function writeNdjson(path: string, pool: readonly string[], count: number): Promise<number> {
  const t0 = performance.now();
  const out = createWriteStream(path);
  for (let from = 0; from < count; from += 2000) {
    if (!out.write(ndjsonChunk(pool, from, Math.min(count, from + 2000)))) await once(out, 'drain');
  }
  out.end();
  await once(out, 'finish');
  return performance.now() - t0;
}

/** 4: NDJSON files streamed through the built CLI to /dev/null, peak memory at 10,000 orders and at the big size. */
async function streamFigures(): Promise<void> {
  console.log('\n4. NDJSON streamed through the built CLI: osmocount check FILE --ndjson > /dev/null');
  const dir = mkdtempSync(join(tmpdir(), 'osmocount-bench-'));
  try {
    const pool = ndjsonPool(2000);
    const small = join(dir, 'small.ndjson');
    await writeNdjson(small, pool, STREAM_SMALL);
    const a = runBuiltCli(CLI_BUNDLE, ['check', small, '--ndjson'], '/dev/null', dir);
    if (a.code !== 0 && a.code !== 1) throw new Error(`the CLI failed on the bench file (exit ${a.code}):\n${a.stderr.slice(0, 2000)}`);
    const rate = STREAM_SMALL / (a.ms / 1000);
    line(`${num.format(STREAM_SMALL)} orders`, `${one.format(a.ms / 1000)} s, ${num.format(rate)} orders/s, peak RSS ${a.maxRssKb === null ? '?' : mb(a.maxRssKb)}`);
    rmSync(small);

    const forced = process.env.BENCH_STREAM_ORDERS ? Number(process.env.BENCH_STREAM_ORDERS) : null;
    const left = Math.max(60, BUDGET_S - (performance.now() - began) / 1000);
    const fits = Math.floor((rate * left) / 50_000) * 50_000;
    const count = forced ?? (STREAM_FULL / rate <= left ? STREAM_FULL : Math.max(50_000, fits));
    if (forced === null && count < STREAM_FULL) {
      console.log(`  (the 1,000,000-order run would take about ${num.format(STREAM_FULL / rate / 60)} min at ${num.format(rate)} orders/s: scaled to ${num.format(count)} to keep the bench near ten minutes; BENCH_STREAM_ORDERS=1000000 forces it)`);
    }
    const big = join(dir, 'big.ndjson');
    const writeMs = await writeNdjson(big, pool, count);
    const bytes = statSync(big).size;
    const b = runBuiltCli(CLI_BUNDLE, ['check', big, '--ndjson'], '/dev/null', dir);
    if (b.code !== 0 && b.code !== 1) throw new Error(`the CLI failed on the big bench file (exit ${b.code}):\n${b.stderr.slice(0, 2000)}`);
    const summary = /Summary: ([\d,]+) orders checked/.exec(b.stderr)?.[1] ?? '?';
    line(`${num.format(count)} orders (${mb(bytes / 1024)}, written in ${one.format(writeMs / 1000)} s)`, `${one.format(b.ms / 1000)} s, ${num.format(count / (b.ms / 1000))} orders/s, peak RSS ${b.maxRssKb === null ? '?' : mb(b.maxRssKb)}`);
    if (a.maxRssKb !== null && b.maxRssKb !== null) {
      const growth = (b.maxRssKb - a.maxRssKb) / 1024;
      line(`peak memory, ${num.format(STREAM_SMALL)} → ${num.format(count)} orders`, `${growth >= 0 ? '+' : ''}${one.format(growth)} MB`, `target flat within ${TARGET.memoryGrowthMb} MB from 10,000 to 1,000,000: ${count < STREAM_FULL ? `${mark(growth <= TARGET.memoryGrowthMb)} at ${num.format(count)}` : mark(growth <= TARGET.memoryGrowthMb)}`);
    }
    line('orders the CLI summary counted', summary);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** 1: a new process each time, as a shell script calls it. */
function coldStart(): void {
  console.log('\n1. CLI cold start (a new node process each run, median of 20)');
  const show = (times: number[]) => `${num.format(percentile(times, 0.5))} ms (fastest ${num.format(times[0] ?? 0)}, slowest ${num.format(times.at(-1) ?? 0)})`;
  const help = coldStartMs(LAUNCHER, ['--help'], 20);
  const median = percentile(help, 0.5);
  line('node src/cli/osmocount.mjs --help', show(help), `target < ${TARGET.coldStartMs} ms: ${mark(median < TARGET.coldStartMs)}`);
  line('… check data/demo/adult-central.json', show(coldStartMs(LAUNCHER, ['check', join(root, 'data/demo/adult-central.json')], 20)));
  line('node -e 0 (Node itself, for scale)', show(coldStartMs('-e', ['0'], 20)));
}

const products = CATALOG.products.filter((p) => p.role !== 'water');

/** The first benchmark's orders: random stocks and amounts, `n` lines (most overflow their bag). */
function makeRandomOrder(n: number, rand: () => number, i: number) {
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

/** 5: the figures the first benchmark printed, unchanged, for comparison across versions. */
function earlierFigures(): void {
  console.log('\n5. Earlier figures (random stocks and amounts, as first benched)');
  const rand = rng(42);
  const forty = Array.from({ length: 2000 }, (_, i) => makeRandomOrder(40, rand, i));
  for (const o of forty.slice(0, 200)) checkOrder(o, CATALOG, POLICY); // warm-up
  const times: number[] = [];
  for (const o of forty) {
    const t0 = performance.now();
    const r = checkOrder(o, CATALOG, POLICY);
    if (r.ok) void r.value.report.osmolarity.reported; // the rounded report is part of the work
    times.push(performance.now() - t0);
    if (!r.ok) throw new Error(`bench order invalid: ${JSON.stringify(r.problems)}`);
  }
  times.sort((a, b) => a - b);
  line('40-line order', `median ${num.format(percentile(times, 0.5) * 1000)} µs, p99 ${num.format(percentile(times, 0.99) * 1000)} µs`, 'target: median under 1,000 µs');
  const random = Array.from({ length: 10000 }, (_, i) => makeRandomOrder(10 + Math.floor(rand() * 31), rand, i));
  const t0 = performance.now();
  let held = 0;
  for (const o of random) {
    const r = checkOrder(o, CATALOG, POLICY);
    if (r.ok && r.value.report.verdict === 'block') held += 1;
  }
  const seconds = (performance.now() - t0) / 1000;
  line('batch of 10,000 random orders (10-40 lines)', `${num.format(random.length / seconds)} orders/s, ${num.format(held)} held`);
}

/** The sections BENCH_SECTIONS names (all when it is unset); sections 2 and 3 run together. */
function sections(): Set<number> {
  const text = process.env.BENCH_SECTIONS;
  if (!text) return new Set([1, 2, 3, 4, 5]);
  const chosen = new Set(text.split(',').map((t) => Number(t.trim())));
  if ([...chosen].some((n) => !Number.isInteger(n) || n < 1 || n > 5)) throw new Error(`BENCH_SECTIONS must list section numbers 1–5 (got "${text}")`);
  return chosen;
}

async function main(): Promise<void> {
  const cpu = cpus();
  const run = sections();
  console.log(`Osmocount benchmarks — Node ${process.version}, ${cpu.length} CPU(s) (${cpu[0]?.model.trim() ?? 'unknown'})`);
  if (run.has(1)) coldStart();
  if (run.has(2) || run.has(3)) batchFigures();
  if (run.has(4)) await streamFigures();
  if (run.has(5)) earlierFigures();
  console.log(`\nBench done in ${one.format((performance.now() - began) / 60000)} min.`);
}

await main();
