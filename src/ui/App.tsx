import { useMemo, useState } from 'react';
import type { Catalog } from '../core/catalog.ts';
import type { Policy } from '../core/policy.ts';
import type { Problem } from '../core/problems.ts';
import { DEFAULT_CATALOG, DEFAULT_FILES, DEFAULT_POLICY, DEMO_ORDERS } from '../defaults.ts';
import { docFromFile, newOrderDoc, type OrderDoc } from './order/draft.ts';
import { useOrderWorkspace } from './order/useOrderWorkspace.ts';
import { useUndoKeys } from './order/useUndoKeys.ts';
import { Caution } from './components/Caution.tsx';
import { TopBar, type View } from './components/TopBar.tsx';
import { VerdictBar } from './components/VerdictBar.tsx';
import { ProblemsList } from './components/ProblemsList.tsx';
import { OrderView } from './OrderView.tsx';
import { CatalogView } from './catalog/CatalogView.tsx';
import { PolicyView } from './policy/PolicyView.tsx';
import { PrintActions } from './print/PrintActions.tsx';
import { parseOrder } from '../core/order.ts';
import { toOrderFile } from './order/draft.ts';

function demoDoc(key: string): OrderDoc | null {
  const demo = DEMO_ORDERS.find((d) => d.key === key);
  const r = demo ? docFromFile(demo.file) : null;
  return r?.ok ? r.value : null;
}

/** The app: the order workspace, the catalog and the policy in use. State lives in memory (storage comes separately). */
export function App() {
  const [view, setView] = useState<View>('order');
  const [catalog, setCatalog] = useState<{ file: unknown; catalog: Catalog }>({ file: DEFAULT_FILES.catalog, catalog: DEFAULT_CATALOG });
  const [policy, setPolicy] = useState<{ file: unknown; policy: Policy }>({ file: DEFAULT_FILES.policy, policy: DEFAULT_POLICY });
  const firstKey = DEMO_ORDERS[0]?.key ?? '';
  const [demoKey, setDemoKey] = useState(firstKey);
  const [openProblems, setOpenProblems] = useState<Problem[]>([]);
  const ws = useOrderWorkspace(() => demoDoc(firstKey) ?? newOrderDoc(), catalog.catalog, policy.policy);
  useUndoKeys(ws.pending !== null, ws.actions, view === 'order');

  const open = (doc: OrderDoc, label: string, key: string) => {
    setOpenProblems([]);
    setDemoKey(key);
    setView('order');
    ws.actions.edit(label, () => doc);
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
      <p className="context">Catalog: {catalog.catalog.name} · Policy: {policy.policy.name}</p>
      <ProblemsList problems={openProblems} title="The file could not be opened as an order" />
      {view === 'order' ? (
        <main aria-label="Order workspace"><OrderView ws={ws} catalog={catalog.catalog} /></main>
      ) : view === 'catalog' ? (
        <CatalogView catalog={catalog.catalog} file={catalog.file} onReplace={(file, c) => setCatalog({ file, catalog: c })} />
      ) : (
        <PolicyView policy={policy.policy} file={policy.file} onReplace={(file, p) => setPolicy({ file, policy: p })} />
      )}
    </div>
  );
}
