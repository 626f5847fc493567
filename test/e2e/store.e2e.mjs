// Saved work in real Chromium: an edit survives a reload and a closed tab or browser, sign-off locks a
// version and a later change makes a new one with its history, a bad import changes nothing stored,
// the QA log records a reading and exports CSV. Any CSP violation, console error or request off this
// machine fails the test (the harness records them; a listener reports CSP violations as errors).
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium } from 'playwright-core';
import { ok, equal, clean } from './assert.mjs';
import { ARTIFACTS } from './harness.mjs';
import { CHROMIUM_ARGS, ensureChromium } from './chromium.mjs';

const DEXTROSE = 'Amount, line 2, Dextrose 70% injection';
const AXE = readFileSync('node_modules/axe-core/axe.min.js', 'utf8');

/** axe-core over the page: serious or critical WCAG 2.1 A/AA violations fail the test. */
async function axe(page, where) {
  await page.evaluate(AXE);
  const result = await page.evaluate(() => globalThis.axe.run(globalThis.document, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'] } }));
  const bad = result.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
  if (bad.length > 0) throw new Error(`${where}: ${bad.map((v) => `${v.id}: ${v.help} (${v.nodes.slice(0, 3).map((n) => n.target.join(' ')).join('; ')})`).join('\n')}`);
}

/** Report every Content-Security-Policy violation as a console error (the harness fails on those). */
async function watchCsp(page) {
  await page.addInitScript(() => {
    globalThis.document.addEventListener('securitypolicyviolation', (e) => {
      globalThis.console.error(`CSP violation: ${e.violatedDirective} blocked ${e.blockedURI || '(inline)'}`);
    });
  });
}

/** Record the same problems the harness records, for pages it did not open. */
function watch(page, problems) {
  page.on('console', (msg) => { if (msg.type() === 'error') problems.push(`console error: ${msg.text()}`); });
  page.on('pageerror', (err) => problems.push(`page error: ${err.message}`));
  page.on('request', (req) => {
    const url = new URL(req.url());
    if (!['127.0.0.1', 'localhost'].includes(url.hostname) && !['data:', 'blob:', 'about:'].includes(url.protocol)) problems.push(`request off this machine: ${req.url()}`);
  });
}

async function ready(page) {
  await page.getByTestId('reported-osmolarity').waitFor();
  await page.getByTestId('autosave-state').waitFor();
}

async function commitAmount(page, label, value) {
  const cell = page.getByLabel(label, { exact: true });
  await cell.fill(value);
  await cell.press('Enter');
}

async function waitKept(page) {
  await page.waitForFunction(() => /Draft kept in this browser/.test(globalThis.document.querySelector('[data-testid="autosave-state"]')?.textContent ?? ''));
}

/** Everything in the app's IndexedDB, read from inside the page. */
async function dumpDb(page) {
  return page.evaluate(async () => {
    const idb = globalThis.indexedDB;
    const db = await new Promise((resolve, reject) => { const r = idb.open('osmocount'); r.onsuccess = () => resolve(r.result); r.onerror = () => reject(r.error); });
    const out = {};
    for (const name of db.objectStoreNames) {
      out[name] = await new Promise((resolve, reject) => { const r = db.transaction(name).objectStore(name).getAll(); r.onsuccess = () => resolve(r.result); r.onerror = () => reject(r.error); });
    }
    db.close();
    return out;
  });
}

export const tests = [
  ['an order change is there after a reload', async (h) => {
    const { page, context, problems } = await h.newPage();
    await watchCsp(page);
    await page.goto(h.baseUrl);
    await ready(page);
    await commitAmount(page, DEXTROSE, '250');
    // Journey 2: dextrose 250 g in the adult peripheral demo reports 1149.3 mOsm/L (workspace e2e).
    await page.waitForFunction(() => globalThis.document.querySelector('[data-testid="reported-osmolarity"]')?.textContent === '1149.3');
    await waitKept(page);
    await page.reload();
    await ready(page);
    equal(await page.getByLabel(DEXTROSE, { exact: true }).inputValue(), '250', 'amount after reload');
    equal(await page.getByTestId('reported-osmolarity').textContent(), '1149.3', 'figures after reload');
    clean(problems);
    await context.close();
  }],

  ['a tab closed mid-edit, and then the whole browser, keep the last committed edit', async (h) => {
    // One browser profile on disk: close the tab without any warning, open another; then close the
    // browser itself and start a new one on the same profile.
    const dir = mkdtempSync(join(tmpdir(), 'osmocount-profile-'));
    const problems = [];
    const launch = () => chromium.launchPersistentContext(dir, { executablePath: ensureChromium(), headless: true, args: CHROMIUM_ARGS, viewport: { width: 1366, height: 768 } });
    try {
      let context = await launch();
      let page = await context.newPage();
      watch(page, problems);
      await watchCsp(page);
      await page.goto(h.baseUrl);
      await ready(page);
      await commitAmount(page, DEXTROSE, '180');
      await waitKept(page);
      // mid-edit: typed into another cell but not committed
      await page.getByLabel('Amount, line 4, Sodium chloride 23.4% injection (4 mEq/mL)', { exact: true }).fill('99');
      await page.close({ runBeforeUnload: false });
      page = await context.newPage();
      watch(page, problems);
      await page.goto(h.baseUrl);
      await ready(page);
      equal(await page.getByLabel(DEXTROSE, { exact: true }).inputValue(), '180', 'committed edit after the tab was closed');
      equal(await page.getByLabel('Amount, line 4, Sodium chloride 23.4% injection (4 mEq/mL)', { exact: true }).inputValue(), '60', 'the uncommitted text is not kept');
      await commitAmount(page, DEXTROSE, '190');
      await waitKept(page);
      await context.close();
      context = await launch();
      page = await context.newPage();
      watch(page, problems);
      await page.goto(h.baseUrl);
      await ready(page);
      equal(await page.getByLabel(DEXTROSE, { exact: true }).inputValue(), '190', 'committed edit after the browser was closed');
      await context.close();
      clean(problems);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  }],

  ['verify an order, edit it: a new version appears with the history of who changed what', async (h) => {
    const { page, context, problems } = await h.newPage();
    await watchCsp(page);
    await page.goto(h.baseUrl);
    await ready(page);
    await page.getByLabel('Your initials').fill('jmk');
    await page.getByRole('button', { name: 'Save and sign off as version 1' }).click();
    await page.getByText(/Verified by JMK/).first().waitFor();
    ok((await page.getByTestId('saved-state').textContent()).includes('Version 1 · verified'), 'version 1 verified');
    await commitAmount(page, DEXTROSE, '250');
    await page.waitForFunction(() => /Version 1 · unsaved changes/.test(globalThis.document.querySelector('[data-testid="saved-state"]')?.textContent ?? ''));
    await page.getByRole('button', { name: 'Save as version 2' }).click();
    const history = page.getByRole('region', { name: 'Version history' });
    await history.getByText('Version 2', { exact: true }).waitFor();
    const text = await history.innerText();
    ok(/Version 2\s+saved by JMK/.test(text), `who saved version 2: ${text}`);
    ok(text.includes('Dextrose 70% injection, line 2, amount: 150 → 250'), `what changed: ${text}`);
    ok(/Verified by JMK/.test(text), 'version 1 still verified');
    const db = await dumpDb(page);
    equal(db.versions.length, 2, 'two versions stored');
    equal(db.versions[0].signOff.by, 'JMK', 'version 1 locked with its sign-off');
    equal(db.versions[1].signOff, null, 'version 2 not signed');
    await axe(page, 'order with the saved bar and history');
    await page.screenshot({ path: `${ARTIFACTS}/store-order-top.png` });
    await history.screenshot({ path: `${ARTIFACTS}/store-history.png` });
    clean(problems);
    await context.close();
  }],

  ['next day: copy yesterday\'s order, change two lines, verify; the old order says the catalog changed since', async (h) => {
    const { page, context, problems } = await h.newPage();
    await watchCsp(page);
    await page.goto(h.baseUrl);
    await ready(page);
    await page.getByLabel('Your initials').fill('AB');
    await page.getByRole('button', { name: 'Save and sign off as version 1' }).click();
    await page.getByText(/Verified by AB/).first().waitFor();
    // Journey 6: the pharmacy's amino-acid stock changes its labelled osmolarity (an edit for the test).
    await page.getByRole('button', { name: 'Catalog', exact: true }).click();
    const catalog = JSON.parse(readFileSync('data/catalog.json', 'utf8'));
    catalog.products.find((p) => p.id === 'amino-acids-10').mOsmPerMl = 0.86;
    await page.getByLabel('Import a catalog file').setInputFiles({ name: 'catalog.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(catalog)) });
    await page.getByText('imported into this browser').waitFor();
    // Journey 5: copy yesterday's bag, change two lines, verify again.
    await page.getByRole('button', { name: 'Saved orders' }).click();
    await page.getByRole('button', { name: 'Copy for the next bag: MPH-2026-0412' }).click();
    equal(await page.getByLabel('New order id').inputValue(), 'MPH-2026-0413', 'suggested id');
    await page.getByRole('button', { name: 'Copy and open' }).click();
    await page.getByLabel('Order ID', { exact: true }).waitFor();
    equal(await page.getByLabel('Order ID', { exact: true }).inputValue(), 'MPH-2026-0413', 'the copy is open');
    await commitAmount(page, DEXTROSE, '130');
    await commitAmount(page, 'Amount, line 4, Sodium chloride 23.4% injection (4 mEq/mL)', '64');
    await page.waitForFunction(() => /Version 1 · unsaved changes/.test(globalThis.document.querySelector('[data-testid="saved-state"]')?.textContent ?? ''));
    await page.getByRole('button', { name: 'Save and sign off as version 2' }).click();
    await page.getByText(/Version 2 is locked/).waitFor();
    const history = await page.getByRole('region', { name: 'Version history' }).innerText();
    ok(history.includes('Dextrose 70% injection, line 2, amount: 150 → 130') && history.includes('Sodium chloride 23.4% injection (4 mEq/mL), line 4, amount: 60 → 64'), `two lines changed: ${history}`);
    ok(history.includes('copied from another order by AB'), `copy recorded: ${history}`);
    // Reopen yesterday's order: it was checked against the previous catalog.
    await page.getByRole('button', { name: 'Saved orders' }).click();
    await page.getByRole('button', { name: 'Open MPH-2026-0412' }).click();
    const notice = page.getByRole('region', { name: 'Changed since checked' });
    await notice.waitFor();
    const text = await notice.innerText();
    ok(/Version 1 was checked against an earlier catalog/.test(text) && /amino-acids-10 mOsmPerMl: [\d.]+ → 0\.86/.test(text), `changed-since notice: ${text}`);
    await notice.screenshot({ path: `${ARTIFACTS}/store-changed-since.png` });
    clean(problems);
    await context.close();
  }],

  ['importing a bad file lists its problems and leaves the stored orders unchanged', async (h) => {
    const { page, context, problems } = await h.newPage();
    await watchCsp(page);
    await page.goto(h.baseUrl);
    await ready(page);
    await page.getByRole('button', { name: 'Save order' }).click();
    await page.getByText('Version 1', { exact: false }).first().waitFor();
    await page.getByRole('button', { name: 'Saved orders' }).click();
    await page.getByText('1 of 1 saved orders').waitFor();
    const before = await dumpDb(page);
    await page.getByRole('button', { name: 'Import orders…' }).click();
    const bad = JSON.stringify([{ format: 'osmocount-order', version: 1, id: 'BAD-1', patient: { id: 'P', weightKg: -2, ageGroup: 'adult' }, route: 'sideways', lines: [] }]);
    await page.getByLabel('Order file (JSON, JSON array or NDJSON)').setInputFiles({ name: 'bad.json', mimeType: 'application/json', buffer: Buffer.from(bad) });
    const invalid = page.getByRole('group', { name: 'Invalid: Order 1 of the list' });
    await invalid.waitFor();
    const text = await invalid.innerText();
    ok(text.includes('patient.weightKg: must be a number ≥ 0.1 and ≤ 700') && text.includes('route: must be one of'), `problems listed: ${text}`);
    await page.getByText('Nothing was imported; the saved orders are unchanged.').waitFor();
    await axe(page, 'saved orders with the import dialog');
    const after = await dumpDb(page);
    equal(JSON.stringify(after.orders), JSON.stringify(before.orders), 'orders unchanged');
    equal(JSON.stringify(after.versions), JSON.stringify(before.versions), 'versions unchanged');
    await page.screenshot({ path: `${ARTIFACTS}/store-import-rejected.png`, fullPage: true });
    clean(problems);
    await context.close();
  }],

  ['the QA log records a reading, shows the plot and exports CSV', async (h) => {
    const { page, context, problems } = await h.newPage();
    await watchCsp(page);
    await page.goto(h.baseUrl);
    await ready(page);
    await page.getByLabel('Your initials').fill('AB');
    await page.getByRole('button', { name: 'Save and sign off as version 1' }).click();
    await page.getByText(/Verified by AB/).first().waitFor();
    await page.getByRole('button', { name: 'QA log' }).click();
    const form = page.getByRole('form', { name: 'Record a measured osmolality' });
    await form.getByLabel('Bag (saved order)').selectOption({ index: 1 });
    await form.getByLabel('Measured, mOsm/kg').fill('962');
    await form.getByLabel('Instrument note').fill('Osmometer 1, freezing point');
    await form.getByRole('button', { name: 'Record reading' }).click();
    await form.getByRole('status').waitFor();
    await page.getByRole('table', { name: 'Bias by formula type' }).getByText('Adult 3-in-1').first().waitFor();
    const download = page.waitForEvent('download');
    await page.getByRole('button', { name: 'Export the QA log (CSV)' }).click();
    const file = await (await download).path();
    const csv = readFileSync(file, 'utf8');
    ok(csv.startsWith('measured_on,order_id,version,age_band,system,measured_mosm_per_kg,method,instrument,particle_calculated,labelSum_calculated'), `CSV header: ${csv.slice(0, 200)}`);
    ok(csv.includes(',962,freezing-point,"Osmometer 1, freezing point",'), `CSV row: ${csv}`);
    await axe(page, 'QA log');
    await page.screenshot({ path: `${ARTIFACTS}/store-qa-log.png`, fullPage: true });
    clean(problems);
    await context.close();
  }],
];
