import { Fragment } from 'react';
import type { Cell, Table } from './model.ts';

function CellContent({ cell }: { cell: Cell }) {
  if (typeof cell === 'string') return cell;
  return cell.map((part, i) => <Fragment key={i}>{i > 0 ? ' ' : ''}<span className="pr-keep">{part}</span></Fragment>);
}

/** A printout table; figure columns are right-aligned, a muted row (the fill) is set in grey italics. */
export function TableView({ table, className, label }: { table: Table; className: string; label: string }) {
  const cls = (c: number) => (table.numeric[c] ? 'pr-num' : undefined);
  return (
    <table className={`pr-table ${className}`} aria-label={label}>
      <thead>
        <tr>{table.columns.map((c, i) => <th key={i} scope="col" className={cls(i)}>{c}</th>)}</tr>
      </thead>
      <tbody>
        {table.rows.map((r, i) => (
          <tr key={i} className={r.muted ? 'pr-muted' : undefined}>
            {r.cells.map((c, j) => <td key={j} className={cls(j)}><CellContent cell={c} /></td>)}
          </tr>
        ))}
      </tbody>
      {table.foot ? (
        <tfoot>
          <tr>{table.foot.map((c, i) => <td key={i} className={cls(i)}>{c}</td>)}</tr>
        </tfoot>
      ) : null}
    </table>
  );
}

/** Caption–value pairs as a description list. */
export function FieldList({ fields, className }: { fields: readonly { label: string; value: string }[]; className: string }) {
  return (
    <dl className={`pr-fields ${className}`}>
      {fields.map((f, i) => (
        <div key={i}><dt>{f.label}</dt><dd>{f.value}</dd></div>
      ))}
    </dl>
  );
}
