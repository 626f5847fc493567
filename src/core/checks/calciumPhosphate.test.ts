import { describe, expect, it } from 'vitest';
import { DEFAULT_POLICY } from '../../defaults.ts';
import { verdictOf } from '../findings.ts';
import type { Route } from '../order.ts';
import { calciumPhosphate, calciumPhosphateLevels, calciumPhosphateProduct, calciumPhosphateScreens } from './calciumPhosphate.ts';
import { bagOnRoute } from '../compute/bag.ts';
import { AGES, bagOf, evaluate, one, pick, policyWith, type OrderSpec } from '../../../test/helpers/orders.ts';

type Extra = OrderSpec['lines'];

/** A 1000 mL bag (so mmol = mmol/L) with calcium from calcium gluconate and inorganic phosphate from sodium phosphates. */
function bag(age: OrderSpec['age'], route: Route, caMmol: string, pMmol: string, extra: Extra = []) {
  return bagOf({
    age, route, weightKg: age === 'adult' ? 70 : 3, volumeMl: 1000,
    lines: [
      { product: 'calcium-gluconate-10', amount: caMmol, unit: 'mmol', species: 'Ca' },
      { product: 'sodium-phosphates-3', amount: pMmol, unit: 'mmol', species: 'phosphate' },
      ...extra,
      { product: 'sterile-water', fill: true },
    ],
  });
}

