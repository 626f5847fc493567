import { createContext, useContext } from 'react';
import type { Catalog } from '../../../core/catalog.ts';
import type { Report } from '../../../core/report.ts';
import type { DraftLine } from '../../order/draft.ts';
import type { WorkspaceActions } from '../../order/useOrderWorkspace.ts';

export type ReportLine = Report['lines'][number];

/** One row of the lines table: the line as typed, its errors, and the report's figures for it. */
export interface LineRow {
  key: string;
  index: number;
  line: DraftLine;
  /** "line 2, Dextrose 70% injection": how controls of this line are named for screen readers. */
  name: string;
  /** Typed, uncommitted amount text (null when the cell holds the order's own text). */
  pendingText: string | null;
  /** The engine's problems per field, joined ('' when none). */
  errors: { product: string; amount: string; unit: string; species: string };
  computed: ReportLine | null;
  highlighted: boolean;
  last: boolean;
}

/** What does not change from keystroke to keystroke: the actions and the catalog. */
export interface LinesContextValue {
  actions: WorkspaceActions;
  catalog: Catalog;
}

export const LinesContext = createContext<LinesContextValue | null>(null);

export function useLines(): LinesContextValue {
  const value = useContext(LinesContext);
  if (!value) throw new Error('lines cells must be rendered inside the lines table');
  return value;
}
