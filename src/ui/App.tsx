import { useEffect, useMemo, useRef, useState } from 'react';
import type { Catalog } from '../core/catalog.ts';
import type { Policy } from '../core/policy.ts';
import type { Problem } from '../core/problems.ts';
import { DEFAULT_CATALOG, DEFAULT_FILES, DEFAULT_POLICY, DEMO_ORDERS } from '../defaults.ts';
import type { JsonObject } from '../store/types.ts';
import { docFromFile, newOrderDoc, toOrderFile, type OrderDoc } from './order/draft.ts';
import { useOrderWorkspace } from './order/useOrderWorkspace.ts';
import { useUndoKeys } from './order/useUndoKeys.ts';
import { Caution } from './components/Caution.tsx';
import { TopBar, type View } from './components/TopBar.tsx';
import { VerdictBar } from './components/VerdictBar.tsx';
import { ProblemsList } from './components/ProblemsList.tsx';
import { OrderView } from './OrderView.tsx';
import { CatalogView } from './catalog/CatalogView.tsx';
import { PolicyView } from './policy/PolicyView.tsx';
import { OpenOrderBar } from './saved/OpenOrderBar.tsx';
import { QaLogPanel } from './saved/QaLogPanel.tsx';
import { RefFilesPanel } from './saved/RefFilesPanel.tsx';
import { SavedOrdersView } from './saved/SavedOrdersView.tsx';
import { useSavedWork } from './saved/SavedWorkProvider.tsx';
import { StorageNotice } from './saved/StorageNotice.tsx';
import { useSavedOrder } from './saved/useSavedOrder.ts';
import { VersionHistory } from './saved/VersionHistory.tsx';
import { PrintActions } from './print/PrintActions.tsx';
import { parseOrder } from '../core/order.ts';

function demoDoc(key: string): OrderDoc | null {
  const demo = DEMO_ORDERS.find((d) => d.key === key);
  const r = demo ? docFromFile(demo.file) : null;
  return r?.ok ? r.value : null;
}

/** The app: the order workspace, saved orders, the catalog and policy, and the QA log, kept in this browser. */
export function App() {
  const work = useSavedWork();
  if (work.status === 'loading') return <div className="app"><p className="none" role="status">Opening the work saved in this browser…</p></div>;
  return <Workspace />;
}

