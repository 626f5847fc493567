import { describe, expect, test } from 'vitest';
import { readFileSync } from 'node:fs';
import { runCli } from './run.ts';
import { memoryIo } from '../../test/support/cliIo.ts';
import { reportSchema } from '../core/report.ts';
import { z } from 'zod';

const demo = (name: string) => readFileSync(new URL(`../../data/demo/${name}.json`, import.meta.url), 'utf8');


const heldOrder = JSON.stringify({
  id: 'HELD-1', patient: { id: 'P', weightKg: 68, ageGroup: 'adult' }, route: 'peripheral', volumeMl: 2000,
  lines: [{ product: 'dextrose-70', amount: 250, unit: 'g' }, { product: 'amino-acids-10', amount: 80, unit: 'g' }, { product: 'sterile-water', fill: true }],
});

describe('osmocount check', () => {
  test('exit 0 for passing orders, with a readable table and the caution', async () => {
    const { io, out } = memoryIo({ 'c.json': demo('adult-central') });
    expect(await runCli(['check', 'c.json'], io)).toBe(0);
    const text = out.join('\n');
    expect(text).toContain('Order MPH-2026-0413');
    expect(text).toMatch(/reported 1412\.5 mOsm\/L/);
    expect(text).toMatch(/checking aid. Local policy and the verifying pharmacist decide/);
  });

  test('exit 1 when any order is held', async () => {
    const { io, out } = memoryIo({ 'h.json': heldOrder, 'c.json': demo('adult-central') });
    expect(await runCli(['check', 'c.json', 'h.json'], io)).toBe(1);
    expect(out.join('\n')).toMatch(/HOLD osmolarity-peripheral/);
  });

  test('--json prints one report, or an array for several; each matches the report schema', async () => {
    const one = memoryIo({ 'c.json': demo('adult-central') });
    await runCli(['check', 'c.json', '--json'], one.io);
    expect(reportSchema.safeParse(JSON.parse(one.out.join(''))).success).toBe(true);
    const many = memoryIo({ 'a.json': demo('adult-peripheral'), 'n.json': demo('preterm-neonate') });
    await runCli(['check', 'a.json', 'n.json', '--json'], many.io);
    const parsed = z.array(reportSchema).safeParse(JSON.parse(many.out.join('')));
    expect(parsed.success).toBe(true);
    expect(parsed.data?.map((r) => r.order)).toEqual(['MPH-2026-0412', 'MPH-2026-0414']);
  });

  test('a batch with one invalid order: problems on stderr as file: where: path: message, valid ones still reported, exit 2', async () => {
    const batch = JSON.stringify([JSON.parse(demo('adult-central')), { ...JSON.parse(heldOrder), id: 'BAD', patient: { id: 'P', weightKg: 0, ageGroup: 'adult' } }, JSON.parse(heldOrder)]);
    const { io, out, err } = memoryIo({ 'batch.json': batch });
    expect(await runCli(['check', 'batch.json', '--json'], io)).toBe(2);
    expect(err).toContain('batch.json: [1]: patient.weightKg: must be a number ≥ 0.1 and ≤ 700');
    const reports = z.array(reportSchema).parse(JSON.parse(out.join('')));
    // The central demo warns on dose ranges (potassium 0.89 mmol/kg/day, phosphate 15 mmol/day under the shipped ranges).
    expect(reports.map((r) => [r.order, r.verdict])).toEqual([['MPH-2026-0413', 'warn'], ['HELD-1', 'block']]);
  });

  test('NDJSON: one order per line, bad lines named', async () => {
    const nd = `${JSON.stringify(JSON.parse(demo('adult-central')))}\n{not json\n${heldOrder}\n`;
    const { io, out, err } = memoryIo({ 'day.ndjson': nd });
    expect(await runCli(['check', 'day.ndjson', '--json'], io)).toBe(2);
    expect(err[0]).toMatch(/^day\.ndjson: line 2: \(line\): is not valid JSON/);
    expect(z.array(reportSchema).parse(JSON.parse(out.join(''))).length).toBe(2);
  });

  test('a missing file, an unknown command, no file, a bad option → exit 2 with a message', async () => {
    const a = memoryIo({});
    expect(await runCli(['check', 'nope.json'], a.io)).toBe(2);
    expect(a.err[0]).toBe('nope.json: (file): cannot be read (ENOENT)');
    const b = memoryIo({});
    expect(await runCli(['verify'], b.io)).toBe(2);
    expect(b.err[0]).toMatch(/unknown command "verify"/);
    const c = memoryIo({});
    expect(await runCli(['check'], c.io)).toBe(2);
    const d = memoryIo({ 'c.json': demo('adult-central') });
    expect(await runCli(['check', 'c.json', '--colour'], d.io)).toBe(2);
  });

  test('an invalid catalog is rejected whole and no order is checked', async () => {
    const { io, out, err } = memoryIo({ 'c.json': demo('adult-central'), 'cat.json': JSON.stringify({ format: 'osmocount-catalog', version: 1, products: [{ id: 'x', name: 'X', role: 'electrolyte', perMl: { Na: -1 } }] }) });
    expect(await runCli(['check', 'c.json', '--catalog', 'cat.json'], io)).toBe(2);
    expect(err[0]).toBe('cat.json: products[0].perMl.Na: must be a number ≥ 0 and ≤ 100');
    expect(out).toEqual([]);
  });

  test('a catalog that lacks a product used by the order makes that order invalid', async () => {
    const cat = JSON.stringify({ format: 'osmocount-catalog', version: 1, products: [{ id: 'sterile-water', name: 'Water', role: 'water', mOsmPerMl: 0 }] });
    const { io, err } = memoryIo({ 'c.json': demo('adult-central'), 'cat.json': cat });
    expect(await runCli(['check', 'c.json', '--catalog', 'cat.json'], io)).toBe(2);
    expect(err[0]).toBe('c.json: lines[0].product: unknown product "amino-acids-15" (not in the catalog)');
  });
});
