import { useMemo, useState } from 'react';
import { formatProblem } from '../core/problems.ts';
import { DEMO_ORDERS } from '../defaults.ts';
import { evaluateFile } from '../store/check.ts';
import type { JsonObject } from '../store/types.ts';
import { Caution } from './components/Caution.tsx';
import { OrderStrip } from './components/OrderStrip.tsx';
import { LinesView } from './components/LinesView.tsx';
import { OsmolarityPanel } from './components/OsmolarityPanel.tsx';
import { TotalsPanel } from './components/TotalsPanel.tsx';
import { FindingsPanel } from './components/FindingsPanel.tsx';
import { OpenOrderBar } from './saved/OpenOrderBar.tsx';
import { QaLogPanel } from './saved/QaLogPanel.tsx';
import { RefFilesPanel } from './saved/RefFilesPanel.tsx';
import { SavedOrdersView } from './saved/SavedOrdersView.tsx';
import { useSavedWork } from './saved/SavedWorkProvider.tsx';
import { ShellAmounts } from './saved/ShellAmounts.tsx';
import { StorageNotice } from './saved/StorageNotice.tsx';
import { useSavedOrder } from './saved/useSavedOrder.ts';
import { VersionHistory } from './saved/VersionHistory.tsx';

type View = 'order' | 'saved' | 'qa';
const demoFile = (key: string) => structuredClone(DEMO_ORDERS.find((d) => d.key === key)?.file ?? {}) as JsonObject;

/** The app: pick an order, see the bag the engine computes and what holds it back; the browser keeps the work. */
export function App() {
  const work = useSavedWork();
  if (work.status === 'loading') return <div className="app"><p className="none">Opening the work saved in this browser…</p></div>;
  return <Shell />;
}

function Shell() {
  const work = useSavedWork();
  const env = work.env;
  const [demoKey, setDemoKey] = useState(work.restored ? '' : (DEMO_ORDERS[0]?.key ?? ''));
  const [first] = useState<JsonObject>(() => work.restored?.file ?? demoFile(DEMO_ORDERS[0]?.key ?? ''));
  const [view, setView] = useState<View>('order');
  const [initials, setInitials] = useState('');
  const saved = useSavedOrder(initials.trim() === '' ? null : initials.trim().toUpperCase());
  const onScreen = saved.current ?? first;
  const result = useMemo(() => (env ? evaluateFile(onScreen, env) : null), [onScreen, env]);
  const pickDemo = (key: string) => { setDemoKey(key); saved.detach(demoFile(key)); setView('order'); };
  const opened = () => { setDemoKey(''); setView('order'); };
  return (
    <div className="app">
      <header className="top">
        <div className="brand"><span className="mark" aria-hidden="true" />Osmocount<span className="tag">PN admixture check</span></div>
        <nav className="views saved" aria-label="Views">
          <button type="button" aria-current={view === 'order' ? 'page' : undefined} onClick={() => setView('order')}>Order</button>
          <button type="button" aria-current={view === 'saved' ? 'page' : undefined} onClick={() => setView('saved')}>Saved orders</button>
          <button type="button" aria-current={view === 'qa' ? 'page' : undefined} onClick={() => setView('qa')}>QA log</button>
        </nav>
        <label className="picker">
          Demo order
          <select value={demoKey} onChange={(e) => pickDemo(e.target.value)}>
            {demoKey === '' ? <option value="">—</option> : null}
            {DEMO_ORDERS.map((d) => <option key={d.key} value={d.key}>{d.title}</option>)}
          </select>
        </label>
        <span className="context">Catalog: {env?.catalog.name} · Policy: {env?.policy.name}</span>
      </header>
      <Caution />
      <StorageNotice />
      {view === 'saved' ? (
        <main><SavedOrdersView api={saved} by={initials.trim().toUpperCase() || null} onOpened={opened} /><RefFilesPanel /></main>
      ) : view === 'qa' ? (
        <main><QaLogPanel by={initials.trim().toUpperCase() || null} /></main>
      ) : (
        <main>
          <OpenOrderBar api={saved} file={onScreen} verdict={result?.ok ? result.value.verdict : null} initials={initials} onInitials={setInitials} />
          {env ? <ShellAmounts file={onScreen} catalog={env.catalog} onCommit={(next) => saved.edited(next)} /> : null}
          {result === null ? null : result.ok ? (
            <>
              <OrderStrip report={result.value.report} />
              <div className="grid">
                <div className="col-main">
                  <LinesView report={result.value.report} />
                  <TotalsPanel report={result.value.report} />
                </div>
                <div className="col-side">
                  <OsmolarityPanel report={result.value.report} />
                  <FindingsPanel report={result.value.report} />
                </div>
              </div>
            </>
          ) : (
            <section className="panel problems" role="alert">
              <h2>This order cannot be checked</h2>
              <ul>{result.problems.map((p, i) => <li key={i}>{formatProblem(p)}</li>)}</ul>
            </section>
          )}
          {saved.saved && env ? <VersionHistory versions={saved.saved.versions} catalog={env.catalog} /> : null}
        </main>
      )}
    </div>
  );
}
