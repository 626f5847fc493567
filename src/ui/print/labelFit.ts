import type { IngredientRow } from './model.ts';
import type { LabelSize } from './options.ts';

// How tall a label's content will print, estimated from its text, so the model can pick the regular
// or the compact (two-column) layout and warn when even that would run onto a second page.
// Heights are CSS px (96 per inch) for print.css, measured in Chromium; text widths use the advance
// widths of DejaVu Sans (the widest of the usual sans-serif fonts, so other fonts only wrap less).
// test/e2e/print.e2e.mjs checks that a label without a warning prints on one page.

/** DejaVu Sans advance widths, 1/1000 em, for ASCII 32–126 (regular, then bold). */
const ADVANCE = {
  regular: [318, 401, 460, 838, 636, 950, 780, 275, 390, 390, 500, 838, 318, 361, 318, 337, 636, 636, 636, 636, 636, 636, 636, 636, 636, 636, 337, 337, 838, 838, 838, 531, 1000, 684, 686, 698, 770, 632, 575, 775, 752, 295, 295, 656, 557, 863, 748, 787, 603, 787, 695, 635, 611, 732, 684, 989, 685, 611, 685, 390, 337, 390, 838, 500, 500, 613, 635, 550, 635, 615, 352, 635, 634, 278, 278, 579, 278, 974, 634, 612, 635, 635, 411, 521, 392, 634, 592, 818, 592, 592, 525, 636, 337, 636, 838],
  bold: [348, 456, 521, 838, 696, 1002, 872, 306, 457, 457, 523, 838, 380, 415, 380, 365, 696, 696, 696, 696, 696, 696, 696, 696, 696, 696, 400, 400, 838, 838, 838, 580, 1000, 774, 762, 734, 830, 683, 683, 821, 837, 372, 372, 775, 637, 995, 837, 850, 733, 850, 770, 720, 682, 812, 774, 1103, 771, 724, 725, 457, 365, 457, 838, 500, 500, 675, 716, 593, 716, 678, 435, 716, 712, 343, 343, 665, 343, 1042, 712, 687, 716, 716, 493, 595, 478, 712, 652, 924, 645, 652, 582, 712, 365, 712, 838],
} as const;

/** Width of a text in points at a type size. Characters outside ASCII count as a wide letter. */
export function textWidthPt(text: string, sizePt: number, bold = false): number {
  const table = bold ? ADVANCE.bold : ADVANCE.regular;
  let em = 0;
  for (const ch of text) {
    const c = ch.codePointAt(0) ?? 0;
    em += (c >= 32 && c <= 126 ? table[c - 32] : undefined) ?? 800;
  }
  return (em / 1000) * sizePt;
}

/** Lines a text takes in a column, at least 1 unless empty; wrapping at word ends wastes about a tenth of each line. */
function lines(text: string, widthPt: number, sizePt: number, bold = false): number {
  if (text === '') return 0;
  const width = textWidthPt(text, sizePt, bold);
  return width <= widthPt ? 1 : Math.ceil((width * 1.12) / widthPt);
}

interface Layout {
  /** Everything but the ingredient rows, for a one-line patient name, a plain route and a 2-in-1. */
  base: number;
  emphaticRoute: number;
  threeInOne: number;
  hold: number;
  namePt: number;
  nameLinePx: number;
  /** Page width taken by padding (and the column gap), pt; type sizes and line heights of a row. */
  sidePt: number;
  rowPt: number;
  notePt: number;
  rowPx: number;
  notePx: number;
  padPx: number;
  groupPx: number;
}

const REGULAR: Layout = { base: 346, emphaticRoute: 18, threeInOne: 12, hold: 20, namePt: 13, nameLinePx: 17, sidePt: 21.6, rowPt: 8.4, notePt: 6.6, rowPx: 13.5, notePx: 10.6, padPx: 1.4, groupPx: 1.5 };
const COMPACT: Layout = { base: 245, emphaticRoute: 22, threeInOne: 10, hold: 19, namePt: 11, nameLinePx: 17, sidePt: 14.4 + 10, rowPt: 7, notePt: 6, rowPx: 10.7, notePx: 7, padPx: 1.1, groupPx: 1 };

