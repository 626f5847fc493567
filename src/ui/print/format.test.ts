import { describe, expect, test } from 'vitest';
import { amount, dateTime, figure, fixed, trimmed } from './format.ts';

describe('printed figures', () => {
  test('amounts drop trailing zeros and keep a leading zero (ISMP error-prone dose designations)', () => {
    expect(amount(5, 'mL')).toBe('5 mL');
    expect(amount(0.5, 'mL')).toBe('0.5 mL');
    expect(amount(9.3, 'mEq')).toBe('9.3 mEq');
    expect(amount(0.8571, 'mEq/kg')).toBe('0.857 mEq/kg');
    expect(amount(2000, 'mL')).toBe('2000 mL');
    expect(amount(140.71, 'mmol')).toBe('140.7 mmol');
  });

  test('fixed figures keep their decimals, half-even, never "-0"', () => {
    expect(figure(214.2857, 2, 'mL')).toBe('214.29 mL');
    expect(fixed(0.125, 2)).toBe('0.12');
    expect(fixed(-0.001, 1)).toBe('0.0');
    expect(trimmed(-0.0001, 2)).toBe('0');
  });
});

describe('dateTime', () => {
  test('day, month name, year and 24-hour time in the given zone', () => {
    const t = new Date('2026-12-03T20:30:00Z');
    expect(dateTime(t, 'UTC')).toBe('03 Dec 2026 20:30');
    // New York is UTC−5 in December (EST); Tokyo UTC+9 all year (IANA tz database).
    expect(dateTime(t, 'America/New_York')).toBe('03 Dec 2026 15:30');
    expect(dateTime(t, 'Asia/Tokyo')).toBe('04 Dec 2026 05:30');
  });

  test('after a clock change the local time moves, the elapsed time does not', () => {
    // 30 h after 28 Mar 2026 12:00 GMT is 29 Mar 18:00 UTC = 19:00 BST (UK clocks go forward on 29 Mar 2026).
    expect(dateTime(new Date('2026-03-29T18:00:00Z'), 'Europe/London')).toBe('29 Mar 2026 19:00');
  });

  test('an invalid date prints as words, not "Invalid Date"', () => {
    expect(dateTime(new Date('nope'), 'UTC')).toBe('(no valid date and time)');
  });
});
