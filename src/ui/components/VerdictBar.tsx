import type { Report } from '../../core/report.ts';
import { ROUTE_TEXT, show, VERDICT_TEXT } from '../show.ts';

interface Props {
  report: Report | null;
  stale: boolean;
  problemCount: number;
}

/** The overall verdict and the reported osmolarity, always in view (sticky under the top bar). */
export function VerdictBar({ report, stale, problemCount }: Props) {
  if (!report) {
    return (
      <div className="verdict-bar verdict-none" role="status" data-testid="verdict">
        <strong>No figures yet</strong> — the order has {problemCount} problem{problemCount === 1 ? '' : 's'} to correct (shown by each field).
      </div>
    );
  }
  const v = VERDICT_TEXT[report.verdict];
  const limit = report.osmolarity.peripheralLimit;
  return (
    <div className={`verdict-bar verdict-${report.verdict}${stale ? ' is-stale' : ''}`}>
      <p className="verdict-word" role="status" data-testid="verdict"><strong>{v.word}</strong> — {v.detail}</p>
      <p className="verdict-osm">
        {show(report.osmolarity.reported, 1)} mOsm/L{limit !== null ? ` · peripheral limit ${show(limit, 0)}` : ''} · {ROUTE_TEXT[report.route]}
      </p>
      {stale ? (
        <p className="stale-note" role="alert">
          Showing the last valid figures: the order has {problemCount} problem{problemCount === 1 ? '' : 's'} (shown by each field).
        </p>
      ) : null}
    </div>
  );
}
