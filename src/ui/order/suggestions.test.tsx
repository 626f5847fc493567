// @vitest-environment jsdom
import { describe, expect, it, vi } from 'vitest';
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { checkOrder } from '../../core/evaluate.ts';
import type { Report } from '../../core/report.ts';
import { DEFAULT_CATALOG, DEFAULT_POLICY, DEMO_ORDERS } from '../../defaults.ts';
import { SuggestionsPanel } from '../components/SuggestionsPanel.tsx';
import { docFromFile, toOrderFile, type OrderDoc } from './draft.ts';
import { applyChanges, setAmount } from './edits.ts';
import { historyReducer, startHistory } from './history.ts';
import { changesOf, readSuggestions, type Suggestion } from './suggestions.ts';

function demoDoc(): OrderDoc {
  const r = docFromFile(DEMO_ORDERS[0]?.file);
  if (!r.ok) throw new Error('demo');
  return r.value;
}

function reportOf(doc: OrderDoc): Report {
  const r = checkOrder(toOrderFile(doc.order), DEFAULT_CATALOG, DEFAULT_POLICY);
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return r.value.report;
}

describe('solver suggestions in the workspace', () => {
  // Journey 2: the adult peripheral demo with dextrose 250 g is about 1,150 mOsm/L, over 900 (ASPEN 2014).
  const held = () => setAmount(demoDoc(), 1, '250');

  it('reads the engine\'s proposals: the edits that apply them and what they do to the bag', () => {
    const report = reportOf(held());
    expect(report.osmolarity.reported).toBe(1149.3);
    const { proposals } = readSuggestions(report);
    const volume = proposals.find((p) => p.id === 'final-volume');
    if (!volume) throw new Error('no volume proposal');
    expect(volume.title).toMatch(/^Final volume \d+ mL$/);
    const path = volume.changes.map((c) => c.path);
    expect(path).toEqual(['volumeMl']);
    expect(volume.consequences[0]).toMatch(/^Osmolarity 1149\.3 → \d+\.\d mOsm\/L \(limit 900\)$/);
    expect(volume.consequences.some((c) => /^Volume 2000 → \d+ mL; fluid 29\.4 → /.test(c))).toBe(true);
    const dextrose = proposals.find((p) => p.id === 'dextrose');
    expect(dextrose?.title).toMatch(/^Dextrose 70% injection: \d+ g$/);
    expect(dextrose?.changes.map((c) => c.path)).toEqual(['lines[1].unit', 'lines[1].amount']);
  });

  it('applying the volume proposal brings the bag to the limit, and undo takes it back', () => {
    let h = startHistory(held());
    const volume = readSuggestions(reportOf(h.present)).proposals.find((p) => p.id === 'final-volume');
    if (!volume) throw new Error('no volume proposal');
    h = historyReducer(h, { type: 'edit', label: `Apply: ${volume.title}`, apply: (d) => applyChanges(d, volume.changes, DEFAULT_CATALOG) });
    const after = reportOf(h.present);
    // The label mOsm in the bag do not change with water: 2298.6 mOsm ÷ 900 mOsm/L = 2554 mL at least.
    expect(after.volumeMl).toBeGreaterThanOrEqual(2554);
    expect(after.osmolarity.reported).toBeLessThanOrEqual(900);
    expect(after.findings.map((f) => f.code)).not.toContain('osmolarity-peripheral');
    expect(volume.verdictAfter).toBe(after.verdict);
    h = historyReducer(h, { type: 'undo' });
    expect(reportOf(h.present).verdict).toBe('block');
  });

  it('a volume proposal for an order without a fill line adds one', () => {
    const changes = changesOf({ field: 'volumeMl', from: null, to: 2600, unit: 'mL', addsFillLine: 'sterile-water' });
    const doc = demoDoc();
    const noFill = { ...doc, order: { ...doc.order, lines: doc.order.lines.filter((l) => !l.fill) }, keys: doc.keys.slice(0, -1) };
    const out = applyChanges(noFill, changes, DEFAULT_CATALOG);
    expect(out.order.volumeMl).toBe('2600');
    expect(out.order.lines.at(-1)).toEqual({ product: 'sterile-water', fill: true });
    expect(new Set(out.keys).size).toBe(out.keys.length);
  });

  it('the panel applies a proposal only on the user\'s click', async () => {
    const onApply = vi.fn();
    const s: Suggestion = { id: 'final-volume', title: 'Final volume ≥ 2560 mL', detail: 'A proposal only.', consequences: ['Volume 2000 → 2560 mL'], changes: [{ path: 'volumeMl', value: '2560' }], verdictAfter: 'pass' };
    render(<SuggestionsPanel suggestions={[s]} unavailable={[{ id: 'dextrose', message: 'No dextrose line to lower.', notes: [] }]} onApply={onApply} disabled={false} />);
    expect(screen.getByText('Volume 2000 → 2560 mL')).toBeInTheDocument();
    expect(screen.getByText('No dextrose line to lower.')).toBeInTheDocument();
    expect(onApply).not.toHaveBeenCalled();
    await userEvent.setup().click(screen.getByRole('button', { name: 'Apply: Final volume ≥ 2560 mL (verdict after: Pass)' }));
    expect(onApply).toHaveBeenCalledWith(s);
  });
});
