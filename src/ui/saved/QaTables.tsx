import type { ComparisonRow, SummaryRow } from '../../store/qa/stats.ts';
import { show, showOr } from '../show.ts';
import './saved.css';

const SYSTEM_TEXT = { '2-in-1': '2-in-1', '3-in-1': '3-in-1' } as const;
const BAND_TEXT = { adult: 'Adult', pediatric: 'Pediatric', neonatal: 'Neonatal' } as const;
const signed = (n: number) => (n > 0 ? `+${show(n, 1)}` : show(n, 1));

/** Mean bias and spread by formula type and calculated figure. */
export function QaSummaryTable({ rows }: { rows: readonly SummaryRow[] }) {
  if (rows.length === 0) return <p className="none">No readings yet: record a measured osmolality for a saved bag.</p>;
  return (
    <table className="saved-table" aria-label="Bias by formula type">
      <thead>
        <tr>
          <th scope="col">Formula</th><th scope="col">Calculated figure</th><th scope="col" className="num">Bags</th>
          <th scope="col" className="num">Mean bias</th><th scope="col" className="num">SD</th>
          <th scope="col" className="num">Mean bias %</th><th scope="col" className="num">95% limits of agreement</th>
        </tr>
      </thead>
      <tbody>
        {rows.map((r) => (
          <tr key={`${r.ageBand}|${r.system}|${r.key}`}>
            <th scope="row">{BAND_TEXT[r.ageBand]} {SYSTEM_TEXT[r.system]}</th>
            <td>{r.label}</td>
            <td className="num">{r.n}</td>
            <td className="num">{signed(r.meanBias)}</td>
            <td className="num">{showOr(r.sd, 1)}</td>
            <td className="num">{r.meanRelativePercent === null ? '—' : `${signed(r.meanRelativePercent)} %`}</td>
            <td className="num">{r.limitsLow === null || r.limitsHigh === null ? '— (one bag)' : `${show(r.limitsLow, 1)} to ${show(r.limitsHigh, 1)}`}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/** Every reading with each calculated figure and its difference. */
export function QaReadingsTable({ rows, onRemove }: { rows: readonly ComparisonRow[]; onRemove(id: string): void }) {
  if (rows.length === 0) return null;
  const keys = [...new Map(rows.flatMap((r) => r.figures.map((f) => [f.key, f.label] as const))).entries()];
  return (
    <table className="saved-table" aria-label="Readings">
      <thead>
        <tr>
          <th scope="col">Measured on</th><th scope="col">Bag</th><th scope="col">Formula</th><th scope="col" className="num">Measured</th>
          {keys.map(([k, label]) => <th key={k} scope="col" className="num">{label} (difference)</th>)}
          <th scope="col">Method</th><th scope="col"><span className="sr-only">Actions</span></th>
        </tr>
      </thead>
      <tbody>
        {rows.map((r) => {
          const byKey = new Map(r.figures.map((f) => [f.key, f]));
          return (
            <tr key={r.entry.id}>
              <td className="nowrap">{r.entry.measuredOn}</td>
              <th scope="row" className="nowrap">{r.entry.orderId} v{r.entry.version}</th>
              <td>{BAND_TEXT[r.entry.ageBand]} {r.entry.system}</td>
              <td className="num">{show(r.measured, 1)}</td>
              {keys.map(([k]) => {
                const f = byKey.get(k);
                return <td key={k} className="num">{f ? `${show(f.calculated, 1)} (${signed(f.difference)})` : '—'}</td>;
              })}
              <td>{r.entry.method}{r.entry.instrument ? `, ${r.entry.instrument}` : ''}</td>
              <td><button type="button" onClick={() => onRemove(r.entry.id)} aria-label={`Remove reading ${r.entry.orderId} ${r.entry.measuredOn}`}>Remove</button></td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}
