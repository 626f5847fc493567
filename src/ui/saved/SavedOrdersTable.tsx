import type { OrderRecord } from '../../store/types.ts';
import { VERDICT_TEXT } from '../show.ts';
import { showTime } from './time.ts';
import './saved.css';

interface Props {
  orders: readonly OrderRecord[];
  openKey: string | null;
  selected: ReadonlySet<string>;
  onSelect(key: string, on: boolean): void;
  onOpen(key: string): void;
  onCopy(record: OrderRecord): void;
  onDelete(record: OrderRecord): void;
}

/** The saved orders as rows: id, patient, when, version, verdict, sign-off, and what can be done. */
export function SavedOrdersTable({ orders, openKey, selected, onSelect, onOpen, onCopy, onDelete }: Props) {
  return (
    <table className="saved-table">
      <thead>
        <tr>
          <th scope="col"><span className="sr-only">Select</span></th>
          <th scope="col">Order</th>
          <th scope="col">Patient</th>
          <th scope="col">Last saved</th>
          <th scope="col" className="num">Version</th>
          <th scope="col">Verdict</th>
          <th scope="col">Verified</th>
          <th scope="col"><span className="sr-only">Actions</span></th>
        </tr>
      </thead>
      <tbody>
        {orders.map((o) => (
          <tr key={o.key} className={o.key === openKey ? 'open-row' : undefined}>
            <td><input type="checkbox" aria-label={`Select ${o.orderId}`} checked={selected.has(o.key)} onChange={(e) => onSelect(o.key, e.target.checked)} /></td>
            <th scope="row">{o.orderId}{o.copiedFrom ? <div className="count">copy of {o.copiedFrom.orderId}</div> : null}</th>
            <td>{o.patientId}{o.patientName ? <div className="count">{o.patientName}</div> : null}</td>
            <td>{showTime(o.updatedAt)}</td>
            <td className="num">{o.latest}</td>
            <td><span className={`badge ${o.verdict ?? 'none'}`}>{o.verdict ? VERDICT_TEXT[o.verdict].word : 'Not checked'}</span></td>
            <td>{o.signOff ? `${o.signOff.by} · ${showTime(o.signOff.at)}` : '—'}</td>
            <td className="actions">
              <button type="button" onClick={() => onOpen(o.key)} aria-label={`Open ${o.orderId}`}>Open</button>
              <button type="button" onClick={() => onCopy(o)} aria-label={`Copy for the next bag: ${o.orderId}`}>Copy for the next bag</button>
              <button type="button" className="danger" onClick={() => onDelete(o)} aria-label={`Delete ${o.orderId}`}>Delete</button>
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
