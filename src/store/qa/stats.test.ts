import { describe, expect, it } from 'vitest';
import { D } from '../../core/decimal.ts';
import type { QaEntry } from '../types.ts';
import { differencesOf, meanAndSd, qaComparisonRows, qaSummaryRows, summarise } from './stats.ts';

let seq = 0;
/** A QA entry with a particle and a label-sum figure (values invented for the arithmetic). */
function entry(measured: string, particle: number, labelSum: number, over: Partial<QaEntry> = {}): QaEntry {
  seq += 1;
  return {
    id: `q${seq}`, orderKey: 'k', orderId: `ORD-${seq}`, version: 1, measured, method: 'freezing-point', instrument: '',
    measuredOn: `2026-11-${String(10 + seq).padStart(2, '0')}`, recordedAt: '2026-12-01T08:00:00.000Z', recordedBy: null,
    ageBand: 'adult', system: '3-in-1',
    calculated: [
      { key: 'particle', label: 'Particle count', value: particle, unit: 'mOsm/L' },
      { key: 'labelSum', label: 'Label sum', value: labelSum, unit: 'mOsm/L' },
    ],
    ...over,
  };
}

describe('mean and sample SD', () => {
  it('NIST StRD univariate NumAcc1 (certified mean 10000002, SD 1; values from memory)', () => {
    const r = meanAndSd(['10000001', '10000003', '10000002'].map((v) => new D(v)));
    expect(r?.mean.toString()).toBe('10000002');
    expect(r?.sd?.toString()).toBe('1');
  });

  it('NIST StRD NumAcc3 (1000000.2 then 500 pairs of 1000000.1 and 1000000.3: certified mean 1000000.2, SD 0.1; from memory)', () => {
    const values = [new D('1000000.2')];
    for (let i = 0; i < 500; i += 1) values.push(new D('1000000.1'), new D('1000000.3'));
    const r = meanAndSd(values);
    expect(r?.n).toBe(1001);
    expect(r?.mean.toString()).toBe('1000000.2');
    expect(r?.sd?.toString()).toBe('0.1');
  });

  it('has no SD for one value and nothing for none', () => {
    expect(meanAndSd([new D(5)])).toEqual({ n: 1, mean: new D(5), sd: null });
    expect(meanAndSd([])).toBeNull();
  });
});

describe('measured vs calculated, by formula type', () => {
  // Hand-computed: adult 3-in-1 bags measured 950, 1010, 1040 mOsm/kg against particle counts of
  // 900, 940, 980 mOsm/L: differences 50, 70, 60; mean 60; deviations −10, +10, 0; SD = √(200/2) = 10.
  // Relative: 50/900 = 5.5556 %, 70/940 = 7.4468 %, 60/980 = 6.1224 %; mean 19.1248/3 = 6.3749 %.
  // Limits of agreement (Bland & Altman 1986): 60 ± 1.96 × 10 = 40.4 … 79.6.
  // Label sums 920, 1000, 1000: differences 30, 10, 40; mean 26.667; deviations 3.333, −16.667, 13.333;
  // squares 11.111 + 277.778 + 177.778 = 466.667; SD = √(466.667/2) = √233.333 = 15.275.
  // Relative: 30/920 = 3.2609 %, 10/1000 = 1 %, 40/1000 = 4 %; mean 8.2609/3 = 2.7536 %.
  // Limits: 26.667 ± 1.96 × 15.275 = 26.667 ± 29.939 = −3.272 … 56.606.
  const adult = [entry('950', 900, 920), entry('1010', 940, 1000), entry('1040', 980, 1000)];

  it('gives each bag its differences', () => {
    const d = differencesOf(adult[0]!);
    expect(d.map((x) => [x.key, x.difference.toString(), x.relativePercent?.toDecimalPlaces(4).toString()])).toEqual([
      ['particle', '50', '5.5556'], ['labelSum', '30', '3.2609'],
    ]);
  });

  it('computes the mean bias, SD, mean relative bias and limits of agreement against the hand-computed figures', () => {
    const rows = qaSummaryRows(adult);
    expect(rows).toEqual([
      { ageBand: 'adult', system: '3-in-1', key: 'particle', label: 'Particle count', n: 3, meanBias: 60, sd: 10, meanRelativePercent: 6.4, limitsLow: 40.4, limitsHigh: 79.6 },
      { ageBand: 'adult', system: '3-in-1', key: 'labelSum', label: 'Label sum', n: 3, meanBias: 26.7, sd: 15.3, meanRelativePercent: 2.8, limitsLow: -3.3, limitsHigh: 56.6 },
    ]);
    const particle = summarise(adult)[0]!;
    expect(particle.meanRelativePercent?.toDecimalPlaces(4).toString()).toBe('6.3749');
    expect(summarise(adult)[1]!.sd?.toDecimalPlaces(3).toString()).toBe('15.275');
  });

  it('keeps formula types apart, in a fixed order, and adds predicted figures where the report had them', () => {
    const neo = entry('700', 650, 660, {
      ageBand: 'neonatal', system: '2-in-1',
      calculated: [
        { key: 'particle', label: 'Particle count', value: 650, unit: 'mOsm/L' },
        { key: 'labelSum', label: 'Label sum', value: 660, unit: 'mOsm/L' },
        { key: 'predicted:pereira-da-silva-2004', label: 'Predicted: Pereira-da-Silva 2004', value: 690, unit: 'mOsm/kg' },
      ],
    });
    const child = entry('820', 800, 790, { ageBand: 'pediatric', system: '2-in-1' });
    const rows = qaSummaryRows([neo, ...adult, child]);
    expect(rows.map((r) => [r.ageBand, r.system, r.key, r.n, r.meanBias, r.sd])).toEqual([
      ['adult', '3-in-1', 'particle', 3, 60, 10],
      ['adult', '3-in-1', 'labelSum', 3, 26.7, 15.3],
      ['pediatric', '2-in-1', 'particle', 1, 20, null],
      ['pediatric', '2-in-1', 'labelSum', 1, 30, null],
      ['neonatal', '2-in-1', 'particle', 1, 50, null],
      ['neonatal', '2-in-1', 'labelSum', 1, 40, null],
      ['neonatal', '2-in-1', 'predicted:pereira-da-silva-2004', 1, 10, null],
    ]);
  });

  it('lists bags newest measurement first with rounded figures', () => {
    const rows = qaComparisonRows([entry('1000.04', 900.05, 950, { measuredOn: '2026-10-01' }), entry('990', 900, 950, { measuredOn: '2026-10-02' })]);
    expect(rows.map((r) => [r.entry.measuredOn, r.measured, r.figures[0]!.difference])).toEqual([
      ['2026-10-02', 990, 90],
      ['2026-10-01', 1000, 100],
    ]);
  });
});
