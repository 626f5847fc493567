// The lines table's columns (TanStack Table v9). Cells are components that read the workspace from
// context, so the column list is built once, at module scope, and inputs keep their focus across edits.
import { createColumnHelper, tableFeatures } from '@tanstack/react-table';
import type { LineRow } from './context.ts';
import { AmountCell, DoseCell, FigureCell, MoveCell, ProductCell, RemoveCell, SpeciesCell, UnitCell } from './cells.tsx';

export const features = tableFeatures({});
const helper = createColumnHelper<typeof features, LineRow>();

/** Column ids whose cells are numbers (right-aligned). */
export const NUMERIC_COLUMNS = new Set(['amount', 'perDay', 'perKg', 'volumeMl', 'mOsm', 'share']);

export const columns = helper.columns([
  helper.display({ id: 'move', header: '#', cell: (c) => <MoveCell row={c.row.original} /> }),
  helper.display({ id: 'product', header: 'Stock', cell: (c) => <ProductCell row={c.row.original} /> }),
  helper.display({ id: 'amount', header: 'Amount', cell: (c) => <AmountCell row={c.row.original} /> }),
  helper.display({ id: 'unit', header: 'Unit', cell: (c) => <UnitCell row={c.row.original} /> }),
  helper.display({ id: 'species', header: 'Counts', cell: (c) => <SpeciesCell row={c.row.original} /> }),
  helper.display({ id: 'perDay', header: 'Per day', cell: (c) => <DoseCell row={c.row.original} per="day" /> }),
  helper.display({ id: 'perKg', header: 'Per kg/day', cell: (c) => <DoseCell row={c.row.original} per="kg" /> }),
  helper.display({ id: 'volumeMl', header: 'Stock mL', cell: (c) => <FigureCell row={c.row.original} figure="volumeMl" /> }),
  helper.display({ id: 'mOsm', header: 'mOsm', cell: (c) => <FigureCell row={c.row.original} figure="mOsm" /> }),
  helper.display({ id: 'share', header: 'Share', cell: (c) => <FigureCell row={c.row.original} figure="sharePercent" /> }),
  helper.display({ id: 'remove', header: () => <span className="sr-only">Remove</span>, cell: (c) => <RemoveCell row={c.row.original} /> }),
]);
