// Browser benchmark (prints figures, asserts nothing): in Chromium, how long from a keystroke in an amount
// cell to the updated reported osmolarity on screen, with a 40-line order open. Run with `npm run bench`
// (after `vite build`). Two figures per keystroke:
//   updated — keydown to the osmolarity text changed in the DOM (engine + React render + commit);
//   painted — keydown to the end of the next frame after that change (what the pharmacist sees).
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { startHarness } from '../e2e/harness.mjs';
import catalog from '../../data/catalog.json' with { type: 'json' };

const LINES = 40;
const WARM_UP = 20;
const KEYSTROKES = 200;

/** A 40-line adult central order: every non-water stock in turn (split additions), then the water fill. */
function fortyLineOrder() {
  const stocks = catalog.products.filter((p) => p.role !== 'water');
  const lines = [{ product: 'dextrose-70', amount: '150', unit: 'g' }];
  for (let i = 0; lines.length < LINES - 1; i++) {
    const p = stocks[i % stocks.length];
    if (p.nutrient) lines.push({ product: p.id, amount: '10', unit: 'g' });
    else if (p.orderSpecies) lines.push({ product: p.id, amount: '2', unit: p.orderSpecies === 'phosphate' || p.orderSpecies === 'glycerophosphate' ? 'mmol' : 'mEq' });
    else lines.push({ product: p.id, amount: '1', unit: 'mL' });
  }
  lines.push({ product: 'sterile-water', fill: true });
  return { format: 'osmocount-order', version: 1, id: 'BENCH-40', patient: { id: 'BENCH-P', weightKg: 70, ageGroup: 'adult' }, route: 'central', volumeMl: 4000, hours: 24, lines };
}

function percentile(sorted, p) {
  return sorted[Math.min(sorted.length - 1, Math.floor(p * sorted.length))] ?? 0;
}

const fmt = (xs) => {
  const s = [...xs].sort((a, b) => a - b);
  return `median ${percentile(s, 0.5).toFixed(1)} ms, p95 ${percentile(s, 0.95).toFixed(1)} ms, max ${s.at(-1).toFixed(1)} ms`;
};

const h = await startHarness();
try {
  const { page, context, problems } = await h.newPage();
  await page.goto(h.baseUrl);
  await page.getByTestId('reported-osmolarity').waitFor();
  const dir = mkdtempSync(join(tmpdir(), 'osmocount-bench-'));
  const file = join(dir, 'bench-40-lines.json');
  writeFileSync(file, JSON.stringify(fortyLineOrder()));
  await page.getByLabel('Open order file…').setInputFiles(file);
  await page.getByRole('combobox', { name: `Stock, line ${LINES}` }).waitFor();
  const rows = await page.locator('table.lines tbody tr').count();
  if (rows !== LINES) throw new Error(`expected ${LINES} lines on screen, found ${rows}`);

  await page.evaluate(() => {
    const w = globalThis;
    w.__samples = [];
    let start = null;
    w.document.addEventListener('keydown', (e) => { start = e.timeStamp; }, true);
    const out = w.document.querySelector('[data-testid="reported-osmolarity"]');
    new w.MutationObserver(() => {
      if (start === null) return;
      const t0 = start;
      const updated = w.performance.now() - t0;
      start = null;
      // rAF runs just before the frame is rendered; a message posted from it arrives after that frame.
      w.requestAnimationFrame(() => {
        const ch = new w.MessageChannel();
        ch.port1.onmessage = () => w.__samples.push({ updated, painted: w.performance.now() - t0 });
        ch.port2.postMessage(null);
      });
    }).observe(out, { subtree: true, childList: true, characterData: true });
  });

  const cell = page.getByLabel('Amount, line 1, Dextrose 70% injection');
  await cell.focus();
  await page.keyboard.press('End');
  // Alternate Backspace and a digit ("150" → "15" → "157" → "15" → "153" …): every keystroke changes the bag.
  const digits = '73948261';
  for (let i = 0; i < WARM_UP + KEYSTROKES; i++) {
    const key = i % 2 === 0 ? 'Backspace' : digits[(i >> 1) % digits.length];
    await page.keyboard.press(key);
    await page.waitForFunction((n) => globalThis.__samples.length >= n, i + 1);
  }
  const samples = (await page.evaluate(() => globalThis.__samples)).slice(WARM_UP);
  console.log(`keystroke → osmolarity, ${LINES}-line order, ${samples.length} keystrokes in Chromium (1366×768):`);
  console.log(`  updated in the DOM: ${fmt(samples.map((s) => s.updated))}`);
  console.log(`  painted (next frame): ${fmt(samples.map((s) => s.painted))} (target: p95 under 16 ms; includes waiting for the frame)`);
  if (problems.length > 0) console.log(`  page problems: ${problems.join('; ')}`);
  await context.close();
} finally {
  await h.stop();
}
