import { useCallback, type KeyboardEvent } from 'react';

function focusables(root: HTMLElement, row: number): HTMLElement[] {
  return [...root.querySelectorAll<HTMLElement>(`[data-row="${row}"]`)].filter((el) => !(el as HTMLButtonElement).disabled);
}

function atEdge(el: HTMLElement, key: 'ArrowLeft' | 'ArrowRight'): boolean {
  if (!(el instanceof HTMLInputElement)) return true;
  const { selectionStart: s, selectionEnd: e, value } = el;
  if (s === null || e === null || s !== e) return false;
  return key === 'ArrowLeft' ? s === 0 : e === value.length;
}

/** Focus a cell of the grid by row and column (the nearest focusable one in that row if that column has none). */
export function focusCell(root: HTMLElement | null, row: number, col: string): void {
  if (!root) return;
  const target = root.querySelector<HTMLElement>(`[data-row="${row}"][data-col="${col}"]`) ?? focusables(root, row)[0];
  target?.focus();
}

/**
 * Arrow keys between the cells of the lines table: up/down to the same column of the next row,
 * left/right to the neighbouring cell (inside a text cell only once the caret is at its edge).
 * Keys a cell has already handled (an open stock list) are left alone.
 */
export function useGridKeys() {
  return useCallback((e: KeyboardEvent<HTMLElement>) => {
    if (e.defaultPrevented || e.altKey || e.ctrlKey || e.metaKey || e.shiftKey) return;
    const el = e.target as HTMLElement;
    const row = Number(el.dataset.row);
    const col = el.dataset.col;
    if (col === undefined || !Number.isInteger(row) || el.getAttribute('aria-expanded') === 'true') return;
    const root = e.currentTarget;
    if (e.key === 'ArrowUp' || e.key === 'ArrowDown') {
      const next = row + (e.key === 'ArrowUp' ? -1 : 1);
      if (focusables(root, next).length === 0) return;
      e.preventDefault();
      focusCell(root, next, col);
    } else if (e.key === 'ArrowLeft' || e.key === 'ArrowRight') {
      if (!atEdge(el, e.key)) return;
      const cells = focusables(root, row);
      const i = cells.indexOf(el) + (e.key === 'ArrowLeft' ? -1 : 1);
      const target = cells[i];
      if (!target) return;
      e.preventDefault();
      target.focus();
    }
  }, []);
}
