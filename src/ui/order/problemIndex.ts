// The engine's `path: message` problems, sorted to the fields that show them inline.
import type { Problem } from '../../core/problems.ts';
import { HEADER_TEXT_FIELDS } from './draft.ts';

/** Fields of a line that show their own problems. */
export const LINE_FIELDS = ['product', 'amount', 'unit', 'species', 'fill'] as const;
export type LineField = (typeof LINE_FIELDS)[number];

const PLACED_HEADER = new Set<string>([...HEADER_TEXT_FIELDS, 'patient.ageGroup', 'route']);
const LINE_PATH = /^lines\[(\d+)\](?:\.(\w+))?$/;

/** Problems by path, and those no field shows (they are listed above the lines). */
export interface ProblemIndex {
  at(path: string): string[];
  /** Problems of a whole line (e.g. a fill line that was given an amount). */
  line(index: number): string[];
  unplaced: Problem[];
  count: number;
}

export const NO_PROBLEMS: ProblemIndex = { at: () => [], line: () => [], unplaced: [], count: 0 };

/** Path of a line field, as the engine writes it: `lines[2].amount`. */
export function linePath(index: number, field: LineField): string {
  return `lines[${index}].${field}`;
}

export function indexProblems(problems: readonly Problem[], lineCount: number): ProblemIndex {
  if (problems.length === 0) return NO_PROBLEMS;
  const byPath = new Map<string, string[]>();
  const unplaced: Problem[] = [];
  const add = (path: string, message: string) => byPath.set(path, [...(byPath.get(path) ?? []), message]);
  for (const p of problems) {
    const m = LINE_PATH.exec(p.path);
    if (m && Number(m[1]) < lineCount) {
      const field = m[2];
      add(field && (LINE_FIELDS as readonly string[]).includes(field) ? p.path : `lines[${m[1]}]`, p.message);
    } else if (PLACED_HEADER.has(p.path)) {
      add(p.path, p.message);
    } else {
      unplaced.push(p);
    }
  }
  return {
    at: (path) => byPath.get(path) ?? [],
    line: (i) => byPath.get(`lines[${i}]`) ?? [],
    unplaced,
    count: problems.length,
  };
}
