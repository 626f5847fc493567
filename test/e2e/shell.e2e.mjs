// The app as a pharmacist first sees it: the demo order, its figures, its verdict and the cautions.
import { ok, equal, clean } from './assert.mjs';
import { ARTIFACTS } from './harness.mjs';

export const tests = [
  ['the demo order loads with real figures, findings and cautions', async (h) => {
    const { page, context, problems } = await h.newPage();
    await page.goto(h.baseUrl);
    const reported = page.getByTestId('reported-osmolarity');
    await reported.waitFor();
    // Adult peripheral demo: label sum 897.0 mOsm/L (see the engine tests for the arithmetic).
    equal(await reported.textContent(), '897.0', 'reported osmolarity');
    const body = await page.locator('body').innerText();
    ok(body.includes('under the peripheral limit of 900 mOsm/L'), 'limit shown');
    ok(/Particle count\s+874\.5 mOsm\/L/.test(body), 'particle count shown');
    ok(body.includes('Dextrose 70% injection'), 'lines shown');
    ok(body.includes('214.29'), 'dextrose stock volume shown');
    ok(body.includes('Local policy and the verifying pharmacist decide'), 'caution shown');
    await page.screenshot({ path: `${ARTIFACTS}/shell-adult-peripheral.png`, fullPage: true });
    clean(problems);
    await context.close();
  }],
  ['switching to the neonatal demo shows per-kg figures and its finding with a source', async (h) => {
    const { page, context, problems } = await h.newPage();
    await page.goto(h.baseUrl);
    await page.getByLabel('Demo order').selectOption('preterm-neonate');
    // The order header shows the opened order's age group in its own field.
    equal(await page.getByLabel('Age group').inputValue(), 'preterm-neonate', 'age group of the opened order');
    await page.getByText('8.33 mg/kg/min', { exact: true }).waitFor();
    const body = await page.locator('body').innerText();
    ok(body.includes('3.500 g/kg'), 'amino acids per kg');
    ok(body.includes('8.33 mg/kg/min'), 'GIR');
    ok(body.includes('Source:'), 'finding sources shown');
    await page.screenshot({ path: `${ARTIFACTS}/shell-preterm.png`, fullPage: true });
    clean(problems);
    await context.close();
  }],
  ['the page carries a strict Content-Security-Policy', async (h) => {
    const { page, context, problems } = await h.newPage();
    const response = await page.goto(h.baseUrl);
    const html = await response.text();
    ok(/http-equiv="Content-Security-Policy" content="default-src 'none'; script-src 'self'/.test(html), 'CSP meta present');
    clean(problems);
    await context.close();
  }],
];
