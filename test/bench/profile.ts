// Profiling entry (not part of npm run bench): N generated orders through checkOrder and the report.
// vite build --mode profile && N=2000 node --cpu-prof dist/profile/profile.mjs
// FINGERPRINT=1 also prints a SHA-256 of every report (JSON, in order) and of each demo order's report: a speed
// change to the engine must leave it unchanged.
// DUMP=FILE writes every report as one JSON line, to compare two engines line by line.
import { createHash } from 'node:crypto';
import { readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { batch } from './generate.ts';
import { DEFAULT_CATALOG, DEFAULT_POLICY } from '../../src/defaults.ts';
import { checkOrder } from '../../src/core/evaluate.ts';

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
