import { describe, expect, test } from 'vitest';
import { readFileSync } from 'node:fs';
import { z } from 'zod';
import { runCli } from './run.ts';
import { reportSchema } from '../core/report.ts';
import { memoryIo } from '../../test/support/cliIo.ts';

type OrderJson = {
  id: string; patient: { id: string; weightKg: number | string; ageGroup: string }; route: string; volumeMl: number;
  lines: { product: string; amount?: number | string; unit?: string; species?: string; fill?: boolean }[];
};
const read = (path: string) => readFileSync(new URL(`../../${path}`, import.meta.url), 'utf8');
const demo = (name: string): OrderJson => JSON.parse(read(`data/demo/${name}.json`));

/**
 * The shipped policy with only the two peripheral route screens left able to warn or hold: every
 * other rule (dose ranges, stability, GIR…) only informs. The verdicts below then follow from two
 * published limits alone, whatever other checks the engine gains:
 * - hold: reported osmolarity over 900 mOsm/L on a peripheral bag (ASPEN 2014, Boullata et al.);
 * - warn: final dextrose over 10% on an adult peripheral bag (INS Standards of Practice 2011).
 * Central bags are screened by neither, so they pass.
 */
function auditPolicy(peripheralMax?: number): string {
  const policy = JSON.parse(read('data/policy.json'));
  const screens = new Set<unknown>([policy.rules['osmolarity-peripheral'], policy.rules['dextrose-peripheral']]);
  const inform = (node: unknown, screen: boolean): void => {
    if (Array.isArray(node)) { node.forEach((n) => inform(n, screen)); return; }
    if (typeof node !== 'object' || node === null) return;
    const o = node as Record<string, unknown>;
    if (typeof o.severity === 'string' && !screen) o.severity = 'info';
    for (const v of Object.values(o)) inform(v, screen || screens.has(o));
  };
  inform(policy, false);
  if (peripheralMax !== undefined) {
    for (const rule of Object.values(policy.rules['osmolarity-peripheral'] as Record<string, { max: number }>)) rule.max = peripheralMax;
  }
  return JSON.stringify(policy);
}

/** The adult peripheral demo with dextrose raised to 250 g (user journey 2). */
function heldOrder(id: string): OrderJson {
  const o = demo('adult-peripheral');
  return { ...o, id, lines: o.lines.map((l) => (l.product === 'dextrose-70' ? { ...l, amount: 250 } : l)) };
}

/** An adult peripheral 2-in-1 of 2,000 mL: dextrose 220 g (11%) and amino acids 40 g, water to volume. */
function warnOrder(id: string): OrderJson {
  return {
    id, patient: { id: 'MRN-700101', weightKg: 68, ageGroup: 'adult' }, route: 'peripheral', volumeMl: 2000,
    lines: [{ product: 'dextrose-70', amount: 220, unit: 'g' }, { product: 'amino-acids-10', amount: 40, unit: 'g' }, { product: 'sterile-water', fill: true }],
  };
}

/** Orders as CSV rows in the documented layout (order columns repeated on every row). */
function csvOf(orders: OrderJson[]): string {
  const rows = ['order_id,patient_id,weight_kg,age_group,route,volume_ml,product,amount,unit,species,fill'];
  for (const o of orders) {
    for (const l of o.lines) rows.push([o.id, o.patient.id, o.patient.weightKg, o.patient.ageGroup, o.route, o.volumeMl, l.product, l.amount ?? '', l.unit ?? '', l.species ?? '', l.fill ? 'true' : ''].join(','));
  }
  return `${rows.join('\n')}\n`;
}

const badCsvOrder: OrderJson = { ...warnOrder('BAD-CSV'), lines: [{ product: 'dextrose-70', amount: 100, unit: 'g' }, { product: 'amino-acids-10', amount: 'abc', unit: 'g' }, { product: 'sterile-water', fill: true }] };

/**
 * A day's orders in three formats, in a directory read recursively (more.ndjson, orders.json,
 * sub/day.csv: by name). Three inputs are invalid: a JSON order with weight 0, a line that is
 * not JSON, a CSV row whose amount is not a number.
 */
