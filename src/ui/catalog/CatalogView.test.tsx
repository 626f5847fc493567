// @vitest-environment jsdom
// The catalog and policy views as a pharmacist uses them: import files, edit a stock, see the order follow.
import { describe, expect, it, vi } from 'vitest';
import { screen, within } from '@testing-library/react';
import { openWorkspace } from '../../../test/support/workspace.tsx';

vi.setConfig({ testTimeout: 30_000 });

const DEFAULT_NAME = 'Catalog: Common US generic PN stocks (Osmocount default)';

function stockRows() {
  return within(screen.getByRole('table', { name: /^Catalog:/ })).getAllByRole('row').length - 1;
}

describe('importing a catalog file', () => {
  it('a bad file lists every problem and leaves the catalog in use unchanged', async () => {
    const s = await openWorkspace();
    await s.view('Catalog');
    expect(screen.getByRole('heading', { level: 1 })).toHaveTextContent(DEFAULT_NAME);
    const before = stockRows();
    const bad = { format: 'osmocount-catalog', version: 1, products: [{ id: 'Bad Id', name: '', role: 'electrolyte', perMl: { Na: -1 } }] };
    await s.importFile('Import catalog file…', 'bad-catalog.json', JSON.stringify(bad));
    const problems = await screen.findByRole('alert', { name: 'Problems in the imported catalog' });
    expect(within(problems).getByText('products[0].id: must be lowercase letters, digits and single dashes')).toBeInTheDocument();
    expect(within(problems).getByText('products[0].name: must not be empty')).toBeInTheDocument();
    expect(within(problems).getByText('products[0].perMl.Na: must be a number ≥ 0 and ≤ 100')).toBeInTheDocument();
    expect(screen.getByText(/bad-catalog\.json was not imported: the catalog in use is unchanged/)).toBeInTheDocument();
    expect(screen.getByRole('heading', { level: 1 })).toHaveTextContent(DEFAULT_NAME);
    expect(stockRows()).toBe(before);
    await s.view('Order');
    expect(s.osmolarity()).toBe('897.0');
  });

  it('a file that is not JSON is refused with the reason', async () => {
    const s = await openWorkspace();
    await s.view('Catalog');
    await s.importFile('Import catalog file…', 'half.json', '{"format": "osmocount-catalog", ');
    const problems = await screen.findByRole('alert', { name: 'Problems in the imported catalog' });
    expect(problems).toHaveTextContent(/\(file\): half\.json is not valid JSON/);
    expect(screen.getByRole('heading', { level: 1 })).toHaveTextContent(DEFAULT_NAME);
  });

  it('a valid file replaces the catalog, and the order says which stock it no longer knows', async () => {
    const s = await openWorkspace();
    await s.view('Catalog');
    // Dextrose 70%: 0.7 g/mL, 3532 mOsm/L (US label); the small catalog has no lipid.
    const small = {
      format: 'osmocount-catalog', version: 1, id: 'ward-5', name: 'Ward 5 stocks',
      products: [
        { id: 'dextrose-70', name: 'Dextrose 70% injection', role: 'dextrose', nutrient: { gramsPerMl: '0.7', mOsmPerGram: '5.046', basis: 'hydrous' }, mOsmPerMl: '3.532' },
        { id: 'sterile-water', name: 'Sterile water for injection', role: 'water', mOsmPerMl: 0 },
      ],
    };
    await s.importFile('Import catalog file…', 'ward-5.json', JSON.stringify(small));
    expect(await screen.findByRole('heading', { level: 1 })).toHaveTextContent('Catalog: Ward 5 stocks');
    expect(stockRows()).toBe(2);
    await s.view('Order');
    expect(screen.getByRole('combobox', { name: 'Stock, line 3' })).toHaveAccessibleDescription('unknown product "lipid-20" (not in the catalog)');
    expect(screen.getByText(/Showing the last valid figures/)).toBeInTheDocument();
  });
});

describe('editing a stock', () => {
  it('validates like the file format, and a saved change reaches the order', async () => {
    const s = await openWorkspace();
    await s.view('Catalog');
    await s.user.click(screen.getByRole('button', { name: 'Edit Amino acids 10% injection (without added electrolytes)' }));
    const field = screen.getByLabelText('Labelled osmolarity, mOsm/mL');
    expect(field).toHaveValue('0.84');
    await s.user.clear(field);
    await s.user.type(field, 'abc');
    expect(field).toHaveAccessibleDescription('must be a number ≥ 0 and ≤ 100');
    expect(screen.getByText('products[4].mOsmPerMl: must be a number ≥ 0 and ≤ 100')).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Save stock' })).toBeDisabled();
    await s.user.clear(field);
    await s.user.type(field, '0.9');
    await s.user.click(screen.getByRole('button', { name: 'Save stock' }));
    await s.view('Order');
    // 800 mL of amino acids 10% now count 0.90 instead of 0.84 mOsm/mL: +48 mOsm ÷ 2 L = +24.0 mOsm/L.
    expect(s.osmolarity()).toBe('921.0');
  });

  it('a new stock needs what the format requires', async () => {
    const s = await openWorkspace();
    await s.view('Catalog');
    const before = stockRows();
    await s.user.click(screen.getByRole('button', { name: 'Add stock' }));
    await s.user.selectOptions(screen.getByLabelText('Role'), 'dextrose');
    expect(screen.getByText(`products[${before}].id: is required (string)`)).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Save stock' })).toBeDisabled();
    await s.user.type(screen.getByLabelText('Id'), 'Dextrose 20');
    expect(screen.getByLabelText('Id')).toHaveAccessibleDescription('must be lowercase letters, digits and single dashes');
    await s.user.clear(screen.getByLabelText('Id'));
    await s.user.type(screen.getByLabelText('Id'), 'dextrose-20');
    await s.user.type(screen.getByLabelText('Generic name'), 'Dextrose 20% injection');
    expect(screen.getByText(`products[${before}].nutrient: is required for a dextrose product`)).toBeInTheDocument();
    await s.user.type(screen.getByLabelText('Nutrient, g/mL'), '0.2');
    await s.user.type(screen.getByLabelText('Nutrient particles, mOsm/g'), '5.046');
    expect(screen.getByText(`products[${before}].nutrient.basis: is required for dextrose: "hydrous" or "anhydrous"`)).toBeInTheDocument();
    await s.user.selectOptions(screen.getByLabelText('Dextrose basis'), 'hydrous');
    await s.user.click(screen.getByRole('button', { name: 'Save stock' }));
    expect(stockRows()).toBe(before + 1);
    expect(screen.getByRole('rowheader', { name: /Dextrose 20% injection/ })).toBeInTheDocument();
  });
});

describe('the policy view', () => {
  it('lists the limits in force with their sources; a bad policy file replaces nothing', async () => {
    const s = await openWorkspace();
    await s.view('Policy');
    const row = screen.getAllByRole('row').find((r) => r.textContent?.includes('osmolarity-peripheral') && r.textContent.includes('All ages'));
    expect(row).toHaveTextContent('≤ 900');
    expect(row).toHaveTextContent('ASPEN 2014');
    await s.importFile('Import policy file…', 'strict.json', JSON.stringify({ format: 'osmocount-policy', version: 1, id: 'x' }));
    const problems = await screen.findByRole('alert', { name: 'Problems in the imported policy' });
    expect(problems).toHaveTextContent('name: is required');
    expect(screen.getByRole('heading', { level: 1 })).toHaveTextContent('Policy: Osmocount default policy');
  });
});
