// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { D } from '../../core/decimal.ts';
import { checkOrder } from '../../core/evaluate.ts';
import { DEFAULT_CATALOG, DEFAULT_POLICY, DEMO_ORDERS } from '../../defaults.ts';
import { openStore } from '../../store/db.ts';
import { loadEnv } from '../../store/files.ts';
import { saveVersion } from '../../store/orders.ts';
import { freshIndexedDb } from '../../store/test-support.ts';
import type { JsonObject } from '../../store/types.ts';
import { show } from '../show.ts';
import { QaLogPanel } from './QaLogPanel.tsx';
import { SavedWorkProvider } from './SavedWorkProvider.tsx';

const DB = 'ui-qa-test';

describe('the osmolality QA log panel', () => {
  it('records a reading for a saved bag and shows the difference, the summary and the plot', async () => {
    freshIndexedDb();
    const r = await openStore(DB);
    if (!r.ok) throw new Error('open');
    const { env } = await loadEnv(r.value);
    await saveVersion(r.value, env, { orderKey: null, file: structuredClone(DEMO_ORDERS[0]!.file) as JsonObject, by: 'AB' });
    r.value.db.close();
    const engine = checkOrder(DEMO_ORDERS[0]!.file, DEFAULT_CATALOG, DEFAULT_POLICY);
    if (!engine.ok) throw new Error('engine');
    const particle = engine.value.report.osmolarity.particle;

    const user = userEvent.setup();
    render(<SavedWorkProvider dbName={DB}><QaLogPanel by="AB" /></SavedWorkProvider>);
    const form = await screen.findByRole('form', { name: 'Record a measured osmolality' });
    await waitFor(() => expect(within(form).getByLabelText('Bag (saved order)')).toHaveTextContent('MPH-2026-0412'));
    // a bad reading first: every problem listed, nothing recorded
    await user.selectOptions(within(form).getByLabelText('Bag (saved order)'), 'MPH-2026-0412 · MRN-448210');
    await waitFor(() => expect(within(form).getByLabelText('Version')).toHaveValue('1'));
    await user.type(within(form).getByLabelText('Measured, mOsm/kg'), 'abc');
    await user.clear(within(form).getByLabelText('Measured on'));
    await user.click(within(form).getByRole('button', { name: 'Record reading' }));
    expect(await within(form).findByRole('alert')).toHaveTextContent('measured: must be a number > 0 and ≤ 6000');
    expect(within(form).getByRole('alert')).toHaveTextContent('measuredOn: must be a date, YYYY-MM-DD');

    await user.clear(within(form).getByLabelText('Measured, mOsm/kg'));
    await user.type(within(form).getByLabelText('Measured, mOsm/kg'), '960');
    await user.type(within(form).getByLabelText('Measured on'), '2026-12-01');
    await user.type(within(form).getByLabelText('Instrument note'), 'Osmometer 1');
    await user.click(within(form).getByRole('button', { name: 'Record reading' }));
    expect(await within(form).findByRole('status')).toHaveTextContent('MPH-2026-0412 v1: 960 mOsm/kg recorded.');

    const readings = await screen.findByRole('table', { name: 'Readings' });
    // difference = 960 − particle count of the demo bag (from the engine's report)
    const diff = new D(960).minus(particle).toFixed(1);
    expect(readings).toHaveTextContent(`${show(particle, 1)} (${diff.startsWith('-') ? '' : '+'}${diff})`);
    const summary = screen.getByRole('table', { name: 'Bias by formula type' });
    expect(summary).toHaveTextContent('Adult 3-in-1');
    expect(summary).toHaveTextContent('— (one bag)');
    expect(screen.getByRole('img', { name: /Measured vs calculated osmolality/ })).toBeInTheDocument();
    expect(screen.getByText(/for 1 bag; 1 of 1 measured higher than the particle count/, { selector: 'desc' })).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Export the QA log (CSV)' })).toBeEnabled();
  });
});
