// @vitest-environment jsdom
import { describe, expect, test, vi } from 'vitest';
import { act, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { PrintActions } from './PrintActions.tsx';
import { DEFAULT_CATALOG, DEFAULT_POLICY } from '../../defaults.ts';
import { demoReport } from '../../../test/support/printFixtures.ts';

function setup(key = 'adult-central') {
  const print = vi.fn();
  window.print = print;
  render(<PrintActions report={demoReport(key)} catalog={DEFAULT_CATALOG} policy={DEFAULT_POLICY} />);
  const container = () => document.querySelector('[data-testid="print-container"]');
  return { print, container, user: userEvent.setup() };
}

describe('PrintActions', () => {
  test('"Print verification sheet" puts the sheet, on the chosen paper, in the print container and opens printing', async () => {
    const { print, container, user } = setup();
    await user.selectOptions(screen.getByLabelText('Paper'), 'letter');
    await user.click(screen.getByRole('button', { name: 'Print verification sheet' }));
    expect(print).toHaveBeenCalledTimes(1);
    const sheet = container()?.querySelector('article.pr-sheet.pr-paper-letter');
    expect(sheet?.textContent).toContain('Marren Point Hospital');
    expect(sheet?.textContent).toContain('MPH-2026-0413');
    // The container sits outside the app's own tree, straight in <body>.
    expect(container()?.parentElement).toBe(document.body);
  });

  test('"Print bag label" prints the label at the chosen size; this bag says CENTRAL LINE ONLY', async () => {
    const { print, container, user } = setup();
    await user.selectOptions(screen.getByLabelText('Label'), '4x4');
    await user.click(screen.getByRole('button', { name: 'Print bag label' }));
    expect(print).toHaveBeenCalledTimes(1);
    const label = container()?.querySelector('article.pr-label.pr-size-4x4.pr-compact');
    expect(label?.querySelector('.pr-l-route-only')?.textContent).toContain('CENTRAL LINE ONLY');
  });

  test('a custom label size is typed; an impossible one disables the label button with the reason', async () => {
    const { container, user } = setup('preterm-neonate');
    await user.selectOptions(screen.getByLabelText('Label'), 'custom');
    const size = screen.getByLabelText('Size');
    await user.type(size, '1x1in');
    expect(screen.getByRole('alert').textContent).toMatch(/each side must be between 3 in/);
    expect(screen.getByRole('button', { name: 'Print bag label' })).toBeDisabled();
    await user.clear(size);
    await user.type(size, '100x150mm');
    expect(screen.queryByRole('alert')).toBeNull();
    await user.click(screen.getByRole('button', { name: 'Print bag label' }));
    expect(container()?.querySelector('article.pr-label.pr-size-custom')?.textContent).toContain('3.5 g/kg/day');
  });
});

test('nothing is in the print container until a printout is asked for, and it empties after printing', async () => {
  window.print = vi.fn();
  render(<PrintActions report={demoReport('adult-central')} catalog={DEFAULT_CATALOG} policy={DEFAULT_POLICY} />);
  expect(document.querySelector('[data-testid="print-container"]')).toBeNull();
  await userEvent.setup().click(screen.getByRole('button', { name: 'Print verification sheet' }));
  expect(document.querySelector('[data-testid="print-container"]')).not.toBeNull();
  act(() => { window.dispatchEvent(new Event('afterprint')); });
  expect(document.querySelector('[data-testid="print-container"]')).toBeNull();
});
