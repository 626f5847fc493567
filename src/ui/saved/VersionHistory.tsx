import type { Catalog } from '../../core/catalog.ts';
import { historyOf, type Change } from '../../store/diff.ts';
import type { OrderVersion } from '../../store/types.ts';
import { VERDICT_TEXT } from '../show.ts';
import { showTime } from './time.ts';
import './saved.css';

const ORIGIN_TEXT = { saved: 'saved', imported: 'imported', copied: 'copied from another order' } as const;

function productName(catalog: Catalog, id: string | undefined): string {
  if (!id) return 'a line';
  return catalog.byId.get(id)?.name ?? id;
}

function ChangeItem({ change, catalog }: { change: Change; catalog: Catalog }) {
  const from = <span className="from">{change.from}</span>;
  const to = <span className="to">{change.to}</span>;
  if (change.field === 'line') {
    const name = productName(catalog, change.product);
    return change.kind === 'added'
      ? <li>Added line {change.lineTo}: {name}, {to}</li>
      : <li>Removed line {change.lineFrom}: {name}, {from}</li>;
  }
  const where = change.product !== undefined ? `${productName(catalog, change.product)}, line ${change.lineTo}, ${change.field}` : change.field;
  if (change.kind === 'added') return <li>{where}: set to {to}</li>;
  if (change.kind === 'removed') return <li>{where}: {from} removed</li>;
  return <li>{where}: {from} → {to}</li>;
}

/** Every version, newest first: who saved it and when, its verdict, its sign-off, and what it changed. */
export function VersionHistory({ versions, catalog }: { versions: readonly OrderVersion[]; catalog: Catalog }) {
  const entries = historyOf(versions);
  if (entries.length === 0) return null;
  return (
    <section className="panel history saved" aria-label="Version history">
      <h2>History</h2>
      <ol>
        {entries.map(({ version: v, changes }) => {
          const verdict = v.check.verdict;
          return (
            <li key={v.n} className={`version${v.signOff ? ' signed' : ''}`}>
              <div>
                <span className="who">Version {v.n}</span>{' '}
                <span className="stamp">{ORIGIN_TEXT[v.origin]} by {v.savedBy ?? 'unknown'} · {showTime(v.savedAt)}</span>
                <span className={`badge ${verdict ?? 'none'}`}>{verdict ? VERDICT_TEXT[verdict].word : 'Not checked'}</span>
                {v.signOff ? <span className="badge signed">Verified by {v.signOff.by} · {showTime(v.signOff.at)}</span> : null}
              </div>
              {v.n === 1 ? null : changes.length === 0 ? (
                <p className="count">No change to the order (re-saved).</p>
              ) : (
                <ul className="changes">{changes.map((c, i) => <ChangeItem key={i} change={c} catalog={catalog} />)}</ul>
              )}
            </li>
          );
        })}
      </ol>
    </section>
  );
}
