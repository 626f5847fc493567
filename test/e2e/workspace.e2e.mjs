// The order workspace in real Chromium: keyboard-only correction of the demo order, undo, the sticky
// verdict at 1366×768, and an axe-core accessibility scan of every view.
import { readFileSync } from 'node:fs';
import { ok, equal, clean } from './assert.mjs';
import { ARTIFACTS } from './harness.mjs';

const AXE = readFileSync('node_modules/axe-core/axe.min.js', 'utf8');

async function reported(page) {
  return page.getByTestId('reported-osmolarity').textContent();
}

/** Press Tab until the focused element's accessible label starts with `label` (keyboard only, no clicks). */
async function tabTo(page, label, max = 120) {
  for (let i = 0; i < max; i++) {
    await page.keyboard.press('Tab');
    const focused = await page.evaluate(() => globalThis.document.activeElement?.getAttribute('aria-label') ?? globalThis.document.activeElement?.textContent ?? '');
    if (focused.startsWith(label)) return;
  }
  throw new Error(`Tab never reached "${label}"`);
}

async function waitForText(page, testId, text) {
  await page.waitForFunction(([id, t]) => globalThis.document.querySelector(`[data-testid="${id}"]`)?.textContent === t, [testId, text]);
}

/** Run axe-core on the page; fail on serious or critical violations. */
async function axe(page, where) {
  await page.evaluate(AXE);
  const result = await page.evaluate(() => globalThis.axe.run(globalThis.document, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'] } }));
  const bad = result.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
  if (bad.length > 0) {
    throw new Error(`${where}: axe found ${bad.length} serious/critical violation(s):\n${bad.map((v) => `${v.id} (${v.impact}): ${v.help}\n  ${v.nodes.slice(0, 3).map((n) => n.target.join(' ')).join('\n  ')}`).join('\n')}`);
  }
  return result.violations.length;
}

export const tests = [
  ['keyboard only: dextrose 150 g → 250 g turns the adult peripheral bag to Hold; undo and redo by keys', async (h) => {
    const { page, context, problems } = await h.newPage();
    await page.goto(h.baseUrl);
    await waitForText(page, 'reported-osmolarity', '897.0');
    const before = await page.getByTestId('verdict').textContent();
    ok(/^(Pass|Review)/.test(before), `verdict before: ${before}`);
    await tabTo(page, 'Amount, line 2, Dextrose 70% injection');
    // Keyboard focus selects the cell's text, so typing replaces it.
    await page.keyboard.type('250');
    await page.keyboard.press('Enter');
    // Journey 2 ("about 1,150 mOsm/L"): 100 g more of dextrose 70% (0.70 g/mL, labelled 3532 mOsm/L) is
    // 142.86 mL × 3.532 mOsm/mL ÷ 2 L = +252.3 mOsm/L over the 897.0 of the demo.
    await waitForText(page, 'reported-osmolarity', '1149.3');
    ok((await page.getByTestId('verdict').textContent()).startsWith('Hold'), 'verdict turns to Hold');
    ok((await page.getByTestId('osmolarity-against').textContent()).startsWith('249.3 over the peripheral limit of 900'), 'limit and margin shown');
    await page.getByText('osmolarity-peripheral').first().waitFor();
    await page.screenshot({ path: `${ARTIFACTS}/workspace-hold-1366x768.png` });
    await page.screenshot({ path: `${ARTIFACTS}/workspace-hold-full.png`, fullPage: true });
    await page.keyboard.press('Control+z');
    await waitForText(page, 'reported-osmolarity', '897.0');
    await page.keyboard.press('Control+Shift+z');
    await waitForText(page, 'reported-osmolarity', '1149.3');
    // Arrow keys: down to the lipid line's amount; an invalid value keeps the last valid figures.
    await page.keyboard.press('ArrowDown');
    const focused = await page.evaluate(() => globalThis.document.activeElement?.getAttribute('aria-label'));
    equal(focused, 'Amount, line 3, Lipid injectable emulsion 20% (soybean oil)', 'ArrowDown moves to the next line');
    await page.keyboard.type('2S0');
    await page.keyboard.press('Enter');
    await page.getByText(/Showing the last valid figures/).waitFor();
    equal(await reported(page), '1149.3', 'figures kept');
    ok(await page.getByText('must be a number ≥ 0 and ≤ 100000').isVisible(), 'inline error');
    await page.screenshot({ path: `${ARTIFACTS}/workspace-invalid-cell.png` });
    clean(problems);
    await context.close();
  }],
  ['the solver\'s volume proposal, applied from the keyboard, brings the held bag under the limit; undo takes it back', async (h) => {
    const { page, context, problems } = await h.newPage();
    await page.goto(h.baseUrl);
    await waitForText(page, 'reported-osmolarity', '897.0');
    await tabTo(page, 'Amount, line 2, Dextrose 70% injection');
    await page.keyboard.type('250');
    await page.keyboard.press('Enter');
    await waitForText(page, 'reported-osmolarity', '1149.3');
    await tabTo(page, 'Apply: Final volume');
    await page.screenshot({ path: `${ARTIFACTS}/workspace-suggestions.png` });
    await page.keyboard.press('Enter');
    // The label mOsm in the bag (2298.6) do not change with water: at 2560 mL, 2298.6 ÷ 2.56 = 897.9 mOsm/L,
    // under 900 (ASPEN 2014). Journey 2: "final volume ≥ 2,560 mL".
    await waitForText(page, 'reported-osmolarity', '897.9');
    equal(await page.getByRole('textbox', { name: 'Final volume' }).inputValue(), '2560', 'final volume applied');
    const verdict = await page.getByTestId('verdict').textContent();
    ok(!verdict.startsWith('Hold'), `no longer held: ${verdict}`);
    ok((await page.getByTestId('osmolarity-against').textContent()).includes('under the peripheral limit of 900'), 'under the limit');
    await page.screenshot({ path: `${ARTIFACTS}/workspace-after-volume.png` });
    await page.keyboard.press('Control+z');
    await waitForText(page, 'reported-osmolarity', '1149.3');
    equal(await page.getByRole('textbox', { name: 'Final volume' }).inputValue(), '2000', 'undo restores the volume');
    clean(problems);
    await context.close();
  }],
  ['keyboard only: add a line, find its stock, give an amount', async (h) => {
    const { page, context, problems } = await h.newPage();
    await page.goto(h.baseUrl);
    await waitForText(page, 'reported-osmolarity', '897.0');
    await tabTo(page, 'Add line');
    await page.keyboard.press('Enter');
    await page.waitForFunction(() => globalThis.document.activeElement?.getAttribute('aria-label') === 'Stock, line 11');
    await page.keyboard.type('potassium acet');
    await page.getByRole('option', { name: 'Potassium acetate injection 2 mEq/mL' }).waitFor();
    await page.screenshot({ path: `${ARTIFACTS}/workspace-stock-picker.png` });
    await page.keyboard.press('Enter');
    await page.keyboard.press('Tab');
    await page.keyboard.type('20');
    await page.keyboard.press('Enter');
    // 20 mEq ÷ 2 mEq/mL = 10 mL; 10 mL × 4 mOsm/mL (label 4000 mOsm/L) ÷ 2 L = +20.0 mOsm/L.
    await waitForText(page, 'reported-osmolarity', '917.0');
    // The line's figures follow in the deferred render.
    await page.locator('tr', { has: page.getByRole('combobox', { name: 'Stock, line 11' }) }).locator('td.col-volumeMl', { hasText: /^10\.00$/ }).waitFor();
    clean(problems);
    await context.close();
  }],
  ['at 1366×768 the verdict stays in view and nothing scrolls sideways', async (h) => {
    const { page, context, problems } = await h.newPage();
    await page.goto(h.baseUrl);
    await waitForText(page, 'reported-osmolarity', '897.0');
    const width = await page.evaluate(() => globalThis.document.documentElement.scrollWidth);
    ok(width <= 1366, `page is ${width} px wide`);
    await page.mouse.wheel(0, 2000);
    await page.waitForFunction(() => globalThis.scrollY > 200);
    const box = await page.getByTestId('verdict').boundingBox();
    ok(box && box.y >= 0 && box.y < 120, `verdict in view after scrolling (y = ${box?.y})`);
    // Choosing a finding highlights the lines it concerns.
    await page.getByLabel('Demo order').selectOption('preterm-neonate');
    const notes = page.locator('details.notes');
    if (!(await notes.evaluate((d) => d.open))) await notes.locator('summary').click();
    await page.getByRole('button', { name: /missing-label-osmolarity/ }).click();
    const highlighted = await page.locator('tr.hl').count();
    ok(highlighted >= 1, 'the concerned line is highlighted');
    await page.screenshot({ path: `${ARTIFACTS}/workspace-finding-highlight.png` });
    clean(problems);
    await context.close();
  }],
  ['the ion-order demo shows the salts the allocator added beside the typed lines', async (h) => {
    const { page, context, problems } = await h.newPage();
    await page.goto(h.baseUrl);
    await page.getByTestId('reported-osmolarity').waitFor();
    await page.getByLabel('Demo order').selectOption('adult-ions');
    await page.getByText('(added from the ion order)').first().waitFor();
    const added = await page.locator('tr.allocated').count();
    ok(added >= 4, `allocated lines shown (${added})`);
    await page.screenshot({ path: `${ARTIFACTS}/workspace-ion-order.png`, fullPage: true });
    clean(problems);
    await context.close();
  }],
  ['axe-core finds no serious or critical accessibility violation in any view', async (h) => {
    // The scan injects axe's source, which the app's CSP forbids; this context bypasses CSP for the scan only.
    const { page, context, problems } = await h.newPage({ bypassCSP: true });
    await page.goto(h.baseUrl);
    await waitForText(page, 'reported-osmolarity', '897.0');
    await axe(page, 'order view');
    const amount = page.getByLabel('Amount, line 2, Dextrose 70% injection');
    await amount.fill('abc');
    await amount.press('Enter');
    await page.getByText(/Showing the last valid figures/).waitFor();
    await axe(page, 'order view with an invalid cell');
    await page.getByRole('button', { name: 'Catalog' }).click();
    await page.getByRole('button', { name: /^Edit Dextrose 70%/ }).click();
    await axe(page, 'catalog view with the stock editor');
    await page.screenshot({ path: `${ARTIFACTS}/workspace-catalog.png` });
    await page.getByRole('button', { name: 'Policy' }).click();
    await axe(page, 'policy view');
    await page.screenshot({ path: `${ARTIFACTS}/workspace-policy.png` });
    clean(problems);
    await context.close();
  }],
];
