// The engine's decimal against decimal.js (the general-purpose reference library) at the same settings:
// 15 significant digits, half-even. Every operation the engine uses must give the same value, digit for
// digit, on random operands: short and 15- or 16-digit coefficients, exponents far apart, signs, zero.
import { describe, expect, test } from 'vitest';
import fc from 'fast-check';
import Decimal from 'decimal.js';
import { D, PRECISION, toDecimal } from '../../src/core/decimal.ts';

const Ref = Decimal.clone({ precision: PRECISION, rounding: Decimal.ROUND_HALF_EVEN, toExpNeg: -7, toExpPos: 21 });
type Ref = InstanceType<typeof Ref>;

/** Decimal strings: 1–16 digit coefficients (the engine's own results have 15), exponents −30…30. */
const coefficient = fc.oneof(
  fc.integer({ min: 0, max: 999 }),
  fc.integer({ min: 0, max: 999_999_999 }),
  fc.integer({ min: 100_000_000_000_000, max: 999_999_999_999_999 }),
  fc.integer({ min: 0, max: Number.MAX_SAFE_INTEGER }),
  fc.constantFrom(0, 1, 5, 25, 125, 999_999_999_999_999, 500_000_000_000_000, 1_000_000_000_000_000),
);
const exponent = fc.oneof(fc.integer({ min: -6, max: 6 }), fc.integer({ min: -30, max: 30 }));
const text = fc.tuple(fc.boolean(), coefficient, exponent).map(([negative, c, e]) => `${negative ? '-' : ''}${c}e${e}`);
const pair = fc.tuple(text, text);
const rounding = fc.integer({ min: 0, max: 8 });
const RUNS = { numRuns: Number(process.env.DECIMAL_RUNS ?? 4000) };

/** The same value, the same way: decimal.js's valueOf text (signed zero included). */
const same = (mine: D, ref: Ref): void => {
  expect(mine.valueOf()).toBe(ref.valueOf());
};

