// Real-browser and command-line end-to-end tests. Each *.e2e.mjs file exports `tests`: [name, fn(h)][].
// Prints one line per test and a closing "N passed, N failed" line; exits 1 on any failure.
import { readdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { startHarness } from './harness.mjs';

const dir = fileURLToPath(new URL('.', import.meta.url));
const only = process.argv[2];
const files = readdirSync(dir).filter((f) => f.endsWith('.e2e.mjs') && (!only || f.includes(only))).sort();
let passed = 0;
let failed = 0;
const harness = await startHarness();
try {
  for (const file of files) {
    const { tests } = await import(new URL(file, import.meta.url));
    for (const [name, fn] of tests) {
      const started = Date.now();
      try {
        await fn(harness);
        passed += 1;
        console.log(`  ✓ ${file} › ${name} (${Date.now() - started} ms)`);
      } catch (e) {
        failed += 1;
        console.log(`  ✗ ${file} › ${name}\n    ${String(e?.stack ?? e).split('\n').join('\n    ')}`);
      }
    }
  }
} finally {
  await harness.stop();
}
console.log(`\ne2e: ${passed} passed, ${failed} failed`);
process.exit(failed > 0 ? 1 : 0);