function mixedDay() {
  return {
    'day/orders.json': JSON.stringify([demo('adult-central'), demo('adult-peripheral'), heldOrder('HELD-JSON'), { ...warnOrder('BAD-WEIGHT'), patient: { id: 'P', weightKg: 0, ageGroup: 'adult' } }]),
    'day/more.ndjson': `${JSON.stringify(demo('preterm-neonate'))}\n${JSON.stringify(warnOrder('WARN-ND'))}\n{not json\n`,
    'day/sub/day.csv': csvOf([warnOrder('WARN-CSV'), heldOrder('HELD-CSV'), badCsvOrder]),
    'day/.hidden/x.json': '{not read at all',
    'day/readme.txt': 'not an order file',
    'audit.json': auditPolicy(),
  };
}

/**
 * Expected figures, from the catalog's label values (each sourced in data/catalog.json):
 * - HELD (journey 2): the adult peripheral demo's label sum is 1,794.04 mOsm (amino acids 10% 800 mL × 0.84,
 *   dextrose 70% 214.29 mL × 3.532, lipid 20% 250 mL × 0.26, NaCl 15 mL × 8.008, KCl 20 mL × 4, K phosphates
 *   5 mL × 7.4, Mg sulfate 1.97 mL × 4.06, Ca gluconate 20 mL × 0.68, multivitamin 10 mL × 4.11, trace elements
 *   1 mL × 0.36) → 897.0 mOsm/L in 2 L. 100 g more dextrose adds 142.86 mL × 3.532 = 504.6 mOsm → 1,149.3 mOsm/L.
 *   Dextrose 250 g / 2,000 mL = 12.5%.
 * - WARN: particles 220 g × 5.046 mOsm/g (USP <785>, 1000/198.17) + 40 g × 7.302 + 400 mL × 0.1098 (Na, acetate)
 *   = 1,446.12 mOsm → 723.1 mOsm/L (above the label sum, 723.0); dextrose 220 g / 2,000 mL = 11%.
 */
const MIXED_SUMMARY = [
  'Summary: 7 orders checked, 3 not checked',
  '  PASS     3',
  '  WARN     2',
  '  HOLD     2',
  '  INVALID  3  (not checked: each problem is listed as file: where: path: message)',
  'Findings that warn or hold, by code',
  '  HOLD  osmolarity-peripheral  2',
  '  WARN  dextrose-peripheral    4',
  'Highest reported osmolarity on peripheral bags (top 10)',
  '  1149.3 mOsm/L  limit 900  HOLD  HELD-JSON      day/orders.json [2]',
  '  1149.3 mOsm/L  limit 900  HOLD  HELD-CSV       day/sub/day.csv rows 5-15',
  '   897.0 mOsm/L  limit 900  PASS  MPH-2026-0412  day/orders.json [1]',
  '   723.1 mOsm/L  limit 900  WARN  WARN-ND        day/more.ndjson line 2',
  '   723.1 mOsm/L  limit 900  WARN  WARN-CSV       day/sub/day.csv rows 2-4',
].join('\n');

