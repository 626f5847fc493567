// @vitest-environment jsdom
// The order workspace, driven as a pharmacist drives it (user steps from test/support/workspace.tsx).
// Check values come from stock labels: dextrose 70% = 0.70 g/mL and 3532 mOsm/L (US label; field guide
// §0 D1); sodium chloride 23.4% = 4 mEq/mL and 8008 mOsm/L (US label; field guide §6.1).
import { describe, expect, it, vi } from 'vitest';
import { screen, within } from '@testing-library/react';
import { openWorkspace } from '../../test/support/workspace.tsx';

// Whole-app renders in jsdom on a shared 2-core machine take a few seconds per test.
vi.setConfig({ testTimeout: 30_000 });

describe('entering an order line', () => {
  it('a new line updates its stock volume and the bag osmolarity', async () => {
    const s = await openWorkspace();
    await s.user.click(screen.getByRole('button', { name: 'New order' }));
    expect(s.verdict()).toMatch(/No figures yet/);
    await s.enterField('Order ID', 'T-1');
    await s.enterField('Patient ID', 'P-1');
    await s.enterField('Dosing weight', '70');
    await s.enterField('Final volume', '1000');
    await s.pickStock(1, 'dextrose 70', 'Dextrose 70% injection');
    expect(s.unitSelect(1)).toHaveValue('g');
    await s.enterAmount(1, '140');
    // 140 g ÷ 0.70 g/mL = 200 mL; 200 mL × 3.532 mOsm/mL ÷ 1 L = 706.4 mOsm/L (label values).
    expect(s.figure(1, 'volumeMl')).toBe('200.00');
    expect(s.osmolarity()).toBe('706.4');
    await s.addLine();
    // The new line is focused, ready for its stock.
    expect(screen.getByRole('combobox', { name: 'Stock, line 2' })).toHaveFocus();
    await s.pickStock(2, 'sodium chloride', 'Sodium chloride 23.4% injection (4 mEq/mL)');
    expect(s.unitSelect(2)).toHaveValue('mEq');
    await s.enterAmount(2, '40');
    // 40 mEq ÷ 4 mEq/mL = 10 mL; + 10 mL × 8.008 mOsm/mL = 80.08 mOsm → 786.5 mOsm/L.
    expect(s.figure(2, 'volumeMl')).toBe('10.00');
    expect(s.osmolarity()).toBe('786.5');
    // The fill line makes up the rest: 1000 − 200 − 10 mL.
    expect(s.figure(3, 'volumeMl')).toBe('790.00');
  });

  it('figures follow the typing before the cell is committed; Escape drops the text', async () => {
    const s = await openWorkspace();
    expect(s.osmolarity()).toBe('897.0');
    await s.enterAmount(2, '250', 'none');
    // 100 g more dextrose 70%: 142.857 mL × 3.532 mOsm/mL ÷ 2 L = +252.3 mOsm/L.
    expect(s.osmolarity()).toBe('1149.3');
    await s.user.keyboard('{Escape}');
    expect(s.osmolarity()).toBe('897.0');
    expect(s.amountCell(2)).toHaveValue('150');
    expect(screen.getByRole('button', { name: 'Undo' })).toBeDisabled();
  });
});

