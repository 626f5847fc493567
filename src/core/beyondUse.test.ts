import { describe, expect, test } from 'vitest';
import { beyondUse, durationMs } from './beyondUse.ts';
import { parsePolicy, type Policy } from './policy.ts';
import { D } from './decimal.ts';
import { DEFAULT_FILES, DEFAULT_POLICY } from '../defaults.ts';

// Durations under test: USP <797> (2008) medium-risk, no sterility testing: 30 h at controlled room
// temperature, 9 days at 2–8 °C; ASPEN 2014 (Boullata et al.): 3-in-1 9 days at 5 °C then 24 h at 25 °C.
// Expected dates are Gregorian calendar arithmetic in UTC (2028 is a leap year, 2026 and 2027 are not).

function dates(iso: string, policy: Policy = DEFAULT_POLICY) {
  const r = beyondUse(new Date(iso), policy);
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return Object.fromEntries(r.value.map((b) => [b.condition.id, b.until.toISOString()]));
}

function policyWith(beyond: unknown) {
  const file = { ...(DEFAULT_FILES.policy as Record<string, unknown>), beyondUse: beyond };
  return parsePolicy(file);
}

describe('the shipped policy', () => {
  test('keeps 30 h at room temperature and 9 days refrigerated then 24 h, each with its source', () => {
    const b = DEFAULT_POLICY.beyondUse;
    expect(b).not.toBeNull();
    const [room, fridge] = b?.conditions ?? [];
    expect(room?.duration.amount.toString()).toBe('30');
    expect(room?.duration.unit).toBe('h');
    expect(room?.source).toMatch(/USP <797> \(2008\)/);
    expect(room?.source).toMatch(/ASPEN 2023/);
    expect(fridge?.duration.amount.toString()).toBe('9');
    expect(fridge?.duration.unit).toBe('days');
    expect(fridge?.temperature).toBe('2–8 °C');
    expect(fridge?.afterRemoval?.duration.amount.toString()).toBe('24');
    expect(fridge?.afterRemoval?.source).toMatch(/ASPEN 2014/);
  });
});

describe('beyondUse', () => {
  test('across midnight: 19:00 + 30 h is 01:00 two days later', () => {
    expect(dates('2026-12-02T19:00:00Z')).toEqual({ 'room-temperature': '2026-12-04T01:00:00.000Z', refrigerated: '2026-12-11T19:00:00.000Z' });
  });

  test('across a 31-day month end and a year end', () => {
    expect(dates('2026-01-31T22:00:00Z')).toEqual({ 'room-temperature': '2026-02-02T04:00:00.000Z', refrigerated: '2026-02-09T22:00:00.000Z' });
    expect(dates('2026-12-28T08:30:00Z')).toEqual({ 'room-temperature': '2026-12-29T14:30:00.000Z', refrigerated: '2027-01-06T08:30:00.000Z' });
    expect(dates('2026-12-31T20:00:00Z')['room-temperature']).toBe('2027-01-02T02:00:00.000Z');
  });

  test('February in a common year and across a leap day', () => {
    expect(dates('2027-02-25T10:00:00Z').refrigerated).toBe('2027-03-06T10:00:00.000Z');
    expect(dates('2028-02-25T10:00:00Z').refrigerated).toBe('2028-03-05T10:00:00.000Z');
    expect(dates('2028-02-28T20:00:00Z')['room-temperature']).toBe('2028-03-01T02:00:00.000Z');
    expect(dates('2028-02-29T12:00:00Z')['room-temperature']).toBe('2028-03-01T18:00:00.000Z');
  });

  test('elapsed time: a bag compounded before a clock change still gets exactly 30 h', () => {
    // 28 Mar 2026 12:00 in London is 12:00 UTC; clocks go forward on 29 Mar; 30 h later is 18:00 UTC (19:00 local).
    const r = beyondUse(new Date('2026-03-28T12:00:00Z'), DEFAULT_POLICY);
    const room = r.ok ? r.value[0] : undefined;
    expect(room ? room.until.getTime() - new Date('2026-03-28T12:00:00Z').getTime() : 0).toBe(30 * 3_600_000);
  });

  test('a fractional duration is exact to the millisecond', () => {
    expect(durationMs({ amount: new D('1.5'), unit: 'h' })).toBe(5_400_000);
    expect(durationMs({ amount: new D('0.5'), unit: 'days' })).toBe(43_200_000);
  });

  test('an invalid compounding time is a problem, not NaN', () => {
    const r = beyondUse(new Date('not a date'), DEFAULT_POLICY);
    expect(r).toEqual({ ok: false, problems: [{ path: 'compoundedAt', message: 'is not a valid date and time' }] });
  });

  test('a policy without the block gives no dates', () => {
    const p: Policy = { ...DEFAULT_POLICY, beyondUse: null };
    expect(beyondUse(new Date('2026-12-02T19:00:00Z'), p)).toEqual({ ok: true, value: [] });
  });
});

describe('the beyondUse block of a policy file', () => {
  test('needs exactly one of hours or days, a source, and unique ids', () => {
    const r = policyWith({
      conditions: [
        { id: 'room', label: 'room temperature', temperature: '20–25 °C', hours: 30, days: 1, source: 'x' },
        { id: 'room', label: 'fridge', temperature: '2–8 °C', source: ' ', afterRemoval: { label: 'room', temperature: '20–25 °C', source: 'y' } },
      ],
      storage: { text: 'Refrigerate', source: 'common practice' },
    });
    expect(r.ok).toBe(false);
    const messages = r.ok ? [] : r.problems.map((p) => `${p.path}: ${p.message}`);
    expect(messages).toEqual(expect.arrayContaining([
      'beyondUse.conditions[1].source: must name the source of the duration (or "common practice")',
    ]));
  });

  test('reports duplicate ids and missing durations once the fields are valid', () => {
    const r = policyWith({
      conditions: [
        { id: 'room', label: 'room temperature', temperature: '20–25 °C', hours: 30, days: 1, source: 'x' },
        { id: 'room', label: 'fridge', temperature: '2–8 °C', source: 'y', afterRemoval: { label: 'room', temperature: '20–25 °C', source: 'y' } },
      ],
      storage: { text: 'Refrigerate', source: 'common practice' },
    });
    const messages = r.ok ? [] : r.problems.map((p) => `${p.path}: ${p.message}`);
    expect(messages).toEqual([
      'beyondUse.conditions[0]: needs exactly one of hours or days',
      'beyondUse.conditions[1]: needs exactly one of hours or days',
      'beyondUse.conditions[1].afterRemoval: needs exactly one of hours or days',
      'beyondUse.conditions[1].id: "room" is listed twice',
    ]);
  });

  test('a duration must be a positive number', () => {
    const r = policyWith({ conditions: [{ id: 'room', label: 'room', temperature: '20–25 °C', hours: -1, source: 'x' }], storage: { text: 't', source: 's' } });
    expect(r.ok ? [] : r.problems.map((p) => `${p.path}: ${p.message}`)).toEqual(['beyondUse.conditions[0].hours: must be a number > 0 and ≤ 8760']);
  });
});
