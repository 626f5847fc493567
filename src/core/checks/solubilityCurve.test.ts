import { describe, expect, it } from 'vitest';
import { D } from '../decimal.ts';
import type { SolubilityCurve } from '../policy.ts';
import { curveFor, readCurve } from './solubilityCurve.ts';

// Hand-written points to test the interpolation arithmetic (not a real product's curve): at
// 10 mEq/L calcium 30 mmol/L phosphate, at 20 → 20, at 40 → 10. Linear interpolation between
// neighbours: at 15 → 30 + (20 − 30) × 5/10 = 25; at 30 → 20 + (10 − 20) × 10/20 = 15.
const points = [
  { calciumMEqPerL: new D(10), maxPhosphateMmolPerL: new D(30) },
  { calciumMEqPerL: new D(20), maxPhosphateMmolPerL: new D(20) },
  { calciumMEqPerL: new D(40), maxPhosphateMmolPerL: new D(10) },
];

function curve(id: string, product: string, percent: string): SolubilityCurve {
  return { id, aminoAcidProduct: product, aminoAcidPercent: new D(percent), temperatureC: null, hours: null, points, source: 'hand-written test points' };
}

describe('readCurve', () => {
  it.each([
    ['15', '25'], ['12.5', '27.5'], ['30', '15'], ['35', '12.5'], ['10', '30'], ['20', '20'], ['40', '10'],
  ])('at %s mEq/L calcium allows %s mmol/L phosphate (linear interpolation)', (ca, p) => {
    const r = readCurve({ points }, new D(ca));
    expect(r.where).toBe('on-curve');
    expect(r.where === 'on-curve' && r.maxPhosphateMmolPerL.toString()).toBe(p);
  });

  it('below the first point uses the first point (a solubility curve falls as calcium rises)', () => {
    const r = readCurve({ points }, new D(5));
    expect(r).toEqual({ where: 'below-first-point', maxPhosphateMmolPerL: new D(30) });
  });

  it('beyond the last point shows nothing compatible', () => {
    expect(readCurve({ points }, new D('40.01'))).toEqual({ where: 'beyond-last-point', lastCalciumMEqPerL: new D(40) });
  });
});

describe('curveFor', () => {
  const curves = [curve('aa10-1', 'amino-acids-10', '1'), curve('aa10-3', 'amino-acids-10', '3'), curve('aa10-2', 'amino-acids-10', '2'), curve('aa15-4', 'amino-acids-15', '4')];
  it('picks the same product at the highest amino-acid % not above the bag (the cautious curve)', () => {
    expect(curveFor(curves, 'amino-acids-10', new D('2.5'))?.id).toBe('aa10-2');
    expect(curveFor(curves, 'amino-acids-10', new D('3'))?.id).toBe('aa10-3');
    expect(curveFor(curves, 'amino-acids-10', new D('9'))?.id).toBe('aa10-3');
  });
  it('has none below the lowest curve or for another product', () => {
    expect(curveFor(curves, 'amino-acids-10', new D('0.5'))).toBeNull();
    expect(curveFor(curves, 'amino-acids-15', new D('3'))).toBeNull();
    expect(curveFor(curves, 'lipid-20', new D('3'))).toBeNull();
  });
});
