// The command-line tool as installed: `npx osmocount` runs the bin that npm install linked and built.
import { execFile } from 'node:child_process';
import { mkdtemp, mkdir, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { ok, equal } from './assert.mjs';

const run = promisify(execFile);

async function osmocount(args) {
  try {
    const { stdout, stderr } = await run('npx', ['--no-install', 'osmocount', ...args], { encoding: 'utf8' });
    return { code: 0, stdout, stderr };
  } catch (e) {
    return { code: e.code, stdout: e.stdout, stderr: e.stderr };
  }
}

export const tests = [
  ['npx osmocount check data/demo/*.json --json prints one report per order', async () => {
    const r = await osmocount(['check', 'data/demo/adult-peripheral.json', 'data/demo/adult-central.json', 'data/demo/preterm-neonate.json', '--json']);
    equal(r.code, 0, 'exit code');
    const reports = JSON.parse(r.stdout);
    equal(reports.length, 3, 'reports');
    ok(reports.every((x) => x.format === 'osmocount-report' && typeof x.osmolarity.reported === 'number'), 'report shape');
  }],
  ['an invalid file exits 2 with file: path: message on stderr', async () => {
    const r = await osmocount(['check', 'package.json']);
    equal(r.code, 2, 'exit code');
    ok(/^package\.json: id: is required/m.test(r.stderr), `stderr names the path: ${r.stderr}`);
  }],
  ['a directory with NDJSON and CSV: held orders as NDJSON on stdout, the summary on stderr, exit 1', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'osmocount-e2e-'));
    try {
      const demos = await Promise.all(['adult-peripheral', 'adult-central', 'preterm-neonate'].map(async (n) => JSON.parse(await readFile(`data/demo/${n}.json`, 'utf8'))));
      await mkdir(join(dir, 'csv'));
      await writeFile(join(dir, 'day.ndjson'), demos.map((o) => JSON.stringify(o)).join('\n'));
      // The adult peripheral demo with dextrose 250 g (user journey 2): about 1,150 mOsm/L on a peripheral line.
      const rows = demos[0].lines.map((l) => ['HELD-CSV', 'MRN-448210', 68, 'adult', 'peripheral', 2000, l.product, l.product === 'dextrose-70' ? 250 : l.amount ?? '', l.unit ?? '', l.species ?? '', l.fill ? 'true' : ''].join(','));
      await writeFile(join(dir, 'csv', 'day.csv'), `\uFEFForder_id,patient_id,weight_kg,age_group,route,volume_ml,product,amount,unit,species,fill\r\n${rows.join('\r\n')}\r\n`);
      const r = await osmocount(['check', dir, '--ndjson', '--only', 'block']);
      equal(r.code, 1, 'exit code');
      const held = r.stdout.trim().split('\n').map((l) => JSON.parse(l));
      ok(held.some((x) => x.order === 'HELD-CSV' && x.verdict === 'block' && x.osmolarity.reported > 900), `held orders: ${r.stdout}`);
      ok(held.every((x) => x.verdict === 'block'), 'only held orders printed');
      ok(/^Summary: 4 orders checked in [\d.]+ s$/m.test(r.stderr), `summary on stderr: ${r.stderr}`);
      ok(r.stderr.includes('HOLD  osmolarity-peripheral'), 'findings by code');
    } finally {
      await rm(dir, { recursive: true, force: true });
    }
  }],
];
