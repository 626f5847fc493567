import type { Report } from '../../core/report.ts';
import { show } from '../show.ts';

const W = 340;
const BAR_H = 14;
const LABEL_W = 132;

/**
 * What drives the osmolarity: one stacked bar of every line's share of the bag's particles, drawn to the
 * reported osmolarity against the peripheral limit, then each line as its own bar (largest first).
 * The figures are the report's; only the drawing scale is computed here.
 */
export function ContributionChart({ report }: { report: Report }) {
  const o = report.osmolarity;
  const limit = o.peripheralLimit;
  const scaleMax = Math.max(limit ?? 0, o.reported, 1) * 1.08;
  const px = (mOsmPerL: number) => (W * mOsmPerL) / scaleMax;
  const lines = report.lines.filter((l) => l.mOsm > 0).sort((a, b) => b.mOsm - a.mOsm);
  const maxLine = Math.max(1, ...lines.map((l) => l.mOsm));
  const total = px(o.reported);
  const widths = lines.map((l) => (total * l.sharePercent) / 100);
  const segments = lines.map((l, i) => ({
    key: l.index, w: widths[i] ?? 0, cls: `seg seg-${i % 4}`,
    x: widths.slice(0, i).reduce((a, b) => a + b, 0),
  }));
  const rowsH = lines.length * (BAR_H + 6);
  return (
    <section className="panel chart" aria-labelledby="chart-title">
      <h2 id="chart-title">What drives osmolarity</h2>
      <svg viewBox={`0 0 ${W} 46`} width="100%" role="img" aria-labelledby="chart-title chart-summary">
        {segments.map((s) => <rect key={s.key} x={s.x} y="10" width={Math.max(0, s.w)} height="18" className={s.cls} />)}
        {limit !== null ? (
          <>
            <line x1={px(limit)} x2={px(limit)} y1="4" y2="34" className="gauge-limit" />
            <text x={Math.min(px(limit), W - 4)} y="44" className="chart-note" textAnchor="end">limit {show(limit, 0)}</text>
          </>
        ) : null}
        <text x="0" y="44" className="chart-note">0</text>
      </svg>
      <p id="chart-summary" className="sr-only">
        Reported {show(o.reported, 1)} mOsm/L{limit !== null ? ` against the peripheral limit of ${show(limit, 0)} mOsm/L` : ''}.
        {' '}{lines.map((l) => `${l.name}: ${show(l.mOsm, 1)} mOsm, ${show(l.sharePercent, 1)}%`).join('; ')}.
      </p>
      <svg viewBox={`0 0 ${W} ${rowsH}`} width="100%" aria-hidden="true" className="chart-rows">
        {lines.map((l, i) => {
          const y = i * (BAR_H + 6);
          const w = ((W - LABEL_W - 84) * l.mOsm) / maxLine;
          return (
            <g key={l.index}>
              <text x="0" y={y + BAR_H - 3} className="chart-label">{l.name.length > 22 ? `${l.name.slice(0, 21)}…` : l.name}</text>
              <rect x={LABEL_W} y={y} width={w} height={BAR_H} className={`seg seg-${i % 4}`} />
              <text x={LABEL_W + w + 4} y={y + BAR_H - 3} className="chart-value">{show(l.mOsm, 0)} · {show(l.sharePercent, 1)}%</text>
            </g>
          );
        })}
      </svg>
    </section>
  );
}
