// The solver's proposals as the workspace shows them. The report's optional `suggestions` field is read
// through this adapter so the panel depends on one small local shape.
import type { Report } from '../../core/report.ts';
import type { Change } from './edits.ts';

/** A proposal that would change the order, with what it does to the bag; applied only on the user's click. */
export interface Suggestion {
  id: string;
  title: string;
  consequences: string[];
  changes: Change[];
  /** The verdict the engine expects after the change, when it says. */
  verdictAfter: 'pass' | 'warn' | 'block' | null;
}

function isRecord(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

function text(v: unknown): string | null {
  if (typeof v === 'string') return v;
  if (typeof v === 'number' && Number.isFinite(v)) return String(v);
  return null;
}

function consequencesOf(v: unknown): string[] {
  if (!Array.isArray(v)) return [];
  return v.flatMap((c) => {
    const t = text(c) ?? (isRecord(c) ? text(c.message) ?? text(c.text) : null);
    return t ? [t] : [];
  });
}

function changesOf(item: Record<string, unknown>): Change[] {
  if (Array.isArray(item.changes)) {
    return item.changes.flatMap((c) => {
      if (!isRecord(c) || typeof c.path !== 'string') return [];
      const value = text(c.value);
      return value === null ? [] : [{ path: c.path, value }];
    });
  }
  const volume = text(item.volumeMl);
  if (volume !== null) return [{ path: 'volumeMl', value: volume }];
  const line = item.line;
  const amount = text(item.amount);
  if (typeof line === 'number' && Number.isInteger(line) && amount !== null) {
    const out: Change[] = [{ path: `lines[${line}].amount`, value: amount }];
    const unit = text(item.unit);
    if (unit !== null) out.push({ path: `lines[${line}].unit`, value: unit });
    return out;
  }
  return [];
}

/** The report's suggestions in the panel's shape; absent or unreadable entries give an empty list. */
export function readSuggestions(report: Report): Suggestion[] {
  const raw = (report as { suggestions?: unknown }).suggestions;
  if (!Array.isArray(raw)) return [];
  return raw.flatMap((item, i) => {
    if (!isRecord(item)) return [];
    const title = text(item.title) ?? text(item.message) ?? text(item.summary);
    const changes = changesOf(item);
    if (title === null || changes.length === 0) return [];
    const v = item.verdictAfter ?? item.verdict;
    return [{
      id: text(item.id) ?? text(item.kind) ?? `s${i}`,
      title,
      consequences: consequencesOf(item.consequences),
      changes,
      verdictAfter: v === 'pass' || v === 'warn' || v === 'block' ? v : null,
    }];
  });
}
