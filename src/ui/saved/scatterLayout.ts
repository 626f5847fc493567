// Geometry of the QA scatter plot (measured against calculated): a square plot with equal axes so
// that the y = x line is the diagonal, nice round ticks, and one point per calculated figure.
import type { ComparisonRow } from '../../store/qa/stats.ts';

export interface ScatterPoint {
  x: number;
  y: number;
  series: 'particle' | 'labelSum' | 'predicted';
  label: string;
}

export interface ScatterLayout {
  size: number;
  pad: number;
  min: number;
  max: number;
  ticks: number[];
  points: ScatterPoint[];
  /** Points (of the particle series) above the line: measured higher than calculated. */
  above: number;
  bags: number;
}

const STEPS = [50, 100, 200, 250, 500, 1000];

/** Round the data range out to a tick step giving 4–8 ticks. */
function niceRange(lo: number, hi: number): { min: number; max: number; step: number } {
  for (const step of STEPS) {
    const min = Math.floor(lo / step) * step;
    const max = Math.ceil(hi / step) * step;
    if ((max - min) / step <= 8) return { min, max: max === min ? min + step : max, step };
  }
  const step = 2000;
  return { min: Math.floor(lo / step) * step, max: Math.ceil(hi / step) * step + step, step };
}

/** The plot for the comparison rows (values already rounded for display); pixel positions in `size`. */
export function scatterLayout(rows: readonly ComparisonRow[], size = 320, pad = 40): ScatterLayout {
  const values = rows.flatMap((r) => [r.measured, ...r.figures.map((f) => f.calculated)]);
  const { min, max, step } = values.length > 0 ? niceRange(Math.min(...values), Math.max(...values)) : { min: 0, max: 1000, step: 200 };
  const span = size - 2 * pad;
  const px = (v: number) => pad + ((v - min) / (max - min)) * span;
  const py = (v: number) => size - pad - ((v - min) / (max - min)) * span;
  const ticks: number[] = [];
  for (let t = min; t <= max; t += step) ticks.push(t);
  const points: ScatterPoint[] = rows.flatMap((r) => r.figures.map((f) => ({
    x: px(f.calculated), y: py(r.measured),
    series: f.key === 'particle' ? 'particle' as const : f.key === 'labelSum' ? 'labelSum' as const : 'predicted' as const,
    label: `${r.entry.orderId}: measured ${r.measured} mOsm/kg, ${f.label.toLowerCase()} ${f.calculated}`,
  })));
  const above = rows.filter((r) => r.figures.some((f) => f.key === 'particle' && r.measured > f.calculated)).length;
  return { size, pad, min, max, ticks, points, above, bags: rows.length };
}
