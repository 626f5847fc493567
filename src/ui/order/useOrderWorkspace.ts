// The order workspace's state: the edit history, the one cell being typed into, and the engine's
// verdict on what is on screen. Figures stay on the last valid report while the order has problems.
import { useMemo, useReducer, useState } from 'react';
import { checkOrder } from '../../core/evaluate.ts';
import type { Catalog } from '../../core/catalog.ts';
import type { Policy } from '../../core/policy.ts';
import type { Report } from '../../core/report.ts';
import { headerValue, toOrderFile, type HeaderField, type OrderDoc } from './draft.ts';
import { setAmount, setHeader } from './edits.ts';
import { historyReducer, redoLabel, startHistory, undoLabel, type History, type HistoryAction } from './history.ts';
import { indexProblems, type ProblemIndex } from './problemIndex.ts';

/** A cell: a header field path, or `line:<key>:amount`. */
export type CellId = string;

export function lineCell(key: string): CellId {
  return `line:${key}:amount`;
}

/** Text typed into a cell but not yet committed (Enter or leaving the cell commits it). */
export interface Pending {
  cell: CellId;
  text: string;
}

function lineKeyOf(cell: CellId): string | null {
  const m = /^line:(.+):amount$/.exec(cell);
  return m ? (m[1] ?? null) : null;
}

/** The document with a pending cell's text in place (what the figures show while typing). */
export function withPending(doc: OrderDoc, pending: Pending | null): OrderDoc {
  if (!pending) return doc;
  const key = lineKeyOf(pending.cell);
  if (key !== null) {
    const i = doc.keys.indexOf(key);
    return i === -1 ? doc : setAmount(doc, i, pending.text);
  }
  return setHeader(doc, pending.cell as HeaderField, pending.text);
}

/** The text a cell holds in the committed document. */
export function committedText(doc: OrderDoc, cell: CellId): string {
  const key = lineKeyOf(cell);
  if (key === null) return headerValue(doc.order, cell as HeaderField);
  return doc.order.lines[doc.keys.indexOf(key)]?.amount ?? '';
}

/** The history plus the cell being typed into. */
export interface WorkspaceState {
  history: History;
  pending: Pending | null;
}

export type WorkspaceAction =
  | HistoryAction
  | { type: 'type'; cell: CellId; text: string }
  /** Commit the pending text of `cell`; `what` names the field for the undo list ("Amount, line 2"). */
  | { type: 'commit'; cell: CellId; what: string }
  | { type: 'cancel' };

/** Typing changes only the pending text; a commit turns it into one recorded edit; any other edit drops it. */
export function workspaceReducer(state: WorkspaceState, action: WorkspaceAction): WorkspaceState {
  switch (action.type) {
    case 'type':
      return { ...state, pending: { cell: action.cell, text: action.text } };
    case 'cancel':
      return state.pending ? { ...state, pending: null } : state;
    case 'commit': {
      const p = state.pending;
      if (!p || p.cell !== action.cell) return state;
      const before = committedText(state.history.present, p.cell);
      const label = `${action.what}: ${before || 'empty'} → ${p.text || 'empty'}`;
      return { history: historyReducer(state.history, { type: 'edit', label, apply: (d) => withPending(d, p) }), pending: null };
    }
    default:
      return { history: historyReducer(state.history, action), pending: null };
  }
}

/** A report and the line keys its line indexes refer to. */
export interface ShownReport {
  report: Report;
  keys: string[];
  docId: number;
}

/** What the components call to change the order; the object never changes, so memoized cells stay put. */
export interface WorkspaceActions {
  type(cell: CellId, text: string): void;
  commit(cell: CellId, what: string): void;
  cancel(): void;
  edit(label: string, apply: (doc: OrderDoc) => OrderDoc): void;
  undo(): void;
  redo(): void;
}

export interface Workspace {
  doc: OrderDoc;
  /** The document as displayed (with the pending text). */
  shown: OrderDoc;
  pending: Pending | null;
  /** The report the figures show: the current one, or the last valid one while the order has problems. */
  figures: ShownReport | null;
  /** True when the figures are from an earlier, valid state of the order. */
  stale: boolean;
  /** The solver's proposals for the committed order (kept while a cell is typed into); null when it is invalid. */
  suggestions: Report['suggestions'] | null;
  problems: ProblemIndex;
  undoLabel: string | null;
  redoLabel: string | null;
  actions: WorkspaceActions;
}

function check(doc: OrderDoc, catalog: Catalog, policy: Policy, suggestions: boolean) {
  const evaluation = checkOrder(toOrderFile(doc.order), catalog, policy, { suggestions });
  const shown: ShownReport | null = evaluation.ok ? { report: evaluation.value.report, keys: doc.keys, docId: doc.docId } : null;
  return { evaluation, shown };
}

/** Hold the order being edited and check it against the catalog and policy on every change. */
export function useOrderWorkspace(initial: () => OrderDoc, catalog: Catalog, policy: Policy): Workspace {
  const [state, dispatch] = useReducer(workspaceReducer, initial, (init) => ({ history: startHistory(init()), pending: null }));
  const { history, pending } = state;
  const doc = history.present;
  const shown = useMemo(() => withPending(doc, pending), [doc, pending]);
  // The committed order is checked once per edit, with the solver's suggestions; while a cell is being
  // typed into, the order with the typed text is checked too (without the solver, so a keystroke stays
  // fast), and shown when it is valid.
  const committed = useMemo(() => check(doc, catalog, policy, true), [doc, catalog, policy]);
  const typed = useMemo(() => (shown === doc ? committed : check(shown, catalog, policy, false)), [shown, doc, committed, catalog, policy]);
  // The last valid figures come from committed states only, so an invalid keystroke falls back to what
  // the order says, not to a half-typed number.
  const [lastValid, setLastValid] = useState<ShownReport | null>(committed.shown);
  if (committed.shown && committed.shown !== lastValid) setLastValid(committed.shown);
  const fallback = committed.shown ?? (lastValid?.docId === shown.docId ? lastValid : null);
  const evaluation = typed.evaluation;
  const problems = useMemo(() => indexProblems(evaluation.ok ? [] : evaluation.problems, shown.order.lines.length), [evaluation, shown.order.lines.length]);
  const actions = useMemo<WorkspaceActions>(() => ({
    type: (cell, text) => dispatch({ type: 'type', cell, text }),
    commit: (cell, what) => dispatch({ type: 'commit', cell, what }),
    cancel: () => dispatch({ type: 'cancel' }),
    edit: (label, apply) => dispatch({ type: 'edit', label, apply }),
    undo: () => dispatch({ type: 'undo' }),
    redo: () => dispatch({ type: 'redo' }),
  }), []);

  return {
    doc, shown, pending,
    figures: typed.shown ?? fallback,
    stale: typed.shown === null,
    suggestions: committed.shown ? committed.shown.report.suggestions ?? [] : null,
    problems,
    undoLabel: undoLabel(history), redoLabel: redoLabel(history),
    actions,
  };
}
