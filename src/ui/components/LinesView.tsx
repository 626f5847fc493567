import type { Report } from '../../core/report.ts';
import { show } from '../show.ts';

type Line = Report['lines'][number];

function ordered(l: Line): string {
  if (l.fill) return 'to volume';
  if (!l.perDay) return '—';
  const species = l.species && (l.unit?.startsWith('mEq') || l.unit?.startsWith('mmol')) ? ` ${l.species}` : '';
  return `${l.perDay.amount} ${l.perDay.unit}${species}`;
}

function perKg(l: Line): string {
  if (!l.perKgPerDay) return '—';
  return `${show(l.perKgPerDay.amount, 3)} ${l.perKgPerDay.unit}`;
}

/** The order's lines with the stock volume each needs and the particles each brings. */
export function LinesView({ report }: { report: Report }) {
  const max = Math.max(1, ...report.lines.map((l) => l.sharePercent));
  return (
    <table className="lines" aria-label="Order lines">
      <thead>
        <tr>
          <th scope="col">Stock</th>
          <th scope="col" className="num">Ordered per day</th>
          <th scope="col" className="num">Per kg per day</th>
          <th scope="col" className="num">Stock volume (mL)</th>
          <th scope="col" className="num">mOsm</th>
          <th scope="col">Share of osmolarity</th>
        </tr>
      </thead>
      <tbody>
        {report.lines.map((l) => (
          <tr key={l.index} className={l.fill ? 'fill' : undefined}>
            <th scope="row">{l.name}{l.strength ? <span className="strength"> · {l.strength}</span> : null}</th>
            <td className="num">{ordered(l)}</td>
            <td className="num">{perKg(l)}</td>
            <td className="num">{show(l.volumeMl, 2)}</td>
            <td className="num">{show(l.mOsm, 1)}</td>
            <td>
              <svg className="share" width="120" height="10" role="img" aria-label={`${show(l.sharePercent, 1)} percent`}>
                <rect x="0" y="0" width="120" height="10" className="share-track" />
                <rect x="0" y="0" width={(120 * l.sharePercent) / max} height="10" className="share-bar" />
              </svg>
              <span className="share-text">{show(l.sharePercent, 1)}%</span>
            </td>
          </tr>
        ))}
      </tbody>
      <tfoot>
        <tr>
          <th scope="row">Bag</th>
          <td /><td />
          <td className="num">{show(report.volumeMl, 2)}</td>
          <td className="num">{show(report.osmolarity.totalMOsm, 1)}</td>
          <td />
        </tr>
      </tfoot>
    </table>
  );
}
