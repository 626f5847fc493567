import { describe, expect, it } from 'vitest';
import type { ComparisonRow } from '../../store/qa/stats.ts';
import type { QaEntry } from '../../store/types.ts';
import { scatterLayout } from './scatterLayout.ts';

const row = (measured: number, particle: number): ComparisonRow => ({
  entry: { orderId: 'X' } as QaEntry,
  measured,
  figures: [{ key: 'particle', label: 'Particle count', calculated: particle, difference: measured - particle, relativePercent: null }],
});

describe('scatter plot geometry', () => {
  it('uses equal, round axes so y = x is the diagonal, and places points by value', () => {
    const l = scatterLayout([row(950, 900), row(1240, 1100)], 320, 40);
    expect([l.min, l.max, l.ticks]).toEqual([900, 1250, [900, 950, 1000, 1050, 1100, 1150, 1200, 1250]]);
    // 900 → left edge (40); 1250 → right edge (280); y is flipped (1250 at the top, 40)
    expect(l.points[0]).toMatchObject({ x: 40, series: 'particle' });
    expect(l.points[1]!.y).toBeCloseTo(280 - ((1240 - 900) / 350) * 240, 9);
    expect(l.above).toBe(2);
  });

  it('has a default frame when there is no reading', () => {
    const l = scatterLayout([]);
    expect([l.min, l.max, l.points.length, l.bags]).toEqual([0, 1000, 0, 0]);
  });
});
