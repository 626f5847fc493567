import { useEffect, useState } from 'react';
import { formatProblem, type Problem, type Result } from '../../core/problems.ts';
import { getOrder } from '../../store/orders.ts';
import type { QaInput } from '../../store/qa/log.ts';
import { QA_METHODS, type OrderVersion, type QaEntry } from '../../store/types.ts';
import { useOrderList } from './useOrderList.ts';
import { useSavedWork } from './SavedWorkProvider.tsx';
import { today } from './time.ts';
import './saved.css';

const METHOD_TEXT = { 'freezing-point': 'Freezing point', 'vapour-pressure': 'Vapour pressure', other: 'Other' } as const;

/** Record a measured osmolality for a compounded bag: which saved order and version, the reading, how. */
export function QaForm({ onRecord }: { onRecord(orderKey: string, version: number, input: QaInput): Promise<Result<QaEntry>> }) {
  const { store } = useSavedWork();
  const { orders } = useOrderList({});
  const [orderKey, setOrderKey] = useState('');
  const [versions, setVersions] = useState<OrderVersion[]>([]);
  const [version, setVersion] = useState(0);
  const [input, setInput] = useState<QaInput>({ measured: '', method: 'freezing-point', instrument: '', measuredOn: today() });
  const [problems, setProblems] = useState<Problem[]>([]);
  const [recorded, setRecorded] = useState<string | null>(null);

  useEffect(() => {
    if (!store || orderKey === '') return;
    let live = true;
    void getOrder(store, orderKey).then((r) => {
      if (!live || !r.ok || !r.value) return;
      setVersions(r.value.versions);
      const signed = [...r.value.versions].reverse().find((v) => v.signOff);
      setVersion((signed ?? r.value.versions.at(-1))?.n ?? 0);
    });
    return () => { live = false; };
  }, [store, orderKey]);

  const submit = async () => {
    if (orderKey === '' || version === 0) { setProblems([{ path: 'order', message: 'choose the saved order the bag was compounded from' }]); return; }
    const r = await onRecord(orderKey, version, input);
    setProblems(r.ok ? [] : r.problems);
    if (r.ok) { setRecorded(`${r.value.orderId} v${r.value.version}: ${r.value.measured} mOsm/kg recorded.`); setInput({ ...input, measured: '' }); }
  };
  const set = (patch: Partial<QaInput>) => { setRecorded(null); setInput({ ...input, ...patch }); };

  return (
    <form className="row" aria-label="Record a measured osmolality" onSubmit={(e) => { e.preventDefault(); void submit(); }}>
      <label>
        Bag (saved order)
        <select value={orderKey} onChange={(e) => { setOrderKey(e.target.value); setVersions([]); setVersion(0); }}>
          <option value="">Choose…</option>
          {(orders ?? []).map((o) => <option key={o.key} value={o.key}>{o.orderId} · {o.patientId}</option>)}
        </select>
      </label>
      <label>
        Version
        <select value={version} onChange={(e) => setVersion(Number(e.target.value))} disabled={versions.length === 0}>
          {versions.map((v) => <option key={v.n} value={v.n}>{v.n}{v.signOff ? ` (verified by ${v.signOff.by})` : ''}</option>)}
        </select>
      </label>
      <label>
        Measured, mOsm/kg
        <input type="text" inputMode="decimal" value={input.measured} size={8} onChange={(e) => set({ measured: e.target.value })} />
      </label>
      <label>
        Method
        <select value={input.method} onChange={(e) => set({ method: e.target.value })}>
          {QA_METHODS.map((m) => <option key={m} value={m}>{METHOD_TEXT[m]}</option>)}
        </select>
      </label>
      <label>
        Instrument note
        <input type="text" value={input.instrument} onChange={(e) => set({ instrument: e.target.value })} />
      </label>
      <label>
        Measured on
        <input type="date" value={input.measuredOn} onChange={(e) => set({ measuredOn: e.target.value })} />
      </label>
      <button type="submit" className="primary">Record reading</button>
      {problems.length > 0 ? <ul className="form-problems" role="alert">{problems.map((p, i) => <li key={i}>{formatProblem(p)}</li>)}</ul> : null}
      {recorded ? <p role="status">{recorded}</p> : null}
    </form>
  );
}
