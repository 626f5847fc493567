import type { Severity } from '../../core/policy.ts';
import type { Verdict } from '../../core/findings.ts';
import type { Barcode } from './barcode.ts';
import type { IngredientGroup } from './ingredients.ts';
import type { LabelSize, Paper } from './options.ts';

// The printout models: plain data with every figure already written out with its unit. Both the
// HTML renderer (CLI) and the React renderer (in-app printing) draw exactly these.

/** A caption and its printed value, e.g. { label: 'Rate', value: '83.33 mL/h' }. */
export interface Field {
  label: string;
  value: string;
}

/** A table cell: text, or parts that each stay on one line (a figure and its unit never split). */
export type Cell = string | readonly string[];

/** A table: header cells, which columns hold figures (right-aligned), body rows, an optional footer row. */
export interface Table {
  columns: string[];
  numeric: boolean[];
  rows: { cells: Cell[]; muted: boolean }[];
  foot: string[] | null;
}

/** The plain text of a cell. */
export function cellText(c: Cell): string {
  return typeof c === 'string' ? c : c.join(' ');
}

/** One finding as the sheet prints it. */
export interface FindingRow {
  severity: Severity;
  severityText: string;
  code: string;
  message: string;
  value: string;
  limit: string;
  source: string;
}

/** The verification sheet: what the second checker reads line by line, then signs. */
export interface SheetModel {
  kind: 'sheet';
  paper: Paper;
  institution: string;
  title: string;
  orderId: string;
  printedAt: string;
  verdict: { verdict: Verdict; word: string; detail: string };
  order: Field[];
  lines: Table;
  osmolarity: { fields: Field[]; statement: string; overPeripheralLimit: boolean };
  totals: { title: string; fields: Field[] }[];
  electrolytes: Table;
  findings: FindingRow[];
  label: Field[];
  sequence: { step: string; lines: string; mix: string; reason: string; source: string }[] | null;
  signOff: string[];
  cautions: string[];
  footnote: string;
}

/** One ingredient row of the bag label. */
export interface IngredientRow {
  group: IngredientGroup;
  groupText: string;
  name: string;
  perKg: string | null;
  perDay: string;
  note: string | null;
}

/** One beyond-use line: under which condition, until when, and what is allowed afterwards. */
export interface BeyondUseRow {
  condition: string;
  until: string;
  duration: string;
  after: string | null;
}

/** The bag label: what the nurse reads at the bedside. */
export interface LabelModel {
  kind: 'label';
  size: LabelSize;
  /** Two-column ingredients and smaller type, for labels under 5 in tall or long orders. */
  compact: boolean;
  /** Set when the content is expected to run onto a second page at this size. */
  fitWarning: string | null;
  institution: string;
  title: string;
  orderId: string;
  patient: { name: string; identifier: string; location: string; weight: string; ageGroup: string };
  route: { text: string; emphatic: boolean; detail: string };
  hold: string | null;
  perKg: boolean;
  ingredients: IngredientRow[];
  volume: Field[];
  compounded: string;
  beyondUse: BeyondUseRow[];
  beyondUseProblem: string | null;
  storage: string;
  filter: string;
  cautions: string[];
  barcode: Barcode | null;
  barcodeProblem: string | null;
  verification: string;
}