describe('osmocount check over a batch', () => {
  test('a mixed day (JSON array, NDJSON, CSV in a directory): every valid order reported, invalid ones named, exact summary, exit 2', async () => {
    const { io, out, err } = memoryIo(mixedDay(), { chunkBytes: 100 });
    expect(await runCli(['check', 'day', '--policy', 'audit.json'], io)).toBe(2);
    const text = out.join('\n');
    expect(text.match(/^Order \S+/gm)).toEqual([
      'Order MPH-2026-0414', 'Order WARN-ND',
      'Order MPH-2026-0413', 'Order MPH-2026-0412', 'Order HELD-JSON',
      'Order WARN-CSV', 'Order HELD-CSV',
    ]);
    expect(text).toContain(MIXED_SUMMARY);
    expect(text.trimEnd().endsWith('PN is a high-alert medication.')).toBe(true);
    expect(err).toEqual([
      expect.stringMatching(/^day\/more\.ndjson: line 3: \(line\): is not valid JSON/),
      // file: where: path: message (the message's bounds are the engine's own).
      expect.stringMatching(/^day\/orders\.json: \[3\]: patient\.weightKg: must be a number /),
      expect.stringMatching(/^day\/sub\/day\.csv: row 17: lines\[1\]\.amount: must be a number /),
    ]);
  });

  test('--ndjson --only block prints just the held reports, one per line; the summary on stderr still counts every order', async () => {
    const { io, out, err } = memoryIo(mixedDay());
    expect(await runCli(['check', 'day', '--policy', 'audit.json', '--ndjson', '--only', 'block'], io)).toBe(2);
    const reports = out.map((line) => reportSchema.parse(JSON.parse(line)));
    expect(reports.map((r) => [r.order, r.verdict, r.osmolarity.reported])).toEqual([['HELD-JSON', 'block', 1149.3], ['HELD-CSV', 'block', 1149.3]]);
    expect(err.join('\n')).toContain(MIXED_SUMMARY);
  });

  test('--json keeps stdout one valid JSON array of the printed orders (summary on stderr)', async () => {
    const { io, out, err } = memoryIo(mixedDay());
    await runCli(['check', 'day', '--policy', 'audit.json', '--json', '--only', 'warn,hold'], io);
    const reports = z.array(reportSchema).parse(JSON.parse(out.join('\n')));
    expect(reports.map((r) => `${r.order} ${r.verdict}`)).toEqual(['WARN-ND warn', 'HELD-JSON block', 'WARN-CSV warn', 'HELD-CSV block']);
    expect(err.join('\n')).toMatch(/^Summary: 7 orders checked, 3 not checked$/m);
  });

  test('--fail-on: exit 1 at the chosen verdict or worse, 0 below it; an invalid input is exit 2 whatever the verdicts', async () => {
    const files = {
      'ok.ndjson': `${JSON.stringify(demo('adult-central'))}\n${JSON.stringify(warnOrder('W-1'))}\n`,
      'held.json': JSON.stringify(heldOrder('H-1')),
      'bad.json': '{"id": "B"}',
      'audit.json': auditPolicy(),
    };
    const run = async (...args: string[]) => runCli(['check', ...args, '--policy', 'audit.json', '--ndjson'], memoryIo(files).io);
    expect(await run('ok.ndjson')).toBe(0);
    expect(await run('ok.ndjson', '--fail-on', 'block')).toBe(0);
    expect(await run('ok.ndjson', '--fail-on', 'warn')).toBe(1);
    expect(await run('ok.ndjson', 'held.json')).toBe(1);
    expect(await run('ok.ndjson', 'held.json', '--fail-on', 'warn')).toBe(1);
    expect(await run('ok.ndjson', 'held.json', 'bad.json')).toBe(2);
    expect(await run('ok.ndjson', '--only', 'block')).toBe(0);
  });

  test('options that make no sense are refused with exit 2 before any order is read', async () => {
    for (const args of [['--fail-on', 'pass'], ['--fail-on', 'sometimes'], ['--only', 'held,maybe'], ['--json', '--ndjson']]) {
      const { io, out, err } = memoryIo({ 'ok.json': read('data/demo/adult-central.json') });
      expect(await runCli(['check', 'ok.json', ...args], io)).toBe(2);
      expect(out).toEqual([]);
      expect(err[0]).toMatch(/^osmocount check: (--fail-on takes warn or block|--only takes pass, warn or block|choose one of --json and --ndjson)/);
    }
  });

  test('journey 7: the peripheral limit lowered to 850 mOsm/L holds the adult peripheral demo (897.0) that passed at 900', async () => {
    const month = [demo('adult-central'), demo('adult-peripheral'), demo('preterm-neonate'), warnOrder('W-1')].map((o) => JSON.stringify(o)).join('\n');
    const files = { 'month.ndjson': month, 'at900.json': auditPolicy(), 'at850.json': auditPolicy(850) };
    const held = async (policy: string) => {
      const { io, out } = memoryIo(files);
      await runCli(['check', 'month.ndjson', '--policy', policy, '--ndjson', '--only', 'block'], io);
      return out.map((line) => reportSchema.parse(JSON.parse(line))).map((r) => [r.order, r.osmolarity.reported, r.osmolarity.peripheralLimit]);
    };
    expect(await held('at900.json')).toEqual([]);
    expect(await held('at850.json')).toEqual([['MPH-2026-0412', 897, 850]]);
  });

  test('NDJSON and CSV go through the stream, never read whole', async () => {
    const { io, out } = memoryIo(
      { 'a.ndjson': `${JSON.stringify(warnOrder('W-ND'))}\n`, 'b.csv': csvOf([warnOrder('W-CSV')]), 'audit.json': auditPolicy() },
      { streamOnly: /\.(ndjson|csv)$/, chunkBytes: 16 },
    );
    expect(await runCli(['check', 'a.ndjson', 'b.csv', '--policy', 'audit.json', '--ndjson'], io)).toBe(0);
    expect(out.map((l) => (JSON.parse(l) as { order: string }).order)).toEqual(['W-ND', 'W-CSV']);
  });

  test('paths: a missing one and a directory without order files are invalid; a file named twice is read once; other Osmocount files are named', async () => {
    const { io, out, err } = memoryIo({ 'd/notes.txt': 'x', 'c.json': read('data/demo/adult-central.json'), 'cat.json': read('data/catalog.json') });
    expect(await runCli(['check', 'gone.ndjson', 'd', 'c.json', 'c.json', 'cat.json', '--ndjson'], io)).toBe(2);
    expect(err.slice(0, 3)).toEqual([
      'gone.ndjson: (file): cannot be read (ENOENT)',
      'd: (directory): holds no order files (*.json, *.ndjson, *.jsonl, *.csv)',
      'cat.json: format: is "osmocount-catalog", not an order (a catalog is given with --catalog, a policy with --policy)',
    ]);
    expect(out).toHaveLength(1);
  });
});

