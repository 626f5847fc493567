import { CsvError, parse } from 'csv-parse';
import type { Readable } from 'node:stream';
import { invalid, type FileProblem, type InputItem } from './inputs.ts';
import { readError } from './io.ts';

/**
 * The CSV layout of orders: one row per order line, the rows of one order next to each other,
 * grouped by `order_id`. Order columns may be repeated on every row of the order or filled on
 * its first row only; where repeated they must agree.
 */
export const CSV_ORDER_COLUMNS = ['order_id', 'patient_id', 'patient_name', 'location', 'weight_kg', 'age_group', 'route', 'volume_ml', 'hours', 'order_note'] as const;
export const CSV_LINE_COLUMNS = ['product', 'amount', 'unit', 'species', 'fill', 'note'] as const;
/** Columns the header must have (a cell may still be empty, e.g. the amount of the fill line). */
export const CSV_REQUIRED = ['order_id', 'patient_id', 'weight_kg', 'age_group', 'route', 'volume_ml', 'product', 'amount', 'unit'] as const;

type OrderColumn = (typeof CSV_ORDER_COLUMNS)[number];
type LineColumn = (typeof CSV_LINE_COLUMNS)[number];
type Column = OrderColumn | LineColumn;
const KNOWN: readonly string[] = [...CSV_ORDER_COLUMNS, ...CSV_LINE_COLUMNS];

/** An order's rows as they are read. */
interface Group {
  id: string;
  rows: number[];
  /** Each order column's value and the row it was first given on. */
  order: Partial<Record<OrderColumn, { value: string; row: number }>>;
  lines: Partial<Record<LineColumn, string>>[];
  problems: FileProblem[];
}

function rowsText(rows: readonly number[]): string {
  const first = rows[0] ?? 0;
  const last = rows[rows.length - 1] ?? first;
  return first === last ? `row ${first}` : `rows ${first}-${last}`;
}

/** `fill` cells: true/false in any case, or empty; anything else reaches the schema as text and is named there. */
function fillValue(text: string): unknown {
  const t = text.toLowerCase();
  if (t === 'true') return true;
  if (t === 'false') return false;
  return text;
}

/** The order file a group of rows stands for (empty cells are left out, numbers stay decimal strings). */
function orderOf(g: Group): unknown {
  const o = (c: OrderColumn) => g.order[c]?.value;
  const patient: Record<string, unknown> = { id: o('patient_id'), weightKg: o('weight_kg'), ageGroup: o('age_group') };
  if (o('patient_name') !== undefined) patient.name = o('patient_name');
  if (o('location') !== undefined) patient.location = o('location');
  const order: Record<string, unknown> = { id: g.id, patient, route: o('route') };
  if (o('volume_ml') !== undefined) order.volumeMl = o('volume_ml');
  if (o('hours') !== undefined) order.hours = o('hours');
  if (o('order_note') !== undefined) order.note = o('order_note');
  order.lines = g.lines.map((cells) => {
    const line: Record<string, unknown> = { product: cells.product ?? '' };
    if (cells.amount !== undefined) line.amount = cells.amount;
    if (cells.unit !== undefined) line.unit = cells.unit;
    if (cells.species !== undefined) line.species = cells.species;
    if (cells.fill !== undefined) line.fill = fillValue(cells.fill);
    if (cells.note !== undefined) line.note = cells.note;
    return line;
  });
  return order;
}

function groupItem(file: string, g: Group): InputItem {
  if (g.problems.length > 0) return { kind: 'invalid', problems: g.problems };
  const rows = g.rows;
  return {
    kind: 'order',
    order: {
      file,
      where: rowsText(rows),
      value: orderOf(g),
      whereOf: (path) => {
        const line = /^lines\[(\d+)\]/.exec(path);
        const row = line ? rows[Number(line[1])] : undefined;
        return row === undefined ? rowsText(rows) : `row ${row}`;
      },
    },
  };
}

/** Check the header row; the column of each name, or the problems that stop the file. */
function readHeader(file: string, cells: string[]): { columns: (Column | null)[] } | { problems: FileProblem[] } {
  const names = cells.map((c) => c.trim().toLowerCase());
  const problem = (message: string): FileProblem => ({ file, where: '', problem: { path: '(header)', message } });
  const problems: FileProblem[] = [];
  const quote = (xs: readonly string[]) => xs.map((x) => `"${x}"`).join(', ');
  const missing = CSV_REQUIRED.filter((c) => !names.includes(c));
  if (missing.length > 0) {
    const hint = names.length === 1 && /[;\t]/.test(cells[0] ?? '') ? ' (columns must be separated by commas)' : '';
    problems.push(problem(`missing column${missing.length > 1 ? 's' : ''} ${quote(missing)}${hint}; an order CSV needs ${CSV_REQUIRED.join(', ')}`));
  }
  const unknown = names.filter((n) => n !== '' && !KNOWN.includes(n));
  if (unknown.length > 0) problems.push(problem(`unknown column${unknown.length > 1 ? 's' : ''} ${quote(unknown)}; known columns are ${KNOWN.join(', ')}`));
  const twice = names.filter((n, i) => n !== '' && names.indexOf(n) !== i);
  if (twice.length > 0) problems.push(problem(`column${twice.length > 1 ? 's' : ''} ${quote(twice)} given twice`));
  if (problems.length > 0) return { problems };
  return { columns: names.map((n) => (n === '' ? null : (n as Column))) };
}

