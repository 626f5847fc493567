import { qaCsv } from '../../store/qa/csv.ts';
import { qaComparisonRows, qaSummaryRows } from '../../store/qa/stats.ts';
import { downloadText } from './files.ts';
import { QaForm } from './QaForm.tsx';
import { QaScatter } from './QaScatter.tsx';
import { QaReadingsTable, QaSummaryTable } from './QaTables.tsx';
import { useQaLog } from './useQaLog.ts';
import './saved.css';

/** The osmolality QA log: record readings, compare them with the calculated figures, export as CSV. */
export function QaLogPanel({ by }: { by: string | null }) {
  const qa = useQaLog();
  const rows = qaComparisonRows(qa.entries);
  const summary = qaSummaryRows(qa.entries);
  return (
    <section className="panel saved qa" aria-label="Osmolality QA log">
      <h2>Osmolality QA log</h2>
      <p className="note">
        Measured osmolality (mOsm/kg, osmometer) against the calculated osmolarity (mOsm/L) of the same bag. They are
        not the same quantity: calculated osmolarity usually under-estimates measured osmolality in concentrated PN
        (Borenstein 2018; JPEN 2016). Bias = measured − calculated; spread = SD of the differences; limits of agreement
        = bias ± 1.96 SD (Bland &amp; Altman 1986). These figures describe this pharmacy’s own bags; local policy and the
        pharmacist decide what to do with them.
      </p>
      <QaForm onRecord={(key, n, input) => qa.record(key, n, input, by)} />
      <div className="qa-grid">
        <div>
          <h3>Bias and spread by formula type</h3>
          <QaSummaryTable rows={summary} />
          <div className="row">
            <button type="button" disabled={qa.entries.length === 0} onClick={() => downloadText('osmocount-qa-log.csv', qaCsv(qa.entries), 'text/csv')}>Export the QA log (CSV)</button>
          </div>
        </div>
        <QaScatter rows={rows} />
      </div>
      <h3>Readings</h3>
      <QaReadingsTable rows={rows} onRemove={(id) => void qa.remove(id)} />
    </section>
  );
}