describe('the progress line', () => {
  const WIPE = '\r\x1b[K';
  const files = () => ({ 'big.ndjson': Array.from({ length: 40 }, (_, i) => JSON.stringify(warnOrder(`W-${i}`))).join('\n'), 'bad.json': '[1]', 'audit.json': auditPolicy() });

  test('on a terminal, a long run shows orders, rate, share read and time left, and the line is wiped before other terminal output', async () => {
    for (const stdoutIsTerminal of [false, true]) {
      let t = 0;
      // Each clock reading moves time on 100 ms: the run "takes" several seconds.
      const term = memoryIo(files(), { clock: () => (t += 100), chunkBytes: 512, stdoutIsTerminal });
      expect(await runCli(['check', 'big.ndjson', 'bad.json', '--policy', 'audit.json', '--ndjson'], term.io)).toBe(2);
      const drawn = term.progress.filter((p) => p !== WIPE);
      expect(drawn.length).toBeGreaterThan(1);
      expect(drawn.every((p) => p.startsWith(WIPE) && /^\d+ orders checked · [\d,]+ orders\/s · \d+% read · about \d+:\d\d left$/.test(p.slice(WIPE.length)))).toBe(true);
      // Whatever reaches the terminal (stderr, and stdout when it is one) finds the progress line wiped.
      let showing = false;
      for (const entry of term.log) {
        if (entry.to === 'progress') showing = entry.text !== WIPE;
        else if (entry.to === 'err' || stdoutIsTerminal) expect(showing, entry.text).toBe(false);
      }
      expect(term.err.join('\n')).toMatch(/^Summary: 40 orders checked in \d+\.\d s, 1 not checked$/m);
    }
  });

  test('quiet when stderr is not a terminal', async () => {
    const pipe = memoryIo(files());
    await runCli(['check', 'big.ndjson', '--policy', 'audit.json', '--ndjson'], pipe.io);
    expect(pipe.progress).toEqual([]);
    expect(pipe.err.join('\n')).toMatch(/^Summary: 40 orders checked$/m);
  });
});
