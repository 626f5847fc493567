import type { ReactNode } from 'react';
import './saved.css';

/** An inline confirmation: the question, a confirm button and a way out (no modal, no focus trap). */
export function ConfirmBox({ title, children, confirm, onConfirm, onCancel, danger = false, busy = false }: {
  title: string; children?: ReactNode; confirm: string; onConfirm(): void; onCancel(): void; danger?: boolean; busy?: boolean;
}) {
  return (
    <div className={`confirm-box${danger ? ' danger' : ''}`} role="alertdialog" aria-label={title}>
      <p><strong>{title}</strong></p>
      {children}
      <div className="row">
        <button type="button" className={danger ? 'danger' : 'primary'} disabled={busy} onClick={onConfirm}>{confirm}</button>
        <button type="button" onClick={onCancel}>Cancel</button>
      </div>
    </div>
  );
}
