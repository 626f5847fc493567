import { describe, expect, test } from 'vitest';
import fc from 'fast-check';
import { parseOrder, parseOrderFile, readPlainOrder } from './order.ts';
import { DEFAULT_CATALOG, DEMO_ORDERS } from '../defaults.ts';

const base = {
  id: 'O-1',
  patient: { id: 'P-1', weightKg: 70, ageGroup: 'adult' },
  route: 'central',
  volumeMl: 1000,
  lines: [{ product: 'dextrose-70', amount: 100, unit: 'g' }, { product: 'sterile-water', fill: true }],
};

function problems(order: unknown): string[] {
  const r = parseOrder(order, DEFAULT_CATALOG);
  if (r.ok) return [];
  return r.problems.map((p) => `${p.path}: ${p.message}`);
}

describe('parseOrder', () => {
  test('a valid order parses', () => {
    expect(problems(base)).toEqual([]);
  });

  test('missing fields are listed with their paths', () => {
    const out = problems({ lines: [] });
    expect(out).toEqual(expect.arrayContaining([
      expect.stringMatching(/^id: is required/),
      expect.stringMatching(/^patient: is required/),
      expect.stringMatching(/^route: is required \(one of "peripheral", "central"\)/),
    ]));
  });

  test('a negative amount names its line', () => {
    expect(problems({ ...base, lines: [{ product: 'dextrose-70', amount: -5, unit: 'g' }] })).toEqual(['lines[0].amount: must be a number ≥ 0 and ≤ 100000']);
  });

  test('an unknown product is an error, not a zero', () => {
    expect(problems({ ...base, lines: [{ product: 'dextrose-99', amount: 5, unit: 'g' }, { product: 'sterile-water', fill: true }] }))
      .toEqual(['lines[0].product: unknown product "dextrose-99" (not in the catalog)']);
  });

  test('an unknown species is an error', () => {
    expect(problems({ ...base, lines: [{ product: 'sodium-chloride-4', amount: 5, unit: 'mEq', species: 'Xx' }] }))
      .toEqual(['lines[0].species: unknown species "Xx"']);
  });

  test('mEq of phosphate is refused: phosphate is ordered in mmol', () => {
    const out = problems({ ...base, lines: [{ product: 'potassium-phosphates-3', amount: 15, unit: 'mEq', species: 'phosphate' }] });
    expect(out).toEqual(['lines[0].unit: phosphate is ordered in mmol, never mEq (its charge depends on pH)']);
  });

  test('mEq on a phosphate stock counts its cation by default, which is allowed', () => {
    expect(problems({ ...base, lines: [{ product: 'sodium-phosphates-3', amount: 12, unit: 'mmol' }, { product: 'sterile-water', fill: true }] })).toEqual([]);
  });

  test('two fill lines are refused', () => {
    const out = problems({ ...base, lines: [{ product: 'sterile-water', fill: true }, { product: 'sterile-water', fill: true }] });
    expect(out).toEqual(['lines[1].fill: only one line may fill the bag (line 0 already does)']);
  });

  test('a fill line needs a final volume', () => {
    const { volumeMl: _v, ...noVolume } = base;
    expect(problems(noVolume)).toEqual(['volumeMl: is required when a line fills the bag']);
  });

  test('weight 0 is refused', () => {
    expect(problems({ ...base, patient: { ...base.patient, weightKg: 0 } })).toEqual(['patient.weightKg: must be a number ≥ 0.1 and ≤ 700']);
  });

  test('strings that are not numbers are refused; decimal strings are read exactly', () => {
    expect(problems({ ...base, volumeMl: 'a lot' })).toEqual(['volumeMl: must be a number > 0 and ≤ 20000']);
    expect(problems({ ...base, patient: { ...base.patient, weightKg: '7e2' } })).toEqual([]);
    expect(problems({ ...base, volumeMl: 'NaN' })).toEqual(['volumeMl: must be a number > 0 and ≤ 20000']);
    expect(problems({ ...base, volumeMl: '1000.50' })).toEqual([]);
  });

  test('grams on an electrolyte stock is refused', () => {
    expect(problems({ ...base, lines: [{ product: 'calcium-gluconate-10', amount: 1, unit: 'g' }, { product: 'sterile-water', fill: true }] })[0])
      .toMatch(/^lines\[0\]\.unit: "g" counts grams of nutrient/);
  });

  test('an amount line needs its amount and unit', () => {
    expect(problems({ ...base, lines: [{ product: 'dextrose-70' }, { product: 'sterile-water', fill: true }] })).toEqual([
      'lines[0].amount: is required (a number ≥ 0) unless the line is the fill',
      'lines[0].unit: is required unless the line is the fill (one of mL, g, mEq, mmol, mL/kg, g/kg, mEq/kg, mmol/kg)',
    ]);
  });

  test('a bad unit and a bad age group are named', () => {
    const out = problems({ ...base, patient: { ...base.patient, ageGroup: 'infant' }, lines: [{ product: 'dextrose-70', amount: 1, unit: 'kg' }] });
    expect(out).toEqual(expect.arrayContaining([
      expect.stringMatching(/^patient\.ageGroup: must be one of "adult", "child"/),
      expect.stringMatching(/^lines\[0\]\.unit: must be one of "mL"/),
    ]));
  });

  test('never throws on arbitrary input', () => {
    for (const input of [null, 42, 'order', [], { lines: null }, { lines: [null] }, { patient: [] }]) {
      expect(() => parseOrder(input, DEFAULT_CATALOG)).not.toThrow();
      expect(parseOrder(input, DEFAULT_CATALOG).ok).toBe(false);
    }
  });
});

