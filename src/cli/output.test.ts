import { describe, expect, test } from 'vitest';
import { readFileSync } from 'node:fs';
import { jsonWriter, ndjsonWriter } from './output.ts';
import { checkOrder } from '../core/evaluate.ts';
import type { Report } from '../core/report.ts';
import { DEFAULT_CATALOG, DEFAULT_POLICY } from '../defaults.ts';

const reports: Report[] = ['adult-peripheral', 'adult-central', 'preterm-neonate'].map((name) => {
  const r = checkOrder(JSON.parse(readFileSync(new URL(`../../data/demo/${name}.json`, import.meta.url), 'utf8')), DEFAULT_CATALOG, DEFAULT_POLICY);
  if (!r.ok) throw new Error(`demo ${name} is invalid`);
  return r.value.report;
});

/** What the writer prints, as the terminal shows it (each call is one line). */
function written(make: typeof jsonWriter, list: Report[]): string {
  const lines: string[] = [];
  const w = make((t) => lines.push(t));
  list.forEach((r) => w.write(r));
  w.end();
  return lines.join('\n');
}

describe('report writers', () => {
  test('--json streamed gives exactly what JSON.stringify(…, null, 2) gives: [] for none, the object for one, the array for several', () => {
    expect(written(jsonWriter, [])).toBe(JSON.stringify([], null, 2));
    expect(written(jsonWriter, reports.slice(0, 1))).toBe(JSON.stringify(reports[0], null, 2));
    expect(written(jsonWriter, reports.slice(0, 2))).toBe(JSON.stringify(reports.slice(0, 2), null, 2));
    expect(written(jsonWriter, reports)).toBe(JSON.stringify(reports, null, 2));
  });

  test('--ndjson: one compact report per line', () => {
    const text = written(ndjsonWriter, reports);
    expect(text.split('\n').map((l) => JSON.parse(l))).toEqual(reports);
    expect(text.split('\n')).toHaveLength(3);
  });
});
