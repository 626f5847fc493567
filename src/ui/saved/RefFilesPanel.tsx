import { useEffect, useState } from 'react';
import { formatProblem, type Problem } from '../../core/problems.ts';
import { shortHash } from '../../store/canonical.ts';
import { exportRefFile, type RefKind } from '../../store/files.ts';
import type { ActiveFile } from '../../store/types.ts';
import { ConfirmBox } from './ConfirmBox.tsx';
import { downloadText, readText } from './files.ts';
import { useSavedWork } from './SavedWorkProvider.tsx';
import { showTime } from './time.ts';
import './saved.css';

const FROM_TEXT = { shipped: 'shipped with Osmocount', edited: 'edited in this browser', imported: 'imported into this browser' } as const;

function RefFile({ kind }: { kind: RefKind }) {
  const { store, env, saveRef, resetRef, report } = useSavedWork();
  const [active, setActive] = useState<ActiveFile | null>(null);
  const [problems, setProblems] = useState<Problem[]>([]);
  const [confirmReset, setConfirmReset] = useState(false);
  const ref = kind === 'catalog' ? env?.catalogRef : env?.policyRef;
  const from = kind === 'catalog' ? env?.catalogFrom : env?.policyFrom;
  const name = kind === 'catalog' ? env?.catalog.name : env?.policy.name;
  useEffect(() => {
    if (!store) return;
    let live = true;
    void store.db.get('active', kind).then((a) => { if (live) setActive(a ?? null); }, () => undefined);
    return () => { live = false; };
  }, [store, kind, ref?.hash]);

  const exportFile = async () => {
    if (!store) return;
    const r = await exportRefFile(store, kind);
    if (r.ok) downloadText(`osmocount-${kind}.json`, r.value);
    else report(r.problems);
  };
  const importFile = async (file: File | undefined) => {
    if (!file) return;
    const text = await readText(file);
    let json: unknown;
    try { json = JSON.parse(text); } catch (e) { setProblems([{ path: '(file)', message: `is not valid JSON (${(e as Error).message})` }]); return; }
    const r = await saveRef(kind, json, 'imported');
    setProblems(r.ok ? [] : r.problems);
    if (!r.ok && r.problems.some((p) => p.path === '(storage)')) report(r.problems);
  };
  if (!ref || !from) return null;
  const title = kind === 'catalog' ? 'Catalog' : 'Policy';
  return (
    <div aria-label={`${title} kept in this browser`} role="group">
      <h3>{title}</h3>
      <dl>
        <dt>In force</dt><dd>{name} <span className="hash">{ref.id} · #{shortHash(ref.hash)}</span></dd>
        <dt>From</dt><dd>{FROM_TEXT[from]}{active && from !== 'shipped' ? ` · ${showTime(active.savedAt)}` : ''}</dd>
      </dl>
      <div className="row">
        <button type="button" onClick={() => void exportFile()}>Export {kind} file</button>
        <label>Import a {kind} file<input type="file" accept=".json,application/json" onChange={(e) => void importFile(e.target.files?.[0])} /></label>
        <button type="button" disabled={from === 'shipped'} onClick={() => setConfirmReset(true)}>Reset to the shipped {kind}</button>
      </div>
      {confirmReset ? (
        <ConfirmBox danger title={`Go back to the shipped ${kind}?`} confirm="Reset" onCancel={() => setConfirmReset(false)}
          onConfirm={() => void resetRef(kind).then((r) => { setConfirmReset(false); if (!r.ok) report(r.problems); })}>
          <p>Orders will be checked against the shipped {kind}. The {kind} in force now stays in this browser’s history, so orders checked against it can still say what changed; export it first if you want the file.</p>
        </ConfirmBox>
      ) : null}
      {problems.length > 0 ? (
        <div role="alert"><p>The {kind} file was not imported; nothing changed:</p><ul className="form-problems">{problems.map((p, i) => <li key={i}>{formatProblem(p)}</li>)}</ul></div>
      ) : null}
    </div>
  );
}

/**
 * The catalog and policy this browser checks orders against: where they came from, export, import,
 * reset. `only` shows one of them (beside the catalog or policy view).
 */
export function RefFilesPanel({ only }: { only?: RefKind }) {
  const title = only === 'catalog' ? 'Catalog in this browser' : only === 'policy' ? 'Policy in this browser' : 'Catalog and policy in this browser';
  return (
    <section className="panel saved ref-files" aria-label={title}>
      <h2>{title}</h2>
      {only !== 'policy' ? <RefFile kind="catalog" /> : null}
      {only !== 'catalog' ? <RefFile kind="policy" /> : null}
    </section>
  );
}