describe('the engine decimal gives decimal.js results at 15 digits', { timeout: 120_000 }, () => {
  test('reading decimal strings and numbers', () => {
    fc.assert(fc.property(text, (t) => same(new D(t), new Ref(t))), RUNS);
    fc.assert(fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), (n) => same(new D(n), new Ref(n))), RUNS);
    // Decimal text with a point, leading and trailing zeros, a sign and an exponent (as files write them).
    const pointed = fc.tuple(fc.constantFrom('', '-', '+'), fc.string({ unit: fc.constantFrom('0', '0', '1', '5', '9'), maxLength: 12 }),
      fc.boolean(), fc.string({ unit: fc.constantFrom('0', '0', '3', '7'), maxLength: 12 }), fc.constantFrom('', 'e3', 'E-2', 'e+0'))
      .filter(([, whole, point, fraction]) => whole.length > 0 || (point && fraction.length > 0))
      .map(([sign, whole, point, fraction, exp]) => `${sign}${whole}${point ? '.' : ''}${point ? fraction : ''}${exp}`);
    fc.assert(fc.property(pointed, (t) => same(new D(t), new Ref(t))), RUNS);
    // Numbers as a JSON file holds them: a short decimal read into a float (2.5, 0.465, 1234.5678), and its
    // neighbours one float step away (they need 16 or 17 digits, and take the text path).
    const short = fc.tuple(fc.boolean(), coefficient, fc.integer({ min: -18, max: 3 })).map(([negative, c, e]) => Number(`${negative ? '-' : ''}${c}e${e}`));
    fc.assert(fc.property(short, fc.constantFrom(0, 1, -1), (n, step) => {
      const v = n + step * Math.abs(n) * Number.EPSILON;
      same(new D(v), new Ref(v));
    }), RUNS);
  });

  test('plus, minus, times and div, each rounded once to 15 significant digits', () => {
    fc.assert(fc.property(pair, ([a, b]) => {
      same(new D(a).plus(b), new Ref(a).plus(b));
      same(new D(a).minus(b), new Ref(a).minus(b));
      same(new D(a).times(b), new Ref(a).times(b));
      if (!new Ref(b).isZero()) same(new D(a).div(b), new Ref(a).div(b));
    }), RUNS);
  });

  test('products and sums at the edges of their shortcuts: trailing zeros, cancelling, 10¹⁵, 2⁵⁰–2⁵³', () => {
    // Coefficients m·2^i·5^j: products of two of them end in zeros (25 × 4, 125 × 8, 5⁹ × 2¹⁰).
    const factor = fc.tuple(fc.constantFrom(1, 3, 7, 9, 13, 999, 12_345_679), fc.integer({ min: 0, max: 30 }), fc.integer({ min: 0, max: 14 }))
      .map(([m, i, j]) => m * 2 ** i * 5 ** j).filter((c) => c <= Number.MAX_SAFE_INTEGER);
    // Coefficients near a power of two or ten, where exactness or a shortcut's bound changes.
    const edge = fc.tuple(fc.constantFrom(2 ** 31, 2 ** 49, 2 ** 50, 2 ** 52, 2 ** 53 - 1, 1e15, 1e14, 1e8, 1e7), fc.integer({ min: -40, max: 40 }))
      .map(([base, step]) => Math.min(Number.MAX_SAFE_INTEGER, base + step)).filter((c) => c > 0);
    const signed = (c: fc.Arbitrary<number>): fc.Arbitrary<string> => fc.tuple(fc.boolean(), c, fc.integer({ min: -20, max: 20 }))
      .map(([negative, m, e]) => `${negative ? '-' : ''}${m}e${e}`);
    const operand = fc.oneof(signed(factor), signed(edge), text);
    fc.assert(fc.property(operand, operand, (a, b) => {
      same(new D(a).times(b), new Ref(a).times(b));
      same(new D(a).plus(b), new Ref(a).plus(b));
      same(new D(a).minus(b), new Ref(a).minus(b));
      if (!new Ref(b).isZero()) same(new D(a).div(b), new Ref(a).div(b));
    }), RUNS);
    // A product just below, at or above 10¹⁵ (b = ⌊10¹⁵ ÷ a⌋ + step).
    fc.assert(fc.property(fc.integer({ min: 1, max: 99_999_999 }), fc.integer({ min: -2, max: 2 }), fc.integer({ min: -9, max: 9 }), (a, step, e) => {
      const b = `${Math.floor(1e15 / a) + step}e${e}`;
      same(new D(a).times(b), new Ref(a).times(b));
    }), RUNS);
    // a·10^d + b that cancels to zero or lands just below, at or above 10¹⁵, for every shift d up to 24.
    fc.assert(fc.property(fc.integer({ min: 0, max: 24 }), fc.integer({ min: 1, max: 999_999_999_999_999 }), fc.integer({ min: -3, max: 3 }), fc.integer({ min: -12, max: 12 }), (d, b, step, e) => {
      const scaled = new Ref(b).plus(step).negated();
      same(new D(`${scaled.toFixed()}e${e}`).plus(`${b}e${e}`), new Ref(`${scaled.toFixed()}e${e}`).plus(`${b}e${e}`));
      const high = new Ref(1e15).minus(b).dividedToIntegerBy(new Ref(10).pow(d)).plus(step);
      if (high.isZero()) return;
      const x = `${high.toFixed()}e${e + d}`;
      same(new D(x).plus(`${b}e${e}`), new Ref(x).plus(`${b}e${e}`));
      same(new D(`${b}e${e}`).minus(x), new Ref(`${b}e${e}`).minus(x));
    }), RUNS);
    // Whole coefficients just below 2⁵³ (x × 0.1 rounds to a whole number for some of them: …989).
    for (const t of ['9007199254740989', '-9007199254740979', '9007199254740990', '9007199254740991']) {
      same(new D(t).toNearest(1), new Ref(t).toNearest(1));
      same(new D(t).toNearest('1e-3', 1), new Ref(t).toNearest('1e-3', 1));
      same(new D(`${t}e-5`).toDecimalPlaces(2), new Ref(`${t}e-5`).toDecimalPlaces(2));
    }
    // Zeros, signed zeros and cancelling sums keep decimal.js's sign.
    const zeros: [string, string][] = [['0', '-0'], ['-0', '-0'], ['5', '-5'], ['-5e3', '5e3'], ['0', '7e-30'], ['-0', '7e40'], ['123e20', '0']];
    for (const [a, b] of zeros) {
      same(new D(a).plus(b), new Ref(a).plus(b));
      same(new D(a).minus(b), new Ref(a).minus(b));
      same(new D(a).times(b), new Ref(a).times(b));
    }
  });

  test('floors taken by multiplying by 10^−k: exact multiples, one either side, and ties', () => {
    // q·10^k + j for j = −1, 0, 1 and a tie (5·10^(k−1)): where a floor from x·10^−k could land one off.
    const near = (q: number, k: number, j: number): number => q * 10 ** k + (j === 2 ? 5 * 10 ** (k - 1) : j);
    const step = fc.constantFrom(-1, 0, 1, 2);
    // A 15-digit figure times a short one past 2⁵³ (a long product split at 10⁸): A = ah·10⁸ + al with al
    // at the edges, and short factors that make al·B a multiple of 10⁸ or of the dropped digits.
    const long = fc.tuple(fc.integer({ min: 1_000_000, max: 9_999_999 }), fc.oneof(fc.constantFrom(0, 1, 99_999_999, 50_000_000, 12_500_000, 3_125_000), fc.integer({ min: 0, max: 99_999_999 })), fc.constantFrom(-1, 0, 1))
      .map(([ah, al, j]) => Math.max(1, ah * 1e8 + al + j));
    const short = fc.oneof(fc.constantFrom(2, 4, 8, 16, 32, 64, 128, 256, 5, 25, 125, 3125, 78_125, 1_953_125, 9_999_999, 1_048_576, 8_388_608), fc.integer({ min: 10, max: 9_999_999 }));
    fc.assert(fc.property(long, short, fc.boolean(), fc.integer({ min: -12, max: 12 }), (a, b, negative, e) => {
      const x = `${negative ? '-' : ''}${a}e${e}`;
      same(new D(x).times(b), new Ref(x).times(b));
      same(new D(b).times(x), new Ref(b).times(x));
    }), RUNS);
    // Products with a 16-digit coefficient (10¹⁵ to 2⁵³), whose last digit goes: ties, …0 and …9 around them.
    fc.assert(fc.property(fc.integer({ min: 100_000_000_000_000, max: 900_719_925_474_098 }), step, fc.integer({ min: -9, max: 9 }), (q, j, e) => {
      const n = near(q, 1, j);
      if (n > Number.MAX_SAFE_INTEGER) return;
      for (const [a, b] of [[n, 1], [n / 2, 2], [n / 5, 5]] as const) {
        if (!Number.isInteger(a)) continue;
        same(new D(`${a}e${e}`).times(b), new Ref(`${a}e${e}`).times(b));
      }
      same(new D(`${n}e${e}`).plus(`1e${e + 20}`), new Ref(`${n}e${e}`).plus(`1e${e + 20}`));
    }), RUNS);
    // Rounding a 15-digit result to 0–4 places with 1–15 digits dropped, at and beside multiples and ties.
    fc.assert(fc.property(fc.integer({ min: 1, max: 15 }), fc.integer({ min: 0, max: 4 }), fc.integer({ min: 0, max: 999_999_999_999_999 }), step, fc.boolean(), (k, dp, seed, j, negative) => {
      const n = near(Math.floor(seed / 10 ** k), k, j);
      if (n <= 0 || n >= 1e15) return;
      const t = `${negative ? '-' : ''}${n}e${-k - dp}`;
      expect(Object.is(new D(t).toRoundedNumber(dp), new Ref(t).toDecimalPlaces(dp).toNumber())).toBe(true);
      expect(new D(t).toScaledInteger(dp)).toBe(new Ref(t).toDecimalPlaces(dp).times(new Ref(10).pow(dp)).toNumber());
      same(new D(t).toDecimalPlaces(dp), new Ref(t).toDecimalPlaces(dp));
    }), RUNS);
  });

  test('division by a short figure (a stock strength): every dividend size, ties and exact quotients', () => {
    const dividend = fc.tuple(fc.boolean(), fc.oneof(fc.integer({ min: 1, max: 999 }), fc.integer({ min: 1, max: 999_999_999_999_999 })), fc.integer({ min: -16, max: 4 }))
      .map(([negative, c, e]) => `${negative ? '-' : ''}${c}e${e}`);
    const divisor = fc.tuple(fc.oneof(fc.integer({ min: 1, max: 9 }), fc.integer({ min: 1, max: 99_999 }), fc.integer({ min: 1, max: 9_999_999 }), fc.constantFrom(2, 4, 8, 16, 3, 7, 465, 2325)), fc.integer({ min: -8, max: 3 }))
      .map(([c, e]) => `${c}e${e}`);
    fc.assert(fc.property(dividend, divisor, (a, b) => same(new D(a).div(b), new Ref(a).div(b))), RUNS);
  });

  test('chains of operations keep agreeing (results feed the next operation)', () => {
    fc.assert(fc.property(fc.array(fc.tuple(fc.constantFrom('plus', 'minus', 'times', 'div'), text), { minLength: 2, maxLength: 12 }), text, (steps, start) => {
      let mine = new D(start);
      let ref = new Ref(start);
      for (const [op, t] of steps) {
        if (op === 'div' && new Ref(t).isZero()) continue;
        mine = mine[op](t);
        ref = ref[op](t);
        same(mine, ref);
      }
    }), RUNS);
  });

  test('comparisons', () => {
    fc.assert(fc.property(pair, ([a, b]) => {
      expect(new D(a).cmp(b)).toBe(new Ref(a).cmp(b));
      expect(new D(a).gt(b)).toBe(new Ref(a).gt(b));
      expect(new D(a).lte(b)).toBe(new Ref(a).lte(b));
      expect(new D(a).eq(b)).toBe(new Ref(a).eq(b));
    }), RUNS);
  });

  test('rounding to decimal places in every rounding mode, whole numbers and multiples', () => {
    fc.assert(fc.property(text, fc.integer({ min: 0, max: 30 }), rounding, (t, dp, rm) => {
      same(new D(t).toDecimalPlaces(dp, rm), new Ref(t).toDecimalPlaces(dp, rm as Decimal.Rounding));
      expect(new D(t).toFixed(dp, rm)).toBe(new Ref(t).toFixed(dp, rm as Decimal.Rounding));
      expect(new D(t).toRoundedNumber(dp)).toBe(new Ref(t).toDecimalPlaces(dp).toNumber());
    }), RUNS);
    // As the report rounds: results of operations (15 digits, ties included) to 0–4 decimals.
    const result = fc.tuple(fc.boolean(), fc.integer({ min: 0, max: 999_999_999_999_999 }), fc.integer({ min: -19, max: 2 }), fc.constantFrom('', '5', '50', '500'))
      .map(([negative, c, e, tie]) => `${negative ? '-' : ''}${String(c).slice(0, 15 - tie.length)}${tie}e${e}`);
    fc.assert(fc.property(result, fc.integer({ min: 0, max: 4 }), (t, dp) => {
      expect(Object.is(new D(t).toRoundedNumber(dp), new Ref(t).toDecimalPlaces(dp).toNumber())).toBe(true);
      // The same rounding as a whole number of 10^−dp (what display text is written from).
      const scaled = new Ref(t).toDecimalPlaces(dp).times(new Ref(10).pow(dp));
      const mine = new D(t).toScaledInteger(dp);
      if (scaled.abs().lte(Number.MAX_SAFE_INTEGER)) expect(mine === scaled.toNumber() || (mine === 0 && scaled.isZero())).toBe(true);
      else expect(mine).toBeNaN();
    }), RUNS);
    fc.assert(fc.property(text, (t) => {
      same(new D(t).round(), new Ref(t).round());
      same(new D(t).floor(), new Ref(t).floor());
      same(new D(t).ceil(), new Ref(t).ceil());
    }), RUNS);
    fc.assert(fc.property(pair, rounding, ([a, step], rm) => {
      expect(new D(a).toNearest(step, rm).toString()).toBe(new Ref(a).toNearest(step, rm as Decimal.Rounding).toString());
    }), RUNS);
  });

  test('text and numbers out: toString, toFixed, toNumber, abs, neg, isInteger', () => {
    fc.assert(fc.property(text, (t) => {
      const mine = new D(t);
      const ref = new Ref(t);
      expect(mine.toString()).toBe(ref.toString());
      expect(mine.toFixed()).toBe(ref.toFixed());
      expect(mine.toNumber()).toBe(ref.toNumber());
      same(mine.abs(), ref.abs());
      same(mine.neg(), ref.neg());
      expect(mine.isInteger()).toBe(ref.isInteger());
      expect(mine.isNeg()).toBe(ref.isNeg());
    }), RUNS);
  });

  test('reading file values: a decimal for plain decimal text (a sign, digits, a point, an exponent), null for anything else', () => {
    const pattern = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
    const piece = fc.constantFrom('', '+', '-', '0', '7', '12', '.', 'e', 'E', '5', '00', ' ', 'x', '1e', '-3', '999999999999999', '0x1F', 'Infinity');
    fc.assert(fc.property(fc.array(piece, { maxLength: 6 }).map((p) => p.join('')), (t) => {
      const expected = pattern.test(t.trim()) ? new Ref(t.trim()) : null;
      const mine = toDecimal(t);
      if (expected === null || !expected.isFinite()) expect(mine).toBeNull();
      else expect(mine?.valueOf()).toBe(expected.valueOf());
    }), RUNS);
    fc.assert(fc.property(text, (t) => { expect(toDecimal(t)?.valueOf()).toBe(new Ref(t).valueOf()); }), RUNS);
  });

  test('worked cases: a third, a repeating quotient, ties to even at the 15th digit', () => {
    expect(new D(1).div(3).toString()).toBe('0.333333333333333');
    expect(new D(20).div(3).toString()).toBe('6.66666666666667');
    expect(new D('0.1').plus('0.2').toString()).toBe('0.3');
    // 1000000000000005 has 16 digits: half-even keeps the even 15th digit (…000), 1000000000000015 goes up (…002).
    expect(new D('1000000000000000').plus(5).toString()).toBe('1000000000000000');
    expect(new D('1000000000000010').plus(5).toString()).toBe('1000000000000020');
    expect(new D('123.456').times('0.001').toString()).toBe('0.123456');
    expect(new D(1).div(0).isFinite()).toBe(false);
    expect(new D('Infinity').plus(1).toString()).toBe('Infinity');
    expect(() => new D('1,5')).toThrow();
  });
});
