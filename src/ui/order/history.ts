// Undo/redo for every edit of the order: a reducer over whole documents (they are small and immutable).
import type { OrderDoc } from './draft.ts';

/** A past or future state with the name of the edit that leads away from it (shown on the undo button). */
export interface HistoryEntry {
  doc: OrderDoc;
  label: string;
}

export interface History {
  past: HistoryEntry[];
  present: OrderDoc;
  future: HistoryEntry[];
}

/** What the history can be asked to do. `edit` carries a pure function of the present document. */
export type HistoryAction =
  | { type: 'edit'; label: string; apply: (doc: OrderDoc) => OrderDoc }
  | { type: 'undo' }
  | { type: 'redo' };

/** How many edits can be undone (older ones are dropped). */
export const HISTORY_DEPTH = 500;

export function startHistory(doc: OrderDoc): History {
  return { past: [], present: doc, future: [] };
}

/**
 * Apply an edit (recorded, redo cleared), or step back/forward. An edit that changes nothing
 * (returns the same document) records nothing.
 */
export function historyReducer(state: History, action: HistoryAction): History {
  switch (action.type) {
    case 'edit': {
      const next = action.apply(state.present);
      if (next === state.present) return state;
      const past = [...state.past, { doc: state.present, label: action.label }];
      return { past: past.length > HISTORY_DEPTH ? past.slice(past.length - HISTORY_DEPTH) : past, present: next, future: [] };
    }
    case 'undo': {
      const last = state.past.at(-1);
      if (!last) return state;
      return { past: state.past.slice(0, -1), present: last.doc, future: [{ doc: state.present, label: last.label }, ...state.future] };
    }
    case 'redo': {
      const [first, ...rest] = state.future;
      if (!first) return state;
      return { past: [...state.past, { doc: state.present, label: first.label }], present: first.doc, future: rest };
    }
  }
}

/** The edit an undo would take back, if any. */
export function undoLabel(state: History): string | null {
  return state.past.at(-1)?.label ?? null;
}

/** The edit a redo would make again, if any. */
export function redoLabel(state: History): string | null {
  return state.future[0]?.label ?? null;
}
