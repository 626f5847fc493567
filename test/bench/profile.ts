// Profiling entry (not part of npm run bench): N generated orders through checkOrder and the report.
// vite build --mode profile && N=2000 node --cpu-prof dist/profile/profile.mjs
// FINGERPRINT=1 also prints a SHA-256 of every report (JSON, in order) and of each demo order's report: a speed
// change to the engine must leave it unchanged.
// DUMP=FILE writes every report as one JSON line, to compare two engines line by line.
// PHASES=1 then times the same orders phase by phase: parsing, the bag, each check, evaluation, the report.
import { createHash } from 'node:crypto';
import { readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { batch } from './generate.ts';
import { DEFAULT_CATALOG, DEFAULT_POLICY } from '../../src/defaults.ts';
import { checkOrder, evaluateOrder } from '../../src/core/evaluate.ts';
import { parseOrder } from '../../src/core/order.ts';
import { computeBag } from '../../src/core/compute/bag.ts';
import { CHECKS } from '../../src/core/checks/index.ts';
import { toReport } from '../../src/core/report.ts';

const n = Number(process.env.N ?? 2000);
const fingerprint = process.env.FINGERPRINT === '1';
const hash = createHash('sha256');
const dump: string[] = [];
let sink = 0;
const t0 = performance.now();
for (const o of batch(n)) {
  const r = checkOrder(o, DEFAULT_CATALOG, DEFAULT_POLICY);
  if (r.ok) sink += r.value.report.osmolarity.reported;
  if (fingerprint) hash.update(JSON.stringify(r.ok ? r.value.report : r.problems));
  if (process.env.DUMP) dump.push(JSON.stringify(r.ok ? r.value.report : r.problems));
}
if (process.env.DUMP) writeFileSync(process.env.DUMP, dump.join('\n'));
const s = (performance.now() - t0) / 1000;
console.log(`${n} orders: ${(n / s).toFixed(0)} orders/s (${(s * 1e6 / n).toFixed(0)} µs/order) ${sink > 0 ? '' : '!'}`);
if (fingerprint) {
  console.log(`reports of the generated batch: ${hash.digest('hex').slice(0, 16)}`);
  const dir = join(process.cwd(), 'data/demo');
  const demo = createHash('sha256');
  for (const f of readdirSync(dir).sort()) {
    const r = checkOrder(JSON.parse(readFileSync(join(dir, f), 'utf8')), DEFAULT_CATALOG, DEFAULT_POLICY);
    demo.update(JSON.stringify(r.ok ? r.value.report : r.problems));
  }
  console.log(`reports of the demo orders: ${demo.digest('hex').slice(0, 16)}`);
}

// PHASES=1: the same orders phase by phase (each warmed, then timed), to see where an order's time goes.
if (process.env.PHASES === '1') {
  const orders = [...batch(Math.min(n, 3000))];
  const parsed = orders.flatMap((o) => { const r = parseOrder(o, DEFAULT_CATALOG); return r.ok ? [r.value] : []; });
  const bags = parsed.map((o) => computeBag(o, DEFAULT_POLICY));
  const phase = (label: string, f: () => void) => {
    f();
    const start = performance.now();
    f();
    f();
    console.log(`  ${label.padEnd(32)} ${(((performance.now() - start) * 1000) / parsed.length / 2).toFixed(1).padStart(7)} µs/order`);
  };
  console.log(`phases over ${parsed.length} orders:`);
  phase('parseOrder', () => orders.forEach((o) => parseOrder(o, DEFAULT_CATALOG)));
  phase('computeBag', () => parsed.forEach((o) => computeBag(o, DEFAULT_POLICY)));
  for (const check of CHECKS) phase(`check ${check.name}`, () => bags.forEach((b) => check(b, DEFAULT_POLICY)));
  phase('evaluate, no suggestions', () => parsed.forEach((o) => evaluateOrder(o, DEFAULT_CATALOG, DEFAULT_POLICY, { suggestions: false })));
  phase('evaluate with suggestions', () => parsed.forEach((o) => evaluateOrder(o, DEFAULT_CATALOG, DEFAULT_POLICY)));
  const evaluations = parsed.map((o) => evaluateOrder(o, DEFAULT_CATALOG, DEFAULT_POLICY, { suggestions: false }));
  phase('toReport', () => evaluations.forEach((e) => toReport(e.bag, e.findings, e.verdict, DEFAULT_CATALOG, DEFAULT_POLICY)));
}