function Workspace() {
  const work = useSavedWork();
  const [view, setView] = useState<View>('order');
  // The catalog and policy in force are the browser's (the shipped ones when it keeps none). An edit the
  // browser could not keep (storage full) stays here, in memory, and the storage message says so.
  const [catalogEdit, setCatalogEdit] = useState<{ file: unknown; catalog: Catalog } | null>(null);
  const [policyEdit, setPolicyEdit] = useState<{ file: unknown; policy: Policy } | null>(null);
  const catalog = catalogEdit ?? { file: work.refFiles?.catalog ?? DEFAULT_FILES.catalog, catalog: work.env?.catalog ?? DEFAULT_CATALOG };
  const policy = policyEdit ?? { file: work.refFiles?.policy ?? DEFAULT_FILES.policy, policy: work.env?.policy ?? DEFAULT_POLICY };
  const [restored] = useState(() => { const r = work.restored ? docFromFile(work.restored.file) : null; return r?.ok ? r.value : null; });
  const firstKey = DEMO_ORDERS[0]?.key ?? '';
  const [demoKey, setDemoKey] = useState(restored ? '' : firstKey);
  const [openProblems, setOpenProblems] = useState<Problem[]>([]);
  const ws = useOrderWorkspace(() => restored ?? demoDoc(firstKey) ?? newOrderDoc(), catalog.catalog, policy.policy);
  useUndoKeys(ws.pending !== null, ws.actions, view === 'order');
  const [initials, setInitials] = useState('');
  const by = initials.trim().toUpperCase() || null;
  const saved = useSavedOrder(by);

  // Which saved order each opened document belongs to, so undo/redo across an "open" takes the draft
  // back to the right saved order (or to none); and the autosave: every committed edit is kept at once.
  const [owners] = useState(() => new Map<number, string | null>([[ws.doc.docId, restored ? (work.restored?.orderKey ?? null) : null]]));
  const kept = useRef(ws.doc);
  const file = useMemo(() => toOrderFile(ws.doc.order) as JsonObject, [ws.doc]);
  const { edited, follow } = saved;
  const openKey = saved.saved?.record.key ?? null;
  useEffect(() => {
    const before = kept.current;
    if (ws.doc === before) return;
    kept.current = ws.doc;
    if (ws.doc.docId !== before.docId) {
      owners.set(before.docId, openKey);
      follow(owners.get(ws.doc.docId) ?? null);
    }
    edited(file);
  }, [ws.doc, file, edited, follow, owners, openKey]);

  const open = (doc: OrderDoc, label: string, key: string, owner: string | null = null) => {
    owners.set(doc.docId, owner);
    setOpenProblems([]);
    setDemoKey(key);
    setView('order');
    ws.actions.edit(label, () => doc);
  };
  const openSaved = (savedFile: JsonObject, key: string) => {
    const r = docFromFile(savedFile);
    if (r.ok) open(r.value, `Open saved order ${r.value.order.id}`, '', key);
    else setOpenProblems(r.problems);
  };
  const replaceCatalog = (file: unknown, c: Catalog) => {
    setCatalogEdit({ file, catalog: c });
    void work.saveRef('catalog', file, 'edited').then((r) => { if (r.ok) setCatalogEdit(null); else work.report(r.problems); });
  };
  const replacePolicy = (file: unknown, p: Policy) => {
    setPolicyEdit({ file, policy: p });
    void work.saveRef('policy', file, 'edited').then((r) => { if (r.ok) setPolicyEdit(null); else work.report(r.problems); });
  };
  const report = ws.figures?.report ?? null;
  // The committed order's lines, for the mixing sequence on the printed sheet.
  const orderLines = useMemo(() => {
    const r = parseOrder(toOrderFile(ws.doc.order), catalog.catalog);
    return r.ok ? r.value.lines : undefined;
  }, [ws.doc, catalog.catalog]);

  return (
    <div className="app">
      <div className="sticky-top">
        <TopBar
          view={view} onView={setView} demoKey={demoKey}
          onDemo={(key) => { const d = demoDoc(key); if (d) open(d, `Open demo order ${key}`, key); }}
          onNew={() => open(newOrderDoc(), 'New order', '')}
          onOpen={(json, name) => {
            const r = docFromFile(json);
            if (r.ok) open(r.value, `Open ${name}`, '');
            else setOpenProblems(r.problems);
          }}
          onOpenProblems={setOpenProblems}
          undoLabel={ws.undoLabel} redoLabel={ws.redoLabel} onUndo={ws.actions.undo} onRedo={ws.actions.redo}
          printSlot={report && !ws.stale ? <PrintActions report={report} catalog={catalog.catalog} policy={policy.policy} {...(orderLines ? { orderLines } : {})} /> : null}
        />
        {view === 'order' ? <VerdictBar report={report} stale={ws.stale} problemCount={ws.problems.count} /> : null}
      </div>
      <Caution />
      <StorageNotice />
      <p className="context">Catalog: {catalog.catalog.name} · Policy: {policy.policy.name}</p>
      <ProblemsList problems={openProblems} title="The file could not be opened as an order" />
      {view === 'order' ? (
        <main aria-label="Order workspace">
          <OpenOrderBar api={saved} file={file} verdict={ws.figures && !ws.stale ? ws.figures.report.verdict : null} initials={initials} onInitials={setInitials} />
          <OrderView ws={ws} catalog={catalog.catalog} />
          {saved.saved ? <VersionHistory versions={saved.saved.versions} catalog={catalog.catalog} /> : null}
        </main>
      ) : view === 'saved' ? (
        <main aria-label="Saved orders"><SavedOrdersView api={saved} by={by} onOpened={openSaved} /></main>
      ) : view === 'qa' ? (
        <main aria-label="QA log"><QaLogPanel by={by} /></main>
      ) : view === 'catalog' ? (
        <><RefFilesPanel only="catalog" /><CatalogView catalog={catalog.catalog} file={catalog.file} onReplace={replaceCatalog} /></>
      ) : (
        <><RefFilesPanel only="policy" /><PolicyView policy={policy.policy} file={policy.file} onReplace={replacePolicy} /></>
      )}
    </div>
  );
}
