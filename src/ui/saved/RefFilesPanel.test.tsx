// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { DEFAULT_FILES } from '../../defaults.ts';
import { freshIndexedDb } from '../../store/test-support.ts';
import type { JsonObject } from '../../store/types.ts';
import { RefFilesPanel } from './RefFilesPanel.tsx';
import { SavedWorkProvider } from './SavedWorkProvider.tsx';

const file = (json: unknown, name: string) => new File([JSON.stringify(json)], name, { type: 'application/json' });

describe('catalog and policy kept in the browser', () => {
  it('imports a catalog (then in force), rejects a bad one with its problems, and resets to the shipped one', async () => {
    freshIndexedDb();
    const user = userEvent.setup();
    render(<SavedWorkProvider dbName="ui-ref-test"><RefFilesPanel /></SavedWorkProvider>);
    const catalog = await screen.findByRole('group', { name: 'Catalog kept in this browser' });
    expect(catalog).toHaveTextContent('shipped with Osmocount');

    const edited = structuredClone(DEFAULT_FILES.catalog) as JsonObject;
    edited.id = 'marren-point-2026-12';
    await user.upload(within(catalog).getByLabelText('Import a catalog file'), file(edited, 'catalog.json'));
    await waitFor(() => expect(catalog).toHaveTextContent('imported into this browser'));
    expect(catalog).toHaveTextContent('marren-point-2026-12');

    const bad = structuredClone(DEFAULT_FILES.catalog) as JsonObject;
    (bad.products as JsonObject[])[2]!.role = 'sugar';
    await user.upload(within(catalog).getByLabelText('Import a catalog file'), file(bad, 'bad.json'));
    const alert = await within(catalog).findByRole('alert');
    expect(alert).toHaveTextContent('The catalog file was not imported; nothing changed:');
    expect(alert).toHaveTextContent('products[2].role: must be one of');
    expect(catalog).toHaveTextContent('marren-point-2026-12');

    await user.click(within(catalog).getByRole('button', { name: 'Reset to the shipped catalog' }));
    await user.click(within(catalog).getByRole('button', { name: 'Reset' }));
    await waitFor(() => expect(catalog).toHaveTextContent('shipped with Osmocount'));
    expect(within(catalog).getByRole('button', { name: 'Reset to the shipped catalog' })).toBeDisabled();
  });
});
