import { describe, expect, test } from 'vitest';
import { Readable } from 'node:stream';
import { ndjsonItems } from './ndjson.ts';
import type { InputItem } from './inputs.ts';

async function collect(items: AsyncIterable<InputItem>): Promise<InputItem[]> {
  const out: InputItem[] = [];
  for await (const item of items) out.push(item);
  return out;
}

/** Bytes cut into pieces of `size`, whatever they split: lines, JSON tokens, UTF-8 characters. */
function chunked(bytes: Buffer, size: number): Readable {
  const pieces: Buffer[] = [];
  for (let i = 0; i < bytes.length; i += size) pieces.push(bytes.subarray(i, i + size));
  return Readable.from(pieces, { objectMode: false });
}

describe('ndjsonItems', () => {
  const orders = [
    { id: 'A-1', patient: { id: 'P-1', name: 'Zoë Ångström (fictional)', weightKg: 70, ageGroup: 'adult' } },
    { id: 'A-2', note: 'µg and ≥ survive a split inside a character' },
    { id: 'A-3', lines: [{ product: 'dextrose-70', amount: '150', unit: 'g' }] },
  ];

  test('chunks split mid-line and mid-character give back every line as written, with its line number', async () => {
    // A byte-order mark, Windows line endings, a blank line and a line that is not JSON.
    const text = `\uFEFF${JSON.stringify(orders[0])}\r\n\r\n${JSON.stringify(orders[1])}\r\n{"id": "broken",\r\n${JSON.stringify(orders[2])}`;
    const bytes = Buffer.from(text, 'utf8');
    for (const size of [1, 3, 7, 64]) {
      const items = await collect(ndjsonItems('day.ndjson', chunked(bytes, size)));
      expect(items.map((i) => (i.kind === 'order' ? [i.order.where, i.order.value] : [i.problems[0]?.where, i.problems[0]?.problem.path]))).toEqual([
        ['line 1', orders[0]],
        ['line 3', orders[1]],
        ['line 4', '(line)'],
        ['line 5', orders[2]],
      ]);
    }
  });

  test('reads line by line: a stream far too large to hold yields its first orders after reading only the start, and is closed when the reader stops', async () => {
    // A billion lines of about 80 bytes: some 80 GB, which could never be read whole.
    const total = 1_000_000_000;
    let pulled = 0;
    let closed = false;
    async function* endless() {
      try {
        for (let i = 1; i <= total; i++) {
          pulled += 1;
          yield `{"id":"S-${i}","patient":{"id":"P-${i}","weightKg":70,"ageGroup":"adult"}}\n`;
        }
      } finally {
        closed = true;
      }
    }
    const seen: string[] = [];
    for await (const item of ndjsonItems('big.ndjson', Readable.from(endless()))) {
      if (item.kind === 'order') seen.push(`${item.order.where} ${(item.order.value as { id: string }).id}`);
      if (seen.length === 3) break;
    }
    expect(seen).toEqual(['line 1 S-1', 'line 2 S-2', 'line 3 S-3']);
    // readline reads ahead a little (its queue and the stream buffer), never the file.
    expect(pulled).toBeLessThan(5000);
    await new Promise((resolve) => setImmediate(resolve));
    expect(closed).toBe(true);
  });

  test('a stream that fails part way: the orders before are kept, then one problem says the rest was not checked', async () => {
    async function* failing() {
      yield `${JSON.stringify(orders[0])}\n`;
      throw Object.assign(new Error('device error'), { code: 'EIO' });
    }
    const items = await collect(ndjsonItems('day.ndjson', Readable.from(failing())));
    expect(items[0]).toEqual({ kind: 'order', order: { file: 'day.ndjson', where: 'line 1', value: orders[0] } });
    expect(items[1]).toEqual({ kind: 'invalid', problems: [{ file: 'day.ndjson', where: 'after line 1', problem: { path: '(file)', message: 'cannot be read to its end (EIO); the rest of the file was not checked' } }] });
  });
});
