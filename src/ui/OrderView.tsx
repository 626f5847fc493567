import { useDeferredValue, useEffect, useMemo, useState } from 'react';
import type { Catalog } from '../core/catalog.ts';
import type { Report } from '../core/report.ts';
import { applyChanges } from './order/edits.ts';
import { readSuggestions, type Suggestion } from './order/suggestions.ts';
import type { Workspace } from './order/useOrderWorkspace.ts';
import { OrderHeader } from './components/OrderHeader.tsx';
import { LinesTable } from './components/lines/LinesTable.tsx';
import { TotalsPanel } from './components/TotalsPanel.tsx';
import { OsmolarityPanel } from './components/OsmolarityPanel.tsx';
import { ContributionChart } from './components/ContributionChart.tsx';
import { FindingsPanel } from './components/FindingsPanel.tsx';
import { SuggestionsPanel } from './components/SuggestionsPanel.tsx';
import { ProblemsList } from './components/ProblemsList.tsx';

type ReportFinding = Report['findings'][number];

function findingId(f: ReportFinding): string {
  return `${f.code}|${f.nutrient ?? ''}|${f.screen ?? ''}`;
}

const NONE: ReadonlySet<string> = new Set();

/** The order workspace: header, lines, and the bag's figures, findings and suggestions beside them. */
export function OrderView({ ws, catalog }: { ws: Workspace; catalog: Catalog }) {
  const [selectedId, setSelectedId] = useState<string | null>(null);
  // The osmolarity panel follows every keystroke at once; the table's figures, totals, findings and
  // chart follow in a deferred render, so typing never waits for the whole screen.
  const urgent = ws.figures;
  const figures = useDeferredValue(ws.figures);
  const report = figures?.report ?? null;
  const selected = report ? report.findings.findIndex((f) => findingId(f) === selectedId) : -1;
  const finding = report?.findings[selected];
  const highlightedLines = useMemo(
    () => (finding && figures ? new Set(finding.lines.flatMap((i) => (figures.keys[i] === undefined ? [] : [figures.keys[i]]))) : NONE),
    [finding, figures],
  );
  const highlightedFields = useMemo(() => (finding ? new Set(finding.fields) : NONE), [finding]);
  // Bring the first line a newly chosen finding concerns into view (the findings list can be long).
  const firstKey = highlightedLines.values().next().value;
  useEffect(() => {
    if (selectedId === null || firstKey === undefined) return;
    document.querySelector(`tr[data-key="${firstKey}"]`)?.scrollIntoView?.({ block: 'center' });
  }, [selectedId, firstKey]);
  // Proposals belong to the committed order: they stay while a number is typed, and go when it is invalid.
  const suggestions = useMemo(() => (report && ws.suggestions ? readSuggestions(report, ws.suggestions) : { proposals: [], unavailable: [] }), [report, ws.suggestions]);
  const apply = (s: Suggestion) => ws.actions.edit(`Apply: ${s.title}`, (d) => applyChanges(d, s.changes, catalog));

  return (
    <>
      <OrderHeader ws={ws} highlighted={highlightedFields} rate={urgent?.report.rateMlPerHour ?? null} />
      <div className="grid">
        <div className="col-main">
          <ProblemsList problems={ws.problems.unplaced} title="Problems in this order" />
          <LinesTable ws={ws} catalog={catalog} figures={figures} highlighted={highlightedLines} />
          {report ? <TotalsPanel report={report} stale={ws.stale} /> : null}
        </div>
        <div className="col-side">
          {report ? (
            <>
              <OsmolarityPanel report={urgent?.report ?? report} stale={ws.stale} />
              <ContributionChart report={report} />
              <SuggestionsPanel suggestions={suggestions.proposals} unavailable={suggestions.unavailable} onApply={apply} disabled={false} />
              <FindingsPanel report={report} selected={selected === -1 ? null : selected}
                onSelect={(i) => setSelectedId(i === null ? null : findingId(report.findings[i]!))} />
            </>
          ) : <p className="panel none">Figures appear as soon as the order can be checked.</p>}
        </div>
      </div>
    </>
  );
}
