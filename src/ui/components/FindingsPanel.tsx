import type { Report } from '../../core/report.ts';
import { SEVERITY_TEXT } from '../show.ts';

const RANK = { block: 0, warn: 1, info: 2 } as const;

/**
 * Every finding, holds first, then reviews, then notes, with its value against its limit and where the
 * limit comes from. Choosing a finding highlights the lines and fields it concerns; again clears it.
 */
export function FindingsPanel({ report, selected, onSelect }: { report: Report; selected: number | null; onSelect(i: number | null): void }) {
  const order = report.findings.map((_, i) => i).sort((a, b) => RANK[report.findings[a]!.severity] - RANK[report.findings[b]!.severity] || a - b);
  const serious = order.filter((i) => report.findings[i]!.severity !== 'info');
  const notes = order.filter((i) => report.findings[i]!.severity === 'info');
  const item = (i: number) => {
    const f = report.findings[i]!;
    const where = f.lines.length + f.fields.length > 0;
    return (
      <li key={i} className={`finding sev-${f.severity}${selected === i ? ' selected' : ''}`}>
        <button type="button" className="finding-button" aria-pressed={selected === i} disabled={!where}
          onClick={() => onSelect(selected === i ? null : i)}>
          <span className="sev">{SEVERITY_TEXT[f.severity]}</span>
          <span className="code">{f.code}{f.nutrient ? ` · ${f.nutrient}` : f.screen ? ` · ${f.screen}` : ''}</span>
          {where ? <span className="concerns">{selected === i ? 'highlighted' : 'show where'}</span> : null}
        </button>
        <p className="msg">{f.message}</p>
        {f.value !== null && f.limit !== null ? <p className="vs">{f.value} against {f.limit} {f.unit}</p> : null}
        <p className="src">Source: {f.source}</p>
      </li>
    );
  };
  return (
    <section className="panel findings" aria-labelledby="findings-title">
      <h2 id="findings-title">Findings</h2>
      {report.findings.length === 0 ? <p className="none">No finding under the policy in force.</p> : null}
      {serious.length > 0 ? <ul>{serious.map(item)}</ul> : null}
      {notes.length > 0 ? (
        // Notes are open when nothing holds the bag back or needs review: then they are what there is to read.
        <details className="notes" key={serious.length > 0 ? 'closed' : 'open'} open={serious.length === 0 || undefined}>
          <summary>{notes.length} note{notes.length === 1 ? '' : 's'} (within range, or for information)</summary>
          <ul>{notes.map(item)}</ul>
        </details>
      ) : null}
    </section>
  );
}
