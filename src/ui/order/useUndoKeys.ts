import { useEffect } from 'react';
import type { WorkspaceActions } from './useOrderWorkspace.ts';

/**
 * Ctrl+Z undoes the last edit of the order, Ctrl+Shift+Z or Ctrl+Y redoes it (⌘ on a Mac). While a cell
 * holds typed but uncommitted text, Ctrl+Z first drops that text. Forms outside the order (the catalog
 * editor, marked `data-own-undo`) keep the browser's own text undo.
 */
export function useUndoKeys(typing: boolean, actions: WorkspaceActions, active: boolean): void {
  const { cancel, undo, redo } = actions;
  useEffect(() => {
    if (!active) return;
    const onKey = (e: KeyboardEvent) => {
      if (!(e.ctrlKey || e.metaKey) || e.altKey) return;
      const target = e.target instanceof Element ? e.target : null;
      if (target?.closest('[data-own-undo]')) return;
      const key = e.key.toLowerCase();
      if (key === 'z' && !e.shiftKey) {
        e.preventDefault();
        if (typing) cancel();
        else undo();
      } else if ((key === 'z' && e.shiftKey) || key === 'y') {
        e.preventDefault();
        redo();
      }
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [active, typing, cancel, undo, redo]);
}
