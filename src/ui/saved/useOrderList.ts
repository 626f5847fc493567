// The saved orders matching a search, refreshed whenever saved work changes.
import { useEffect, useState } from 'react';
import { listOrders } from '../../store/orders.ts';
import type { OrderQuery } from '../../store/search.ts';
import type { OrderRecord } from '../../store/types.ts';
import { useSavedWork } from './SavedWorkProvider.tsx';

/** The matching orders (null while loading) and how many are saved in all. */
export function useOrderList(query: OrderQuery): { orders: OrderRecord[] | null; total: number } {
  const { store, revision, report } = useSavedWork();
  const [orders, setOrders] = useState<OrderRecord[] | null>(null);
  const [total, setTotal] = useState(0);
  const { text, from, to, verdict, signed } = query;
  useEffect(() => {
    if (!store) return;
    let live = true;
    void (async () => {
      const q: OrderQuery = {};
      if (text) q.text = text;
      if (from) q.from = from;
      if (to) q.to = to;
      if (verdict) q.verdict = verdict;
      if (signed) q.signed = signed;
      const [matching, all] = await Promise.all([listOrders(store, q), listOrders(store)]);
      if (!live) return;
      if (!matching.ok) { report(matching.problems); return; }
      setOrders(matching.value);
      setTotal(all.ok ? all.value.length : matching.value.length);
    })();
    return () => { live = false; };
  }, [store, revision, report, text, from, to, verdict, signed]);
  return { orders, total };
}
