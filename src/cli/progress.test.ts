import { describe, expect, test } from 'vitest';
import { progressLine, progressText, QUIET_MS, REDRAW_MS } from './progress.ts';

describe('progress line', () => {
  test('text: 12,000 orders in 3 s is 4,000/s; a quarter of the bytes read in 3 s leaves about 9 s', () => {
    expect(progressText(12000, 3000, 25, 100)).toBe('12,000 orders checked · 4,000 orders/s · 25% read · about 0:09 left');
    expect(progressText(1_000_000, 200_000, 1, 3)).toBe('1,000,000 orders checked · 5,000 orders/s · 33% read · about 6:40 left');
    expect(progressText(5, 1000, 0, 0)).toBe('5 orders checked · 5 orders/s');
    // Two hours left shows hours.
    expect(progressText(10, 3_600_000, 1, 3)).toBe('10 orders checked · 0 orders/s · 33% read · about 2:00:00 left');
  });

  test('quiet for the first second, then at most one redraw per interval; wiping writes only when something is shown', () => {
    let t = 0;
    const drawn: string[] = [];
    const p = progressLine((s) => drawn.push(s), () => t, 1000);
    p.clear();
    p.update(10, 100);
    t = QUIET_MS - 1;
    p.update(20, 200);
    expect(drawn).toEqual([]);
    t = QUIET_MS;
    p.update(30, 300);
    t = QUIET_MS + REDRAW_MS - 1;
    p.update(40, 400);
    t = QUIET_MS + REDRAW_MS;
    p.update(50, 500);
    p.clear();
    p.clear();
    expect(drawn).toEqual([
      '\r\x1b[K30 orders checked · 30 orders/s · 30% read · about 0:02 left',
      '\r\x1b[K50 orders checked · 40 orders/s · 50% read · about 0:01 left',
      '\r\x1b[K',
    ]);
  });

  test('no terminal, no line', () => {
    const p = progressLine(undefined, () => 5000, 10);
    expect(() => { p.update(1, 1); p.clear(); }).not.toThrow();
  });
});
