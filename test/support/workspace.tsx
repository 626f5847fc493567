// User steps for the workspace's component tests: what a pharmacist does, in their words.
// Each step drives the real App through @testing-library/user-event; nothing is mocked.
import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { App } from '../../src/ui/App.tsx';

export type Steps = Awaited<ReturnType<typeof openWorkspace>>;

/** Open the app (the first demo order is loaded) and return the steps a user can take in it. */
export async function openWorkspace() {
  const user = userEvent.setup();
  render(<App />);
  const rowOf = (line: number) => {
    const rows = within(screen.getByRole('table', { name: 'Lines' })).getAllByRole('row');
    // Row 0 is the header; order lines follow in order.
    const row = rows[line];
    if (!row) throw new Error(`no line ${line}`);
    return row;
  };
  const amountCell = (line: number) => screen.getByRole('textbox', { name: new RegExp(`^Amount, line ${line}\\b`) });
  const unitSelect = (line: number) => screen.getByRole('combobox', { name: new RegExp(`^Unit, line ${line}\\b`) });
  const steps = {
    user,
    /** The reported osmolarity as displayed (mOsm/L). */
    osmolarity: () => screen.getByTestId('reported-osmolarity').textContent,
    verdict: () => screen.getByTestId('verdict').textContent ?? '',
    amountCell,
    unitSelect,
    /** Type into a line's amount and commit with Enter (or leave it uncommitted). */
    async enterAmount(line: number, text: string, commit: 'Enter' | 'Tab' | 'none' = 'Enter') {
      await user.clear(amountCell(line));
      if (text !== '') await user.keyboard(text);
      if (commit === 'Enter') await user.keyboard('{Enter}');
      if (commit === 'Tab') await user.tab();
    },
    /** Type into a header field (by its label) and commit with Enter. */
    async enterField(label: string, text: string) {
      await user.clear(screen.getByLabelText(label));
      if (text !== '') await user.keyboard(text);
      await user.keyboard('{Enter}');
    },
    /** Search the stock picker of a line and pick the option with this name. */
    async pickStock(line: number, query: string, name: string) {
      const input = screen.getByRole('combobox', { name: `Stock, line ${line}` });
      await user.click(input);
      await user.keyboard(query);
      await user.click(screen.getByRole('option', { name }));
    },
    async chooseUnit(line: number, unit: string) {
      await user.selectOptions(unitSelect(line), unit);
    },
    unitChoices: (line: number) => within(unitSelect(line)).getAllByRole('option').map((o) => o.getAttribute('value')),
    speciesChoices: (line: number) => {
      const select = screen.queryByRole('combobox', { name: new RegExp(`^Counted species, line ${line}\\b`) });
      return select ? within(select).getAllByRole('option').map((o) => o.getAttribute('value')) : [];
    },
    /** A computed figure of a line (stock mL, mOsm, share, per day, per kg) as displayed. */
    figure: (line: number, column: 'volumeMl' | 'mOsm' | 'share' | 'perDay' | 'perKg') => rowOf(line).querySelector(`td.col-${column}`)?.textContent ?? '',
    lineCount: () => screen.getAllByRole('combobox', { name: /^Stock, line/ }).length,
    async addLine() { await user.click(screen.getByRole('button', { name: 'Add line' })); },
    async undo() { await user.keyboard('{Control>}z{/Control}'); },
    async redo(keys: 'shift-z' | 'y' = 'shift-z') {
      await user.keyboard(keys === 'y' ? '{Control>}y{/Control}' : '{Control>}{Shift>}z{/Shift}{/Control}');
    },
    async view(name: 'Order' | 'Catalog' | 'Policy') {
      await user.click(within(screen.getByRole('navigation', { name: 'Views' })).getByRole('button', { name }));
    },
    /** Choose a file in a file input (by its label) holding this text. */
    async importFile(label: string, name: string, text: string) {
      await user.upload(screen.getByLabelText(label), new File([text], name, { type: 'application/json' }));
    },
  };
  await screen.findByTestId('reported-osmolarity');
  return steps;
}
