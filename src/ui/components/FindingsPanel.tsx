import type { Report } from '../../core/report.ts';
import { SEVERITY_TEXT } from '../show.ts';

/**
 * Every finding with its value against its limit and where the limit comes from. Choosing a finding
 * highlights the lines and fields it concerns; choosing it again clears the highlight.
 */
export function FindingsPanel({ report, selected, onSelect }: { report: Report; selected: number | null; onSelect(i: number | null): void }) {
  return (
    <section className="panel findings" aria-labelledby="findings-title">
      <h2 id="findings-title">Findings</h2>
      {report.findings.length === 0 ? <p className="none">No finding under the policy in force.</p> : (
        <ul>
          {report.findings.map((f, i) => (
            <li key={i} className={`finding sev-${f.severity}${selected === i ? ' selected' : ''}`}>
              <button type="button" className="finding-button" aria-pressed={selected === i}
                aria-label={`${SEVERITY_TEXT[f.severity]}: ${f.code}${f.nutrient ? ` ${f.nutrient}` : ''}. Show the lines and fields it concerns`}
                onClick={() => onSelect(selected === i ? null : i)}>
                <span className="sev">{SEVERITY_TEXT[f.severity]}</span>
                <span className="code">{f.code}{f.nutrient ? ` · ${f.nutrient}` : ''}</span>
                {f.lines.length + f.fields.length > 0 ? <span className="concerns">{selected === i ? 'highlighted' : 'show where'}</span> : null}
              </button>
              <p className="msg">{f.message}</p>
              {f.value !== null && f.limit !== null ? <p className="vs">{f.value} against {f.limit} {f.unit}</p> : null}
              <p className="src">Source: {f.source}</p>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