function rowHeight(r: IngredientRow, l: Layout, columnPt: number, compact: boolean): number {
  const amounts = [r.perKg, r.perDay].filter((a): a is string => a !== null);
  // Regular layout: the per-kg and per-day amounts sit in columns at least 1.1 in and 0.9 in wide (print.css).
  const minPt = [r.perKg === null ? 0 : 79.2, 64.8];
  const widths = [r.perKg, r.perDay].map((a, i) => (a === null ? null : Math.max(textWidthPt(a, l.rowPt, true), compact ? 0 : minPt[i] ?? 0)));
  const present = widths.filter((w): w is number => w !== null);
  const amountPt = compact ? Math.max(...present) : present.reduce((sum, w) => sum + w, 0) + (present.length - 1) * 8;
  const namePt = Math.max(columnPt - amountPt - (compact ? 4 : 6), columnPt * 0.3);
  const left = lines(r.name, namePt, l.rowPt) * l.rowPx + lines(r.note ?? '', namePt, l.notePt) * l.notePx;
  const right = (compact ? amounts.length : 1) * l.rowPx;
  return Math.max(left, right) + l.padPx;
}

/** What the estimate needs to know about a label. */
export interface LabelParts {
  patientName: string;
  emphaticRoute: boolean;
  threeInOne: boolean;
  /** The label carries the hold banner. */
  hold: boolean;
  ingredients: readonly IngredientRow[];
}

/** The estimate's pieces, px: everything but the list, each ingredient row, the list (one or two columns). */
export function estimateParts(parts: LabelParts, size: LabelSize, compact: boolean): { fixed: number; rows: number[]; list: number } {
  const widthPt = toIn(size.width, size.unit) * 72;
  const l = compact ? COMPACT : REGULAR;
  return pieces(parts, l, widthPt, compact);
}

function pieces(parts: LabelParts, l: Layout, widthPt: number, compact: boolean): { fixed: number; rows: number[]; list: number } {
  const contentPt = widthPt - l.sidePt;
  // Text-heavy parts (dates, storage, cautions) wrap a little more on a label narrower than 4 in.
  const narrow = 1 + Math.max(0, (288 - l.sidePt) / contentPt - 1) / 4;
  const fixed = l.base * narrow + (parts.emphaticRoute ? l.emphaticRoute : 0) + (parts.threeInOne ? l.threeInOne : 0) + (parts.hold ? l.hold : 0)
    + (lines(parts.patientName, contentPt, l.namePt, true) - 1) * l.nameLinePx;
  const columnPt = compact ? contentPt / 2 : contentPt;
  const rows = parts.ingredients.map((r, i) => rowHeight(r, l, columnPt, compact) + (i > 0 && parts.ingredients[i - 1]?.group !== r.group ? l.groupPx : 0));
  const list = compact ? twoColumns(rows) : rows.reduce((a, b) => a + b, 0);
  return { fixed: fixed + 12, rows, list };
}

/** Height of rows balanced into two columns without splitting a row: the best split point. */
function twoColumns(rows: readonly number[]): number {
  const total = rows.reduce((a, b) => a + b, 0);
  let best = total;
  let first = 0;
  for (const r of rows) {
    first += r;
    best = Math.min(best, Math.max(first, total - first));
  }
  return best;
}

/** The estimate with its safety margin: a few px, and a twentieth of the list (rows wrap unevenly). */
function estimate(parts: LabelParts, l: Layout, widthPt: number, compact: boolean): number {
  const p = pieces(parts, l, widthPt, compact);
  return p.fixed + p.list * 1.05 + 6;
}

/** The layout a label gets and whether its content is expected to fit on one page. */
export interface LabelFit {
  compact: boolean;
  fits: boolean;
  /** Estimated content height and the page's usable height, CSS px. */
  estimatePx: number;
  pagePx: number;
}

const PX_PER_IN = 96;
const toIn = (v: number, unit: 'in' | 'mm') => (unit === 'in' ? v : v / 25.4);

/**
 * The regular layout on labels at least 5 in tall when it fits, else the compact one; `fits` is
 * false when even the compact layout is expected to overflow (the caller warns: use a larger label).
 * Example: the 10-ingredient adult demo fits 4 × 6 in regular and 4 × 4 in compact.
 */
export function labelFit(parts: LabelParts, size: LabelSize): LabelFit {
  const heightIn = toIn(size.height, size.unit);
  const widthPt = toIn(size.width, size.unit) * 72;
  const pagePx = heightIn * PX_PER_IN - 4;
  const regular = estimate(parts, REGULAR, widthPt, false);
  if (heightIn >= 5 - 0.005 && regular <= pagePx) return { compact: false, fits: true, estimatePx: Math.round(regular), pagePx: Math.round(pagePx) };
  const compact = estimate(parts, COMPACT, widthPt, true);
  return { compact: true, fits: compact <= pagePx, estimatePx: Math.round(compact), pagePx: Math.round(pagePx) };
}
