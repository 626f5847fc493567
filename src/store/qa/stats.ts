// Measured vs calculated osmolality: per bag, and the mean bias and spread per formula type. Exact
// decimal arithmetic; numbers are rounded once, in qaSummaryRows/qaComparisonRows, for display.
import { D, ZERO, round, sum } from '../../core/decimal.ts';
import { AGE_BANDS, SYSTEMS, type AgeBand, type QaEntry, type System } from '../types.ts';

/**
 * The multiplier of the SD for the 95% limits of agreement (Bland JM, Altman DG. Statistical methods
 * for assessing agreement between two methods of clinical measurement. Lancet 1986;i:307-10).
 */
export const LIMITS_OF_AGREEMENT_Z = new D('1.96');

/** One calculated figure of a bag against its measured osmolality. */
export interface Difference {
  key: string;
  label: string;
  calculated: D;
  /** measured − calculated (mOsm/kg − mOsm/L: the gap between the estimate and the osmometer). */
  difference: D;
  /** difference ÷ calculated × 100; null when the calculated figure is 0. */
  relativePercent: D | null;
}

/** The differences of one QA entry, one per calculated figure. */
export function differencesOf(entry: QaEntry): Difference[] {
  const measured = new D(entry.measured);
  return entry.calculated.map((c) => {
    const calculated = new D(c.value);
    const difference = measured.minus(calculated);
    return { key: c.key, label: c.label, calculated, difference, relativePercent: calculated.isZero() ? null : difference.div(calculated).times(100) };
  });
}

/** Mean, and sample standard deviation (n − 1; null below two values). */
export function meanAndSd(values: readonly D[]): { n: number; mean: D; sd: D | null } | null {
  const n = values.length;
  if (n === 0) return null;
  const mean = sum(values).div(n);
  if (n < 2) return { n, mean, sd: null };
  const squares = sum(values.map((v) => v.minus(mean)).map((d) => d.times(d)));
  return { n, mean, sd: squares.div(n - 1).sqrt() };
}

/** Bias and spread of one calculated figure over the bags of one formula type. */
export interface GroupStats {
  ageBand: AgeBand;
  system: System;
  key: string;
  label: string;
  n: number;
  /** Mean of measured − calculated. */
  meanBias: D;
  /** Sample SD of measured − calculated (null for one bag). */
  sd: D | null;
  /** Mean of the relative differences, %. */
  meanRelativePercent: D | null;
  /** Bias ± 1.96 SD (null for one bag). */
  limits: { low: D; high: D } | null;
}

/**
 * Mean bias and spread by formula type (adult/pediatric/neonatal × 2-in-1/3-in-1) and calculated
 * figure, in a fixed order: age band, system, then particle, label sum, predictions.
 */
export function summarise(entries: readonly QaEntry[]): GroupStats[] {
  const groups = new Map<string, { ageBand: AgeBand; system: System; key: string; label: string; diffs: D[]; rel: D[] }>();
  for (const entry of entries) {
    for (const d of differencesOf(entry)) {
      const id = `${entry.ageBand}|${entry.system}|${d.key}`;
      const g = groups.get(id) ?? { ageBand: entry.ageBand, system: entry.system, key: d.key, label: d.label, diffs: [], rel: [] };
      g.diffs.push(d.difference);
      if (d.relativePercent) g.rel.push(d.relativePercent);
      groups.set(id, g);
    }
  }
  const keyRank = (k: string) => (k === 'particle' ? 0 : k === 'labelSum' ? 1 : 2);
  return [...groups.values()]
    .sort((a, b) => AGE_BANDS.indexOf(a.ageBand) - AGE_BANDS.indexOf(b.ageBand) || SYSTEMS.indexOf(a.system) - SYSTEMS.indexOf(b.system) || keyRank(a.key) - keyRank(b.key) || a.key.localeCompare(b.key))
    .map((g) => {
      const s = meanAndSd(g.diffs) ?? { n: 0, mean: ZERO, sd: null };
      const r = meanAndSd(g.rel);
      const spread = s.sd ? s.sd.times(LIMITS_OF_AGREEMENT_Z) : null;
      return {
        ageBand: g.ageBand, system: g.system, key: g.key, label: g.label, n: s.n,
        meanBias: s.mean, sd: s.sd, meanRelativePercent: r ? r.mean : null,
        limits: spread ? { low: s.mean.minus(spread), high: s.mean.plus(spread) } : null,
      };
    });
}

/** A summary row as the screen and the CSV show it (mOsm to 0.1, % to 0.1). */
export interface SummaryRow {
  ageBand: AgeBand;
  system: System;
  key: string;
  label: string;
  n: number;
  meanBias: number;
  sd: number | null;
  meanRelativePercent: number | null;
  limitsLow: number | null;
  limitsHigh: number | null;
}

/** The summary rounded at the display edge. */
export function qaSummaryRows(entries: readonly QaEntry[]): SummaryRow[] {
  return summarise(entries).map((g) => ({
    ageBand: g.ageBand, system: g.system, key: g.key, label: g.label, n: g.n,
    meanBias: round(g.meanBias, 1),
    sd: g.sd ? round(g.sd, 1) : null,
    meanRelativePercent: g.meanRelativePercent ? round(g.meanRelativePercent, 1) : null,
    limitsLow: g.limits ? round(g.limits.low, 1) : null,
    limitsHigh: g.limits ? round(g.limits.high, 1) : null,
  }));
}

/** One bag's row: measured, and each calculated figure with its difference (rounded for display). */
export interface ComparisonRow {
  entry: QaEntry;
  measured: number;
  figures: { key: string; label: string; calculated: number; difference: number; relativePercent: number | null }[];
}

/** Every entry with its differences, newest measurement first, rounded at the display edge. */
export function qaComparisonRows(entries: readonly QaEntry[]): ComparisonRow[] {
  return [...entries]
    .sort((a, b) => (a.measuredOn === b.measuredOn ? b.recordedAt.localeCompare(a.recordedAt) : b.measuredOn.localeCompare(a.measuredOn)))
    .map((entry) => ({
      entry,
      measured: round(new D(entry.measured), 1),
      figures: differencesOf(entry).map((d) => ({
        key: d.key, label: d.label,
        calculated: round(d.calculated, 1),
        difference: round(d.difference, 1),
        relativePercent: d.relativePercent ? round(d.relativePercent, 1) : null,
      })),
    }));
}
