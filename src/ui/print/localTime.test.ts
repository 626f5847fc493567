import { describe, expect, test } from 'vitest';
import { parseDateTime } from './localTime.ts';

// Offsets from the IANA time zone database: London GMT (UTC+0) in winter, BST (UTC+1) from
// 29 Mar 2026 01:00 UTC; New York EST (UTC−5) in December.

const iso = (text: string, tz = 'UTC') => {
  const r = parseDateTime(text, tz, '--compounded');
  return r.ok ? r.value.toISOString() : r.problems.map((p) => `${p.path}: ${p.message}`).join('; ');
};

describe('parseDateTime', () => {
  test('with Z or an offset', () => {
    expect(iso('2026-12-02T14:30Z')).toBe('2026-12-02T14:30:00.000Z');
    expect(iso('2026-12-02T14:30+01:00')).toBe('2026-12-02T13:30:00.000Z');
    expect(iso('2026-12-02T09:30:15-05:00')).toBe('2026-12-02T14:30:15.000Z');
  });

  test('wall-clock time in the pharmacy’s zone, on both sides of a clock change', () => {
    expect(iso('2026-12-02T09:30', 'America/New_York')).toBe('2026-12-02T14:30:00.000Z');
    expect(iso('2026-03-28T12:00', 'Europe/London')).toBe('2026-03-28T12:00:00.000Z');
    expect(iso('2026-03-29T12:00', 'Europe/London')).toBe('2026-03-29T11:00:00.000Z');
  });

  test('impossible or malformed times are problems with the option’s name', () => {
    expect(iso('2026-02-30T10:00')).toBe('--compounded: is not a real date and time (got "2026-02-30T10:00")');
    expect(iso('2027-02-29T10:00')).toMatch(/is not a real date/);
    expect(iso('2028-02-29T10:00')).toBe('2028-02-29T10:00:00.000Z'); // 2028 is a leap year
    expect(iso('2026-12-02T24:00')).toMatch(/is not a real date/);
    expect(iso('tomorrow')).toMatch(/^--compounded: must be a date and time like/);
  });
});
