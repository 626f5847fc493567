// The command-line tool as installed: `npx osmocount` runs the bin that npm install linked and built.
import { execFile } from 'node:child_process';
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
];
