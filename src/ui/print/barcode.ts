import { code128, drawingSVG } from 'bwip-js/browser';
import type { Result } from '../../core/problems.ts';

/** A barcode as plain geometry (bars as stroked paths), drawn by both the HTML and the React renderer. */
export interface Barcode {
  symbology: 'Code 128';
  text: string;
  viewBox: string;
  /** Width of the symbol in modules (narrowest bar widths), quiet zones not included. */
  modules: number;
  paths: { d: string; strokeWidth: string }[];
}

/** Code 128 encodes printable ASCII; the label reads the order id under the bars as well. */
const ENCODABLE = /^[\x20-\x7e]{1,80}$/;

/**
 * The order id as a Code 128 barcode (bwip-js, per-symbology import). An id Code 128 cannot carry
 * (empty, over 80 characters, or outside printable ASCII) is a problem, not a broken barcode.
 */
export function orderBarcode(text: string): Result<Barcode> {
  if (!ENCODABLE.test(text)) {
    return { ok: false, problems: [{ path: 'order', message: 'cannot be drawn as Code 128 (use 1–80 printable ASCII characters); write the order id by hand' }] };
  }
  let svg: string;
  try {
    svg = code128({ bcid: 'code128', text, scale: 1, height: 8, includetext: false }, drawingSVG());
  } catch (e) {
    return { ok: false, problems: [{ path: 'order', message: `cannot be drawn as Code 128 (${(e as Error).message})` }] };
  }
  const viewBox = /viewBox="([\d.\s]+)"/.exec(svg)?.[1] ?? '';
  const [, , w = 0, h = 0] = viewBox.split(/\s+/).map(Number);
  const paths = [...svg.matchAll(/<path stroke="#000000" stroke-width="([\d.]+)" d="([^"]+)"/g)].map((m) => ({ strokeWidth: m[1] ?? '1', d: m[2] ?? '' }));
  if (!viewBox || paths.length === 0 || !(w > 0 && h > 0)) return { ok: false, problems: [{ path: 'order', message: 'barcode drawing failed' }] };
  return { ok: true, value: { symbology: 'Code 128', text, viewBox, modules: w, paths } };
}