describe('calcium-phosphate', () => {
  describe.each(AGES)('%s', (age) => {
    // Knight, Heer, Abdenour 1983: Ca (mmol/L) × P (mmol/L) ≤ 75 central, ≤ 100 peripheral.
    it.each([
      ['central', '7.5', '10', 'info'], ['central', '7.5', '9.99', 'info'], ['central', '7.5', '10.01', 'warn'],
      ['peripheral', '10', '10', 'info'], ['peripheral', '10', '9.99', 'info'], ['peripheral', '10', '10.01', 'warn'],
    ] as const)('product screen (Knight 1983), %s: Ca %s × P %s mmol/L is %s', (route, ca, p, severity) => {
      const f = one(calciumPhosphate(bag(age, route, ca, p), DEFAULT_POLICY), 'calcium-phosphate', { screen: 'product' });
      expect(f.severity).toBe(severity);
      expect(f.limit?.toNumber()).toBe(route === 'central' ? 75 : 100);
      expect(f.source).toContain('Knight');
      expect(f.message).toContain('screens only');
    });

    // Sum screen, common practice (from memory): Ca (mEq/L) + P (mmol/L) ≤ 45. 7.5 mmol Ca = 15 mEq.
    it.each([
      ['30', 'info'], ['29.99', 'info'], ['30.01', 'warn'],
    ])('sum screen (common practice): 15 mEq/L Ca + %s mmol/L P is %s', (p, severity) => {
      const f = one(calciumPhosphate(bag(age, 'central', '7.5', p), DEFAULT_POLICY), 'calcium-phosphate', { screen: 'sum' });
      expect(f.severity).toBe(severity);
      expect(f.limit?.toNumber()).toBe(45);
      expect(f.source).toContain('common practice');
    });
  });

  it('reports calcium in mmol/L and mEq/L, inorganic and organic phosphate apart', () => {
    const b = bag('adult', 'central', '5', '10', [{ product: 'sodium-glycerophosphate-1', amount: 4, unit: 'mmol' }]);
    const lv = calciumPhosphateLevels(b);
    expect(lv.calciumMmolPerL.toDecimalPlaces(10).toNumber()).toBe(5);
    expect(lv.calciumMEqPerL.toDecimalPlaces(10).toNumber()).toBe(10);
    expect(lv.inorganicPhosphateMmolPerL.toDecimalPlaces(10).toNumber()).toBe(10);
    expect(lv.organicPhosphateMmolPerL.toNumber()).toBe(4);
    const product = one(calciumPhosphate(b, DEFAULT_POLICY), 'calcium-phosphate', { screen: 'product' });
    expect(product.value?.toDecimalPlaces(10).toNumber()).toBe(50); // organic phosphate stays out of the product
    expect(product.message).toContain('not counted in the inorganic term');
  });

  it('a glycerophosphate-only bag passes the inorganic screens (exchange format; Bouchoud 2010: organic salts up to 50 mmol/L)', () => {
    // 20 mmol/L calcium with 20 mmol/L inorganic phosphate would be a product of 400, far over 75.
    const b = bagOf({ age: 'preterm-neonate', route: 'central', weightKg: 1, volumeMl: 1000, lines: [
      { product: 'calcium-gluconate-10', amount: 20, unit: 'mmol', species: 'Ca' },
      { product: 'sodium-glycerophosphate-1', amount: 20, unit: 'mmol' },
      { product: 'sterile-water', fill: true },
    ] });
    const findings = calciumPhosphate(b, DEFAULT_POLICY);
    expect(pick(findings, 'calcium-phosphate', { screen: 'product' })).toEqual([]);
    expect(pick(findings, 'calcium-phosphate', { screen: 'sum' })).toEqual([]);
    const organic = one(findings, 'calcium-phosphate', { screen: 'organic-phosphate' });
    expect(organic.severity).toBe('info');
    expect(organic.message).toContain('inorganic screens are not triggered');
    expect(verdictOf(findings)).toBe('pass');
  });

  it('organic phosphate beyond the tested 50 mmol/L warns (Bouchoud 2010)', () => {
    const at = (mmol: string) => one(calciumPhosphate(bagOf({ age: 'child', route: 'central', weightKg: 10, volumeMl: 1000, lines: [
      { product: 'calcium-gluconate-10', amount: 10, unit: 'mmol', species: 'Ca' },
      { product: 'sodium-glycerophosphate-1', amount: mmol, unit: 'mmol' },
      { product: 'sterile-water', fill: true },
    ] }), DEFAULT_POLICY), 'calcium-phosphate', { screen: 'organic-phosphate' });
    expect(at('50').severity).toBe('info');
    expect(at('50.01').severity).toBe('warn');
  });

  it('flags calcium chloride with inorganic phosphate even when the screens pass (Henry 1980)', () => {
    const withChloride = bagOf({ age: 'term-neonate', route: 'central', weightKg: 3, volumeMl: 1000, lines: [
      { product: 'calcium-chloride-10', amount: 5, unit: 'mmol', species: 'Ca' },
      { product: 'sodium-phosphates-3', amount: 5, unit: 'mmol', species: 'phosphate' },
      { product: 'sterile-water', fill: true },
    ] });
    const findings = calciumPhosphate(withChloride, DEFAULT_POLICY);
    expect(one(findings, 'calcium-phosphate', { screen: 'product' }).severity).toBe('info'); // 25 ≤ 75
    const chloride = one(findings, 'calcium-phosphate', { screen: 'calcium-chloride' });
    expect(chloride.severity).toBe('warn');
    expect(chloride.source).toContain('Henry');
    expect(chloride.lines).toEqual([0, 1]);
    expect(pick(calciumPhosphate(bag('term-neonate', 'central', '5', '5'), DEFAULT_POLICY), 'calcium-phosphate', { screen: 'calcium-chloride' })).toEqual([]);
  });

  it('calcium chloride with organic phosphate only is not flagged as chloride + inorganic phosphate', () => {
    const b = bagOf({ age: 'preterm-neonate', route: 'central', weightKg: 1, volumeMl: 100, lines: [
      { product: 'calcium-chloride-10', amount: 1, unit: 'mmol', species: 'Ca' },
      { product: 'sodium-glycerophosphate-1', amount: 1, unit: 'mmol' },
      { product: 'sterile-water', fill: true },
    ] });
    expect(pick(calciumPhosphate(b, DEFAULT_POLICY), 'calcium-phosphate', { screen: 'calcium-chloride' })).toEqual([]);
  });

  it('notes that a precipitate cannot be seen in a 3-in-1 (FDA Safety Alert 1994)', () => {
    const with3in1 = calciumPhosphate(bag('adult', 'central', '2', '7', [{ product: 'lipid-20', amount: 250, unit: 'mL' }]), DEFAULT_POLICY);
    const note = one(with3in1, 'calcium-phosphate', { screen: 'hidden-by-lipid' });
    expect(note.severity).toBe('info');
    expect(note.message).toContain('cannot be seen');
    expect(pick(calciumPhosphate(bag('adult', 'central', '2', '7'), DEFAULT_POLICY), 'calcium-phosphate', { screen: 'hidden-by-lipid' })).toEqual([]);
  });

  it('reports nothing without calcium or without phosphate', () => {
    expect(calciumPhosphate(bag('adult', 'central', '0', '10'), DEFAULT_POLICY)).toEqual([]);
    expect(calciumPhosphate(bag('adult', 'central', '5', '0'), DEFAULT_POLICY)).toEqual([]);
  });

  describe('solubility curve from the policy', () => {
    // Hand-written curve points (not a real product's curve) to test interpolation and the margin:
    // amino acids 10% at 2%: 10 mEq/L Ca → 30 mmol/L P, 20 → 20, 40 → 10.
    const policy = policyWith((p) => {
      p.solubilityCurves = [
        { id: 'aa10-at-1', aminoAcidProduct: 'amino-acids-10', aminoAcidPercent: 1, points: [{ calciumMEqPerL: 10, maxPhosphateMmolPerL: 5 }, { calciumMEqPerL: 40, maxPhosphateMmolPerL: 1 }], source: 'hand-written test points' },
        { id: 'aa10-at-2', aminoAcidProduct: 'amino-acids-10', aminoAcidPercent: 2, temperatureC: 37, hours: 24, points: [
          { calciumMEqPerL: 10, maxPhosphateMmolPerL: 30 }, { calciumMEqPerL: 20, maxPhosphateMmolPerL: 20 }, { calciumMEqPerL: 40, maxPhosphateMmolPerL: 10 },
        ], source: 'hand-written test points' },
      ];
    });
    // 250 mL of amino acids 10% in 1000 mL = 2.5%: the 2% curve applies. 7.5 mmol Ca = 15 mEq/L → 25 mmol/L P allowed.
    const aa: Extra = [{ product: 'amino-acids-10', amount: 250, unit: 'mL' }];

    it.each([
      ['25', 'info', '0.00'], ['24.9', 'info', '0.10'], ['25.01', 'block', '0.01'],
    ])('inorganic phosphate %s mmol/L at 15 mEq/L calcium is %s (margin %s)', (p, severity, margin) => {
      const f = one(calciumPhosphate(bag('child', 'central', '7.5', p, aa), policy), 'calcium-phosphate', { screen: 'solubility-curve' });
      expect(f.severity).toBe(severity);
      expect(f.limit?.toDecimalPlaces(10).toNumber()).toBe(25);
      expect(f.message).toContain(severity === 'block' ? `over it by ${margin}` : `margin ${margin}`);
      expect(f.source).toContain('hand-written test points');
      expect(f.source).toContain('ASPEN 2014');
      expect(f.message).toContain('at 2% amino acids, 37 °C, 24 h');
    });

    it('calcium beyond the curve blocks: nothing is shown compatible there', () => {
      const f = one(calciumPhosphate(bag('child', 'central', '25', '1', aa), policy), 'calcium-phosphate', { screen: 'solubility-curve' });
      expect(f.severity).toBe('block');
      expect(f.message).toContain('beyond the last point');
    });

    it('a bag below every curve\'s amino-acid % gets no curve reading, and the screens say so', () => {
      const low: Extra = [{ product: 'amino-acids-10', amount: 50, unit: 'mL' }]; // 0.5%
      const findings = calciumPhosphate(bag('child', 'central', '7.5', '2', low), policy);
      expect(pick(findings, 'calcium-phosphate', { screen: 'solubility-curve' })).toEqual([]);
      expect(one(findings, 'calcium-phosphate', { screen: 'product' }).message).toContain('start above this bag');
    });

    it('without a curve for the product, the screen message asks for the published curve', () => {
      const f = one(calciumPhosphate(bag('child', 'central', '7.5', '2', aa), DEFAULT_POLICY), 'calcium-phosphate', { screen: 'product' });
      expect(f.message).toContain('No solubility curve');
    });

    // ASPEN 2014 (Boullata et al.), question 7: a published curve is for one amino-acid product.
    it('reads the product of a bag whose amino acids come on two lines of one stock, and no curve for a bag mixing two', () => {
      const twoLines: Extra = [...aa, { product: 'amino-acids-10', amount: 50, unit: 'mL' }];
      const same = one(calciumPhosphate(bag('child', 'central', '7.5', '2', twoLines), policy), 'calcium-phosphate', { screen: 'solubility-curve' });
      expect(same.message).toContain('aa10-at-2');
      const mixed: Extra = [...aa, { product: 'amino-acids-15', amount: 50, unit: 'mL' }];
      const findings = calciumPhosphate(bag('child', 'central', '7.5', '2', mixed), policy);
      expect(pick(findings, 'calcium-phosphate', { screen: 'solubility-curve' })).toEqual([]);
      expect(one(findings, 'calcium-phosphate', { screen: 'product' }).message).toContain('mixes amino-acid products');
    });

    it('a bag without amino acids gets no curve reading, and the screens say so', () => {
      const f = one(calciumPhosphate(bag('child', 'central', '7.5', '2'), policy), 'calcium-phosphate', { screen: 'product' });
      expect(f.message).toContain('no amino acids: published curves do not cover it');
    });
  });

  it('is the product screen, then the screens that do not read the route, whatever bag or policy was checked before', () => {
    const aa: Extra = [{ product: 'amino-acids-10', amount: 250, unit: 'mL' }, { product: 'lipid-20', amount: 250, unit: 'mL' }];
    // Ca × P = 7.5 × 11 = 82.5: over the central screen (75) and within the peripheral one (100), Knight 1983.
    const central = bag('child', 'central', '7.5', '11', aa);
    const peripheral = bag('child', 'peripheral', '7.5', '11', aa);
    // A policy reading central bags against the peripheral figure (Knight, Heer, Abdenour 1983: 100).
    const lenient = policyWith((p) => {
      p.rules['calcium-phosphate-product-central'].child = { max: 100, unit: 'mmol²/L²', severity: 'warn', source: 'test policy: Knight, Heer, Abdenour, JPEN 1983 peripheral figure applied centrally' };
    });
    const all = calciumPhosphate(central, DEFAULT_POLICY);
    expect(all.map((f) => [f.screen, f.severity])).toEqual([['product', 'warn'], ['sum', 'info'], ['hidden-by-lipid', 'info']]);
    expect(all).toEqual([...calciumPhosphateProduct(central, DEFAULT_POLICY), ...calciumPhosphateScreens(central, DEFAULT_POLICY)]);
    // The same bag on the peripheral route: its product screen is the peripheral one, as for a bag computed peripheral.
    const onPeripheral = calciumPhosphateProduct(bagOnRoute(central, 'peripheral'), DEFAULT_POLICY);
    expect(onPeripheral).toEqual(calciumPhosphateProduct(peripheral, DEFAULT_POLICY));
    expect(one(onPeripheral, 'calcium-phosphate').severity).toBe('info');
    expect(one(calciumPhosphateProduct(central, lenient), 'calcium-phosphate').severity).toBe('info');
    expect(calciumPhosphate(central, DEFAULT_POLICY)).toEqual(all);
  });

  it('its findings reach the report through evaluateOrder', () => {
    const e = evaluate({ age: 'adult', route: 'central', weightKg: 70, volumeMl: 1000, lines: [
      { product: 'calcium-chloride-10', amount: 5, unit: 'mmol', species: 'Ca' },
      { product: 'potassium-phosphates-3', amount: 20, unit: 'mmol', species: 'phosphate' },
      { product: 'sterile-water', fill: true },
    ] });
    const screens = e.report.findings.filter((f) => f.code === 'calcium-phosphate').map((f) => f.screen);
    expect(screens).toEqual(['product', 'sum', 'calcium-chloride']);
    expect(e.report.findings.find((f) => f.screen === 'product')?.value).toBe(100); // 5 × 20 > 75
  });
});
