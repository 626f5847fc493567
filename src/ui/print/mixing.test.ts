import { describe, expect, test } from 'vitest';
import { sheetSequence } from './mixing.ts';
import { sheetModel } from './sheetModel.ts';
import { sheetText } from './text.ts';
import { checkOrder } from '../../core/evaluate.ts';
import { DEFAULT_CATALOG, DEFAULT_POLICY, DEMO_ORDERS } from '../../defaults.ts';
import { printOptions } from '../../../test/support/printFixtures.ts';

// The shipped policy's addition order: base solutions and water first, phosphate early, calcium
// late with mixing before it, lipid last (FDA Safety Alert 1994 as summarised by Thibault; ASPEN
// Safe Practices 2004, from memory).

function central() {
  const r = checkOrder(DEMO_ORDERS.find((d) => d.key === 'adult-central')?.file, DEFAULT_CATALOG, DEFAULT_POLICY);
  if (!r.ok) throw new Error('demo');
  return r.value;
}

describe('sheetSequence', () => {
  test('phosphate before calcium, calcium after mixing; every line once', () => {
    const ev = central();
    const steps = sheetSequence(ev.order.lines, DEFAULT_POLICY) ?? [];
    const stepOf = (name: string) => steps.findIndex((s) => s.lines.some((l) => l.name.startsWith(name)));
    expect(stepOf('Dextrose')).toBe(0);
    expect(stepOf('Sterile water')).toBe(0);
    expect(stepOf('Potassium phosphates')).toBeLessThan(stepOf('Calcium gluconate'));
    expect(steps[stepOf('Calcium gluconate') - 1]?.mixAfter).toBe(true);
    expect(steps.flatMap((s) => s.lines).length).toBe(ev.order.lines.length);
  });

  test('none without a compounding section in the policy', () => {
    expect(sheetSequence(central().order.lines, { ...DEFAULT_POLICY, compounding: null })).toBeUndefined();
  });

  test('the sheet prints it with each step’s reason and source', () => {
    const ev = central();
    const sequence = sheetSequence(ev.order.lines, DEFAULT_POLICY) ?? [];
    const t = sheetText(sheetModel(ev.report, printOptions({ sequence })));
    expect(t).toMatch(/Suggested mixing sequence\n1\. .*Dextrose 70% injection \(line 2\).*\(source: FDA Safety Alert 1994/);
    expect(t).toMatch(/\. Calcium gluconate 10% injection \(0\.465 mEq Ca per mL\) \(line 7\)\. Mix well before the next step\./);
  });
});
