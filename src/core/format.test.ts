import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { D, round } from './decimal.ts';
import { fmt, fmtScaled, fmtTrim } from './format.ts';

describe('fmt and fmtTrim', () => {
  it('round half to even (IEEE 754 roundTiesToEven): 2.345 → 2.34, 2.355 → 2.36, 0.5 → 0, 1.5 → 2', () => {
    expect(fmt(new D('2.345'), 2)).toBe('2.34');
    expect(fmt(new D('2.355'), 2)).toBe('2.36');
    expect(fmt(new D('0.5'), 0)).toBe('0');
    expect(fmt(new D('1.5'), 0)).toBe('2');
    expect(fmtTrim(new D('2.3450'), 2)).toBe('2.34');
  });

  it('never shows a negative zero', () => {
    expect(fmt(new D('-0.001'), 2)).toBe('0.00');
    expect(fmtTrim(new D('-0.0004'), 3)).toBe('0');
  });

  it('refuses a non-finite value, as the report does', () => {
    expect(() => fmt(new D(Infinity), 1)).toThrow();
    expect(() => fmtTrim(new D(NaN), 1)).toThrow();
  });

  it('shows exactly the number the report holds, at any size (law)', () => {
    const decimalText = fc.tuple(fc.boolean(), fc.stringMatching(/^[1-9][0-9]{0,29}$/), fc.integer({ min: -25, max: 25 }))
      .map(([negative, digits, exponent]) => `${negative ? '-' : ''}${digits}e${exponent}`);
    fc.assert(fc.property(decimalText, fc.integer({ min: 0, max: 4 }), (text, places) => {
      const value = new D(text);
      const reported = round(value, places);
      expect(fmt(value, places)).toBe(new D(reported).toFixed(places));
      expect(fmtTrim(value, places)).toBe(new D(reported).toString());
    }), { numRuns: 2000 });
    // Engine results (15 digits), ties at the last shown place among them.
    const result = fc.tuple(fc.boolean(), fc.integer({ min: 0, max: 999_999_999_999 }), fc.constantFrom('', '5', '50', '500'), fc.integer({ min: -16, max: 2 }))
      .map(([negative, digits, tie, exponent]) => `${negative ? '-' : ''}${digits}${tie}e${exponent}`);
    fc.assert(fc.property(result, fc.integer({ min: 0, max: 4 }), (text, places) => {
      const value = new D(text);
      expect(fmt(value, places)).toBe(new D(round(value, places)).toFixed(places));
    }), { numRuns: 4000 });
  });

  it('writes small figures and their trimmed form as the report holds them, whatever their sign (law)', () => {
    // The figures most shown (a few units of their last place, 0–3 places), written from their scaled digits.
    const figure = fc.tuple(fc.integer({ min: -20_000, max: 20_000 }), fc.integer({ min: 0, max: 3 }));
    fc.assert(fc.property(figure, fc.integer({ min: 0, max: 3 }), ([units, exponent], places) => {
      const value = new D(`${units}e-${exponent}`);
      const expected = new D(round(value, places)).toFixed(places);
      expect(fmt(value, places)).toBe(expected);
      expect(fmtTrim(value, places)).toBe(new D(round(value, places)).toString());
    }), { numRuns: 4000 });
    expect(fmt(new D('29.41'), 2)).toBe('29.41');
    expect(fmt(new D('-163.83'), 2)).toBe('-163.83');
    expect(fmt(new D('163.84'), 2)).toBe('163.84');
    expect(fmtScaled(2941, 2)).toBe('29.41');
    expect(fmtScaled(-5, 3)).toBe('-0.005');
    expect(fmtTrim(new D('68'), 3)).toBe('68');
    expect(fmtTrim(new D('-2.50'), 3)).toBe('-2.5');
    expect(fmtTrim(new D('1200'), 1)).toBe('1200');
  });
});
