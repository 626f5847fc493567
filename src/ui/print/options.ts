import type { Catalog } from '../../core/catalog.ts';
import type { Policy } from '../../core/policy.ts';
import type { Result } from '../../core/problems.ts';

export const PAPERS = ['a4', 'letter'] as const;
/** Paper for the verification sheet. */
export type Paper = (typeof PAPERS)[number];

export const PAPER_TEXT: Readonly<Record<Paper, string>> = { a4: 'A4', letter: 'US Letter' };

/** A bag-label size, width × height, in inches or millimetres. */
export interface LabelSize {
  /** `4x6`, `4x4`, or `custom`. */
  id: string;
  width: number;
  height: number;
  unit: 'in' | 'mm';
}

export const LABEL_PRESETS: readonly LabelSize[] = [
  { id: '4x6', width: 4, height: 6, unit: 'in' },
  { id: '4x4', width: 4, height: 4, unit: 'in' },
];

const MM_PER_IN = 25.4;
/** Smallest and largest label the layout is made for, in mm (3 × 3 in up to 8.5 × 14 in). */
export const LABEL_BOUNDS_MM = { min: 76, max: 356 } as const;

/** Display text of a label size, e.g. "4 × 6 in". */
export function labelSizeText(s: LabelSize): string {
  return `${s.width} × ${s.height} ${s.unit}`;
}

function toMm(value: number, unit: 'in' | 'mm'): number {
  return unit === 'in' ? value * MM_PER_IN : value;
}

/**
 * Read a label size: a preset (`4x6`, `4x4`) or a custom `WxHin` / `WxHmm` (e.g. `3.5x5in`,
 * `100x150mm`); a problem with the path when it is not one or is outside the printable range.
 */
export function parseLabelSize(text: string, path = 'label-size'): Result<LabelSize> {
  const t = text.trim().toLowerCase().replace(/\s+/g, '').replace('×', 'x');
  const preset = LABEL_PRESETS.find((p) => p.id === t || `${p.id}in` === t);
  if (preset) return { ok: true, value: preset };
  const m = /^(\d+(?:\.\d+)?)x(\d+(?:\.\d+)?)(in|mm)$/.exec(t);
  if (!m) return { ok: false, problems: [{ path, message: `must be 4x6, 4x4, or a custom size like 3.5x5in or 100x150mm (got "${text}")` }] };
  const unit = m[3] as 'in' | 'mm';
  const width = Number(m[1]);
  const height = Number(m[2]);
  const { min, max } = LABEL_BOUNDS_MM;
  if ([width, height].some((v) => toMm(v, unit) < min - 0.5 || toMm(v, unit) > max + 0.5)) {
    return { ok: false, problems: [{ path, message: `each side must be between 3 in (76 mm) and 14 in (356 mm) (got ${width} × ${height} ${unit})` }] };
  }
  return { ok: true, value: { id: 'custom', width, height, unit } };
}

/** A label size as CSS lengths. */
export function cssSize(s: LabelSize): { width: string; height: string } {
  return { width: `${s.width}${s.unit}`, height: `${s.height}${s.unit}` };
}

/**
 * One step of a suggested mixing sequence, as the verification sheet prints it. The compounding
 * module's sequence steps fit this shape; until one is given, the sheet prints no sequence.
 */
export interface PrintSequenceStep {
  step: number;
  lines: readonly { index: number; name: string }[];
  mixAfter: boolean;
  reason: string;
  source: string;
}

/** Everything a printout needs besides the report. */
export interface PrintOptions {
  /** Institution name printed on both (from settings; fictional in the demo). */
  institution: string;
  paper: Paper;
  labelSize: LabelSize;
  /** When the bag is (or was) compounded: the label's date and the start of its beyond-use time. */
  compoundedAt: Date;
  /** When the sheet is printed. */
  printedAt: Date;
  /** IANA time zone the date/times are printed in (the pharmacy's). */
  timeZone: string;
  /** The catalog the report was checked against (label sequence and units come from its products). */
  catalog: Catalog;
  /** The policy the report was checked against (beyond-use dates and storage come from it). */
  policy: Policy;
  /** The suggested mixing sequence, when the compounding module has produced one. */
  sequence?: readonly PrintSequenceStep[];
}

/** A time zone Intl can print in; otherwise a problem. */
export function checkTimeZone(timeZone: string, path = 'time-zone'): Result<string> {
  try {
    new Intl.DateTimeFormat('en-GB', { timeZone }).format(0);
    return { ok: true, value: timeZone };
  } catch {
    return { ok: false, problems: [{ path, message: `"${timeZone}" is not a known time zone (use an IANA name like Europe/London)` }] };
  }
}

/**
 * Extra CSS a custom label size needs (its page size and width); presets are in print.css. The app
 * adds it through the CSS object model (the Content-Security-Policy forbids inline styles), the
 * CLI writes it into the document's <style>.
 */
export function customLabelCss(s: LabelSize): string {
  if (s.id !== 'custom') return '';
  const { width, height } = cssSize(s);
  return `@page pr-label-custom { size: ${width} ${height}; margin: 0; }\n.pr-label.pr-size-custom { width: ${width}; }\n@media screen { .pr-doc .pr-size-custom { min-height: ${height}; } }\n`;
}
