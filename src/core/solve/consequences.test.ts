import { describe, expect, it } from 'vitest';
import type { Finding } from '../findings.ts';
import type { Severity } from '../policy.ts';
import { findingChanges } from './consequences.ts';

// The laws of a proposal's "would bring" and "would clear" lists: a warning or hold is the same one
// before and after when its code, screen, nutrient and severity match; information never counts.
function finding(code: Finding['code'], severity: Severity, more: { screen?: string; nutrient?: string } = {}): Finding {
  return { code, severity, value: null, limit: null, unit: null, decimals: 0, message: `${code} ${severity}`, source: 'test', lines: [], fields: [], ...more };
}

describe('findingChanges', () => {
  it('a finding present on both sides neither appears nor disappears, whatever its message', () => {
    const before = [finding('gir', 'warn')];
    const after = [{ ...finding('gir', 'warn'), message: 'another text' }];
    expect(findingChanges(before, after)).toEqual({ appears: [], disappears: [] });
  });

  it('a warning that becomes a hold clears the warning and brings the hold', () => {
    const warn = finding('osmolarity-peripheral', 'warn');
    const block = finding('osmolarity-peripheral', 'block');
    expect(findingChanges([warn], [block])).toEqual({ appears: [block], disappears: [warn] });
  });

  it('information findings are never listed', () => {
    expect(findingChanges([finding('potassium-peripheral', 'info')], [finding('aluminum', 'info')])).toEqual({ appears: [], disappears: [] });
    // An information finding before does not hide a warning of the same kind after.
    const warn = finding('potassium-peripheral', 'warn');
    expect(findingChanges([finding('potassium-peripheral', 'info')], [warn]).appears).toEqual([warn]);
  });

  it('screens and nutrients tell findings of one code apart; a missing one matches an empty one', () => {
    const product = finding('calcium-phosphate', 'warn', { screen: 'product' });
    const sum = finding('calcium-phosphate', 'warn', { screen: 'sum' });
    expect(findingChanges([product], [sum])).toEqual({ appears: [sum], disappears: [product] });
    const energy = finding('dose-range', 'warn', { nutrient: 'energy' });
    expect(findingChanges([finding('dose-range', 'warn')], [energy]).appears).toEqual([energy]);
    expect(findingChanges([finding('gir', 'warn', { screen: '' })], [finding('gir', 'warn')])).toEqual({ appears: [], disappears: [] });
  });

  it('every copy of a new kind is listed, in the order found', () => {
    const a = finding('dose-range', 'warn', { nutrient: 'sodium' });
    const b = { ...a, message: 'second' };
    expect(findingChanges([], [a, b]).appears).toEqual([a, b]);
  });
});
