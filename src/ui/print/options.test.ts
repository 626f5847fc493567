import { describe, expect, test } from 'vitest';
import { checkTimeZone, customLabelCss, parseLabelSize } from './options.ts';

describe('parseLabelSize', () => {
  test('presets and custom sizes in inches or millimetres', () => {
    expect(parseLabelSize('4x6')).toEqual({ ok: true, value: { id: '4x6', width: 4, height: 6, unit: 'in' } });
    expect(parseLabelSize(' 4X4 ')).toEqual({ ok: true, value: { id: '4x4', width: 4, height: 4, unit: 'in' } });
    expect(parseLabelSize('3.5x5in')).toEqual({ ok: true, value: { id: 'custom', width: 3.5, height: 5, unit: 'in' } });
    expect(parseLabelSize('100x150mm')).toEqual({ ok: true, value: { id: 'custom', width: 100, height: 150, unit: 'mm' } });
  });

  test('anything else is a problem with the option as its path', () => {
    expect(parseLabelSize('big')).toEqual({ ok: false, problems: [{ path: 'label-size', message: 'must be 4x6, 4x4, or a custom size like 3.5x5in or 100x150mm (got "big")' }] });
    expect(parseLabelSize('4x6cm').ok).toBe(false);
    expect(parseLabelSize('2x2in')).toEqual({ ok: false, problems: [{ path: 'label-size', message: 'each side must be between 3 in (76 mm) and 14 in (356 mm) (got 2 × 2 in)' }] });
    expect(parseLabelSize('400x100mm').ok).toBe(false);
  });

  test('a custom size brings its own page rule; presets are in print.css', () => {
    expect(customLabelCss({ id: '4x6', width: 4, height: 6, unit: 'in' })).toBe('');
    expect(customLabelCss({ id: 'custom', width: 100, height: 150, unit: 'mm' })).toContain('@page pr-label-custom { size: 100mm 150mm; margin: 0; }');
  });
});

test('checkTimeZone accepts IANA names and reports others', () => {
  expect(checkTimeZone('Europe/London')).toEqual({ ok: true, value: 'Europe/London' });
  expect(checkTimeZone('Mars/Olympus').ok).toBe(false);
});
