import type { Barcode } from './barcode.ts';

/** Module (narrowest bar) width, in: 13 mil is 2–3 dots on a 203 or 300 dpi label printer. */
const MODULE_IN = 0.013;
/** The widest the symbol may be beside the initials box; longer ids get narrower modules. */
const MAX_WIDTH_IN = 2.2;

/**
 * A barcode drawn from its geometry: stroked bars, no markup injected, no style attribute. Its
 * size is set by SVG attributes (allowed under the app's CSP): 13 mil modules, 0.3 in tall.
 */
export function BarcodeSvg({ barcode }: { barcode: Barcode }) {
  const width = Math.min(barcode.modules * MODULE_IN, MAX_WIDTH_IN);
  return (
    <svg className="pr-barcode" viewBox={barcode.viewBox} width={`${width.toFixed(3)}in`} height="0.3in" preserveAspectRatio="none"
      role="img" aria-label={`${barcode.symbology} barcode of ${barcode.text}`} shapeRendering="crispEdges" xmlns="http://www.w3.org/2000/svg">
      {barcode.paths.map((p, i) => <path key={i} stroke="#000000" strokeWidth={p.strokeWidth} d={p.d} />)}
    </svg>
  );
}
