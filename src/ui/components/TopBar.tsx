import { useId, type ReactNode } from 'react';
import type { Problem } from '../../core/problems.ts';
import { DEMO_ORDERS } from '../../defaults.ts';
import { FileImport } from './FileImport.tsx';

export type View = 'order' | 'saved' | 'catalog' | 'policy' | 'qa';
const VIEWS: { view: View; label: string }[] = [
  { view: 'order', label: 'Order' },
  { view: 'saved', label: 'Saved orders' },
  { view: 'catalog', label: 'Catalog' },
  { view: 'policy', label: 'Policy' },
  { view: 'qa', label: 'QA log' },
];

interface Props {
  view: View;
  onView(v: View): void;
  demoKey: string;
  onDemo(key: string): void;
  onNew(): void;
  onOpen(json: unknown, name: string): void;
  onOpenProblems(p: Problem[]): void;
  undoLabel: string | null;
  redoLabel: string | null;
  onUndo(): void;
  onRedo(): void;
  /** Where the print buttons mount (the printouts are another part of the app). */
  printSlot?: ReactNode;
}

/** Brand, the views (order, saved orders, catalog, policy, QA log), and the order actions: demo orders, new, open, undo/redo, print. */
export function TopBar(p: Props) {
  const demoId = useId();
  return (
    <header className="top">
      <div className="brand"><span className="mark" aria-hidden="true" />Osmocount<span className="tag">PN admixture check</span></div>
      <nav className="views" aria-label="Views">
        {VIEWS.map((v) => (
          <button key={v.view} type="button" className="view-tab" aria-current={p.view === v.view ? 'page' : undefined} onClick={() => p.onView(v.view)}>{v.label}</button>
        ))}
      </nav>
      <div className="toolbar" role="group" aria-label="Order actions">
        <label className="picker" htmlFor={demoId}>Demo order</label>
        <select id={demoId} value={p.demoKey} onChange={(e) => p.onDemo(e.target.value)}>
          {p.demoKey === '' ? <option value="">—</option> : null}
          {DEMO_ORDERS.map((d) => <option key={d.key} value={d.key}>{d.title}</option>)}
        </select>
        <button type="button" onClick={p.onNew}>New order</button>
        <FileImport label="Open order file…" onJson={p.onOpen} onProblems={p.onOpenProblems} />
        <button type="button" onClick={p.onUndo} disabled={p.undoLabel === null} aria-keyshortcuts="Control+Z"
          title={p.undoLabel ? `Undo: ${p.undoLabel} (Ctrl+Z)` : 'Nothing to undo'} aria-label={p.undoLabel ? `Undo: ${p.undoLabel}` : 'Undo'}>Undo</button>
        <button type="button" onClick={p.onRedo} disabled={p.redoLabel === null} aria-keyshortcuts="Control+Shift+Z Control+Y"
          title={p.redoLabel ? `Redo: ${p.redoLabel} (Ctrl+Shift+Z)` : 'Nothing to redo'} aria-label={p.redoLabel ? `Redo: ${p.redoLabel}` : 'Redo'}>Redo</button>
        {/* PrintActions (src/ui/print/) mounts here through `printSlot`: it gets the report on screen. */}
        <span className="print-slot" data-slot="print-actions">{p.printSlot}</span>
      </div>
    </header>
  );
}
