import { describe, expect, it } from 'vitest';
import { D } from '../decimal.ts';
import { DEFAULT_POLICY } from '../../defaults.ts';
import { gir } from './gir.ts';
import { bagOf, policyWith, type OrderSpec } from '../../../test/helpers/orders.ts';

// GIR (mg/kg/min) = dextrose g/day × 1000 ÷ (kg × 1440) over 24 h, so g/kg/day = GIR × 1.44
// (ESPGHAN 2018 tables give both; field guide §5.1).
function bagAtGir(age: OrderSpec['age'], weightKg: number | string, girMgPerKgMin: string) {
  const gPerKg = new D(girMgPerKgMin).times('1.44').toString();
  return bagOf({ age, weightKg, route: 'central', lines: [{ product: 'dextrose-70', amount: gPerKg, unit: 'g/kg' }] });
}

function severityAt(age: OrderSpec['age'], weightKg: number | string, girValue: string) {
  const findings = gir(bagAtGir(age, weightKg, girValue), DEFAULT_POLICY);
  expect(findings).toHaveLength(1);
  return findings[0]?.severity;
}

describe('gir', () => {
  it('field guide §5.1 check value: 300 g/day in 70 kg is 2.98 mg/kg/min', () => {
    const bag = bagOf({ age: 'adult', weightKg: 70, lines: [{ product: 'dextrose-70', amount: 300, unit: 'g' }] });
    expect(bag.girMgPerKgPerMin.toDecimalPlaces(2).toNumber()).toBe(2.98);
    expect(gir(bag, DEFAULT_POLICY)[0]?.severity).toBe('info');
  });

  // Adults: ESPEN ICU 2019 ≤ 5 mg/kg/min (from memory), ASPEN 4–5 (from memory).
  it.each([
    ['5', 'info'], ['4.99', 'info'], ['5.01', 'warn'],
  ])('adult at GIR %s (limit 5, ESPEN ICU 2019) is %s', (value, severity) => {
    expect(severityAt('adult', 60, value)).toBe(severity);
  });

  // Preterm: ESPGHAN 2018 carbohydrates (Mesotten): minimum 4, maximum 12 mg/kg/min.
  it.each([
    ['12', 'info'], ['11.99', 'info'], ['12.01', 'warn'],
    ['4', 'info'], ['4.01', 'info'], ['3.99', 'warn'],
  ])('preterm neonate at GIR %s (ESPGHAN 2018: 4-12) is %s', (value, severity) => {
    expect(severityAt('preterm-neonate', '1.1', value)).toBe(severity);
  });

  // Term: ESPGHAN 2018 day 1 2.5-5, maximum 12 mg/kg/min (from memory).
  it.each([
    ['12', 'info'], ['12.01', 'warn'], ['11.99', 'info'],
    ['2.5', 'info'], ['2.49', 'warn'], ['2.51', 'info'],
  ])('term neonate at GIR %s (ESPGHAN 2018: 2.5-12) is %s', (value, severity) => {
    expect(severityAt('term-neonate', '3.4', value)).toBe(severity);
  });

  // Children: ESPGHAN 2018 weight bands (from memory), each spanning acute to recovery:
  // ≤ 10 kg 2-10; 11-30 kg 1.5-6; 31-45 kg 1-4; > 45 kg 0.5-3 mg/kg/min.
  it.each([
    [8, '10', 'info'], [8, '10.01', 'warn'], [8, '9.99', 'info'], [8, '2', 'info'], [8, '1.99', 'warn'],
    [10, '10', 'info'],
    ['10.5', '6', 'info'], ['10.5', '6.01', 'warn'], [20, '5.99', 'info'], [30, '1.49', 'warn'],
    [40, '4', 'info'], [40, '4.01', 'warn'], [45, '0.99', 'warn'],
    [60, '3', 'info'], [60, '3.01', 'warn'], [60, '0.5', 'info'], [60, '0.49', 'warn'],
  ])('child of %s kg at GIR %s (ESPGHAN 2018 weight band) is %s', (kg, value, severity) => {
    expect(severityAt('child', kg, value)).toBe(severity);
  });

  it('names the weight band and the source of the limit', () => {
    const [f] = gir(bagAtGir('child', 12, '6.5'), DEFAULT_POLICY);
    expect(f?.message).toContain('weight band up to 30 kg');
    expect(f?.source).toContain('ESPGHAN 2018');
    expect(f?.limit?.toString()).toBe('6');
  });

  it('reports nothing for a bag without dextrose', () => {
    const bag = bagOf({ age: 'adult', weightKg: 70, lines: [{ product: 'amino-acids-10', amount: 80, unit: 'g' }] });
    expect(gir(bag, DEFAULT_POLICY)).toEqual([]);
  });

  it('takes its limit and severity from the policy', () => {
    const strict = policyWith((p) => { p.rules.gir.adult = { max: 4, unit: 'mg/kg/min', severity: 'block', source: 'test policy: ASPEN lower figure 4 mg/kg/min (from memory)' }; });
    const [f] = gir(bagAtGir('adult', 60, '4.5'), strict);
    expect(f?.severity).toBe('block');
    expect(f?.source).toContain('test policy');
  });
});
