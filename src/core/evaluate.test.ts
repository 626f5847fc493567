import { describe, expect, it } from 'vitest';
import { checkOrder } from './evaluate.ts';
import { DEFAULT_CATALOG, DEFAULT_POLICY, DEMO_ORDERS } from '../defaults.ts';

describe('checkOrder options', () => {
  it('suggestions: false skips the solver and changes nothing else', () => {
    // Journey 2: the adult peripheral demo with dextrose 250 g is over the 900 mOsm/L peripheral limit (ASPEN 2014).
    const file = structuredClone(DEMO_ORDERS.find((d) => d.key === 'adult-peripheral')?.file) as { lines: { amount?: unknown }[] };
    file.lines[1]!.amount = 250;
    const full = checkOrder(file, DEFAULT_CATALOG, DEFAULT_POLICY);
    const quick = checkOrder(file, DEFAULT_CATALOG, DEFAULT_POLICY, { suggestions: false });
    if (!full.ok || !quick.ok) throw new Error('demo did not check');
    expect(full.value.report.suggestions?.map((s) => s.kind)).toContain('final-volume');
    expect(quick.value.report.suggestions ?? []).toEqual([]);
    const { suggestions: _a, ...fullRest } = full.value.report;
    const { suggestions: _b, ...quickRest } = quick.value.report;
    expect(quickRest).toEqual(fullRest);
  });
});
