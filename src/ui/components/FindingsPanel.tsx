import type { Report } from '../../core/report.ts';
import { SEVERITY_TEXT, VERDICT_TEXT } from '../show.ts';

/** The verdict, then every finding with its value against its limit and where the limit comes from. */
export function FindingsPanel({ report }: { report: Report }) {
  const v = VERDICT_TEXT[report.verdict];
  return (
    <section className="panel findings" aria-labelledby="findings-title">
      <h2 id="findings-title">Findings</h2>
      <p className={`verdict verdict-${report.verdict}`} data-testid="verdict" role="status">
        <strong>{v.word}</strong> — {v.detail}
      </p>
      {report.findings.length === 0 ? <p className="none">No finding under the policy in force.</p> : (
        <ul>
          {report.findings.map((f, i) => (
            <li key={i} className={`finding sev-${f.severity}`}>
              <span className="sev">{SEVERITY_TEXT[f.severity]}</span>
              <span className="code">{f.code}{f.nutrient ? ` · ${f.nutrient}` : ''}</span>
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
