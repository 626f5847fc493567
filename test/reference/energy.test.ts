// Energy and physical constants against textbook values.
import { describe, expect, test } from 'vitest';
import { evaluate, product } from '../support/build.ts';
import { mmHgPerMOsmPerL } from '../../src/core/compute/bag.ts';
import { D } from '../../src/core/decimal.ts';

describe('energy (Krause\'s Food & the Nutrition Care Process, Box 18.5; field guide §9.2)', () => {
  test('A: D25 / AA 4.25 / lipid 3.0 at 2400 mL → 600 g, 102 g, 72 g → 3096 kcal with 9 kcal/g fat', () => {
    const products = [
      product({ id: 'dex', role: 'dextrose', nutrient: { gramsPerMl: '0.7', mOsmPerGram: '5.046', kcalPerGram: '3.4' } }),
      product({ id: 'aa', role: 'amino-acids', nutrient: { gramsPerMl: '0.1', mOsmPerGram: '10', kcalPerGram: '4' } }),
      product({ id: 'fat', role: 'lipid', nutrient: { gramsPerMl: '0.2', mOsmPerGram: '0', kcalPerGram: '9' } }),
    ];
    const r = evaluate(products, {
      volumeMl: 2400,
      lines: [
        { product: 'dex', amount: 600, unit: 'g' }, { product: 'aa', amount: 102, unit: 'g' },
        { product: 'fat', amount: 72, unit: 'g' }, { product: 'water', fill: true },
      ],
    }).report.totals;
    expect(r.dextrosePercent).toBe(25);
    expect(r.aminoAcidPercent).toBe(4.25);
    expect(r.lipidPercent).toBe(3);
    expect(r.kcal.dextrose).toBe(2040);
    expect(r.kcal.aminoAcids).toBe(408);
    expect(r.kcal.lipid).toBe(648);
    expect(r.kcal.total).toBe(3096);
  });

  test('B: 357 mL D70, 1200 mL AA 10%, 250 mL ILE 20% → 850 + 480 + 500 = 1830 kcal, 120 g protein', () => {
    const products = [
      product({ id: 'd70', role: 'dextrose', nutrient: { gramsPerMl: '0.7', mOsmPerGram: '5.046' }, kcalPerMl: '2.38' }),
      product({ id: 'aa10', role: 'amino-acids', nutrient: { gramsPerMl: '0.1', mOsmPerGram: '10' }, kcalPerMl: '0.4' }),
      product({ id: 'ile20', role: 'lipid', nutrient: { gramsPerMl: '0.2', mOsmPerGram: '0' }, kcalPerMl: '2.0' }),
    ];
    const r = evaluate(products, {
      lines: [{ product: 'd70', amount: 357, unit: 'mL' }, { product: 'aa10', amount: 1200, unit: 'mL' }, { product: 'ile20', amount: 250, unit: 'mL' }],
    }).report.totals;
    expect(Math.round(r.kcal.dextrose)).toBe(850);
    expect(r.kcal.aminoAcids).toBe(480);
    expect(r.kcal.lipid).toBe(500);
    expect(Math.round(r.kcal.total)).toBe(1830);
    expect(r.grams.aminoAcids).toBe(120);
  });

  test('GIR: 300 g dextrose a day for 70 kg → 2.98 mg/kg/min (field guide §5.1, derived)', () => {
    const dex = product({ id: 'dex', role: 'dextrose', nutrient: { gramsPerMl: '0.7', mOsmPerGram: '5.046' } });
    const r = evaluate([dex], { volumeMl: 2000, lines: [{ product: 'dex', amount: 300, unit: 'g' }, { product: 'water', fill: true }] }).report;
    expect(r.totals.girMgPerKgPerMin).toBe(2.98);
    expect(r.totals.nitrogenG).toBe(0);
    expect(r.totals.npcToN).toBeNull();
  });
});

describe('osmotic pressure (van \'t Hoff)', () => {
  test('19.3 mmHg per mOsm/L at 37 °C (Rasouli 2016, Clin Biochem; physiology textbook value)', () => {
    expect(mmHgPerMOsmPerL(new D(37)).toNumber()).toBeCloseTo(19.3, 1);
    // 18.59 mmHg at 25 °C (field guide §7, derived from the same law).
    expect(mmHgPerMOsmPerL(new D(25)).toNumber()).toBeCloseTo(18.59, 2);
  });
});
