import { formatProblem, type Problem } from '../core/problems.ts';
import { readError, type CliIo } from './io.ts';

/** One order found in an input file, with where it came from (for messages). */
export interface FoundOrder {
  file: string;
  /** Where in the file: '' for a single object, `[3]` in an array, `line 4` in NDJSON, `rows 2-9` in CSV. */
  where: string;
  value: unknown;
  /** Where a problem at this path inside the order sits, when it is more precise than `where` (a CSV line's row). */
  whereOf?: (path: string) => string;
}

/** A problem tied to a file and a place in it, printed as `file: where: path: message`. */
export interface FileProblem {
  file: string;
  where: string;
  problem: Problem;
}

/** What an input reader yields: an order to check, or one unit (an order, a line, a file) that cannot be checked. */
export type InputItem = { kind: 'order'; order: FoundOrder } | InvalidItem;
/** An order, a line, a row or a file that cannot be checked, with every problem found in it. */
export type InvalidItem = { kind: 'invalid'; problems: FileProblem[] };

export function formatFileProblem(p: FileProblem): string {
  return [p.file, p.where, formatProblem(p.problem)].filter((s) => s !== '').join(': ');
}

/** One invalid unit with one problem. */
export function invalid(file: string, where: string, path: string, message: string): InvalidItem {
  return { kind: 'invalid', problems: [{ file, where, problem: { path, message } }] };
}

/**
 * Split a file's text into orders: one JSON object, a JSON array of orders, or NDJSON (one per line).
 * Unreadable JSON is a problem with its line, never a crash. The text is held whole: big batches
 * belong in NDJSON or CSV files, which are streamed.
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

/** The items of a JSON file's text (see ordersFromText), problems first as the old CLI printed them. */
export function* jsonItems(file: string, text: string): Generator<InputItem> {
  const found = ordersFromText(file, text);
  for (const p of found.problems) yield { kind: 'invalid', problems: [p] };
  for (const order of found.orders) yield { kind: 'order', order };
}

/**
 * The format of another Osmocount file (catalog, policy, report) found where an order was
 * expected, so it gets one clear problem instead of a list of missing order fields.
 */
export function foreignFormat(value: unknown): string | null {
  if (typeof value !== 'object' || value === null || !('format' in value)) return null;
  const format = (value as { format: unknown }).format;
  return typeof format === 'string' && format.startsWith('osmocount-') && format !== 'osmocount-order' ? format : null;
}

/**
 * The orders of files read whole (compound and print), file by file. A file that cannot be read, and
 * text that holds no valid order list, go to `problems` as they are met, before the file's orders.
 */
export async function* ordersInFiles(io: CliIo, files: readonly string[], problems: FileProblem[]): AsyncGenerator<FoundOrder> {
  for (const file of files) {
    let text: string;
    try {
      text = await io.readFile(file);
    } catch (e) {
      problems.push({ file, where: '', problem: { path: '(file)', message: `cannot be read (${readError(e)})` } });
      continue;
    }
    const found = ordersFromText(file, text);
    problems.push(...found.problems);
    yield* found.orders;
  }
}
