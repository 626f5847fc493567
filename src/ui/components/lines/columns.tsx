// The lines table's columns (TanStack Table v9). Built once at module scope; each cell reads its row's
// view model, and input cells are memoized components, so inputs keep their focus across edits.
import { createColumnHelper, tableFeatures } from '@tanstack/react-table';
import type { LineRow } from './context.ts';
import { AmountCell, DoseCell, FigureCell, MoveCell, ProductCell, RemoveCell, SpeciesCell, UnitCell } from './cells.tsx';

export const features = tableFeatures({});
const helper = createColumnHelper<typeof features, LineRow>();

/** Column ids whose cells are numbers (right-aligned). */
export const NUMERIC_COLUMNS = new Set(['amount', 'perDay', 'perKg', 'volumeMl', 'mOsm', 'share']);

export const columns = helper.columns([
  helper.display({ id: 'move', header: '#', cell: ({ row: { original: r } }) => <MoveCell index={r.index} name={r.name} last={r.last} /> }),
  helper.display({ id: 'product', header: 'Stock', cell: ({ row: { original: r } }) => <ProductCell index={r.index} product={r.line.product} error={r.errors.product} /> }),
  helper.display({
    id: 'amount', header: 'Amount',
    cell: ({ row: { original: r } }) => <AmountCell index={r.index} rowKey={r.key} name={r.name} fill={r.line.fill === true} text={r.pendingText ?? r.line.amount ?? ''} error={r.errors.amount} />,
  }),
  helper.display({ id: 'unit', header: 'Unit', cell: ({ row: { original: r } }) => <UnitCell index={r.index} name={r.name} line={r.line} error={r.errors.unit} /> }),
  helper.display({ id: 'species', header: 'Counts', cell: ({ row: { original: r } }) => <SpeciesCell index={r.index} name={r.name} line={r.line} error={r.errors.species} /> }),
  helper.display({ id: 'perDay', header: 'Per day', cell: (c) => <DoseCell row={c.row.original} per="day" /> }),
  helper.display({ id: 'perKg', header: 'Per kg/day', cell: (c) => <DoseCell row={c.row.original} per="kg" /> }),
  helper.display({ id: 'volumeMl', header: 'Stock mL', cell: (c) => <FigureCell row={c.row.original} figure="volumeMl" /> }),
  helper.display({ id: 'mOsm', header: 'mOsm', cell: (c) => <FigureCell row={c.row.original} figure="mOsm" /> }),
  helper.display({ id: 'share', header: 'Share', cell: (c) => <FigureCell row={c.row.original} figure="sharePercent" /> }),
  helper.display({ id: 'remove', header: () => <span className="sr-only">Remove</span>, cell: ({ row: { original: r } }) => <RemoveCell index={r.index} name={r.name} /> }),
]);
