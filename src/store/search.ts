// Finding saved orders: by order id, patient id or name, date, verdict and sign-off. Pure functions
// over the summary rows (a pharmacy keeps hundreds to a few thousand orders in the browser).
import type { Verdict } from '../core/findings.ts';
import type { OrderRecord } from './types.ts';

/** What the user searches for; every field is optional and they combine with "and". */
export interface OrderQuery {
  /** Part of the order id, patient id or patient name, any case. */
  text?: string;
  /** Saved (created or changed) on or after this local date, YYYY-MM-DD. */
  from?: string;
  /** Saved (created or changed) on or before this local date, YYYY-MM-DD. */
  to?: string;
  /** The latest version's verdict; `unchecked` = it did not validate. */
  verdict?: Verdict | 'unchecked';
  signed?: 'signed' | 'unsigned';
}

/** The local calendar date (YYYY-MM-DD) of an ISO timestamp, as the pharmacist's clock shows it. */
export function localDate(iso: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return '';
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}`;
}

function inRange(date: string, from: string | undefined, to: string | undefined): boolean {
  return date !== '' && (from === undefined || from === '' || date >= from) && (to === undefined || to === '' || date <= to);
}

/** Whether a saved order matches the query. */
export function matchesQuery(record: OrderRecord, query: OrderQuery): boolean {
  const needle = query.text?.trim().toLowerCase() ?? '';
  if (needle !== '') {
    const hay = [record.orderId, record.patientId, record.patientName ?? ''].map((s) => s.toLowerCase());
    if (!hay.some((s) => s.includes(needle))) return false;
  }
  if ((query.from || query.to) && !inRange(localDate(record.createdAt), query.from, query.to) && !inRange(localDate(record.updatedAt), query.from, query.to)) return false;
  if (query.verdict !== undefined && (query.verdict === 'unchecked' ? record.verdict !== null : record.verdict !== query.verdict)) return false;
  if (query.signed === 'signed' && record.signOff === null) return false;
  if (query.signed === 'unsigned' && record.signOff !== null) return false;
  return true;
}

/** The matching orders, most recently changed first (ties by order id). */
export function searchOrders(records: readonly OrderRecord[], query: OrderQuery): OrderRecord[] {
  return records
    .filter((r) => matchesQuery(r, query))
    .sort((a, b) => (a.updatedAt === b.updatedAt ? a.orderId.localeCompare(b.orderId) : a.updatedAt < b.updatedAt ? 1 : -1));
}
