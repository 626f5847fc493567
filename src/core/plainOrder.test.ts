// The plain-order reader must agree with the order schema: whenever it reads a file, the schema reads
// the same file to the same result; it may only decline (null), never accept what the schema rejects.
import { describe, expect, test } from 'vitest';
import fc from 'fast-check';
import { orderFileSchema } from './order.ts';
import { readPlainOrder } from './plainOrder.ts';
import { batch } from '../../test/bench/generate.ts';

const generated = [...batch(300)];

/** Values a field may hold in a hand-edited or broken file. */
const oddValue = fc.oneof(
  fc.constant(undefined), fc.constant(null), fc.boolean(), fc.string({ maxLength: 6 }),
  fc.constantFrom('', ' ', '12', '1e3', '-1', '0', '0.5', 'adult', 'peripheral', 'g', 'mEq/kg', 'osmocount-order', ' P-1 ', '1e999', 'NaN', 'Infinity'),
  fc.double(), fc.integer({ min: -10, max: 30000 }), fc.constant([]), fc.constant({}),
);

/** A generated order with one field, or one line's field, replaced by an odd value (or removed). */
const mutated = fc.tuple(fc.integer({ min: 0, max: generated.length - 1 }), fc.integer({ min: 0, max: 40 }), fc.constantFrom(
  'id', 'route', 'volumeMl', 'hours', 'note', 'format', 'version', 'ions', 'lines', 'extra',
  'patient', 'patient.id', 'patient.weightKg', 'patient.ageGroup', 'patient.name',
  'line', 'line.product', 'line.amount', 'line.unit', 'line.species', 'line.fill', 'line.note',
), oddValue).map(([i, lineIndex, field, value]) => {
  const o = structuredClone(generated[i]!) as unknown as Record<string, unknown> & { patient: Record<string, unknown>; lines: unknown[] };
  const [head, tail] = field.split('.');
  if (head === 'patient' && tail) o.patient[tail] = value;
  else if (head === 'line') {
    const at = lineIndex % o.lines.length;
    if (tail) (o.lines[at] as Record<string, unknown>)[tail] = value;
    else o.lines[at] = value;
  } else o[head!] = value;
  return o;
});

function agree(input: unknown): void {
  const plain = readPlainOrder(input);
  if (plain === null) return;
  const schema = orderFileSchema.safeParse(input);
  expect(schema.success).toBe(true);
  expect(plain).toEqual(schema.data);
}

describe('readPlainOrder and the order schema', () => {
  test('read every generated order alike (and the plain reader does read them)', () => {
    for (const o of generated) {
      expect(readPlainOrder(o)).not.toBeNull();
      agree(o);
    }
  });

  test('agree on orders with a field replaced by an odd value: the plain reader only declines, never differs', () => {
    fc.assert(fc.property(mutated, (o) => agree(o)), { numRuns: 3000 });
  });

  test('decline ion orders, trimmed-empty ids and out-of-range numbers, which the schema reports', () => {
    const o = generated[0]!;
    expect(readPlainOrder({ ...o, ions: { per: 'day', Na: 50 } })).toBeNull();
    expect(readPlainOrder({ ...o, id: '   ' })).toBeNull();
    expect(readPlainOrder({ ...o, patient: { ...o.patient, weightKg: '0.05' } })).toBeNull();
    expect(readPlainOrder({ ...o, hours: 80 })).toBeNull();
  });
});
