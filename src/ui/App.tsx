import { useMemo, useState } from 'react';
import { checkOrder } from '../core/evaluate.ts';
import { formatProblem } from '../core/problems.ts';
import { DEFAULT_CATALOG, DEFAULT_POLICY, DEMO_ORDERS } from '../defaults.ts';
import { Caution } from './components/Caution.tsx';
import { OrderStrip } from './components/OrderStrip.tsx';
import { LinesView } from './components/LinesView.tsx';
import { OsmolarityPanel } from './components/OsmolarityPanel.tsx';
import { TotalsPanel } from './components/TotalsPanel.tsx';
import { FindingsPanel } from './components/FindingsPanel.tsx';
import { PrintActions } from './print/PrintActions.tsx';

/** The app: pick an order, see the bag the engine computes and what holds it back. */
export function App() {
  const [demoKey, setDemoKey] = useState(DEMO_ORDERS[0]?.key ?? '');
  const demo = DEMO_ORDERS.find((d) => d.key === demoKey) ?? DEMO_ORDERS[0];
  const result = useMemo(() => (demo ? checkOrder(demo.file, DEFAULT_CATALOG, DEFAULT_POLICY) : null), [demo]);
  return (
    <div className="app">
      <header className="top">
        <div className="brand"><span className="mark" aria-hidden="true" />Osmocount<span className="tag">PN admixture check</span></div>
        <label className="picker">
          Demo order
          <select value={demoKey} onChange={(e) => setDemoKey(e.target.value)}>
            {DEMO_ORDERS.map((d) => <option key={d.key} value={d.key}>{d.title}</option>)}
          </select>
        </label>
        <span className="context">Catalog: {DEFAULT_CATALOG.name} · Policy: {DEFAULT_POLICY.name}</span>
        {result?.ok ? <PrintActions report={result.value.report} orderLines={result.value.order.lines} catalog={DEFAULT_CATALOG} policy={DEFAULT_POLICY} /> : null}
      </header>
      <Caution />
      {result === null ? null : result.ok ? (
        <main>
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
        </main>
      ) : (
        <main>
          <section className="panel problems" role="alert">
            <h2>This order cannot be checked</h2>
            <ul>{result.problems.map((p, i) => <li key={i}>{formatProblem(p)}</li>)}</ul>
          </section>
        </main>
      )}
    </div>
  );
}
