// @vitest-environment jsdom
import { describe, expect, it, vi } from 'vitest';
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { checkOrder } from '../../core/evaluate.ts';
import type { Report } from '../../core/report.ts';
import { DEFAULT_CATALOG, DEFAULT_POLICY, DEMO_ORDERS } from '../../defaults.ts';
import { SuggestionsPanel } from '../components/SuggestionsPanel.tsx';
import { docFromFile, toOrderFile } from './draft.ts';
import { applyChanges, setAmount } from './edits.ts';
import { historyReducer, startHistory } from './history.ts';
import { readSuggestions, type Suggestion } from './suggestions.ts';

function demoDoc() {
  const r = docFromFile(DEMO_ORDERS[0]?.file);
  if (!r.ok) throw new Error('demo');
  return r.value;
}

function reportOf(doc: ReturnType<typeof demoDoc>): Report {
  const r = checkOrder(toOrderFile(doc.order), DEFAULT_CATALOG, DEFAULT_POLICY);
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return r.value.report;
}

describe('solver suggestions', () => {
  it('reads path/value changes and the older single-field forms; ignores what it cannot apply', () => {
    const base = reportOf(demoDoc());
    const report = { ...base, suggestions: [
      { id: 'volume', title: 'Final volume ≥ 2560 mL', consequences: ['fluid 37.6 mL/kg/day'], changes: [{ path: 'volumeMl', value: 2560 }], verdictAfter: 'pass' },
      { kind: 'dextrose', message: 'Dextrose ≤ 150 g at 2000 mL', line: 1, amount: 150, consequences: [{ message: 'GIR 1.53 mg/kg/min' }] },
      { title: 'nothing to do' },
      'junk',
    ] } as Report;
    expect(readSuggestions(report)).toEqual<Suggestion[]>([
      { id: 'volume', title: 'Final volume ≥ 2560 mL', consequences: ['fluid 37.6 mL/kg/day'], changes: [{ path: 'volumeMl', value: '2560' }], verdictAfter: 'pass' },
      { id: 'dextrose', title: 'Dextrose ≤ 150 g at 2000 mL', consequences: ['GIR 1.53 mg/kg/min'], changes: [{ path: 'lines[1].amount', value: '150' }], verdictAfter: null },
    ]);
    expect(readSuggestions(base)).toEqual([]);
  });

  it('applying a larger volume brings the 250 g peripheral bag under 900 mOsm/L, and undo takes it back', () => {
    // Journey 2: dextrose 250 g at 2000 mL gives about 1,150 mOsm/L; the label mOsm in the bag do not change
    // with water, so 2298.6 mOsm ÷ 2.56 L ≈ 897.9 mOsm/L (ASPEN 2014 limit 900).
    let h = startHistory(setAmount(demoDoc(), 1, '250'));
    expect(reportOf(h.present).osmolarity.reported).toBe(1149.3);
    h = historyReducer(h, { type: 'edit', label: 'Apply: volume', apply: (d) => applyChanges(d, [{ path: 'volumeMl', value: '2560' }], DEFAULT_CATALOG) });
    const after = reportOf(h.present);
    expect(after.osmolarity.reported).toBe(897.9);
    expect(after.verdict).not.toBe('block');
    h = historyReducer(h, { type: 'undo' });
    expect(reportOf(h.present).verdict).toBe('block');
  });

  it('the panel applies a suggestion only on the user\'s click', async () => {
    const onApply = vi.fn();
    const s: Suggestion = { id: 'v', title: 'Final volume ≥ 2560 mL', consequences: ['fluid 37.6 mL/kg/day'], changes: [{ path: 'volumeMl', value: '2560' }], verdictAfter: 'pass' };
    render(<SuggestionsPanel suggestions={[s]} onApply={onApply} disabled={false} />);
    expect(screen.getByText('fluid 37.6 mL/kg/day')).toBeInTheDocument();
    expect(onApply).not.toHaveBeenCalled();
    await userEvent.setup().click(screen.getByRole('button', { name: 'Apply: Final volume ≥ 2560 mL' }));
    expect(onApply).toHaveBeenCalledWith(s);
  });
});
