import { describe, expect, test } from 'vitest';
import { addReport, newSummary, summaryText, TOP } from './summary.ts';
import type { Report } from '../core/report.ts';

type Finding = Report['findings'][number];

/** Only the report fields the summary reads. */
function report(order: string, route: 'peripheral' | 'central', reported: number, verdict: Report['verdict'], findings: Partial<Finding>[] = []): Report {
  return {
    order, route, verdict,
    osmolarity: { reported, peripheralLimit: 900 },
    findings: findings.map((f) => ({ code: 'gir', severity: 'info', ...f })),
  } as unknown as Report;
}

describe('summary', () => {
  test('the ten highest peripheral bags, highest first, equal figures in reading order; central bags never listed', () => {
    const s = newSummary();
    const figures = [700, 950.5, 880, 880, 1200, 640, 910, 880, 300, 1010, 820, 500];
    figures.forEach((x, i) => addReport(s, report(`P-${i}`, 'peripheral', x, x > 900 ? 'block' : 'pass'), `day.ndjson line ${i + 1}`));
    addReport(s, report('C-1', 'central', 2000, 'pass'), 'c.json');
    expect(s.highestPeripheral.map((b) => `${b.order} ${b.reported}`)).toEqual([
      'P-4 1200', 'P-9 1010', 'P-1 950.5', 'P-6 910', 'P-2 880', 'P-3 880', 'P-7 880', 'P-10 820', 'P-0 700', 'P-5 640',
    ]);
    expect(s.highestPeripheral).toHaveLength(TOP);
    expect(s.byVerdict).toEqual({ pass: 9, warn: 0, block: 4 });
  });

  test('findings that warn or hold are counted by code, with the nutrient when there is one; information is not counted', () => {
    const s = newSummary();
    addReport(s, report('A', 'central', 300, 'warn', [{ code: 'dose-range', nutrient: 'K', severity: 'warn' }, { code: 'dose-range', nutrient: 'Na', severity: 'info' }, { code: 'gir', severity: 'info' }]), 'a');
    addReport(s, report('B', 'central', 300, 'block', [{ code: 'dose-range', nutrient: 'K', severity: 'warn' }, { code: 'volume-overflow', severity: 'block' }]), 'b');
    s.invalid = 1;
    expect(summaryText(s)).toBe([
      'Summary: 2 orders checked, 1 not checked',
      '  PASS     0',
      '  WARN     1',
      '  HOLD     1',
      '  INVALID  1  (not checked: each problem is listed as file: where: path: message)',
      'Findings that warn or hold, by code',
      '  HOLD  volume-overflow  1',
      '  WARN  dose-range (K)   2',
      'Highest osmolarity on peripheral bags: no peripheral bag checked',
    ].join('\n'));
  });

  test('counts are written with thousands separators, and the time when known', () => {
    const s = newSummary();
    s.byVerdict.pass = 1234567;
    expect(summaryText(s, 61.25).split('\n').slice(0, 2)).toEqual(['Summary: 1,234,567 orders checked in 61.3 s', '  PASS     1,234,567']);
  });
});
