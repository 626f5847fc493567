import { useState } from 'react';
import { formatProblem, type Problem } from '../../core/problems.ts';
import { commitImport, planImport, type ImportDone, type ImportPlan } from '../../store/importOrders.ts';
import { readText } from './files.ts';
import { useSavedWork } from './SavedWorkProvider.tsx';
import './saved.css';

/** Where an order sits in the file, for people: "order 2 of the list", "line 4", "the file". */
function placeText(where: string): string {
  const m = /^\[(\d+)\]$/.exec(where);
  if (m) return `Order ${Number(m[1]) + 1} of the list`;
  return where === '' ? 'The file' : where.replace(/^line/, 'Line');
}

const ACTION_TEXT = { new: 'new order', 'new-version': 'new version of the saved order', unchanged: 'same as the saved order (nothing to add)' } as const;

/**
 * Import order files (one order, a JSON array, or NDJSON). Every order is checked first and every
 * problem listed; nothing is written until the user imports, and a batch with invalid orders needs an
 * explicit "leave the invalid ones out".
 */
export function ImportDialog({ by, onClose }: { by: string | null; onClose(): void }) {
  const { store, env, touch, report } = useSavedWork();
  const [text, setText] = useState('');
  const [name, setName] = useState<string | null>(null);
  const [plan, setPlan] = useState<ImportPlan | null>(null);
  const [partialOk, setPartialOk] = useState(false);
  const [done, setDone] = useState<ImportDone | null>(null);
  const [problems, setProblems] = useState<Problem[]>([]);

  const check = async (body: string) => {
    setDone(null);
    setPartialOk(false);
    setProblems([]);
    if (!store || !env) return;
    const r = await planImport(store, env, body);
    if (r.ok) setPlan(r.value);
    else report(r.problems);
  };
  const pick = async (file: File | undefined) => {
    if (!file) return;
    const body = await readText(file);
    setName(file.name);
    setText(body);
    await check(body);
  };
  const commit = async () => {
    if (!store || !env || !plan) return;
    const r = await commitImport(store, env, plan, { acceptPartial: partialOk, by });
    if (!r.ok) { setProblems(r.problems); if (r.problems.some((p) => p.path === '(storage)')) report(r.problems); return; }
    setDone(r.value);
    setPlan(null);
    touch();
  };
  const partial = plan !== null && plan.invalid.length > 0 && plan.valid.length > 0;

  return (
    <section className="panel import-dialog saved" aria-label="Import orders">
      <h2>Import orders</h2>
      <div className="row">
        <label>
          Order file (JSON, JSON array or NDJSON)
          <input type="file" accept=".json,.ndjson,.jsonl,application/json" onChange={(e) => void pick(e.target.files?.[0])} />
        </label>
      </div>
      <label className="block">
        or paste the file’s text
        <textarea aria-label="Order file text" value={text} onChange={(e) => { setText(e.target.value); setName(null); setPlan(null); }} />
      </label>
      <div className="row">
        <button type="button" disabled={text.trim() === ''} onClick={() => void check(text)}>Check the file</button>
        <button type="button" onClick={onClose}>Close</button>
      </div>
      {plan ? (
        <div aria-label="What the import would do">
          <p><strong>{name ?? 'The pasted text'}: {plan.valid.length} order{plan.valid.length === 1 ? '' : 's'} can be imported, {plan.invalid.length} cannot.</strong></p>
          {plan.valid.length > 0 ? <ul className="valid-list">{plan.valid.map((v) => <li key={v.where + v.orderId}>{v.orderId}: {ACTION_TEXT[v.action]}{v.from !== 'v1' ? ` (read from the ${v.from === 'v0' ? 'pre-release' : 'unversioned'} layout)` : ''}</li>)}</ul> : null}
          {plan.invalid.map((x, i) => (
            <div className="invalid" key={i} role="group" aria-label={`Invalid: ${placeText(x.where)}`}>
              <strong>{placeText(x.where)}{x.orderId ? ` (${x.orderId})` : ''} cannot be imported:</strong>
              <ul>{x.problems.map((p, j) => <li key={j}>{formatProblem(p)}</li>)}</ul>
            </div>
          ))}
          {partial ? (
            <label className="confirm">
              <input type="checkbox" checked={partialOk} onChange={(e) => setPartialOk(e.target.checked)} />
              <span>Import the {plan.valid.length} valid order{plan.valid.length === 1 ? '' : 's'} and leave out the {plan.invalid.length} invalid one{plan.invalid.length === 1 ? '' : 's'}</span>
            </label>
          ) : null}
          {plan.valid.length > 0 ? (
            <button type="button" className="primary" disabled={partial && !partialOk} onClick={() => void commit()}>
              Import {plan.valid.length} order{plan.valid.length === 1 ? '' : 's'}
            </button>
          ) : <p>Nothing was imported; the saved orders are unchanged.</p>}
        </div>
      ) : null}
      {problems.length > 0 ? <ul className="form-problems" role="alert">{problems.map((p, i) => <li key={i}>{formatProblem(p)}</li>)}</ul> : null}
      {done ? <p role="status">Imported: {done.created} new order{done.created === 1 ? '' : 's'}, {done.newVersions} new version{done.newVersions === 1 ? '' : 's'}, {done.unchanged} unchanged.</p> : null}
    </section>
  );
}