describe('an invalid amount', () => {
  it('shows its error by the cell and the figures keep the last valid value', async () => {
    const s = await openWorkspace();
    await s.enterAmount(2, '15O');
    expect(s.amountCell(2)).toHaveAttribute('aria-invalid', 'true');
    expect(s.amountCell(2)).toHaveAccessibleDescription('must be a number ≥ 0 and ≤ 100000');
    expect(s.osmolarity()).toBe('897.0');
    expect(s.verdict()).toBeTruthy();
    expect(screen.getByText(/Showing the last valid figures: the order has 1 problem/)).toBeInTheDocument();
    expect(document.body.textContent).not.toMatch(/NaN|Infinity/);
    await s.enterAmount(2, '250');
    expect(s.amountCell(2)).not.toHaveAttribute('aria-invalid');
    expect(s.osmolarity()).toBe('1149.3');
    expect(screen.queryByText(/Showing the last valid figures/)).toBeNull();
    expect(s.verdict()).toMatch(/^Hold/);
  });

  it('an empty amount reads "is required" and a negative one is refused', async () => {
    const s = await openWorkspace();
    await s.enterAmount(4, '');
    expect(s.amountCell(4)).toHaveAccessibleDescription(/is required/);
    await s.enterAmount(4, '-5');
    expect(s.amountCell(4)).toHaveAccessibleDescription('must be a number ≥ 0 and ≤ 100000');
    expect(s.osmolarity()).toBe('897.0');
  });

  it('a header field shows its own error', async () => {
    const s = await openWorkspace();
    await s.enterField('Dosing weight', '0');
    expect(screen.getByLabelText('Dosing weight')).toHaveAccessibleDescription('must be a number ≥ 0.1 and ≤ 700');
    expect(s.osmolarity()).toBe('897.0');
  });
});

describe('undo and redo', () => {
  it('Ctrl+Z takes an edit back, Ctrl+Shift+Z and Ctrl+Y make it again', async () => {
    const s = await openWorkspace();
    await s.enterAmount(2, '250');
    expect(s.osmolarity()).toBe('1149.3');
    await s.undo();
    expect(s.osmolarity()).toBe('897.0');
    expect(s.amountCell(2)).toHaveValue('150');
    await s.redo('shift-z');
    expect(s.osmolarity()).toBe('1149.3');
    expect(s.amountCell(2)).toHaveValue('250');
    await s.undo();
    await s.redo('y');
    expect(s.amountCell(2)).toHaveValue('250');
  });

  it('removing and moving lines are undoable too', async () => {
    const s = await openWorkspace();
    const before = s.lineCount();
    await s.user.click(screen.getByRole('button', { name: 'Remove line 2, Dextrose 70% injection' }));
    expect(s.lineCount()).toBe(before - 1);
    expect(Number(s.osmolarity())).toBeLessThan(897);
    await s.user.click(screen.getByRole('button', { name: 'Move down, line 1, Amino acids 10% injection (without added electrolytes)' }));
    expect(screen.getByRole('combobox', { name: 'Stock, line 2' })).toHaveValue('Amino acids 10% injection (without added electrolytes)');
    await s.undo();
    await s.undo();
    expect(s.lineCount()).toBe(before);
    expect(screen.getByRole('combobox', { name: 'Stock, line 2' })).toHaveValue('Dextrose 70% injection');
    expect(s.osmolarity()).toBe('897.0');
  });
});

describe('solver proposals', () => {
  it('apply the larger final volume with one click; undo takes it back', async () => {
    const s = await openWorkspace();
    await s.enterAmount(2, '250');
    expect(s.verdict()).toMatch(/^Hold/);
    await s.user.click(screen.getByRole('button', { name: /^Apply: Final volume 2560 mL/ }));
    // 2298.6 label mOsm ÷ 2.56 L = 897.9 mOsm/L: under the 900 limit (ASPEN 2014).
    expect(s.osmolarity()).toBe('897.9');
    expect(screen.getByLabelText('Final volume')).toHaveValue('2560');
    expect(s.verdict()).not.toMatch(/^Hold/);
    await s.undo();
    expect(s.osmolarity()).toBe('1149.3');
  });
});

