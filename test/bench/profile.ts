// Profiling entry (not part of npm run bench): N generated orders through checkOrder and the report.
// vite build --mode profile && N=2000 node --cpu-prof dist/profile/profile.mjs
import { batch } from './generate.ts';
import { DEFAULT_CATALOG, DEFAULT_POLICY } from '../../src/defaults.ts';
import { checkOrder } from '../../src/core/evaluate.ts';

const n = Number(process.env.N ?? 2000);
let sink = 0;
const t0 = performance.now();
for (const o of batch(n)) {
  const r = checkOrder(o, DEFAULT_CATALOG, DEFAULT_POLICY);
  if (r.ok) sink += r.value.report.osmolarity.reported;
}
const s = (performance.now() - t0) / 1000;
console.log(`${n} orders: ${(n / s).toFixed(0)} orders/s (${(s * 1e6 / n).toFixed(0)} µs/order) ${sink > 0 ? '' : '!'}`);
