import { useId, useMemo, useState } from 'react';
import { createPortal } from 'react-dom';
import type { Catalog } from '../../core/catalog.ts';
import type { OrderLine } from '../../core/order.ts';
import type { Policy } from '../../core/policy.ts';
import type { Report } from '../../core/report.ts';
import { LabelView } from './LabelView.tsx';
import { SheetView } from './SheetView.tsx';
import { labelModel } from './labelModel.ts';
import { sheetModel } from './sheetModel.ts';
import { LABEL_PRESETS, PAPERS, PAPER_TEXT, customLabelCss, labelSizeText, parseLabelSize, type PrintOptions, type PrintSequenceStep } from './options.ts';
import { sheetPageCss } from './pageCss.ts';
import { useAdoptedCss } from './useAdoptedCss.ts';
import { usePrintJob } from './usePrintJob.ts';
import { sheetSequence } from './mixing.ts';
import './print.css';

/** The demo's institution (a fictional hospital); a deployment passes its own name. */
export const DEMO_INSTITUTION = 'Marren Point Hospital';

interface Props {
  report: Report;
  catalog: Catalog;
  policy: Policy;
  institution?: string;
  /** The order's lines, for the suggested mixing sequence on the sheet (from the policy's compounding section). */
  orderLines?: readonly OrderLine[];
  /** A mixing sequence given directly (takes precedence over one made from orderLines). */
  sequence?: readonly PrintSequenceStep[];
}

/** The label-size choice: presets, or a custom size typed as WxHin / WxHmm. */
function LabelSizeField({ onChange }: { onChange: (size: ReturnType<typeof parseLabelSize>) => void }) {
  const [choice, setChoice] = useState(LABEL_PRESETS[0]?.id ?? '4x6');
  const [custom, setCustom] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const id = useId();
  const apply = (id: string, text: string) => {
    const r = parseLabelSize(id === 'custom' ? text : id, 'Label size');
    setProblem(r.ok || (id === 'custom' && text.trim() === '') ? null : r.problems.map((p) => p.message).join('; '));
    onChange(r);
  };
  return (
    <>
      <span className="pr-field">
        <label htmlFor={`${id}-size`}>Label</label>
        <select id={`${id}-size`} value={choice} onChange={(e) => { setChoice(e.target.value); apply(e.target.value, custom); }}>
          {LABEL_PRESETS.map((p) => <option key={p.id} value={p.id}>{labelSizeText(p)}</option>)}
          <option value="custom">Custom…</option>
        </select>
      </span>
      {choice === 'custom' ? (
        <span className="pr-field">
          <label htmlFor={`${id}-custom`}>Size</label>
          <input id={`${id}-custom`} value={custom} placeholder="e.g. 3.5x5in or 100x150mm" size={16} aria-invalid={problem !== null}
            onChange={(e) => { setCustom(e.target.value); apply('custom', e.target.value); }} />
        </span>
      ) : null}
      {problem ? <span className="pr-field-problem" role="alert">{problem}</span> : null}
    </>
  );
}

/**
 * Print buttons for the current order: the verification sheet (A4 or US Letter) and the bag label
 * (4 × 6 in, 4 × 4 in or custom). The chosen printout renders into a print-only container outside
 * the app while printing, so nothing of the workspace prints.
 */
export function PrintActions({ report, catalog, policy, institution, orderLines, sequence: given }: Props) {
  const { job, paper, setPaper, labelSize, setLabelSize, print } = usePrintJob();
  const [sizeOk, setSizeOk] = useState(true);
  const paperId = useId();
  const at = job?.at;
  const sequence = useMemo(() => given ?? (orderLines ? sheetSequence(orderLines, policy) : undefined), [given, orderLines, policy]);
  const options = useMemo<PrintOptions>(() => {
    const when = at ?? new Date();
    return {
      institution: institution ?? policy.institution ?? DEMO_INSTITUTION,
      paper, labelSize, catalog, policy,
      compoundedAt: when, printedAt: when,
      timeZone: Intl.DateTimeFormat().resolvedOptions().timeZone,
      ...(sequence ? { sequence } : {}),
    };
  }, [institution, paper, labelSize, catalog, policy, at, sequence]);
  const label = useMemo(() => labelModel(report, options), [report, options]);
  const sheet = useMemo(() => (job?.kind === 'sheet' ? sheetModel(report, options) : null), [job?.kind, report, options]);
  useAdoptedCss(customLabelCss(labelSize) + (sheet ? sheetPageCss(sheet) : ''));
  let printout = null;
  if (sheet) printout = <SheetView model={sheet} />;
  else if (job?.kind === 'label') printout = <LabelView model={label} />;
  return (
    <div className="pr-actions" role="group" aria-label="Print">
      <span className="pr-field">
        <label htmlFor={paperId}>Paper</label>
        <select id={paperId} value={paper} onChange={(e) => setPaper(e.target.value === 'letter' ? 'letter' : 'a4')}>
          {PAPERS.map((p) => <option key={p} value={p}>{PAPER_TEXT[p]}</option>)}
        </select>
      </span>
      <button type="button" className="pr-button" onClick={() => print('sheet')}>Print verification sheet</button>
      <LabelSizeField onChange={(r) => { setSizeOk(r.ok); if (r.ok) setLabelSize(r.value); }} />
      <button type="button" className="pr-button" disabled={!sizeOk} onClick={() => print('label')}>Print bag label</button>
      {label.fitWarning ? <span className="pr-field-problem" role="status">{label.fitWarning}</span> : null}
      {printout ? createPortal(<div className="pr-portal" data-testid="print-container">{printout}</div>, document.body) : null}
    </div>
  );
}
