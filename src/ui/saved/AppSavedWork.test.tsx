// @vitest-environment jsdom
// The app with its saved work: opening a saved order attaches the workspace to it, and undo/redo
// across that "open" moves the draft between the saved order and the unsaved one.
import { describe, expect, it } from 'vitest';
import { render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { DEMO_ORDERS } from '../../defaults.ts';
import { openStore } from '../../store/db.ts';
import { loadEnv } from '../../store/files.ts';
import { loadDraft, saveVersion } from '../../store/orders.ts';
import { freshIndexedDb } from '../../store/test-support.ts';
import type { JsonObject } from '../../store/types.ts';
import { App } from '../App.tsx';
import { SavedWorkProvider } from './SavedWorkProvider.tsx';

const DB = 'ui-app-test';

describe('the app with saved work', () => {
  it('opens a saved order, and undo steps back to the unsaved demo with the draft following', async () => {
    freshIndexedDb();
    const r = await openStore(DB);
    if (!r.ok) throw new Error('open');
    const { env } = await loadEnv(r.value);
    const central = DEMO_ORDERS.find((d) => d.key === 'adult-central')!;
    const s = await saveVersion(r.value, env, { orderKey: null, file: structuredClone(central.file) as JsonObject, by: 'AB' });
    if (!s.ok) throw new Error('save');
    r.value.db.close();

    const user = userEvent.setup();
    render(<SavedWorkProvider dbName={DB}><App /></SavedWorkProvider>);
    expect(await screen.findByTestId('saved-state')).toHaveTextContent('Not saved as an order yet');
    await user.click(screen.getByRole('button', { name: 'Saved orders' }));
    await user.click(await screen.findByRole('button', { name: `Open ${s.value.record.orderId}` }));
    await waitFor(() => expect(screen.getByTestId('saved-state')).toHaveTextContent('Version 1'));
    expect(screen.getByLabelText('Order ID')).toHaveValue(s.value.record.orderId);

    await user.click(screen.getByRole('button', { name: /^Undo: Open saved order/ }));
    await waitFor(() => expect(screen.getByTestId('saved-state')).toHaveTextContent('Not saved as an order yet'));
    expect(screen.getByLabelText('Order ID')).toHaveValue('MPH-2026-0412');
    await waitFor(async () => {
      const again = await openStore(DB);
      if (!again.ok) throw new Error('open');
      const draft = await loadDraft(again.value);
      again.value.db.close();
      expect(draft.ok && draft.value?.orderKey).toBeNull();
    });

    await user.click(screen.getByRole('button', { name: /^Redo: Open saved order/ }));
    await waitFor(() => expect(screen.getByTestId('saved-state')).toHaveTextContent('Version 1'));
  });

  it('saves the order on screen, and the next edit is an unsaved change of that saved order', async () => {
    freshIndexedDb();
    const user = userEvent.setup();
    render(<SavedWorkProvider dbName={DB}><App /></SavedWorkProvider>);
    await user.click(await screen.findByRole('button', { name: 'Save order' }));
    await waitFor(() => expect(screen.getByTestId('saved-state')).toHaveTextContent('Version 1'));
    const amount = screen.getByRole('textbox', { name: /^Amount, line 2\b/ });
    await user.clear(amount);
    await user.keyboard('140{Enter}');
    await waitFor(() => expect(screen.getByTestId('saved-state')).toHaveTextContent('Version 1 · unsaved changes'));
    await user.click(screen.getByRole('button', { name: 'Save as version 2' }));
    await waitFor(() => expect(screen.getByTestId('saved-state')).toHaveTextContent('Version 2'));
    expect(await screen.findByRole('region', { name: 'Version history' })).toHaveTextContent('amount: 150 → 140');
  });
});
