// The osmolality QA log for the screen: its entries, recording a reading for a saved version, removal.
import { useCallback, useEffect, useState } from 'react';
import type { Result } from '../../core/problems.ts';
import { getOrder } from '../../store/orders.ts';
import { deleteMeasurement, listMeasurements, recordMeasurement, reportOfVersion, type QaInput } from '../../store/qa/log.ts';
import type { QaEntry } from '../../store/types.ts';
import { useSavedWork } from './SavedWorkProvider.tsx';

export interface QaLogApi {
  entries: QaEntry[];
  record(orderKey: string, version: number, input: QaInput, by: string | null): Promise<Result<QaEntry>>;
  remove(id: string): Promise<void>;
}

/** The QA log's entries and actions (figures come from the catalog and policy the bag was checked against). */
export function useQaLog(): QaLogApi {
  const { store, env, report, revision, touch } = useSavedWork();
  const [entries, setEntries] = useState<QaEntry[]>([]);
  useEffect(() => {
    if (!store) return;
    let live = true;
    void listMeasurements(store).then((r) => { if (!live) return; if (r.ok) setEntries(r.value); else report(r.problems); });
    return () => { live = false; };
  }, [store, revision, report]);

  const record = useCallback(async (orderKey: string, n: number, input: QaInput, by: string | null): Promise<Result<QaEntry>> => {
    if (!store || !env) return { ok: false, problems: [{ path: '(storage)', message: 'the browser’s storage is not open yet' }] };
    const order = await getOrder(store, orderKey);
    if (!order.ok) return order;
    const version = order.value?.versions.find((v) => v.n === n);
    if (!version) return { ok: false, problems: [{ path: 'order', message: 'choose a saved order and version' }] };
    const vr = await reportOfVersion(store, version, env);
    if (!vr.ok) return { ok: false, problems: [{ path: 'order', message: 'this version does not validate, so it has no calculated figures' }, ...vr.problems] };
    const r = await recordMeasurement(store, input, version, vr.value.report, by);
    if (r.ok) touch();
    else if (r.problems.some((p) => p.path === '(storage)')) report(r.problems);
    return r;
  }, [store, env, report, touch]);

  const remove = useCallback(async (id: string) => {
    if (!store) return;
    const r = await deleteMeasurement(store, id);
    if (r.ok) touch(); else report(r.problems);
  }, [store, report, touch]);

  return { entries, record, remove };
}
