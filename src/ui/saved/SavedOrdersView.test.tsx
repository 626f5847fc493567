// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { DEMO_ORDERS } from '../../defaults.ts';
import { openStore } from '../../store/db.ts';
import { loadEnv } from '../../store/files.ts';
import { saveVersion, signOff } from '../../store/orders.ts';
import { freshIndexedDb, snapshot } from '../../store/test-support.ts';
import type { JsonObject } from '../../store/types.ts';
import { SavedOrdersView } from './SavedOrdersView.tsx';
import { SavedWorkProvider, useSavedWork } from './SavedWorkProvider.tsx';
import { useSavedOrder } from './useSavedOrder.ts';

const DB = 'ui-list-test';

async function seed() {
  freshIndexedDb();
  const r = await openStore(DB);
  if (!r.ok) throw new Error('open');
  const store = r.value;
  const { env } = await loadEnv(store);
  const keys: string[] = [];
  // the three demo orders of the invented scenario: MPH-2026-0412, -0413 and -0414
  for (const d of DEMO_ORDERS.filter((o) => ['adult-peripheral', 'adult-central', 'preterm-neonate'].includes(o.key))) {
    const s = await saveVersion(store, env, { orderKey: null, file: structuredClone(d.file) as JsonObject, by: 'AB' });
    if (s.ok) keys.push(s.value.record.key);
  }
  await signOff(store, env, keys[0]!, 1, 'AB');
  store.db.close();
}

let opened = 0;
function View() {
  const work = useSavedWork();
  if (work.status !== 'ready') return null;
  return <Inner />;
}
function Inner() {
  const api = useSavedOrder('CD');
  return (
    <>
      <p data-testid="open">{api.saved ? `${api.saved.record.orderId} v${api.latest?.n}` : 'none'}</p>
      <SavedOrdersView api={api} by="CD" onOpened={(_file, key) => { opened += 1; api.follow(key); }} />
    </>
  );
}

describe('the saved-orders view', () => {
  it('lists saved orders and searches them by id, patient and sign-off', async () => {
    await seed();
    const user = userEvent.setup();
    render(<SavedWorkProvider dbName={DB}><View /></SavedWorkProvider>);
    expect(await screen.findByText('3 of 3 saved orders')).toBeInTheDocument();
    await user.type(screen.getByLabelText('Order id, patient id or name'), 'thornquist');
    await waitFor(() => expect(screen.getByRole('status')).toHaveTextContent('1 of 3 saved orders'));
    expect(screen.getByRole('rowheader', { name: 'MPH-2026-0414' })).toBeInTheDocument();
    await user.clear(screen.getByLabelText('Order id, patient id or name'));
    await user.selectOptions(screen.getByLabelText('Sign-off'), 'signed');
    await waitFor(() => expect(screen.getByRole('status')).toHaveTextContent('1 of 3 saved orders'));
    expect(screen.getByRole('rowheader', { name: 'MPH-2026-0412' })).toBeInTheDocument();
  });

  it('copies an order for the next bag with a suggested id, and opens the copy', async () => {
    await seed();
    const user = userEvent.setup();
    render(<SavedWorkProvider dbName={DB}><View /></SavedWorkProvider>);
    await user.click(await screen.findByRole('button', { name: 'Copy for the next bag: MPH-2026-0412' }));
    const box = await screen.findByRole('alertdialog', { name: 'Copy MPH-2026-0412 for the next bag' });
    const id = within(box).getByLabelText('New order id');
    await waitFor(() => expect(id).toHaveValue('MPH-2026-0415')); // 0413 and 0414 are taken by the other demos
    const before = opened;
    await user.click(within(box).getByRole('button', { name: 'Copy and open' }));
    await waitFor(() => expect(screen.getByTestId('open')).toHaveTextContent('MPH-2026-0415 v1'));
    expect(opened).toBe(before + 1);
    expect(await screen.findByText('4 of 4 saved orders')).toBeInTheDocument();
    expect(screen.getByText('copy of MPH-2026-0412')).toBeInTheDocument();
  });

  it('deletes only after confirmation, and a cancelled delete changes nothing', async () => {
    await seed();
    const user = userEvent.setup();
    render(<SavedWorkProvider dbName={DB}><View /></SavedWorkProvider>);
    await user.click(await screen.findByRole('button', { name: 'Delete MPH-2026-0413' }));
    const box = screen.getByRole('alertdialog', { name: 'Delete MPH-2026-0413?' });
    expect(box).toHaveTextContent('cannot be undone');
    await user.click(within(box).getByRole('button', { name: 'Cancel' }));
    expect(screen.getByText('3 of 3 saved orders')).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Delete MPH-2026-0413' }));
    await user.click(screen.getByRole('button', { name: 'Delete for good' }));
    expect(await screen.findByText('2 of 2 saved orders')).toBeInTheDocument();
    expect(screen.queryByRole('rowheader', { name: 'MPH-2026-0413' })).not.toBeInTheDocument();
  });

  it('imports a batch: lists every problem, needs consent for a partial import, and a rejected file changes nothing', async () => {
    await seed();
    const user = userEvent.setup();
    render(<SavedWorkProvider dbName={DB}><View /></SavedWorkProvider>);
    await user.click(await screen.findByRole('button', { name: 'Import orders…' }));
    const dialog = screen.getByRole('region', { name: 'Import orders' });
    const text = within(dialog).getByLabelText('Order file text');
    const good = { ...(structuredClone(DEMO_ORDERS[1]!.file) as JsonObject), id: 'MPH-2026-0500' };
    const bad = { ...(structuredClone(DEMO_ORDERS[1]!.file) as JsonObject), id: 'MPH-2026-0501', route: 'sideways', hours: 0 };
    await user.click(text);
    await user.paste(JSON.stringify([good, bad]));
    await user.click(within(dialog).getByRole('button', { name: 'Check the file' }));
    const invalid = await within(dialog).findByRole('group', { name: 'Invalid: Order 2 of the list' });
    expect(invalid).toHaveTextContent('Order 2 of the list (MPH-2026-0501) cannot be imported:');
    expect(invalid).toHaveTextContent('hours: must be a number ≥ 1 and ≤ 72');
    expect(invalid).toHaveTextContent('route: must be one of "peripheral", "central"');
    const importButton = within(dialog).getByRole('button', { name: 'Import 1 order' });
    expect(importButton).toBeDisabled();
    await user.click(within(dialog).getByRole('checkbox', { name: /leave out the 1 invalid one/ }));
    await user.click(importButton);
    expect(await within(dialog).findByRole('status')).toHaveTextContent('Imported: 1 new order, 0 new versions, 0 unchanged.');
    expect(await screen.findByText('4 of 4 saved orders')).toBeInTheDocument();

    // a file with nothing valid: nothing to import, the stored orders unchanged
    const r = await openStore(DB);
    if (!r.ok) throw new Error('open');
    const before = await snapshot(r.value);
    await user.clear(text);
    await user.paste('{"format": "osmocount-order", "version": 7}');
    await user.click(within(dialog).getByRole('button', { name: 'Check the file' }));
    expect(await within(dialog).findByText(/version: is 7: the file was written by a newer Osmocount/)).toBeInTheDocument();
    expect(within(dialog).getByText('Nothing was imported; the saved orders are unchanged.')).toBeInTheDocument();
    expect(await snapshot(r.value)).toEqual(before);
    r.value.db.close();
  });
});
