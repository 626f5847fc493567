import type { SheetModel } from './model.ts';
import { FieldList, TableView } from './TableView.tsx';

/** The verification sheet, drawn from its model (the same markup prints in the app and from the CLI). */
export function SheetView({ model: m }: { model: SheetModel }) {
  return (
    <article className={`pr-sheet pr-paper-${m.paper}`} aria-label={m.title}>
      <header className="pr-sheet-head">
        <div>
          <p className="pr-inst">{m.institution}</p>
          <h1>{m.title}</h1>
          <p className="pr-meta">Order <strong>{m.orderId}</strong> · printed {m.printedAt}</p>
        </div>
        <p className={`pr-verdict pr-verdict-${m.verdict.verdict}`}>
          <strong>{m.verdict.word}</strong>
          <span>{m.verdict.detail}</span>
        </p>
      </header>

      <section className="pr-block">
        <h2>Patient and order</h2>
        <FieldList fields={m.order} className="pr-grid5" />
      </section>

      <section className="pr-block pr-breakable">
        <h2>Lines: stock, amount, volume to add, particles</h2>
        <TableView table={m.lines} className="pr-lines" label="Order lines" />
      </section>

      <section className="pr-block">
        <h2>Osmolarity</h2>
        <FieldList fields={m.osmolarity.fields} className="pr-grid4" />
        <p className={m.osmolarity.overPeripheralLimit ? 'pr-statement pr-over' : 'pr-statement'}>{m.osmolarity.statement}</p>
      </section>

      <section className="pr-block">
        <h2>Electrolytes</h2>
        <TableView table={m.electrolytes} className="pr-ions" label="Electrolytes" />
      </section>

      <div className="pr-cols3">
        {m.totals.map((g) => (
          <section key={g.title} className="pr-block">
            <h2>{g.title}</h2>
            <FieldList fields={g.fields} className="pr-pairs" />
          </section>
        ))}
      </div>

      <section className="pr-block pr-breakable">
        <h2>Findings</h2>
        {m.findings.length === 0 ? <p className="pr-none">No findings under the policy in force.</p> : (
          <table className="pr-table pr-findings" aria-label="Findings">
            <thead><tr><th scope="col">Severity</th><th scope="col">Finding and source</th><th scope="col" className="pr-num">Value</th><th scope="col" className="pr-num">Limit</th></tr></thead>
            <tbody>
              {m.findings.map((f, i) => (
                <tr key={i} className={`pr-sev-${f.severity}`}>
                  <td className="pr-sev">{f.severityText}</td>
                  <td>
                    <span className="pr-code">{f.code}</span> {f.message}
                    <span className="pr-src pr-finding-src">Source: {f.source}</span>
                  </td>
                  <td className="pr-num">{f.value}</td>
                  <td className="pr-num">{f.limit}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
        <p className={`pr-verdict-line pr-verdict-${m.verdict.verdict}`}>Verdict: <strong>{m.verdict.word}</strong> — {m.verdict.detail}</p>
      </section>

      <section className="pr-block">
        <h2>Label and storage</h2>
        <FieldList fields={m.label} className="pr-pairs pr-wide" />
      </section>

      {m.sequence ? (
        <section className="pr-block pr-breakable">
          <h2>Suggested mixing sequence</h2>
          <ol className="pr-sequence">
            {m.sequence.map((s) => (
              <li key={s.step}>
                <strong>{s.lines}</strong> {s.mix}
                <span className="pr-seq-reason">{s.reason}</span>
                <span className="pr-src pr-finding-src">Source: {s.source}</span>
              </li>
            ))}
          </ol>
        </section>
      ) : null}

      <section className="pr-block pr-signoff" aria-label="Sign-off">
        {m.signOff.map((who) => (
          <div key={who} className="pr-sign">
            <span className="pr-sign-who">{who}</span>
            <span className="pr-sign-line">Name or initials</span>
            <span className="pr-sign-line">Date and time</span>
          </div>
        ))}
      </section>

      <section className="pr-cautions" aria-label="Cautions">
        <ul>{m.cautions.map((c) => <li key={c}>{c}</li>)}</ul>
      </section>
      <footer className="pr-foot">{m.footnote}</footer>
    </article>
  );
}
