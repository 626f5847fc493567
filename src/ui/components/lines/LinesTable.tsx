import { useEffect, useMemo, useRef } from 'react';
import { useTable } from '@tanstack/react-table';
import type { Catalog } from '../../../core/catalog.ts';
import { addLine } from '../../order/edits.ts';
import type { ShownReport, Workspace } from '../../order/useOrderWorkspace.ts';
import { show, showAmount } from '../../show.ts';
import { columns, features, NUMERIC_COLUMNS } from './columns.tsx';
import { LinesContext, type LineRow, type LinesContextValue, type ReportLine } from './context.ts';
import { linePath, type LineField } from '../../order/problemIndex.ts';
import { lineCell } from '../../order/useOrderWorkspace.ts';
import { focusCell, useGridKeys } from './useGridKeys.ts';

interface Props {
  ws: Workspace;
  catalog: Catalog;
  figures: ShownReport | null;
  /** Keys of the lines the selected finding concerns. */
  highlighted: ReadonlySet<string>;
}

/** The order's lines: typed amounts on the left, the engine's figures for each line on the right. */
export function LinesTable({ ws, catalog, figures, highlighted }: Props) {
  const { shown, problems, pending, actions } = ws;
  const byKey = useMemo(() => {
    const map = new Map<string, ReportLine>();
    if (figures) for (const l of figures.report.lines) { const k = figures.keys[l.index]; if (k !== undefined) map.set(k, l); }
    return map;
  }, [figures]);
  const data = useMemo<LineRow[]>(() => shown.order.lines.map((line, index) => {
    const key = shown.keys[index] ?? `x${index}`;
    const product = catalog.byId.get(line.product);
    const at = (field: LineField) => problems.at(linePath(index, field));
    return {
      key, index, line,
      name: `line ${index + 1}${product ? `, ${product.name}` : line.product ? `, ${line.product}` : ''}`,
      pendingText: pending?.cell === lineCell(key) ? pending.text : null,
      errors: {
        product: [...at('product'), ...problems.line(index), ...at('fill')].join('; '),
        amount: at('amount').join('; '), unit: at('unit').join('; '), species: at('species').join('; '),
      },
      computed: byKey.get(key) ?? null,
      highlighted: highlighted.has(key),
      last: index === shown.order.lines.length - 1,
    };
  }), [shown, catalog, problems, pending, byKey, highlighted]);
  const extra = figures ? figures.report.lines.filter((l) => l.index >= figures.keys.length) : [];
  const context = useMemo<LinesContextValue>(() => ({ actions, catalog }), [actions, catalog]);
  const table = useTable({ features, columns, data, getRowId: (r) => r.key });
  const onKeyDown = useGridKeys();
  const body = useRef<HTMLTableSectionElement>(null);
  // A line just added gets the focus once it is on screen.
  const focusKey = useRef<string | null>(null);
  useEffect(() => {
    const key = focusKey.current;
    if (key === null) return;
    const i = shown.keys.indexOf(key);
    if (i === -1) return;
    focusKey.current = null;
    focusCell(body.current, i, 'product');
  }, [shown.keys]);

  const add = () => {
    focusKey.current = `l${ws.doc.nextKey}`;
    actions.edit('Add a line', (d) => addLine(d).doc);
  };
  const lineProblems = problems.at('lines');

  return (
    <section className="panel lines-panel" aria-labelledby="lines-title">
      <div className="panel-head">
        <h2 id="lines-title">Lines</h2>
        <button type="button" className="small" onClick={add}>Add line</button>
      </div>
      {lineProblems.length > 0 ? <p className="error">{lineProblems.join('; ')}</p> : null}
      <LinesContext.Provider value={context}>
        <table className="lines" aria-labelledby="lines-title">
          <thead>
            {table.getHeaderGroups().map((g) => (
              <tr key={g.id}>
                {g.headers.map((h) => (
                  <th key={h.id} scope="col" className={`col-${h.column.id}${NUMERIC_COLUMNS.has(h.column.id) ? ' num' : ''}`}>
                    <table.FlexRender header={h} />
                  </th>
                ))}
              </tr>
            ))}
          </thead>
          <tbody ref={body} onKeyDown={onKeyDown}>
            {table.getRowModel().rows.map((row) => {
              const r = row.original;
              const classes = [r.line.fill ? 'fill' : '', r.highlighted ? 'hl' : ''].filter(Boolean).join(' ');
              return (
                <tr key={row.id} className={classes || undefined} data-key={r.key}>
                  {row.getAllCells().map((cell) => (
                    <td key={cell.id} className={`col-${cell.column.id}${NUMERIC_COLUMNS.has(cell.column.id) ? ' num' : ''}`}>
                      <table.FlexRender cell={cell} />
                    </td>
                  ))}
                </tr>
              );
            })}
            {extra.map((l) => (
              <tr key={`alloc-${l.index}`} className="allocated">
                <td colSpan={5}>{l.name} <span className="muted">(added from the ion order)</span></td>
                <td className="num">{l.perDay ? `${showAmount(l.perDay.amount)} ${l.perDay.unit}` : '—'}</td>
                <td className="num">{l.perKgPerDay ? `${showAmount(l.perKgPerDay.amount)} ${l.perKgPerDay.unit}` : '—'}</td>
                <td className="num">{show(l.volumeMl, 2)}</td>
                <td className="num">{show(l.mOsm, 1)}</td>
                <td className="num">{show(l.sharePercent, 1)}%</td>
                <td />
              </tr>
            ))}
          </tbody>
          {figures ? (
            <tfoot>
              <tr>
                <th scope="row" colSpan={7}>Bag{figures.report.lines.some((l) => l.fill) ? ' (filled to volume)' : ''}</th>
                <td className="num">{show(figures.report.volumeMl, 2)}</td>
                <td className="num">{show(figures.report.osmolarity.totalMOsm, 1)}</td>
                <td className="num">100%</td>
                <td />
              </tr>
            </tfoot>
          ) : null}
        </table>
      </LinesContext.Provider>
    </section>
  );
}
