/* global window */
// The printouts as paper: the CLI writes the HTML, Chromium prints it to PDF at the page size,
// poppler reads the text back (pdftotext -layout) and counts the pages (pdfinfo); PNG renders are
// saved under test-results/e2e/ for review. Then the same from the app's print buttons.
//
// Expected amounts come from the demo orders and the stock labels (field guide §0, §6.1): lipid 20% =
// 20 g oil/100 mL; potassium phosphates 3 mmol P + 4.4 mEq K per mL; sodium glycerophosphate 1 mmol P
// + 2 mmol Na per mL; the neonate weighs 1.1 kg. Beyond use from 2 Dec 2026 14:30 UTC: USP <797>
// (2008) 30 h at room temperature → 3 Dec 20:30, 9 days refrigerated → 11 Dec 14:30, then 24 h
// (ASPEN 2014). Filters: ASPEN 2014, 1.2 µm for 3-in-1, 0.22 µm for 2-in-1. Peripheral limit
// 900 mOsm/L: ASPEN 2014. Page sizes in PostScript points (72 per inch): A4 595 × 842
// (210 × 297 mm), US Letter 612 × 792, labels 4 × 6 in = 288 × 432, 4 × 4 in = 288 × 288.
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { ok, equal, clean } from './assert.mjs';
import { ARTIFACTS } from './harness.mjs';

const COMPOUNDED = '2026-12-02T14:30Z';
const BUD_ROOM = '03 Dec 2026 20:30';
const BUD_FRIDGE = '11 Dec 2026 14:30';

const INGREDIENTS = {
  'adult-central': [
    ['Amino acids', '100 g/day'], ['Dextrose', '300 g/day'], ['Sodium chloride', '60 mEq/day'], ['Sodium acetate', '40 mEq/day'],
    ['Potassium chloride', '40 mEq/day'], ['Potassium phosphates', '15 mmol/day'], ['Magnesium sulfate', '16 mEq/day'],
    ['Calcium gluconate', '10 mEq/day'], ['Multiple vitamins, adult', '10 mL/day'], ['Trace elements, adult', '1 mL/day'],
  ],
  'adult-peripheral': [
    ['Amino acids', '80 g/day'], ['Dextrose', '150 g/day'], ['Lipid emulsion (soybean oil)', '50 g/day'], ['Sodium chloride', '60 mEq/day'],
    ['Potassium chloride', '40 mEq/day'], ['Potassium phosphates', '15 mmol/day'], ['Magnesium sulfate', '8 mEq/day'],
    ['Calcium gluconate', '9.3 mEq/day'], ['Multiple vitamins, adult', '10 mL/day'], ['Trace elements, adult', '1 mL/day'],
  ],
  'preterm-neonate': [
    ['Amino acids', '3.5 g/kg/day', '3.85 g/day'], ['Dextrose', '12 g/kg/day', '13.2 g/day'],
    ['Sodium glycerophosphate', '1.5 mmol/kg/day', '1.65 mmol/day'], ['Potassium acetate', '2 mEq/kg/day', '2.2 mEq/day'],
    ['Calcium gluconate', '2 mmol/kg/day', '2.2 mmol/day'],
  ],
};
const ORDER_ID = { 'adult-central': 'MPH-2026-0413', 'adult-peripheral': 'MPH-2026-0412', 'preterm-neonate': 'MPH-2026-0414' };

function ensureCli() {
  if (!existsSync('dist/cli/osmocount.mjs')) execFileSync(process.execPath, ['node_modules/vite/bin/vite.js', 'build', '--mode', 'cli', '--logLevel', 'warn'], { stdio: 'inherit' });
}

