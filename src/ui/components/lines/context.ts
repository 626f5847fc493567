import { createContext, useContext } from 'react';
import type { Catalog } from '../../../core/catalog.ts';
import type { Report } from '../../../core/report.ts';
import type { DraftLine } from '../../order/draft.ts';
import type { Workspace } from '../../order/useOrderWorkspace.ts';

export type ReportLine = Report['lines'][number];

/** One row of the lines table: the line as typed, its place and its stable key. */
export interface LineRow {
  key: string;
  index: number;
  line: DraftLine;
}

/** What every cell of the lines table needs: the workspace, the catalog, and the report's figures per line. */
export interface LinesContextValue {
  ws: Workspace;
  catalog: Catalog;
  /** The report line for an order line (by key), from the figures on screen. */
  computed(key: string): ReportLine | null;
  highlighted: ReadonlySet<string>;
  lineCount: number;
}

export const LinesContext = createContext<LinesContextValue | null>(null);

export function useLines(): LinesContextValue {
  const value = useContext(LinesContext);
  if (!value) throw new Error('lines cells must be rendered inside the lines table');
  return value;
}

/** Name of the line's stock for labels ("line 2, Dextrose 70% injection"). */
export function lineName(ctx: LinesContextValue, row: LineRow): string {
  const product = ctx.catalog.byId.get(row.line.product);
  return `line ${row.index + 1}${product ? `, ${product.name}` : row.line.product ? `, ${row.line.product}` : ''}`;
}