/**
 * The orders of a CSV stream in the documented layout (see CSV_ORDER_COLUMNS), parsed by
 * csv-parse as the bytes arrive: quoted fields, a byte-order mark and `\r\n` endings are read as
 * a spreadsheet writes them, and a stray quote inside an unquoted cell is kept. Rows are numbered
 * as lines of the file (the header is row 1); a problem in an order line names that line's row.
 * An order whose id comes back after other orders, whose repeated order columns disagree, or that
 * has a row with the wrong number of fields, is not checked.
 */
export async function* csvItems(file: string, input: Readable): AsyncGenerator<InputItem> {
  const parser = input.pipe(parse({ bom: true, info: true, skip_empty_lines: true, trim: true, relax_column_count: true, relax_quotes: true }));
  input.on('error', (e) => parser.destroy(e));
  let columns: (Column | null)[] | null = null;
  let group: Group | null = null;
  let lastRow = 0;
  /** The rows of every order already read: an id that comes back is an error, not a second order. */
  const seen = new Map<string, string>();
  try {
    for await (const { record, info } of parser as AsyncIterable<{ record: string[]; info: { lines: number } }>) {
      const row = info.lines;
      lastRow = row;
      if (columns === null) {
        const header = readHeader(file, record);
        if ('problems' in header) {
          yield { kind: 'invalid', problems: header.problems };
          return;
        }
        columns = header.columns;
        continue;
      }
      const cells: Partial<Record<Column, string>> = {};
      columns.forEach((c, i) => {
        const v = record[i]?.trim();
        if (c !== null && v !== undefined && v !== '') cells[c] = v;
      });
      const id = cells.order_id;
      if (id === undefined) {
        yield invalid(file, `row ${row}`, 'order_id', 'is empty: every row names the order it belongs to');
        continue;
      }
      if (group && group.id !== id) {
        seen.set(group.id, rowsText(group.rows));
        yield groupItem(file, group);
        group = null;
      }
      if (!group) {
        group = { id, rows: [], order: {}, lines: [], problems: [] };
        const before = seen.get(id);
        if (before !== undefined) {
          group.problems.push({ file, where: `row ${row}`, problem: { path: 'order_id', message: `"${id}" already had ${before}: the rows of one order must be next to each other (sort the file by order_id); the earlier part was checked alone and its report is incomplete` } });
        }
      }
      const g: Group = group;
      if (record.length !== columns.length) {
        g.problems.push({ file, where: `row ${row}`, problem: { path: '(row)', message: `has ${record.length} fields where the header has ${columns.length} (a comma inside a field needs "quotes")` } });
      }
      g.rows.push(row);
      for (const c of CSV_ORDER_COLUMNS) {
        const v = cells[c];
        if (v === undefined) continue;
        const first = g.order[c];
        if (!first) g.order[c] = { value: v, row };
        else if (first.value !== v) g.problems.push({ file, where: `row ${row}`, problem: { path: c, message: `"${v}" differs from "${first.value}" on row ${first.row} of the same order` } });
      }
      const line: Partial<Record<LineColumn, string>> = {};
      for (const c of CSV_LINE_COLUMNS) if (cells[c] !== undefined) line[c] = cells[c];
      g.lines.push(line);
    }
  } catch (e) {
    const pending = group ? ` Order "${group.id}" (${rowsText(group.rows)}) was not checked.` : '';
    const what = e instanceof CsvError ? `is not valid CSV (${e.message})` : `cannot be read to its end (${readError(e)})`;
    yield invalid(file, `row ${(e as { lines?: number }).lines ?? lastRow + 1}`, '(file)', `${what}; ${lastRow <= 1 ? 'no order in it was checked' : `nothing after row ${lastRow} was checked`}.${pending}`);
    return;
  } finally {
    parser.destroy();
    input.destroy();
  }
  if (columns === null && group === null) {
    yield invalid(file, '', '(file)', `is empty: expected a header row (${CSV_REQUIRED.join(', ')}) and one row per order line`);
    return;
  }
  if (group) yield groupItem(file, group);
}
