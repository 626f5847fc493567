import { describe, expect, it } from 'vitest';
import { bagOf } from '../../../test/helpers/orders.ts';
import { bagOnRoute, perKgOf, perLitreOf } from './bag.ts';

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
