import { describe, expect, test } from 'vitest';
import { D } from './decimal.ts';
import { as, mEqToMmol, mmolToMEq, mgToMmol, mmolToMg, perKgToPerDay, perDayToPerKg, UnitError } from './units.ts';

describe('unit conversions', () => {
  test('mEq ↔ mmol by charge: 10 mEq Ca = 5 mmol; 4.06 mEq Mg = 2.03 mmol (magnesium sulfate label)', () => {
    expect(mEqToMmol('Ca', as(new D(10), 'mEq')).toNumber()).toBe(5);
    expect(mEqToMmol('Mg', as(new D('4.06'), 'mEq')).toNumber()).toBe(2.03);
    expect(mmolToMEq('Na', as(new D(4), 'mmol')).toNumber()).toBe(4);
  });

  test('phosphate has no mEq', () => {
    expect(() => mEqToMmol('phosphate', as(new D(1), 'mEq'))).toThrow(UnitError);
    expect(() => mmolToMEq('glycerophosphate', as(new D(1), 'mmol'))).toThrow(UnitError);
  });

  test('mg ↔ mmol: 1 mmol P weighs 31 mg (phosphate labels); 1 mEq Ca = 20 mg (field guide §6.1)', () => {
    expect(mmolToMg('phosphate', as(new D(1), 'mmol')).toNumber()).toBeCloseTo(31, 0);
    expect(mmolToMg('Ca', mEqToMmol('Ca', as(new D(1), 'mEq'))).toNumber()).toBeCloseTo(20, 0);
    expect(mgToMmol('Na', as(new D('92'), 'mg')).toNumber()).toBeCloseTo(4, 2);
  });

  test('per kg ↔ per day', () => {
    const perKg = as(new D('3.5'), 'g');
    expect(perKgToPerDay(perKg, new D('1.1')).toNumber()).toBe(3.85);
    expect(perDayToPerKg(as(new D('3.85'), 'g'), new D('1.1')).toNumber()).toBe(3.5);
  });
});