/** Run the installed CLI (its launcher runs the built bundle), in UTC. */
function osmocount(args) {
  const r = spawnSync(process.execPath, ['src/cli/osmocount.mjs', ...args], { encoding: 'utf8', env: { ...process.env, TZ: 'UTC' } });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

function pdfInfo(pdf) {
  const text = execFileSync('pdfinfo', [pdf], { encoding: 'utf8' });
  const pages = Number(/Pages:\s+(\d+)/.exec(text)?.[1]);
  const [, w, h] = /Page size:\s+([\d.]+) x ([\d.]+) pts/.exec(text) ?? [];
  return { pages, width: Math.round(Number(w)), height: Math.round(Number(h)) };
}

const pdfText = (pdf) => execFileSync('pdftotext', ['-layout', pdf, '-'], { encoding: 'utf8' });
/** The text in reading order (no layout). */
const pdfWords = (pdf) => execFileSync('pdftotext', [pdf, '-'], { encoding: 'utf8' });
const flat = (text) => text.replace(/\s+/g, ' ');

function pngs(pdf, prefix) {
  execFileSync('pdftoppm', ['-png', '-r', '80', pdf, `${ARTIFACTS}/${prefix}`]);
}

/** Load an HTML document into Chromium and print it to PDF at its CSS page size (in a given page, or a fresh one). */
async function toPdf(h, html, pdf, reuse = null) {
  const { page, context, problems } = reuse ?? await h.newPage();
  await page.setContent(html, { waitUntil: 'load' });
  await page.pdf({ path: pdf, preferCSSPageSize: true, printBackground: true });
  clean(problems);
  if (!reuse) await context.close();
}

let outDir = null;
/** Print the three demo orders with the CLI once (sheets on A4, labels 4 × 6 and 4 × 4). */
function cliOutput() {
  if (outDir) return outDir;
  ensureCli();
  outDir = mkdtempSync(join(tmpdir(), 'osmocount-print-'));
  const demos = Object.keys(INGREDIENTS).map((k) => `data/demo/${k}.json`);
  const common = ['--institution', 'Marren Point Hospital', '--compounded', COMPOUNDED];
  for (const [dir, extra] of [['a4-4x6', ['--sheet', '--label']], ['letter-4x4', ['--sheet', '--label', '--paper', 'letter', '--label-size', '4x4']]]) {
    const r = osmocount(['print', ...demos, ...extra, ...common, '--out', join(outDir, dir)]);
    equal(r.code, 0, `osmocount print exit code (stderr: ${r.stderr})`);
  }
  return outDir;
}

function checkLabelText(key, text, compact) {
  const t = flat(text);
  for (const [name, ...amounts] of INGREDIENTS[key]) {
    ok(t.includes(name.split(' ')[0]), `${key}: ingredient ${name} printed`);
    for (const a of amounts) ok(t.includes(a), `${key}: ${name} amount ${a} printed`);
    // On the 4 × 6 in label the amounts sit on the line where the ingredient's name starts.
    if (!compact) ok(new RegExp(`^${name.split(' ')[0]}.*\\s${amounts.join('\\s+')}$`, 'm').test(text), `${key}: "${name}" and ${amounts.join(', ')} on one line`);
  }
  ok(!/water/i.test(t), `${key}: the fill water is not an ingredient`);
  ok(t.includes(`Compounded ${'02 Dec 2026 14:30'}`), `${key}: compounding time`);
  ok(t.includes(`USE BY ${BUD_ROOM} if kept at room temperature 20–25 °C (30 h)`), `${key}: room-temperature BUD`);
  ok(t.includes(`USE BY ${BUD_FRIDGE} if kept refrigerated 2–8 °C (9 days), then up to 24 h at room temperature`), `${key}: refrigerated BUD`);
  ok(t.includes('Keep refrigerated at 2–8 °C'), `${key}: storage`);
  ok(t.includes('Do not use if precipitate or separation is seen'), `${key}: precipitate caution`);
  ok(t.includes('High-alert medication'), `${key}: high-alert caution`);
  ok(t.includes('Pharmacist verified (initials)'), `${key}: verification line`);
  ok(t.includes(`Order ${ORDER_ID[key]}`), `${key}: order id under the barcode`);
}

export const tests = [
  ['CLI labels print on one 4 × 6 in page with every ingredient, route, BUD, filter and cautions', async (h) => {
    const dir = cliOutput();
    const tab = await h.newPage();
    for (const key of Object.keys(INGREDIENTS)) {
      const pdf = join(dir, `${key}-label-4x6.pdf`);
      await toPdf(h, readFileSync(join(dir, 'a4-4x6', `${ORDER_ID[key]}.label.html`), 'utf8'), pdf, tab);
      const info = pdfInfo(pdf);
      equal(`${info.width}x${info.height}`, '288x432', `${key}: 4 × 6 in page`);
      equal(info.pages, 1, `${key}: the label fits on one page`);
      const text = pdfText(pdf);
      checkLabelText(key, text, false);
      pngs(pdf, `print-label-4x6-${key}`);
    }
    const central = flat(pdfText(join(dir, 'adult-central-label-4x6.pdf')));
    ok(central.includes('CENTRAL LINE ONLY'), 'over-limit bag: CENTRAL LINE ONLY');
    ok(central.includes('over the peripheral limit of 900 mOsm/L'), 'over-limit bag: against 900 mOsm/L');
    ok(central.includes('Use a 0.22 µm in-line filter (2-in-1: no lipid)'), '2-in-1 filter');
    const peripheral = flat(pdfText(join(dir, 'adult-peripheral-label-4x6.pdf')));
    ok(peripheral.includes('Peripheral vein or central line') && !peripheral.includes('CENTRAL LINE ONLY'), 'peripheral bag route wording');
    ok(peripheral.includes('Use a 1.2 µm in-line filter (3-in-1: contains lipid)'), '3-in-1 filter');
    ok(peripheral.includes('with 22 mEq/day K'), 'potassium phosphates bring 15 ÷ 3 × 4.4 = 22 mEq K');
    const neonate = flat(pdfText(join(dir, 'preterm-neonate-label-4x6.pdf')));
    ok(neonate.includes('Central line') && neonate.includes('Dosing weight 1.1 kg'), 'neonate route and dosing weight');
    await tab.context.close();
  }],

  ['CLI labels also fit one 4 × 4 in page', async (h) => {
    const dir = cliOutput();
    const tab = await h.newPage();
    for (const key of Object.keys(INGREDIENTS)) {
      const pdf = join(dir, `${key}-label-4x4.pdf`);
      await toPdf(h, readFileSync(join(dir, 'letter-4x4', `${ORDER_ID[key]}.label.html`), 'utf8'), pdf, tab);
      const info = pdfInfo(pdf);
      equal(`${info.width}x${info.height}`, '288x288', `${key}: 4 × 4 in page`);
      equal(info.pages, 1, `${key}: the 4 × 4 label fits on one page`);
      checkLabelText(key, pdfText(pdf), true);
      pngs(pdf, `print-label-4x4-${key}`);
    }
    ok(flat(pdfText(join(dir, 'adult-central-label-4x4.pdf'))).includes('CENTRAL LINE ONLY'), '4 × 4: CENTRAL LINE ONLY');
    await tab.context.close();
  }],

  ['CLI verification sheets print on A4 and US Letter with every line, osmolarities, verdict and sign-off', async (h) => {
    const dir = cliOutput();
    const tab = await h.newPage();
    for (const [paper, size] of [['a4-4x6', '595x842'], ['letter-4x4', '612x792']]) {
      for (const key of Object.keys(INGREDIENTS)) {
        const pdf = join(dir, `${key}-sheet-${paper}.pdf`);
        await toPdf(h, readFileSync(join(dir, paper, `${ORDER_ID[key]}.sheet.html`), 'utf8'), pdf, tab);
        const info = pdfInfo(pdf);
        equal(`${info.width}x${info.height}`, size, `${key}: sheet page size (${paper})`);
        // Every page is numbered and names the order and patient (a loose page still says which bag).
        const raw = pdfText(pdf);
        equal(raw.split('\f').filter((p) => p.includes(`Order ${ORDER_ID[key]} · patient ID`) && p.includes(`of ${info.pages}`)).length, info.pages, `${key}: order id and page number on each of ${info.pages} pages`);
        // Captions are set in capitals by the style sheet, so compare without case.
        const t = flat(pdfText(pdf)).toLowerCase();
        for (const s of ['Marren Point Hospital', 'PN verification sheet', `Order ${ORDER_ID[key]}`, 'Prepared by', 'Checked by', 'Name or initials',
          'Date and time', 'Particle count', 'Label sum', 'Reported', 'Peripheral limit', 'Electrolytes', 'Findings', 'Verdict:', 'a checking aid',
          'local policy and the verifying pharmacist decide', 'PN is a high-alert medication', `${BUD_ROOM} (30 h)`, 'Page 1 of',
          'Suggested mixing sequence']) {
          ok(t.includes(s.toLowerCase()), `${key} sheet (${paper}): "${s}"`);
        }
        if (paper === 'a4-4x6') pngs(pdf, `print-sheet-a4-${key}`);
      }
    }
    const central = flat(pdfText(join(dir, 'adult-central-sheet-a4-4x6.pdf')));
    // Dextrose 70%: 300 g ÷ 0.7 g/mL = 428.57 mL; × 3.532 mOsm/mL = 1513.7 mOsm (field guide §9.4 D1: 1513.9 with 5.046 mOsm/g).
    ok(/Dextrose 70% injection .*300 g\/day 428\.57 mL 1513\.7 mOsm/.test(central), 'dextrose line with volume and mOsm');
    ok(central.includes('is over the peripheral limit of 900 mOsm/L: central line only'), 'reported osmolarity against the limit');
    // The sheet's verdict is the engine's (osmocount check --json on the same order).
    const verdict = JSON.parse(osmocount(['check', 'data/demo/adult-central.json', '--json']).stdout).verdict;
    const word = { pass: 'pass — no finding holds this bag', warn: 'review — warnings need a pharmacist’s review', block: 'hold — do not compound as ordered' }[verdict];
    ok(central.toLowerCase().includes(`verdict: ${word}`), `verdict ${verdict} printed`);
    const neonate = flat(pdfText(join(dir, 'preterm-neonate-sheet-a4-4x6.pdf')));
    ok(/3\.85 g\/day 3\.5 g\/kg\/day 38\.50 mL/.test(neonate), 'neonate line per day and per kg; 3.85 g ÷ 0.1 g/mL');
    await tab.context.close();
  }],

  ['names with <script> and & print literally on paper', async (h) => {
    ensureCli();
    const dir = mkdtempSync(join(tmpdir(), 'osmocount-hostile-'));
    const catalog = JSON.parse(readFileSync('data/catalog.json', 'utf8'));
    catalog.products.push({ id: 'zinc-hostile', name: 'Zinc <script>alert("x")</script> & copper injection', role: 'additive', perMl: { Cl: '0.01' }, mOsmPerMl: '0.02' });
    writeFileSync(join(dir, 'catalog.json'), JSON.stringify(catalog));
    writeFileSync(join(dir, 'order.json'), JSON.stringify({
      id: 'MPH-2026-9001', patient: { id: 'MRN-1&2', name: '<script>alert("pt")</script> Smith & Jones', location: 'Ward <i>7</i>', weightKg: 60, ageGroup: 'adult' },
      route: 'central', volumeMl: 1500,
      lines: [{ product: 'amino-acids-10', amount: 60, unit: 'g' }, { product: 'zinc-hostile', amount: 2, unit: 'mL' }, { product: 'sterile-water', fill: true }],
    }));
    const r = osmocount(['print', join(dir, 'order.json'), '--sheet', '--label', '--catalog', join(dir, 'catalog.json'), '--compounded', COMPOUNDED, '--out', dir]);
    equal(r.code, 0, `exit code (stderr: ${r.stderr})`);
    for (const kind of ['sheet', 'label']) {
      const pdf = join(dir, `${kind}.pdf`);
      await toPdf(h, readFileSync(join(dir, `MPH-2026-9001.${kind}.html`), 'utf8'), pdf);
      // Compared without white space: a long name may wrap inside the markup.
      const t = pdfWords(pdf).replace(/\s/g, '');
      ok(t.includes('<script>alert("pt")</script>Smith&Jones'), `${kind}: patient name printed literally`);
      ok(t.includes('Zinc<script>alert'), `${kind}: product name printed literally`);
      ok(t.includes('Ward<i>7</i>'), `${kind}: location printed literally`);
    }
  }],

  ['a label the model does not warn about prints on one page, at every size', async (h) => {
    ensureCli();
    const dir = mkdtempSync(join(tmpdir(), 'osmocount-fit-'));
    const lines = (kids) => [
      ['amino-acids-10', kids ? 3 : 80, 'g'], ['dextrose-70', kids ? 10 : 150, 'g'], ['lipid-20', kids ? 10 : 250, 'mL'],
      ['sodium-chloride-4', kids ? 2 : 60, 'mEq'], ['sodium-acetate-2', kids ? 1 : 20, 'mEq'], ['sodium-phosphates-3', kids ? 0.5 : 10, 'mmol', 'phosphate'],
      ['potassium-chloride-2', kids ? 1 : 20, 'mEq'], ['potassium-acetate-2', kids ? 1 : 20, 'mEq'], ['potassium-phosphates-3', kids ? 0.5 : 10, 'mmol', 'phosphate'],
      ['magnesium-sulfate-50', kids ? 0.3 : 8, 'mEq'], ['calcium-gluconate-10', kids ? 1 : 9.3, 'mEq'], ['calcium-chloride-10', kids ? 0.2 : 2, 'mEq'],
      ['multivitamin-adult', kids ? 1 : 10, 'mL'], ['trace-elements-adult', kids ? 0.1 : 1, 'mL'], ['sodium-glycerophosphate-1', kids ? 0.5 : 10, 'mmol'],
    ].map(([product, amount, unit, species]) => ({ product, amount, unit: kids ? `${unit}/kg` : unit, ...(species ? { species } : {}) }));
    const orders = [8, 11, 15].flatMap((n) => [false, true].map((kids) => ({
      id: `FIT-${n}${kids ? 'K' : 'A'}`, route: 'central', volumeMl: kids ? 1000 : 3000,
      patient: { id: 'MRN-1', name: 'Alexandra Quillfeather-Montgomery (fictional)', location: 'Ward 5 East, bed 12', weightKg: kids ? 8 : 68, ageGroup: kids ? 'child' : 'adult' },
      lines: [...lines(kids).slice(0, n), { product: 'sterile-water', fill: true }],
    })));
    writeFileSync(join(dir, 'orders.json'), JSON.stringify(orders));
    const files = [join(dir, 'orders.json'), ...Object.keys(INGREDIENTS).map((k) => `data/demo/${k}.json`)];
    let checked = 0;
    let warned = 0;
    const tab = await h.newPage();
    for (const size of ['4x4', '4x6', '100x150mm', '3.5x5in']) {
      const out = join(dir, size);
      const r = osmocount(['print', ...files, '--label', '--label-size', size, '--compounded', COMPOUNDED, '--out', out]);
      equal(r.code, 0, `exit code at ${size} (stderr: ${r.stderr})`);
      const warnedIds = new Set([...r.stderr.matchAll(/^warning: (\S+): /gm)].map((m) => m[1]));
      for (const id of [...orders.map((o) => o.id), ...Object.values(ORDER_ID)]) {
        const pdf = join(dir, `${id}-${size}.pdf`);
        if (warnedIds.has(id)) { warned += 1; continue; }
        await toPdf(h, readFileSync(join(out, `${id}.label.html`), 'utf8'), pdf, tab);
        equal(pdfInfo(pdf).pages, 1, `${id} at ${size}: no warning, so one page`);
        checked += 1;
      }
    }
    await tab.context.close();
    ok(warned > 0 && checked > 20, `some labels warned (${warned}), most were checked (${checked})`);
    const big = osmocount(['print', join(dir, 'orders.json'), '--label', '--label-size', '4x4', '--out', join(dir, 'again')]);
    ok(/^warning: FIT-15K: This label may not fit on one 4 × 4 in label \(15 ingredients\): print it on a larger label\.$/m.test(big.stderr), 'the long child order warns at 4 × 4 in');
  }],

  ['the app prints the verification sheet, and nothing of the workspace', async (h) => {
    const { page, context, problems } = await h.newPage();
    await page.addInitScript(() => { window.__printed = 0; window.print = () => { window.__printed += 1; }; });
    await page.goto(h.baseUrl);
    await page.getByLabel('Demo order').selectOption('adult-central');
    await page.getByRole('button', { name: 'Print verification sheet' }).click();
    equal(await page.evaluate(() => window.__printed), 1, 'window.print called once');
    await page.emulateMedia({ media: 'print' });
    const container = page.getByTestId('print-container');
    ok(await container.isVisible(), 'print container visible in print media');
    ok(!(await page.locator('#root').isVisible()), 'the workspace is hidden in print media');
    const text = await container.textContent();
    ok(text.includes('PN verification sheet') && text.includes('MPH-2026-0413') && text.includes('Marren Point Hospital'), 'the sheet is in the container');
    await page.screenshot({ path: `${ARTIFACTS}/print-app-sheet-print-media.png`, fullPage: true });
    const pdf = join(mkdtempSync(join(tmpdir(), 'osmocount-app-')), 'app-sheet.pdf');
    await page.pdf({ path: pdf, preferCSSPageSize: true, printBackground: true });
    const info = pdfInfo(pdf);
    equal(`${info.width}x${info.height}`, '595x842', 'A4 from the app');
    const t = flat(pdfText(pdf));
    ok(t.includes('PN verification sheet') && !t.includes('Demo order') && !t.includes('PN admixture check'), 'only the sheet prints');
    // The page foot comes from a style sheet added through the CSS object model (the CSP forbids inline styles).
    ok(t.includes('Order MPH-2026-0413 · patient ID MRN-301977'), 'order id at the foot of the in-app sheet');
    pngs(pdf, 'print-app-sheet');
    await page.emulateMedia({ media: 'screen' });
    ok(!(await container.isVisible()), 'the print container stays hidden on screen');
    clean(problems);
    await context.close();
  }],

  ['the app prints the bag label at 4 × 4 in and at a custom size, under its CSP', async (h) => {
    const { page, context, problems } = await h.newPage();
    await page.addInitScript(() => { window.print = () => {}; });
    await page.goto(h.baseUrl);
    await page.getByLabel('Label', { exact: true }).selectOption('4x4');
    await page.getByRole('button', { name: 'Print bag label' }).click();
    const dir = mkdtempSync(join(tmpdir(), 'osmocount-app-'));
    await page.pdf({ path: join(dir, 'l44.pdf'), preferCSSPageSize: true, printBackground: true });
    let info = pdfInfo(join(dir, 'l44.pdf'));
    equal(`${info.width}x${info.height}x${info.pages}`, '288x288x1', 'one 4 × 4 in page');
    ok(flat(pdfText(join(dir, 'l44.pdf'))).includes('Peripheral vein or central line'), 'the peripheral demo label');
    await page.getByLabel('Label', { exact: true }).selectOption('custom');
    await page.getByLabel('Size').fill('100x150mm');
    await page.getByRole('button', { name: 'Print bag label' }).click();
    await page.pdf({ path: join(dir, 'custom.pdf'), preferCSSPageSize: true, printBackground: true });
    info = pdfInfo(join(dir, 'custom.pdf'));
    // 100 × 150 mm = 283.5 × 425.2 pt.
    equal(`${info.width}x${info.height}x${info.pages}`, '283x425x1', 'one 100 × 150 mm page');
    ok(!(await page.getByText('may not fit').count()), 'no fit warning for the demo label');
    pngs(join(dir, 'custom.pdf'), 'print-app-label-100x150mm');
    clean(problems);
    await context.close();
  }],
];
