import { formatProblem, type Problem } from '../core/problems.ts';

/** One order found in an input file, with where it came from (for messages). */
export interface FoundOrder {
  file: string;
  /** Where in the file: '' for a single object, `[3]` in an array, `line 4` in NDJSON. */
  where: string;
  value: unknown;
}

/** A problem tied to a file and a place in it, printed as `file: where: path: message`. */
export interface FileProblem {
  file: string;
  where: string;
  problem: Problem;
}

export function formatFileProblem(p: FileProblem): string {
  return [p.file, p.where, formatProblem(p.problem)].filter((s) => s !== '').join(': ');
}

/**
 * Split a file's text into orders: one JSON object, a JSON array of orders, or NDJSON (one per line).
 * Unreadable JSON is a problem with its line, never a crash.
 */
export function ordersFromText(file: string, text: string): { orders: FoundOrder[]; problems: FileProblem[] } {
  const body = text.replace(/^\uFEFF/, '');
  const trimmed = body.trim();
  if (trimmed === '') return { orders: [], problems: [{ file, where: '', problem: { path: '(file)', message: 'is empty: expected an order, an array of orders or NDJSON' } }] };
  try {
    const value: unknown = JSON.parse(trimmed);
    if (Array.isArray(value)) return { orders: value.map((v, i) => ({ file, where: `[${i}]`, value: v })), problems: [] };
    return { orders: [{ file, where: '', value }], problems: [] };
  } catch (wholeError) {
    const lines = body.split(/\r?\n/);
    const nonEmpty = lines.filter((l) => l.trim() !== '');
    if (nonEmpty.length <= 1 || !trimmed.startsWith('{')) {
      return { orders: [], problems: [{ file, where: '', problem: { path: '(file)', message: `is not valid JSON (${(wholeError as Error).message})` } }] };
    }
    const orders: FoundOrder[] = [];
    const problems: FileProblem[] = [];
    lines.forEach((line, i) => {
      if (line.trim() === '') return;
      try {
        orders.push({ file, where: `line ${i + 1}`, value: JSON.parse(line) });
      } catch (e) {
        problems.push({ file, where: `line ${i + 1}`, problem: { path: '(line)', message: `is not valid JSON (${(e as Error).message})` } });
      }
    });
    return { orders, problems };
  }
}
