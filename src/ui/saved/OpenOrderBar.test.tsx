// @vitest-environment jsdom
import { useState } from 'react';
import { describe, expect, it } from 'vitest';
import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { DEMO_ORDERS } from '../../defaults.ts';
import { evaluateFile } from '../../store/check.ts';
import { freshIndexedDb } from '../../store/test-support.ts';
import type { JsonObject } from '../../store/types.ts';
import { OpenOrderBar } from './OpenOrderBar.tsx';
import { SavedWorkProvider, useSavedWork } from './SavedWorkProvider.tsx';
import { StorageNotice } from './StorageNotice.tsx';
import { useSavedOrder } from './useSavedOrder.ts';
import { VersionHistory } from './VersionHistory.tsx';

/** A stand-in for the order workspace: one editable field (bag volume) committed on Enter. */
function MiniWorkspace() {
  const work = useSavedWork();
  if (work.status !== 'ready' || !work.env) return <p>Loading</p>;
  return <Ready />;
}

function Ready() {
  const work = useSavedWork();
  const api = useSavedOrder(null);
  const [file, setFile] = useState<JsonObject>(() => work.restored?.file ?? (structuredClone(DEMO_ORDERS[0]!.file) as JsonObject));
  const [text, setText] = useState(String(file.volumeMl));
  const [initials, setInitials] = useState('');
  const evaluation = work.env ? evaluateFile(file, work.env) : null;
  const commit = () => { const next = { ...file, volumeMl: text }; setFile(next); api.edited(next); };
  return (
    <>
      <label>Bag volume<input value={text} onChange={(e) => setText(e.target.value)} onKeyDown={(e) => { if (e.key === 'Enter') commit(); }} /></label>
      <OpenOrderBar api={api} file={file} verdict={evaluation?.ok ? evaluation.value.verdict : null} initials={initials} onInitials={setInitials} />
      {api.saved && work.env ? <VersionHistory versions={api.saved.versions} catalog={work.env.catalog} /> : null}
    </>
  );
}

function app() {
  return <SavedWorkProvider dbName="ui-test"><StorageNotice /><MiniWorkspace /></SavedWorkProvider>;
}

describe('the open order in the browser', () => {
  it('keeps the last committed edit across a reload (the provider opened again on the same storage)', async () => {
    freshIndexedDb();
    const user = userEvent.setup();
    const first = render(app());
    const volume = await screen.findByLabelText('Bag volume');
    await user.clear(volume);
    await user.type(volume, '2400{Enter}');
    await waitFor(() => expect(screen.getByTestId('autosave-state')).toHaveTextContent('Draft kept in this browser'));
    first.unmount();
    render(app());
    expect(await screen.findByLabelText('Bag volume')).toHaveValue('2400');
    expect(screen.getByTestId('saved-state')).toHaveTextContent('Not saved as an order yet');
  });

  it('saves, signs off (locking the version), and a later change makes version 2 with its history', async () => {
    freshIndexedDb();
    const user = userEvent.setup();
    render(app());
    await screen.findByLabelText('Bag volume');
    await user.type(screen.getByLabelText('Your initials'), 'jmk');
    // The adult peripheral demo is a bag the checks pass or review; confirm the hold box only if it shows.
    const hold = screen.queryByRole('checkbox', { name: /checks hold this bag/ });
    if (hold) await user.click(hold);
    await user.click(screen.getByRole('button', { name: 'Save and sign off as version 1' }));
    await waitFor(() => expect(screen.getByLabelText('Sign-off')).toHaveTextContent('Verified by JMK'));
    expect(screen.getByLabelText('Sign-off')).toHaveTextContent('Version 1 is locked: any change makes version 2.');

    const volume = screen.getByLabelText('Bag volume');
    await user.clear(volume);
    await user.type(volume, '2560{Enter}');
    await waitFor(() => expect(screen.getByTestId('saved-state')).toHaveTextContent('Version 1 · unsaved changes'));
    await user.click(screen.getByRole('button', { name: 'Save as version 2' }));
    const history = await screen.findByRole('region', { name: 'Version history' });
    await waitFor(() => expect(within(history).getAllByRole('listitem').length).toBeGreaterThanOrEqual(2));
    expect(history).toHaveTextContent('Version 2 saved by JMK');
    expect(history).toHaveTextContent('Bag volume (mL): 2000 → 2560');
    expect(history).toHaveTextContent('Verified by JMK');
    expect(screen.getByRole('button', { name: 'Sign off version 2' })).toBeEnabled();
  });

  it('says clearly when storage is full, and keeps the edit on screen', async () => {
    freshIndexedDb();
    const user = userEvent.setup();
    render(app());
    const volume = await screen.findByLabelText('Bag volume');
    const put = IDBObjectStore.prototype.put;
    IDBObjectStore.prototype.put = () => { throw new DOMException('quota', 'QuotaExceededError'); };
    try {
      await user.clear(volume);
      await user.type(volume, '2100{Enter}');
      const alert = await screen.findByRole('alert', { name: 'Storage problem' });
      expect(alert).toHaveTextContent('storage for this site is full, so nothing was saved');
      expect(screen.getByTestId('autosave-state')).toHaveTextContent('could not be kept in this browser');
      expect(screen.getByLabelText('Bag volume')).toHaveValue('2100');
    } finally {
      IDBObjectStore.prototype.put = put;
    }
  });
});