describe('readPlainOrder (the schema-free reader of well-formed files)', () => {
  // Mostly a good value, now and then a bad one, and once in a while anything at all (absent included).
  const anything = fc.constantFrom<unknown>(undefined, null, true, 0, 'text', [], {});
  const value = (good: unknown[], bad: unknown[]) => fc.oneof(
    { arbitrary: fc.constantFrom(...good), weight: 24 }, { arbitrary: fc.constantFrom(...bad), weight: 2 }, { arbitrary: anything, weight: 1 },
  );
  const text = value(['O-1', ' P-7 ', 'x'], ['', ' ']);
  const anyLine = fc.record({
    product: value(['dextrose-70', 'amino-acids-10', 'sterile-water', 'potassium-chloride-2', 'potassium-phosphates-3'], ['', 'no-such-stock']),
    amount: value([0, 2.5, '12.5', ' 80 ', '1e3'], [-1, 100001, 'abc', '', Number.NaN, Infinity]),
    unit: value(['g', 'mL', 'mEq/kg', 'mmol', 'mEq'], ['kg']),
    species: value(['K', 'phosphate', 'Zz'], [1]), fill: value([true, false], ['yes']), note: text, extra: anything,
  }, { requiredKeys: ['product'] });
  // Mostly lines a prescriber would write (each stock in a unit it is ordered in), sometimes any mix at all.
  const amount = value([0, 2.5, '12.5', ' 80 ', '1e3'], [-1, 'abc']);
  const note = fc.option(text, { nil: undefined });
  const line = fc.oneof(
    { arbitrary: fc.record({ product: fc.constant('dextrose-70'), amount, unit: fc.constantFrom('g', 'g/kg', 'mL'), note }, { requiredKeys: ['product', 'amount', 'unit'] }), weight: 3 },
    { arbitrary: fc.record({ product: fc.constant('potassium-chloride-2'), amount, unit: fc.constantFrom('mEq', 'mEq/kg', 'mmol'), species: fc.constantFrom('K', 'Cl') }, { requiredKeys: ['product', 'amount', 'unit'] }), weight: 3 },
    { arbitrary: fc.record({ product: fc.constant('potassium-phosphates-3'), amount, unit: fc.constantFrom('mmol', 'mEq'), species: fc.constantFrom('phosphate', 'K') }, { requiredKeys: ['product', 'amount', 'unit'] }), weight: 3 },
    { arbitrary: fc.record({ product: fc.constant('sterile-water'), fill: fc.constant(true), note }, { requiredKeys: ['product', 'fill'] }), weight: 1 },
    { arbitrary: anyLine, weight: 2 },
  );
  const file = fc.record({
    format: value(['osmocount-order'], ['other']), version: value([1], [2]),
    id: text,
    patient: fc.record({
      id: text, name: text, location: text, weightKg: value([70, '3.2', ' 0.5 ', '1e2'], [0, 701, 'heavy']),
      ageGroup: value(['adult', 'child', 'term-neonate', 'preterm-neonate'], ['elder']),
    }, { requiredKeys: ['id', 'weightKg', 'ageGroup'] }),
    route: value(['central', 'peripheral'], ['arterial']),
    volumeMl: value([1000, '2500', 0.5], [0, 20001]), hours: value([24, '12.5', 1], [0.5, 73]),
    lines: fc.oneof({ arbitrary: fc.array(line, { maxLength: 4 }), weight: 20 }, { arbitrary: anything, weight: 1 }),
    ions: fc.oneof({ arbitrary: fc.constant(undefined), weight: 8 }, { arbitrary: fc.constant({ per: 'day', Na: 40 }), weight: 1 }),
    note: text,
  }, { requiredKeys: ['id', 'patient', 'route', 'lines'] });

  test('it reads exactly the files the full path (schema, then binding) accepts without an ion block, to the same order (law)', () => {
    let read = 0;
    fc.assert(fc.property(file, (input) => {
      const plain = readPlainOrder(input, DEFAULT_CATALOG);
      const full = parseOrderFile(input, DEFAULT_CATALOG);
      // And the other way: every order without an ion block that the full path accepts takes the cheap way.
      if (plain === null) {
        expect(full.ok && input.ions === undefined).toBe(false);
        return;
      }
      read++;
      expect(full.ok).toBe(true);
      if (full.ok) expect(plain).toEqual(full.value);
    }), { numRuns: 10000 });
    expect(read).toBeGreaterThan(300);
  });

  test('reads every demo order without an ion block, as the full path does', () => {
    for (const { key, file: demo } of DEMO_ORDERS) {
      if ((demo as { ions?: unknown }).ions !== undefined) continue;
      const plain = readPlainOrder(demo, DEFAULT_CATALOG);
      expect(plain, key).not.toBeNull();
      const full = parseOrderFile(demo, DEFAULT_CATALOG);
      expect(full.ok && full.value).toEqual(plain);
    }
  });
});
