import { describe, expect, test } from 'vitest';
import { readFileSync } from 'node:fs';
import { runCli, type CliIo } from './run.ts';
import { fileNameFor } from './print.ts';

const demo = (name: string) => readFileSync(new URL(`../../data/demo/${name}.json`, import.meta.url), 'utf8');

function memoryIo(files: Record<string, string>, canWrite = true) {
  const out: string[] = [];
  const err: string[] = [];
  const written = new Map<string, string>();
  const io: CliIo = {
    readFile: async (path) => {
      const text = files[path];
      if (text === undefined) throw Object.assign(new Error('no such file'), { code: 'ENOENT' });
      return text;
    },
    stdout: (t) => out.push(t),
    stderr: (t) => err.push(t),
    wallClock: () => new Date('2026-12-02T13:05:00Z'),
  };
  if (canWrite) io.writeFile = async (path, text) => { written.set(path, text); };
  return { io, out, err, written };
}

const base = ['--out', 'out', '--compounded', '2026-12-02T14:30Z', '--time-zone', 'UTC', '--institution', 'Marren Point Hospital'];

describe('osmocount print', () => {
  test('writes one sheet and one label per order, named by order id; exit 0', async () => {
    const { io, out, written } = memoryIo({ 'a.json': demo('adult-peripheral'), 'n.json': demo('preterm-neonate') });
    expect(await runCli(['print', 'a.json', 'n.json', '--sheet', '--label', ...base], io)).toBe(0);
    expect([...written.keys()]).toEqual(['out/MPH-2026-0412.sheet.html', 'out/MPH-2026-0412.label.html', 'out/MPH-2026-0414.sheet.html', 'out/MPH-2026-0414.label.html']);
    expect(out).toContain('wrote out/MPH-2026-0412.label.html');
    const label = written.get('out/MPH-2026-0412.label.html') ?? '';
    expect(label).toContain('Marren Point Hospital');
    // USP <797> (2008): 30 h at room temperature from 2 Dec 14:30 → 3 Dec 20:30.
    expect(label).toContain('03 Dec 2026 20:30');
    expect(label).toContain('1.2 µm');
    expect(written.get('out/MPH-2026-0414.sheet.html')).toContain('printed 02 Dec 2026 13:05');
    expect(written.get('out/MPH-2026-0414.sheet.html')).toContain('Suggested mixing sequence'); // from the policy's compounding section
  });

  test('--paper, --label-size and a wall-clock --compounded in --time-zone', async () => {
    const { io, written } = memoryIo({ 'c.json': demo('adult-central') });
    const args = ['print', 'c.json', '--sheet', '--label', '--out', 'o', '--paper', 'letter', '--label-size', '4x4', '--compounded', '2026-12-02T09:30', '--time-zone', 'America/New_York'];
    expect(await runCli(args, io)).toBe(0);
    expect(written.get('o/MPH-2026-0413.sheet.html')).toContain('pr-paper-letter');
    const label = written.get('o/MPH-2026-0413.label.html') ?? '';
    expect(label).toContain('pr-size-4x4');
    expect(label).toContain('02 Dec 2026 09:30'); // compounded, New York time
    expect(label).toContain('03 Dec 2026 15:30'); // + 30 h
    expect(label).toContain('CENTRAL LINE ONLY');
    expect(label).toContain('(institution not set)');
  });

  test('a held order is printed with its hold banner; exit 1', async () => {
    const held = JSON.parse(demo('adult-peripheral')) as { lines: { product: string; amount?: number }[] };
    for (const l of held.lines) if (l.product === 'dextrose-70') l.amount = 250;
    const { io, out, written } = memoryIo({ 'h.json': JSON.stringify(held) });
    expect(await runCli(['print', 'h.json', '--label', ...base], io)).toBe(1);
    expect(written.get('out/MPH-2026-0412.label.html')).toContain('ON HOLD');
    expect(out.join('\n')).toMatch(/order on HOLD/);
  });

  test('invalid orders are reported like check (file: where: path: message), valid ones still printed; exit 2', async () => {
    const batch = JSON.stringify([JSON.parse(demo('adult-central')), { id: 'BAD', patient: { id: 'P', weightKg: 0, ageGroup: 'adult' }, route: 'central', lines: [] }]);
    const { io, err, written } = memoryIo({ 'b.json': batch });
    expect(await runCli(['print', 'b.json', '--sheet', ...base], io)).toBe(2);
    expect(err).toContain('b.json: [1]: patient.weightKg: must be a number ≥ 0.1 and ≤ 700');
    expect([...written.keys()]).toEqual(['out/MPH-2026-0413.sheet.html']);
  });

  test('bad options are listed with their names, nothing is written; exit 2', async () => {
    const { io, err, written } = memoryIo({ 'c.json': demo('adult-central') });
    const code = await runCli(['print', 'c.json', '--paper', 'a5', '--label-size', '2x9', '--compounded', '2026-02-30T10:00', '--time-zone', 'UTC'], io);
    expect(code).toBe(2);
    const text = err.join('\n');
    expect(text).toContain('osmocount print: --sheet/--label: choose what to print: --sheet, --label, or both');
    expect(text).toContain('osmocount print: --out: is required');
    expect(text).toContain('osmocount print: --paper: must be one of a4, letter (got "a5")');
    expect(text).toContain('osmocount print: --label-size: must be 4x6, 4x4, or a custom size');
    expect(text).toContain('osmocount print: --compounded: is not a real date and time (got "2026-02-30T10:00")');
    expect(written.size).toBe(0);
  });

  test('an unknown option, an unreadable file, a missing writer and a bad policy exit 2 without a throw', async () => {
    const a = memoryIo({});
    expect(await runCli(['print', 'x.json', '--sheet', '--bogus'], a.io)).toBe(2);
    expect(a.err.join('\n')).toMatch(/osmocount print: Unknown option '--bogus'/);
    const b = memoryIo({});
    expect(await runCli(['print', 'missing.json', '--sheet', ...base], b.io)).toBe(2);
    expect(b.err).toContain('missing.json: (file): cannot be read (ENOENT)');
    const c = memoryIo({ 'c.json': demo('adult-central') }, false);
    expect(await runCli(['print', 'c.json', '--sheet', ...base], c.io)).toBe(2);
    expect(c.err).toContain('osmocount print: this environment cannot write files');
    const d = memoryIo({ 'c.json': demo('adult-central'), 'p.json': '{"format":"osmocount-policy"}' });
    expect(await runCli(['print', 'c.json', '--sheet', '--policy', 'p.json', ...base], d.io)).toBe(2);
    expect(d.written.size).toBe(0);
  });

  test('a write that fails is reported and exits 2', async () => {
    const { io, err } = memoryIo({ 'c.json': demo('adult-central') });
    io.writeFile = async () => { throw Object.assign(new Error('denied'), { code: 'EACCES' }); };
    expect(await runCli(['print', 'c.json', '--label', ...base], io)).toBe(2);
    expect(err).toContain('out/MPH-2026-0413.label.html: (file): cannot be written (EACCES)');
  });
});

describe('fileNameFor', () => {
  test('keeps safe characters, replaces the rest, never empty, hidden or a path', () => {
    expect(fileNameFor('MPH-2026-0413')).toBe('MPH-2026-0413');
    expect(fileNameFor('../../etc/passwd')).toBe('etc_passwd');
    expect(fileNameFor('a b/c\\d:e<&>')).toBe('a_b_c_d_e_');
    expect(fileNameFor('...')).toBe('order');
    expect(fileNameFor('Ünïcode')).toBe('Unicode');
  });

  test('two orders with the same id get distinct files', async () => {
    const order = demo('adult-central');
    const { io, written } = memoryIo({ 'a.json': order, 'b.json': order });
    await runCli(['print', 'a.json', 'b.json', '--sheet', ...base], io);
    expect([...written.keys()]).toEqual(['out/MPH-2026-0413.sheet.html', 'out/MPH-2026-0413-2.sheet.html']);
  });
});
