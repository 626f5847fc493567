import { describe, expect, it } from 'vitest';
import { bagOf } from '../../../test/helpers/orders.ts';
import { bagOnRoute, computeBag, perKgOf, perLitreOf, type Bag } from './bag.ts';
import { D } from '../decimal.ts';
import { DEFAULT_POLICY } from '../../defaults.ts';

describe('perKgOf and perLitreOf', () => {
  // 2000 mL for 68 kg: 29.41 mL/kg/day (the dose-range example); 60 mmol sodium chloride 23.4% (4 mmol/mL, label) in 2000 mL: 30 mmol/L.
  const bag = bagOf({ age: 'adult', route: 'central', weightKg: 68, volumeMl: 2000, lines: [
    { product: 'sodium-chloride-4', amount: 60, unit: 'mmol', species: 'Na' }, { product: 'sterile-water', fill: true },
  ] });

  it('divide a figure of the bag by the dosing weight, or take it per litre of the final volume', () => {
    expect(perKgOf(bag, bag.finalVolumeMl).toDecimalPlaces(2).toNumber()).toBe(29.41);
    expect(perLitreOf(bag, bag.speciesMmol.Na).toNumber()).toBe(30);
  });

  it('work each figure out once per bag', () => {
    expect(perKgOf(bag, bag.finalVolumeMl)).toBe(perKgOf(bag, bag.finalVolumeMl));
    expect(perLitreOf(bag, bag.speciesMmol.Na)).toBe(perLitreOf(bag, bag.speciesMmol.Na));
    // Another bag of another weight has its own figures.
    const heavier = { ...bag, order: { ...bag.order, patient: { ...bag.order.patient, weightKg: bag.order.patient.weightKg.times(2) } } };
    expect(perKgOf(heavier, heavier.finalVolumeMl).toDecimalPlaces(3).toNumber()).toBe(14.706);
  });
});

describe('bagOnRoute', () => {
  // The same central bag (30 mmol/L sodium) on the peripheral route: every figure is the same decimal.
  const bag = bagOf({ age: 'adult', route: 'central', weightKg: 68, volumeMl: 2000, lines: [
    { product: 'sodium-chloride-4', amount: 60, unit: 'mmol', species: 'Na' }, { product: 'sterile-water', fill: true },
  ] });

  it('is the bag with only its order\'s route changed, every field copied', () => {
    const peripheral = bagOnRoute(bag, 'peripheral');
    expect(peripheral).toStrictEqual({ ...bag, order: { ...bag.order, route: 'peripheral' } });
    expect(Object.keys(peripheral)).toEqual(Object.keys(bag));
    expect(Object.keys(peripheral.order)).toEqual(Object.keys(bag.order));
    expect(bag.order.route).toBe('central');
  });
});

describe('computeBag from a bag it was made from', () => {
  // 68 kg adult, 2000 mL: 60 mmol sodium (sodium chloride 4 mmol/mL → 15 mL), 250 g dextrose 70% (0.7 g/mL
  // → 357.142857142857 mL, label values), water to volume.
  const bag = bagOf({ age: 'adult', route: 'peripheral', weightKg: 68, volumeMl: 2000, lines: [
    { product: 'sodium-chloride-4', amount: 60, unit: 'mmol', species: 'Na' },
    { product: 'dextrose-70', amount: 250, unit: 'g' },
    { product: 'sterile-water', fill: true },
  ] });
  const policy = DEFAULT_POLICY;
  // Every figure of a bag, as text: the lines' and the totals' (the memo of derived figures aside).
  const figures = (b: Bag) => JSON.stringify({ ...b, derived: null });

  it('gives the same bag as computing afresh, taking the unchanged lines as they are', () => {
    const bigger = { ...bag.order, volumeMl: new D(2500) };
    const reused = computeBag(bigger, policy, bag);
    expect(figures(reused)).toBe(figures(computeBag(bigger, policy)));
    expect(reused.lines[0]).toBe(bag.lines[0]);
    expect(reused.lines[1]).toBe(bag.lines[1]);
    // The fill makes up the new volume: 2500 − 15 − 357.142857142857 mL = 2127.857142857143, at 15 digits.
    expect(reused.lines[2]!.volumeMl.toString()).toBe('2127.85714285714');
  });

  it('works out afresh a line the new order changed, and every line at another weight', () => {
    const dextrose = bag.order.lines[1]!;
    if (dextrose.kind !== 'amount') throw new Error('the dextrose line has an amount');
    const less = { ...bag.order, lines: bag.order.lines.map((l) => (l === dextrose ? { ...dextrose, amount: new D(150) } : l)) };
    const reused = computeBag(less, policy, bag);
    expect(figures(reused)).toBe(figures(computeBag(less, policy)));
    expect(reused.lines[0]).toBe(bag.lines[0]);
    expect(reused.lines[1]!.volumeMl.toString()).toBe('214.285714285714'); // 150 g ÷ 0.7 g/mL
    const heavier = { ...bag.order, patient: { ...bag.order.patient, weightKg: new D(80) } };
    expect(computeBag(heavier, policy, bag).lines[0]).not.toBe(bag.lines[0]);
  });
});