describe('keyboard-only entry', () => {
  it('arrow keys move between cells; Enter commits', async () => {
    const s = await openWorkspace();
    await s.user.click(s.amountCell(1));
    await s.user.keyboard('{ArrowDown}');
    expect(s.amountCell(2)).toHaveFocus();
    await s.user.keyboard('250{Enter}');
    expect(s.osmolarity()).toBe('1149.3');
    await s.user.keyboard('{ArrowRight}');
    expect(s.unitSelect(2)).toHaveFocus();
    await s.user.keyboard('{ArrowUp}');
    expect(s.unitSelect(1)).toHaveFocus();
    await s.user.tab({ shift: true });
    expect(s.amountCell(1)).toHaveFocus();
  });

  it('the stock picker filters as you type and picks with the arrow keys and Enter', async () => {
    const s = await openWorkspace();
    const picker = screen.getByRole('combobox', { name: 'Stock, line 4' });
    await s.user.click(picker);
    await s.user.keyboard('acetate');
    const options = within(screen.getByRole('listbox')).getAllByRole('option').map((o) => o.textContent);
    expect(options).toEqual(['Sodium acetate injection 2 mEq/mL', 'Potassium acetate injection 2 mEq/mL']);
    expect(screen.getByRole('group', { name: 'Electrolytes' })).toBeInTheDocument();
    await s.user.keyboard('{ArrowDown}{Enter}');
    expect(picker).toHaveValue('Potassium acetate injection 2 mEq/mL');
    expect(s.unitSelect(4)).toHaveValue('mEq');
  });
});

describe('unit choices per stock', () => {
  // Adult peripheral demo lines: 1 amino acids 10%, 2 dextrose 70%, 3 lipid 20%, 4 sodium chloride,
  // 5 potassium chloride, 6 potassium phosphates, 7 magnesium sulfate, 8 calcium gluconate,
  // 9 multivitamin, 10 trace elements, 11 sterile water (fill).
  it('offers g only for nutrient stocks, mEq/mmol only where the stock has an ion to count, never mEq of phosphate', async () => {
    const s = await openWorkspace();
    expect(s.unitChoices(2)).toEqual(['g', 'g/kg', 'mL', 'mL/kg', 'fill']);
    expect(s.unitChoices(3)).toEqual(['g', 'g/kg', 'mL', 'mL/kg', 'fill']);
    expect(s.unitChoices(4)).toEqual(['mEq', 'mEq/kg', 'mmol', 'mmol/kg', 'mL', 'mL/kg', 'fill']);
    expect(s.unitChoices(9)).toEqual(['mL', 'mL/kg', 'fill']);
    expect(s.unitChoices(11)).toEqual(['mL', 'mL/kg', 'fill']);
    // Potassium phosphates (3 mmol P + 4.4 mEq K per mL): mmol counts phosphate or potassium; mEq only potassium.
    expect(s.unitChoices(6)).toEqual(['mEq', 'mEq/kg', 'mmol', 'mmol/kg', 'mL', 'mL/kg', 'fill']);
    expect(s.speciesChoices(6)).toEqual(['phosphate', 'K']);
    await s.chooseUnit(6, 'mEq');
    expect(s.speciesChoices(6)).toEqual([]);
    expect(screen.getAllByText('potassium').length).toBeGreaterThan(0);
    // 15 mEq of potassium at 4.4 mEq/mL = 3.41 mL (label value).
    expect(s.figure(6, 'volumeMl')).toBe('3.41');
  });

  it('a new stock that cannot take the line\'s unit gets its own, per kg kept', async () => {
    const s = await openWorkspace();
    await s.chooseUnit(4, 'mEq/kg');
    await s.pickStock(4, 'dextrose 50', 'Dextrose 50% injection');
    expect(s.unitSelect(4)).toHaveValue('g/kg');
    await s.pickStock(4, 'potassium phos', 'Potassium phosphates injection (3 mmol P + 4.4 mEq K per mL)');
    expect(s.unitSelect(4)).toHaveValue('mmol/kg');
  });

  it('the fill choice makes a line the fill: no amount, it makes up the volume', async () => {
    const s = await openWorkspace();
    await s.chooseUnit(11, 'mL');
    await s.enterAmount(11, '500');
    expect(s.figure(11, 'volumeMl')).toBe('500.00');
    await s.chooseUnit(11, 'fill');
    expect(screen.queryByRole('textbox', { name: /^Amount, line 11\b/ })).toBeNull();
    expect(s.osmolarity()).toBe('897.0');
  });
});
