import { describe, expect, it } from 'vitest';
import { D } from '../decimal.ts';
import { DEFAULT_POLICY } from '../../defaults.ts';
import { ceilToStep, crossings, floorToStep, methodsOf } from './threshold.ts';
import { bagOf, policyWith } from '../../../test/helpers/orders.ts';

describe('rounding to a step', () => {
  it.each([['2554', '10', '2560'], ['2560', '10', '2560'], ['2560.0000000000001', '10', '2560'], ['2550.1', '10', '2560'], ['96.2', '1', '97']])('ceil %s to %s → %s', (x, s, out) => {
    expect(ceilToStep(new D(x), new D(s)).toString()).toBe(out);
  });
  it.each([['151.2', '5', '150'], ['150', '5', '150'], ['0.35', '0.1', '0.3'], ['149.99999999999999', '5', '150']])('floor %s to %s → %s', (x, s, out) => {
    expect(floorToStep(new D(x), new D(s)).toString()).toBe(out);
  });
});

describe('crossings', () => {
  it('finds where osmolarity meets the limit as the water fill grows: 1000 mOsm in V mL meets 900 at 1111.1 mL', () => {
    // Dextrose 10% 1000 mL: label 505 mOsm/L (505 mOsm); with 495 mL more water the same 505 mOsm.
    // Use dextrose 50%: 200 mL × 2.523 = 504.6 mOsm label, particle 200 × 0.5 × 5.046 = 504.6.
    const at = (v: number) => bagOf({ age: 'adult', route: 'peripheral', weightKg: 70, volumeMl: v, lines: [
      { product: 'dextrose-50', amount: 200, unit: 'mL' }, { product: 'sterile-water', fill: true },
    ] });
    const found = crossings(DEFAULT_POLICY, new D(900), new D(400), at(400), new D(1400), at(1400));
    expect(found?.map((c) => c.method)).toEqual(['particle', 'labelSum']);
    // 504.6 mOsm ÷ 900 mOsm/L = 560.667 mL for both methods; osmolarity falls as volume rises.
    expect(found?.every((c) => c.falling && c.x.toDecimalPlaces(3).toNumber() === 560.667)).toBe(true);
  });

  it('reads only the method the policy reports', () => {
    expect(methodsOf(DEFAULT_POLICY)).toEqual(['particle', 'labelSum']);
    expect(methodsOf(policyWith((p) => { p.reportedOsmolarity = 'labelSum'; }))).toEqual(['labelSum']);
  });
});
