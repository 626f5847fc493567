import { useState } from 'react';
import { formatProblem, type Problem } from '../../core/problems.ts';
import { exportOrders, type ExportLayout } from '../../store/importOrders.ts';
import { deleteOrder } from '../../store/orders.ts';
import type { OrderQuery } from '../../store/search.ts';
import type { JsonObject, OrderRecord } from '../../store/types.ts';
import { ConfirmBox } from './ConfirmBox.tsx';
import { downloadText } from './files.ts';
import { ImportDialog } from './ImportDialog.tsx';
import { OrderSearchForm } from './OrderSearchForm.tsx';
import { SavedOrdersTable } from './SavedOrdersTable.tsx';
import { useOrderList } from './useOrderList.ts';
import { useSavedWork } from './SavedWorkProvider.tsx';
import type { SavedOrderApi } from './useSavedOrder.ts';
import './saved.css';

/** Storage sizes as people read them: "0.1 MB", "10.7 GB" (decimal units, as browsers report them). */
function size(bytes: number): string {
  return bytes >= 1e9 ? `${(bytes / 1e9).toFixed(1)} GB` : `${(bytes / 1e6).toFixed(1)} MB`;
}

/** Where the saved work lives and whether the browser may clear it. */
function StorageLine() {
  const { storage } = useSavedWork();
  const used = storage.usage !== null && storage.quota !== null ? ` Using ${size(storage.usage)} of the ${size(storage.quota)} this browser allows the site.` : '';
  const kept = storage.persisted === true
    ? 'This browser keeps the saved work even when its disk runs short.'
    : 'This browser may clear saved work when its disk runs short: export orders you need to keep.';
  return <p className="count" data-testid="storage-line">Orders are kept in this browser on this workstation only. {kept}{used}</p>;
}

type Pending = { kind: 'copy'; record: OrderRecord; id: string } | { kind: 'delete'; record: OrderRecord } | null;

/** Saved orders: search, open, copy for the next bag, delete (confirmed), export and import. */
export function SavedOrdersView({ api, by, onOpened }: { api: SavedOrderApi; by: string | null; onOpened(file: JsonObject, orderKey: string): void }) {
  const { store, touch, report } = useSavedWork();
  const [query, setQuery] = useState<OrderQuery>({});
  const { orders, total } = useOrderList(query);
  const [selected, setSelected] = useState<Set<string>>(new Set());
  const [pending, setPending] = useState<Pending>(null);
  const [importing, setImporting] = useState(false);
  const [problems, setProblems] = useState<Problem[]>([]);

  const open = async (key: string) => { const file = await api.open(key); if (file) onOpened(file, key); };
  const startCopy = async (record: OrderRecord) => setPending({ kind: 'copy', record, id: await api.suggestId(record.orderId) });
  const copy = async (record: OrderRecord, id: string) => {
    const r = await api.copy(record.key, id, by);
    setProblems(r.ok ? [] : r.problems);
    if (r.ok) { setPending(null); onOpened(r.value.file, r.value.orderKey); }
  };
  const remove = async (record: OrderRecord) => {
    if (!store) return;
    const r = await deleteOrder(store, record.key);
    if (!r.ok) { report(r.problems); return; }
    api.forget(record.key);
    setSelected((s) => { const n = new Set(s); n.delete(record.key); return n; });
    setPending(null);
    touch();
  };
  const exportAs = async (layout: ExportLayout) => {
    if (!store || !orders) return;
    const keys = orders.filter((o) => selected.size === 0 || selected.has(o.key)).map((o) => o.key);
    const r = await exportOrders(store, keys, layout);
    if (!r.ok) { report(r.problems); return; }
    downloadText(`osmocount-orders.${layout === 'ndjson' ? 'ndjson' : 'json'}`, r.value, layout === 'ndjson' ? 'application/x-ndjson' : 'application/json');
  };

  return (
    <section className="panel saved saved-list" aria-label="Saved orders">
      <h2>Saved orders</h2>
      <OrderSearchForm query={query} onChange={setQuery} />
      <div className="row">
        <span className="count" role="status">{orders === null ? 'Loading…' : `${orders.length} of ${total} saved orders`}</span>
        <button type="button" disabled={!orders?.length} onClick={() => void exportAs('json')}>Export {selected.size > 0 ? `${selected.size} selected` : 'shown'} (JSON)</button>
        <button type="button" disabled={!orders?.length} onClick={() => void exportAs('ndjson')}>Export (NDJSON)</button>
        <button type="button" onClick={() => setImporting((v) => !v)}>Import orders…</button>
      </div>
      {importing ? <ImportDialog by={by} onClose={() => setImporting(false)} /> : null}
      {pending?.kind === 'copy' ? (
        <ConfirmBox title={`Copy ${pending.record.orderId} for the next bag`} confirm="Copy and open" onConfirm={() => void copy(pending.record, pending.id)} onCancel={() => setPending(null)}>
          <p>Same patient and lines, a new order id, not verified. Change what the new bag needs, then verify it.</p>
          <label>New order id<input type="text" value={pending.id} onChange={(e) => setPending({ ...pending, id: e.target.value })} /></label>
        </ConfirmBox>
      ) : null}
      {pending?.kind === 'delete' ? (
        <ConfirmBox danger title={`Delete ${pending.record.orderId}?`} confirm="Delete for good" onConfirm={() => void remove(pending.record)} onCancel={() => setPending(null)}>
          <p>Order {pending.record.orderId} (patient {pending.record.patientId}) and all {pending.record.latest} of its versions will be removed from this browser. This cannot be undone; export it first to keep a copy. QA readings of this bag stay in the QA log.</p>
        </ConfirmBox>
      ) : null}
      {problems.length > 0 ? <ul className="form-problems" role="alert">{problems.map((p, i) => <li key={i}>{formatProblem(p)}</li>)}</ul> : null}
      {orders && orders.length > 0 ? (
        <SavedOrdersTable
          orders={orders} openKey={api.saved?.record.key ?? null} selected={selected}
          onSelect={(key, on) => setSelected((s) => { const n = new Set(s); if (on) n.add(key); else n.delete(key); return n; })}
          onOpen={(key) => void open(key)} onCopy={(r) => void startCopy(r)} onDelete={(record) => setPending({ kind: 'delete', record })}
        />
      ) : orders ? <p className="none">{total === 0 ? 'No order is saved in this browser yet.' : 'No saved order matches.'}</p> : null}
      <StorageLine />
    </section>
  );
}
