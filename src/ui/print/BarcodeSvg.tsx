import type { Barcode } from './barcode.ts';

/** A barcode drawn from its geometry: stroked bars, no markup injected, no style attribute. */
export function BarcodeSvg({ barcode }: { barcode: Barcode }) {
  return (
    <svg className="pr-barcode" viewBox={barcode.viewBox} role="img" aria-label={`${barcode.symbology} barcode of ${barcode.text}`} shapeRendering="crispEdges" xmlns="http://www.w3.org/2000/svg">
      {barcode.paths.map((p, i) => <path key={i} stroke="#000000" strokeWidth={p.strokeWidth} d={p.d} />)}
    </svg>
  );
}
