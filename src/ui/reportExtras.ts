// Optional report fields that other parts of the engine add (read structurally, so the screens work
// with or without them).
import type { Report } from '../core/report.ts';

/** One predicted osmolality estimate (information only). */
export interface OsmolalityEstimate {
  label: string;
  value: number;
  unit: string;
  source: string;
  status: string;
}

function isRecord(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/** `information.predictedOsmolality`, when the report carries it: its estimates and its note. */
export function predictedOsmolality(report: Report): { estimates: OsmolalityEstimate[]; note: string } | null {
  const p = (report.information as Record<string, unknown>).predictedOsmolality;
  if (!isRecord(p) || !Array.isArray(p.estimates)) return null;
  const estimates = p.estimates.flatMap((e): OsmolalityEstimate[] => {
    if (!isRecord(e) || typeof e.value !== 'number' || !Number.isFinite(e.value)) return [];
    return [{ label: String(e.label ?? e.method ?? 'estimate'), value: e.value, unit: String(e.unit ?? 'mOsm/kg'), source: String(e.source ?? ''), status: String(e.status ?? '') }];
  });
  return estimates.length > 0 ? { estimates, note: typeof p.note === 'string' ? p.note : '' } : null;
}
