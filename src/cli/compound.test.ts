import { describe, expect, it } from 'vitest';
import { runCli } from './run.ts';
import { memoryIo } from '../../test/support/cliIo.ts';
import { compoundReportSchema } from '../core/compound/compoundReport.ts';
import { reportSchema } from '../core/report.ts';
import adultIons from '../../data/demo/adult-ions.json';
import adultCentral from '../../data/demo/adult-central.json';

const demo = JSON.stringify(adultIons);


const infeasible = JSON.stringify({
  id: 'T-CLI-INF', patient: { id: 'P', weightKg: 70, ageGroup: 'adult' }, route: 'central', volumeMl: 2000,
  lines: [{ product: 'sterile-water', fill: true }],
  ions: { per: 'day', Na: 20, K: 80, phosphate: 20, phosphateSalt: 'sodium' },
});

describe('osmocount compound', () => {
  it('--json prints the exchange-format shape: order, lines, ordered, delivered, problems (+ sequence, rounding)', async () => {
    const { io, out, err } = memoryIo({ 'ions.json': demo });
    expect(await runCli(['compound', 'ions.json', '--json'], io)).toBe(0);
    expect(err).toEqual([]);
    const json: unknown = JSON.parse(out.join('\n'));
    const parsed = compoundReportSchema.safeParse(json);
    expect(parsed.success).toBe(true);
    if (!parsed.success) return;
    const r = parsed.data;
    expect(Object.keys(r)).toEqual(expect.arrayContaining(['order', 'lines', 'ordered', 'delivered', 'problems', 'sequence', 'rounding']));
    expect(r.order).toBe('MPH-2026-0415');
    // Journey 4 order: Na 100, K 80, Ca 10, Mg 12 mEq, phosphate 20 mmol; chloride/acetate by preference.
    expect(r.ordered).toEqual({ Na: 100, K: 80, Ca: 10, Mg: 12, phosphate: 20, Cl: 0, acetate: 0 });
    expect(r.unordered).toEqual(['Cl', 'acetate']);
    // As in the format's example line: potassium phosphates 20 mmol, 6.7 mL measured (20 ÷ 3 = 6.667).
    expect(r.lines[0]).toMatchObject({ product: 'potassium-phosphates-3', amount: 20, unit: 'mmol', species: 'phosphate', volumeMl: 6.7 });
    expect(r.delivered.phosphate).toBe(20.1);
    expect(r.problems).toEqual([]);
    expect(r.rounding[0]?.doses.find((d) => d.ion === 'phosphate')).toEqual({ ion: 'phosphate', unit: 'mmol', exact: 20, measured: 20.1, change: 0.1 });
    expect(r.sequence.map((s) => s.groups[0])).toEqual(['dextrose', 'phosphate', 'sodium-potassium', 'additives', 'calcium']);
  });

  it('prints lines, the delivered-vs-ordered table and the mixing sequence as text', async () => {
    const { io, out } = memoryIo({ 'ions.json': demo });
    expect(await runCli(['compound', 'ions.json'], io)).toBe(0);
    const text = out.join('\n');
    expect(text).toContain('Lines added (volumes rounded to measurable increments)');
    expect(text).toMatch(/Potassium phosphates injection .* 20\.00 mmol phosphate .* 6\.667 +6\.70/);
    expect(text).toMatch(/phosphate \(mmol\) +20\.00 +20\.10 +\+0\.10/);
    expect(text).toContain('Mixing sequence');
    expect(text).toContain('FDA Safety Alert 1994');
    expect(text).toContain('pharmacist decide');
  });

  it('exits 1 and prints the problem with its proposal when the order cannot be met', async () => {
    const { io, out } = memoryIo({ 'bad.json': infeasible });
    expect(await runCli(['compound', 'bad.json', '--json'], io)).toBe(1);
    const r = compoundReportSchema.parse(JSON.parse(out.join('\n')));
    expect(r.feasible).toBe(false);
    expect(r.problems[0]?.code).toBe('phosphate-cation-exceeds-order');
    expect(r.problems[0]?.proposal?.change).toEqual({ phosphateSalt: 'potassium' });
    expect(r.proposal?.phosphateSalt).toBe('potassium');
  });

  it('exits 2 for an order without an ions block, with a path: message problem', async () => {
    const { io, err } = memoryIo({ 'salts.json': JSON.stringify(adultCentral) });
    expect(await runCli(['compound', 'salts.json'], io)).toBe(2);
    expect(err[0]).toMatch(/^salts\.json: ions: is required/);
  });
});

describe('osmocount check on an ion order', () => {
  it('allocates, then checks the bag', async () => {
    const { io, out } = memoryIo({ 'ions.json': demo, 'bad.json': infeasible });
    expect(await runCli(['check', 'ions.json', '--json'], io)).toBe(0);
    const report = reportSchema.parse(JSON.parse(out.join('\n')));
    expect(report.lines.filter((l) => l.role === 'electrolyte').length).toBe(7);
    expect(report.findings.some((f) => f.code === 'ion-order')).toBe(true);
    const bad = memoryIo({ 'bad.json': infeasible });
    expect(await runCli(['check', 'bad.json'], bad.io)).toBe(1);
    expect(bad.out.join('\n')).toContain('HOLD ion-order');
  });
});
