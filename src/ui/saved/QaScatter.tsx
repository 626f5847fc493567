import type { ComparisonRow } from '../../store/qa/stats.ts';
import { scatterLayout } from './scatterLayout.ts';
import './saved.css';

/**
 * Measured osmolality (y) against each calculated figure (x) with the line y = x: points above it are
 * bags the osmometer read higher than calculated. Equal axes, so distance from the line is the bias.
 */
export function QaScatter({ rows }: { rows: readonly ComparisonRow[] }) {
  const l = scatterLayout(rows);
  const lo = l.pad;
  const hi = l.size - l.pad;
  const summary = l.bags === 0
    ? 'No readings yet.'
    : `Measured against calculated osmolality for ${l.bags} bag${l.bags === 1 ? '' : 's'}; ${l.above} of ${l.bags} measured higher than the particle count (above the line y = x). Axes ${l.min} to ${l.max}. The table lists every value.`;
  const scale = (t: number) => lo + ((t - l.min) / (l.max - l.min)) * (hi - lo);
  return (
    <figure className="qa-figure">
      <svg className="scatter" role="img" aria-labelledby="qa-scatter-title qa-scatter-desc" width={l.size} height={l.size} viewBox={`0 0 ${l.size} ${l.size}`}>
        <title id="qa-scatter-title">Measured vs calculated osmolality</title>
        <desc id="qa-scatter-desc">{summary}</desc>
        <rect className="frame" x={lo} y={lo} width={hi - lo} height={hi - lo} />
        {l.ticks.map((t) => (
          <g key={t}>
            <line className="tick" x1={scale(t)} y1={hi} x2={scale(t)} y2={hi + 4} />
            <text x={scale(t)} y={hi + 15} textAnchor="middle">{t}</text>
            <line className="tick" x1={lo - 4} y1={l.size - scale(t)} x2={lo} y2={l.size - scale(t)} />
            <text x={lo - 6} y={l.size - scale(t) + 3} textAnchor="end">{t}</text>
          </g>
        ))}
        <line className="identity" x1={lo} y1={hi} x2={hi} y2={lo} />
        <text x={hi - 4} y={lo + 12} textAnchor="end">y = x</text>
        <text x={l.size / 2} y={l.size - 4} textAnchor="middle">calculated (mOsm/L; predicted mOsm/kg)</text>
        <text x={10} y={l.size / 2} textAnchor="middle" transform={`rotate(-90 10 ${l.size / 2})`}>measured (mOsm/kg)</text>
        {l.points.map((p, i) => p.series === 'predicted'
          ? <rect key={i} className="pt-predicted" x={p.x - 3.5} y={p.y - 3.5} width={7} height={7}><title>{p.label}</title></rect>
          : <circle key={i} className={`pt-${p.series}`} cx={p.x} cy={p.y} r={4}><title>{p.label}</title></circle>)}
      </svg>
      <figcaption className="legend">
        <span><svg width="10" height="10" aria-hidden="true"><circle className="pt-particle" cx="5" cy="5" r="4" /></svg>particle count</span>
        <span><svg width="10" height="10" aria-hidden="true"><circle className="pt-labelSum" cx="5" cy="5" r="3.5" /></svg>label sum</span>
        <span><svg width="10" height="10" aria-hidden="true"><rect className="pt-predicted" x="1.5" y="1.5" width="7" height="7" /></svg>predicted osmolality</span>
      </figcaption>
      <p className="sr-only">{summary}</p>
    </figure>
  );
}
