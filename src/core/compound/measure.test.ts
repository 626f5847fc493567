import { describe, expect, it } from 'vitest';
import { DEFAULT_POLICY } from '../../defaults.ts';
import { D } from '../decimal.ts';
import { incrementFor, measurableVolume } from './measure.ts';

// The shipped policy's increments: 0.1 mL at or above 1 mL, 0.01 mL below (common practice:
// syringe graduations), nearest increment with halves up.
const increments = DEFAULT_POLICY.compounding?.volumeIncrements;
if (!increments) throw new Error('the shipped policy has a compounding section');
const measure = (ml: string): string => measurableVolume(new D(ml), increments).toString();

describe('measurableVolume', () => {
  it('rounds at or above 1 mL to 0.1 mL', () => {
    // 20 mmol P ÷ 3 mmol/mL = 6.6667 mL → 6.7 mL (exchange format example: volumeMl 6.7).
    expect(measure(new D(20).div(3).toString())).toBe('6.7');
    expect(measure('1')).toBe('1');
    expect(measure('21.505376')).toBe('21.5');
    expect(measure('7.25')).toBe('7.3');
    expect(measure('11.625')).toBe('11.6');
  });

  it('rounds below 1 mL to 0.01 mL', () => {
    // 0.6 mEq Mg ÷ 4.06 mEq/mL = 0.1478 mL → 0.15 mL.
    expect(measure('0.1477832')).toBe('0.15');
    expect(measure('0.3525')).toBe('0.35');
    expect(measure('0.995')).toBe('1');
    expect(measure('0.004')).toBe('0');
  });

  it('picks the increment from the volume before rounding', () => {
    expect(incrementFor(new D('0.999'), increments)?.toString()).toBe('0.01');
    expect(incrementFor(new D('1'), increments)?.toString()).toBe('0.1');
    expect(incrementFor(new D('250'), increments)?.toString()).toBe('0.1');
  });
});
