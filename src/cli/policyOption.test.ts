import { describe, expect, it } from 'vitest';
import adultPeripheral from '../../data/demo/adult-peripheral.json';
import policyFile from '../../data/policy.json';
import { runCli, EXIT, type CliIo } from './run.ts';
import type { Report } from '../core/report.ts';

function memoryIo(files: Record<string, string>) {
  const out: string[] = [];
  const err: string[] = [];
  const io: CliIo = {
    readFile: async (path) => {
      const text = files[path];
      if (text === undefined) throw Object.assign(new Error('not found'), { code: 'ENOENT' });
      return text;
    },
    stdout: (t) => out.push(t),
    stderr: (t) => err.push(t),
  };
  return { io, out, err };
}

function policyWithPeripheralLimit(max: number, source: string): string {
  const p = structuredClone(policyFile) as typeof policyFile;
  p.rules['osmolarity-peripheral'].all = { ...p.rules['osmolarity-peripheral'].all, max, source };
  p.rules['osmolarity-peripheral'].child = { ...p.rules['osmolarity-peripheral'].child, max, source };
  return JSON.stringify(p);
}

// The adult peripheral demo reports 897.0 mOsm/L (label sum of its stocks' labelled osmolarities).
const files = {
  'order.json': JSON.stringify(adultPeripheral),
  // ESPEN CVC guideline (Pittiruti 2009): < 850 mOsm/L for peripheral PN (the figure from memory).
  'strict.json': policyWithPeripheralLimit(850, 'ESPEN 2009 (Pittiruti et al.): < 850 mOsm/L peripherally (from memory)'),
};

describe('osmocount check --policy', () => {
  it('with the shipped policy the demo passes the peripheral screen (897.0 ≤ 900, ASPEN 2014) and warns', async () => {
    const { io, out } = memoryIo(files);
    expect(await runCli(['check', 'order.json', '--json'], io)).toBe(EXIT.ok);
    const report = JSON.parse(out.join('\n')) as Report;
    expect(report.verdict).toBe('warn');
    expect(report.findings.some((f) => f.code === 'osmolarity-peripheral')).toBe(false);
  });

  it('a stricter peripheral limit (850) changes the verdict to hold, and proposes a volume', async () => {
    const { io, out } = memoryIo(files);
    expect(await runCli(['check', 'order.json', '--policy', 'strict.json', '--json'], io)).toBe(EXIT.block);
    const report = JSON.parse(out.join('\n')) as Report;
    expect(report.verdict).toBe('block');
    const f = report.findings.find((x) => x.code === 'osmolarity-peripheral');
    expect(f?.limit).toBe(850);
    expect(f?.source).toContain('ESPEN 2009');
    // 897.0 mOsm/L × 2 L = 1794 mOsm; ÷ 0.85 = 2110.6 mL → 2120 mL at the 10 mL step.
    expect(report.suggestions?.[0]).toMatchObject({ kind: 'final-volume', status: 'proposal', change: { to: 2120 } });
  });

  it('an invalid policy exits 2, prints each problem as file: path: message, and checks no order', async () => {
    const bad = structuredClone(policyFile) as typeof policyFile;
    bad.doseRanges.K.adult.unit = 'mEq/L';
    const { io, out, err } = memoryIo({ ...files, 'bad.json': JSON.stringify(bad) });
    expect(await runCli(['check', 'order.json', '--policy', 'bad.json', '--json'], io)).toBe(EXIT.invalid);
    expect(out).toEqual([]);
    expect(err).toEqual([
      'bad.json: doseRanges.K.adult.unit: must be one of mmol/kg/day, mEq/kg/day, mmol/day, mEq/day',
      'The catalog or policy is invalid: no order was checked.',
    ]);
  });

  it('the human table shows the release-check findings with their sources', async () => {
    const { io, out } = memoryIo(files);
    await runCli(['check', 'order.json'], io);
    const text = out.join('\n');
    expect(text).toContain('WARN tna-stability (dextrose)');
    expect(text).toContain('source: ASPEN 2014');
    const strict = memoryIo(files);
    expect(await runCli(['check', 'order.json', '--policy', 'strict.json'], strict.io)).toBe(EXIT.block);
    expect(strict.out.join('\n')).toContain('PROPOSAL final-volume: Final volume 2120 mL');
  });
});
