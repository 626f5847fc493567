import Decimal from 'decimal.js';

/**
 * The engine's decimal numbers: every result is the exact result rounded to 15 significant decimal
 * digits, half-even, the same rule decimal.js follows with `precision: 15` (the tests hold the two side by
 * side on random operands). A dose of 10⁵ units is exact to 10⁻¹⁰ of a unit; the report shows at most 4
 * decimals, so the 15th digit reaches a printed figure only when the exact value sits on a rounding tie
 * after a quotient that cannot be exact (13.93 mEq calcium through 0.465 mEq/mL and back to 6.965 mmol may
 * print 6.96 or 6.97); that is so at any finite precision.
 *
 * Why not decimal.js for every operation: a decimal.js operation allocates digit arrays and costs 0.1–1.5 µs;
 * a batch of a day's orders makes millions of them. Here a value is a safe-integer coefficient and a
 * power of ten, `c × 10^e`, and every operation works on binary floats that are exact integers: sums that
 * stay below 2⁵³ are exact; wider sums and products are carried exactly as an unevaluated sum of two floats
 * (Dekker's error-free product, Knuth's error-free sum) and rounded to 15 digits by an exact remainder —
 * or, in the commonest cases (a long figure times a short one, two long figures of different sizes), split
 * into partial results that stay exact; a quotient is estimated in floating point and corrected by the same
 * exact remainder. decimal.js stays
 * behind the fast paths for what they do not cover: ±Infinity and NaN, a coefficient of more than 16 digits
 * read from input, and operands more than 10²² apart.
 */
export const PRECISION = 15;

/** decimal.js with the engine's settings: the reference the fast paths agree with, and their fallback. */
export const Reference = Decimal.clone({ precision: PRECISION, rounding: Decimal.ROUND_HALF_EVEN, toExpNeg: -7, toExpPos: 21 });
type Reference = InstanceType<typeof Reference>;

/** A number, a decimal string or a decimal: what every operation accepts. */
export type Numeric = D | number | string;

const MAX = Number.MAX_SAFE_INTEGER;
/** 10^PRECISION: a rounded coefficient is below it. */
const LIMIT = 1e15;
/** Powers of ten as doubles; exact up to 10²². */
const POW10: readonly number[] = Array.from({ length: 40 }, (_, i) => Number(`1e${i}`));
/**
 * 10^−k as doubles (k ≤ 15), each within a relative 2⁻⁵³ of the true value: x·10^−k for x below 2⁵³ is
 * then within x·10^−k·2⁻⁵² of x ÷ 10^k, under 0.25 for k ≥ 1, so its floor is the true floor or one
 * off, and an exact remainder corrects it. A multiplication instead of a division (a quarter the latency).
 */
const INV10: readonly number[] = Array.from({ length: 16 }, (_, i) => Number(`1e-${i}`));
const HALF_EVEN = 6;
/** Veltkamp's splitter for doubles: 2²⁷ + 1. */
const SPLITTER = 134217729;

// ---- exact integer arithmetic on doubles ---------------------------------------------------------------

/** The error of the rounded product a × b (a, b integers below 2⁵³): a × b = fl(a × b) + twoProductError. */
function twoProductError(a: number, b: number, p: number): number {
  let t = SPLITTER * a;
  const ah = t - (t - a);
  const al = a - ah;
  t = SPLITTER * b;
  const bh = t - (t - b);
  const bl = b - bh;
  return al * bl - (((p - ah * bh) - al * bh) - ah * bl);
}

/** Digits of a positive safe integer (exact). */
function digits(n: number): number {
  if (n < 1e8) {
    if (n < 1e4) return n < 1e2 ? (n < 10 ? 1 : 2) : n < 1e3 ? 3 : 4;
    return n < 1e6 ? (n < 1e5 ? 5 : 6) : n < 1e7 ? 7 : 8;
  }
  if (n < 1e12) return n < 1e10 ? (n < 1e9 ? 9 : 10) : n < 1e11 ? 11 : 12;
  return n < 1e14 ? (n < 1e13 ? 13 : 14) : n < 1e15 ? 15 : n < 1e16 ? 16 : 16 + digits(Math.floor(n / 1e16));
}

/** Whether a rounding mode adds one to the truncated magnitude. `half` compares the dropped part with one half. */
function bumps(rm: number, negative: boolean, odd: boolean, half: number): boolean {
  switch (rm) {
    case 0: return true; // up, away from zero
    case 1: return false; // down, toward zero
    case 2: return !negative; // ceil
    case 3: return negative; // floor
    case 4: return half >= 0; // half-up
    case 5: return half > 0; // half-down
    case 6: return half > 0 || (half === 0 && odd); // half-even
    case 7: return half > 0 || (half === 0 && !negative); // half-ceil
    default: return half > 0 || (half === 0 && negative); // half-floor
  }
}

/** Whether an integer below 2⁵³ is odd. (`%` on doubles is a slow library call; halving is exact.) */
function odd(q: number): boolean {
  const half = q / 2;
  return half !== Math.floor(half);
}

/**
 * Whether an integer below 2⁵³ is a multiple of ten: x ÷ 10 is a whole number only then (below 2⁵³ the
 * quotient's spacing is at most 1/8, so k + 0.1 … k + 0.9 never rounds to a whole number).
 */
function tens(x: number): boolean {
  const t = x / 10;
  return t === Math.floor(t);
}

let remainder = 0;

/**
 * floor(N ÷ d) for an exact non-negative integer N = hi + lo (an unevaluated sum of doubles) and a positive
 * integer d, when the quotient is below 2⁵³. Leaves the exact remainder in `remainder`.
 */
function floorQuotient(hi: number, lo: number, d: number): number {
  let q = Math.floor(hi / d);
  // r = N − q × d, exactly: the products' error terms are integers below 2⁵³ and hi − h cancels exactly.
  const h = q * d;
  let r = (hi - h) + (lo - twoProductError(q, d, h));
  while (r < 0) { q -= 1; r += d; }
  while (r >= d) { q += 1; r -= d; }
  remainder = r;
  return q;
}

/** Round floor(N ÷ d) by the remainder left in `remainder` (`negative` is the sign of the whole value). */
function roundQuotient(q: number, d: number, rm: number, negative: boolean): number {
  if (remainder === 0) return q;
  const twice = remainder * 2;
  return bumps(rm, negative, odd(q), twice < d ? -1 : twice === d ? 0 : 1) ? q + 1 : q;
}

// ---- construction ----------------------------------------------------------------------------------------

const RAW: unique symbol = Symbol('raw');

/**
 * A finite value with a coefficient below 2⁵² in magnitude (every rounded result: at most 10¹⁵), trailing
 * zeros removed (zero has exponent 0). The test multiplies by the double 0.1, which is 0.1·(1 + 2⁻⁵⁴),
 * instead of dividing by ten: for c = 10k the product k·(1 + 2⁻⁵⁴) is nearer k than half of k's float
 * spacing, so it rounds to k exactly; for c = 10k + j (j = 1…9) the exact product lies at least
 * 0.1 − |c|·0.1·2⁻⁵⁴ > 0.07 from every whole number, and below 2⁴⁹ (|c| < 2⁵²) half the float spacing is
 * at most 1/32, so it never rounds to one.
 */
function canonical(c: number, e: number): D {
  if (c === 0) return new D(RAW, c, 0, null);
  let t = c * 0.1;
  while (t === Math.floor(t)) {
    c = t;
    e += 1;
    t = c * 0.1;
  }
  return new D(RAW, c, e, null);
}

/** As canonical, for any safe-integer coefficient. */
function canonicalWide(c: number, e: number): D {
  if (c === 0) return new D(RAW, c, 0, null);
  while (tens(c)) { c /= 10; e += 1; }
  return new D(RAW, c, e, null);
}

/** The exact integer N = hi + lo, times 10^e, rounded to PRECISION digits (half-even). */
function roundPair(hi: number, lo: number, e: number): D {
  const negative = hi < 0 || (hi === 0 && lo < 0);
  if (negative) { hi = -hi; lo = -lo; }
  const approx = hi + lo;
  if (approx < LIMIT) return canonical(negative ? -approx : approx, e); // below 2⁵³, so the sum is exact
  let k = digits(approx) - PRECISION; // above 10¹⁶ possibly one off: corrected below
  // The exact remainder needs 10^k below 2⁵⁰; wider values (only from 16-digit inputs) take the exact slow path.
  if (k > PRECISION) return roundExactly(BigInt(negative ? -hi : hi) + BigInt(negative ? -lo : lo), e);
  let q = floorQuotient(hi, lo, POW10[k]!);
  if (q >= LIMIT) { k += 1; q = floorQuotient(hi, lo, POW10[k]!); }
  else if (q < LIMIT / 10) { k -= 1; q = floorQuotient(hi, lo, POW10[k]!); }
  q = roundQuotient(q, POW10[k]!, HALF_EVEN, negative);
  return canonical(negative ? -q : q, e + k);
}

/** An exact integer times 10^e, rounded to PRECISION digits by decimal.js (the rare wide case). */
function roundExactly(n: bigint, e: number): D {
  return fromReference(new Reference(`${n}e${e}`).toSignificantDigits(PRECISION, Decimal.ROUND_HALF_EVEN));
}

/**
 * m ÷ 10^shift rounded half-even, for 0 ≤ m < 10¹⁵ (a rounded coefficient) and 1 ≤ shift ≤ 15: the floor
 * from m·10^−shift, at most one off (INV10), and the remainder exact (every product here stays below 2⁵³).
 */
function shiftedHalfEven(m: number, shift: number): number {
  const d = POW10[shift]!;
  let q = Math.floor(m * INV10[shift]!);
  let r = m - q * d;
  if (r < 0) { q -= 1; r += d; } else if (r >= d) { q += 1; r -= d; }
  const twice = r * 2;
  return twice > d || (twice === d && odd(q)) ? q + 1 : q;
}

/** A factor this short times a rounded coefficient (below 10¹⁵) splits into exact partial products. */
const SHORT = 1e7;

/**
 * a × b × 10^e rounded to PRECISION digits (half-even), for |a| < 10¹⁵ and |b| < 10⁷ — a volume times a
 * stock's per-mL figure, the engine's commonest product. a splits at 10⁸ into parts whose products with b
 * stay below 10¹⁵, so P = hi·10⁸ + lo is held exactly and rounded by its own digits, without the general
 * error-free product.
 */
function productShort(a: number, b: number, e: number): D {
  const negative = (a < 0) !== (b < 0);
  const A = Math.abs(a);
  const B = Math.abs(b);
  // Each floor below comes from a multiplication by 10^−k, at most one off (INV10), and is corrected by
  // its exact remainder.
  let ah = Math.floor(A * 1e-8);
  let al = A - ah * 1e8;
  if (al < 0) { ah -= 1; al += 1e8; } else if (al >= 1e8) { ah += 1; al -= 1e8; }
  let hi = ah * B;
  let lo = al * B;
  let carry = Math.floor(lo * 1e-8);
  lo -= carry * 1e8;
  if (lo < 0) { carry -= 1; lo += 1e8; } else if (lo >= 1e8) { carry += 1; lo -= 1e8; }
  hi += carry;
  if (hi < 1e7) {
    const p = hi * 1e8 + lo; // below 10¹⁵: exact
    return canonical(negative ? -p : p, e);
  }
  const k = digits(hi) - 7; // digits to drop, 1…8
  const d = POW10[k]!;
  let ql = Math.floor(lo * INV10[k]!);
  let r = lo - ql * d;
  if (r < 0) { ql -= 1; r += d; } else if (r >= d) { ql += 1; r -= d; }
  let q = hi * POW10[8 - k]! + ql;
  if (r !== 0) {
    const twice = r * 2;
    if (twice > d || (twice === d && odd(q))) q += 1;
  }
  return canonical(negative ? -q : q, e + k);
}

/**
 * A safe integer of 16 digits (10¹⁵ ≤ |n| < 2⁵³) times 10^e, rounded to PRECISION digits: only its last
 * digit goes. q × 10 stays below 2⁵³, so the remainder is exact.
 */
function roundLast(n: number, e: number): D {
  const negative = n < 0;
  const m = negative ? -n : n;
  let q = Math.floor(m * 0.1); // at most one off (INV10)
  let r = m - q * 10;
  if (r < 0) { q -= 1; r += 10; } else if (r >= 10) { q += 1; r -= 10; }
  if (r > 5 || (r === 5 && odd(q))) q += 1;
  return canonical(negative ? -q : q, e + 1);
}

/** A safe integer times 10^e, rounded to PRECISION digits. */
function make(c: number, e: number): D {
  return c < LIMIT && c > -LIMIT ? canonical(c, e) : roundLast(c, e);
}

function fromReference(r: Reference): D {
  if (!r.isFinite()) return new D(RAW, NaN, 0, r);
  return new D(r.valueOf());
}

function toReference(d: D): Reference {
  return d.x ?? new Reference(d.valueOf());
}

/** Whole numbers −1024…1024, made once: operands like `.times(1000)` or `.gt(0)` allocate nothing. */
let SMALL_INTEGERS: readonly D[] = [];

function parsed(v: Numeric): D {
  if (v instanceof D) return v;
  if (typeof v === 'number' && v >= -1024 && v <= 1024 && Number.isInteger(v) && !Object.is(v, -0)) return SMALL_INTEGERS[v + 1024]!;
  return new D(v);
}

let parsedC = 0;
let parsedE = 0;

/**
 * Read a plain decimal string (decimal.js's grammar) into parsedC/parsedE; false when it needs decimal.js.
 * The digits are summed as they are read (exact while the value stays below 2⁵³); zeros wait until a
 * non-zero digit follows them, so trailing zeros become the exponent.
 */
function parseDecimal(s: string): boolean {
  const n = s.length;
  let i = 0;
  let negative = false;
  const first = s.charCodeAt(0);
  if (first === 45) { negative = true; i = 1; } else if (first === 43) i = 1;
  let c = 0;
  let significant = 0; // digits from the first non-zero one to the last non-zero one
  let zeros = 0; // zeros read since the last non-zero digit
  let fraction = 0; // digits after the point
  let any = false;
  let inFraction = false;
  for (; i < n; i++) {
    const code = s.charCodeAt(i);
    if (code === 46 && !inFraction) { inFraction = true; continue; }
    const digit = code - 48;
    if (digit < 0 || digit > 9) break;
    any = true;
    if (inFraction) fraction++;
    if (digit === 0) {
      if (significant > 0) zeros++;
    } else if (significant === 0) {
      c = digit;
      significant = 1;
    } else {
      significant += zeros + 1;
      if (significant <= 16) c = c * POW10[zeros + 1]! + digit;
      zeros = 0;
    }
  }
  if (!any) return false;
  let exponent = 0;
  if (i < n && (s.charCodeAt(i) | 32) === 101) {
    const expStart = ++i;
    if (i < n && (s.charCodeAt(i) === 45 || s.charCodeAt(i) === 43)) i++;
    const digitsStart = i;
    while (i < n && s.charCodeAt(i) >= 48 && s.charCodeAt(i) <= 57) i++;
    if (i === digitsStart || i - digitsStart > 9) return false;
    exponent = Number(s.slice(expStart, i));
  }
  if (i !== n || significant > 16 || c > MAX) return false;
  parsedC = negative ? -c : c;
  parsedE = c === 0 ? 0 : exponent - fraction + zeros;
  return true;
}

/**
 * Read a finite binary float with at most 15 significant digits and 15 decimals (every dose a file holds:
 * 2.5, 0.465, 1234.5678) into parsedC/parsedE without writing its text: the decimal String(v) shows. The
 * first k for which M = v·10^k is a whole number below 10¹⁵ and M ÷ 10^k gives v back is taken: that
 * division is correctly rounded, so the decimal M·10⁻ᵏ reads as v, and no other decimal of 15 digits or
 * fewer does (they are further apart than a float's spacing), so it is the shortest one, String(v)'s.
 * False when there is none (1/3, 1e-20, 0.1 + 0.2): the caller reads the text.
 */
function shortDecimal(v: number): boolean {
  const magnitude = Math.abs(v);
  if (!(magnitude < 1e15) || magnitude < 1e-15) return false;
  for (let k = 1; k <= 15; k++) {
    const scale = POW10[k]!;
    const m = v * scale;
    if (m >= 1e15 || m <= -1e15) return false;
    if (m === Math.floor(m) && m / scale === v) {
      let c = m;
      let e = -k;
      while (tens(c)) { c /= 10; e += 1; }
      parsedC = c;
      parsedE = e;
      return true;
    }
  }
  return false;
}

/** A number, decimal text or decimal read into a new decimal (decimal.js's grammar and results). */
function readValue(value: Numeric): D {
  if (value instanceof D) return value;
  if (typeof value === 'number' && Number.isInteger(value) && value <= MAX && value >= -MAX) {
    let coefficient = value;
    let exponent = 0;
    if (coefficient !== 0) while (tens(coefficient)) { coefficient /= 10; exponent += 1; }
    return new D(RAW, coefficient, exponent, null);
  }
  if (typeof value === 'number' && shortDecimal(value)) return new D(RAW, parsedC, parsedE, null);
  const text = typeof value === 'number' ? String(value) : value;
  // parseDecimal leaves no trailing zeros in the coefficient: no canonical() pass.
  if (typeof text === 'string' && parseDecimal(text)) return new D(RAW, parsedC, parsedE, null);
  // decimal.js reads (or rejects, with its own error) everything else: Infinity, NaN, long coefficients.
  const reference = new Reference(value as string | number);
  if (reference.isFinite() && parseDecimal(reference.valueOf())) return new D(RAW, parsedC, parsedE, null);
  return new D(RAW, NaN, 0, reference);
}

/**
 * An exact decimal number: `c × 10^e` with a safe-integer coefficient, or, for ±Infinity, NaN and
 * coefficients of more than 16 digits read from input, a decimal.js value in `x`. Immutable. The methods
 * are the decimal.js ones the engine uses, with the same names and results (at 15 digits).
 */
export class D {
  static readonly ROUND_UP = 0;
  static readonly ROUND_DOWN = 1;
  static readonly ROUND_CEIL = 2;
  static readonly ROUND_FLOOR = 3;
  static readonly ROUND_HALF_UP = 4;
  static readonly ROUND_HALF_DOWN = 5;
  static readonly ROUND_HALF_EVEN = 6;

  /** The coefficient: a safe integer without trailing zeros (NaN when the value is held in `x`). */
  readonly c: number;
  /** The power of ten the coefficient is multiplied by. */
  readonly e: number;
  /** The decimal.js value, for the values the coefficient cannot hold; null otherwise. */
  readonly x: Reference | null;

  constructor(value: Numeric);
  constructor(raw: typeof RAW, c: number, e: number, x: Reference | null);
  constructor(value: Numeric | typeof RAW, c = 0, e = 0, x: Reference | null = null) {
    // Kept this small on purpose: every operation ends in `new D(RAW, …)`, and a short constructor is
    // inlined there. Reading a number or text is readValue's work.
    if (value === RAW) {
      this.c = c;
      this.e = e;
      this.x = x;
    } else {
      const read = readValue(value);
      this.c = read.c;
      this.e = read.e;
      this.x = read.x;
    }
  }

  static max(...values: Numeric[]): D {
    let best = parsed(values[0] ?? NaN);
    for (let i = 1; i < values.length; i++) {
      const v = parsed(values[i]!);
      if (v.x !== null && v.x.isNaN()) return v;
      if (best.cmp(v) < 0) best = v;
    }
    return best;
  }

  static min(...values: Numeric[]): D {
    let best = parsed(values[0] ?? NaN);
    for (let i = 1; i < values.length; i++) {
      const v = parsed(values[i]!);
      if (v.x !== null && v.x.isNaN()) return v;
      if (best.cmp(v) > 0) best = v;
    }
    return best;
  }

  // ---- arithmetic ----------------------------------------------------------------------------------------

  plus(y: Numeric): D {
    const v = parsed(y);
    if (this.x !== null || v.x !== null) return fromReference(toReference(this).plus(toReference(v)));
    // Adding zero to a rounded value gives that value (a bag's totals add many zeros): no new decimal.
    if (v.c === 0 && this.c !== 0 && this.c < LIMIT && this.c > -LIMIT) return this;
    if (this.c === 0 && v.c !== 0 && v.c < LIMIT && v.c > -LIMIT) return v;
    return add(this.c, this.e, v.c, v.e);
  }

  add(y: Numeric): D {
    return this.plus(y);
  }

  minus(y: Numeric): D {
    const v = parsed(y);
    if (this.x !== null || v.x !== null) return fromReference(toReference(this).minus(toReference(v)));
    return add(this.c, this.e, -v.c, v.e);
  }

  sub(y: Numeric): D {
    return this.minus(y);
  }

  times(y: Numeric): D {
    const v = parsed(y);
    if (this.x !== null || v.x !== null) return fromReference(toReference(this).times(toReference(v)));
    const a = this.c;
    const b = v.c;
    const p = a * b;
    const e = this.e + v.e;
    // Below 10¹⁵ the float product is exact and needs no rounding (fl(a × b) ≥ 2⁵³ when a × b is wider).
    if (p < LIMIT && p > -LIMIT) return canonical(p, e);
    if (p <= MAX && p >= -MAX) return roundLast(p, e);
    if (b < SHORT && b > -SHORT && a < LIMIT && a > -LIMIT) return productShort(a, b, e);
    if (a < SHORT && a > -SHORT && b < LIMIT && b > -LIMIT) return productShort(b, a, e);
    return roundPair(p, twoProductError(a, b, p), e);
  }

  mul(y: Numeric): D {
    return this.times(y);
  }

  div(y: Numeric): D {
    const v = parsed(y);
    if (this.x !== null || v.x !== null || v.c === 0) return fromReference(toReference(this).div(toReference(v)));
    const a = this.c;
    const b = v.c;
    if (a === 0) return canonical(a / b, 0);
    const negative = (a < 0) !== (b < 0);
    const A = Math.abs(a);
    const B = Math.abs(b);
    // A whole quotient: fl(q × B) equals A only when q × B is A exactly (a product above 2⁵³ rounds to
    // at least 2⁵³, above any safe A).
    const whole = A / B;
    if (whole === Math.floor(whole) && whole * B === A) {
      // A ends in no zero, so neither does a whole quotient (A = whole × B): no canonical() pass.
      const q = negative ? -whole : whole;
      return whole < LIMIT ? new D(RAW, q, this.e - v.e, null) : roundLast(q, this.e - v.e);
    }
    if (A >= LIMIT || B >= LIMIT) return fromReference(toReference(this).div(toReference(v)));
    // Scale A by 10^s so that floor(A·10^s ÷ B) has exactly PRECISION digits.
    const nA = digits(A);
    const nB = digits(B);
    let s = PRECISION - 1 + nB - nA;
    if ((nA <= nB ? A * POW10[nB - nA]! : A) < (nA <= nB ? B : B * POW10[nA - nB]!)) s += 1;
    if (s <= 22 && B * POW10[s]! <= MAX) {
      // Long division in two exact steps (the commonest case, a divisor of a few digits): A = qa·B + ra,
      // then ra·10^s = qb·B + rb, both products below 2⁵³; floor(A·10^s ÷ B) = qa·10^s + qb, remainder rb.
      const scale = POW10[s]!;
      let qa = Math.floor(A / B);
      let ra = A - qa * B;
      if (ra < 0) { qa -= 1; ra += B; } else if (ra >= B) { qa += 1; ra -= B; }
      const t = ra * scale;
      let qb = Math.floor(t / B);
      let rb = t - qb * B;
      if (rb < 0) { qb -= 1; rb += B; } else if (rb >= B) { qb += 1; rb -= B; }
      remainder = rb;
      const q = roundQuotient(qa * scale + qb, B, HALF_EVEN, negative);
      return canonical(negative ? -q : q, this.e - v.e - s);
    }
    let hi: number;
    let lo: number;
    if (s <= 22) {
      hi = A * POW10[s]!;
      lo = twoProductError(A, POW10[s]!, hi);
    } else {
      const scaled = A * POW10[s - 22]!; // exact: s > 22 only for a short A
      hi = scaled * 1e22;
      lo = twoProductError(scaled, 1e22, hi);
    }
    const q = roundQuotient(floorQuotient(hi, lo, B), B, HALF_EVEN, negative);
    return canonical(negative ? -q : q, this.e - v.e - s);
  }

  dividedBy(y: Numeric): D {
    return this.div(y);
  }

  /** The square root (by decimal.js, correctly rounded to PRECISION digits). */
  sqrt(): D {
    return fromReference(toReference(this).sqrt());
  }

  neg(): D {
    return this.x !== null ? fromReference(this.x.neg()) : new D(RAW, -this.c, this.e, null);
  }

  negated(): D {
    return this.neg();
  }

  abs(): D {
    if (this.x !== null) return fromReference(this.x.abs());
    return this.c < 0 || Object.is(this.c, -0) ? new D(RAW, -this.c, this.e, null) : this;
  }

  // ---- comparison ----------------------------------------------------------------------------------------

  /** −1, 0 or 1 as this is below, equal to or above y; NaN when either is NaN. */
  cmp(y: Numeric): number {
    const v = parsed(y);
    if (this.x !== null || v.x !== null) return toReference(this).cmp(toReference(v));
    const a = this.c;
    const b = v.c;
    if (this.e === v.e || a === 0 || b === 0) return a < b ? -1 : a > b ? 1 : 0;
    if ((a < 0) !== (b < 0)) return a < 0 ? -1 : 1;
    // Same sign, both non-zero: align to the smaller exponent. A scaled coefficient above 2⁵³ rounds to a
    // double at least 2⁵³, still above the other (a safe integer), so the comparison stays exact.
    if (this.e > v.e) {
      const scaled = a * POW10[Math.min(39, this.e - v.e)]!;
      return scaled < b ? -1 : scaled > b ? 1 : 0;
    }
    const scaled = b * POW10[Math.min(39, v.e - this.e)]!;
    return a < scaled ? -1 : a > scaled ? 1 : 0;
  }

  comparedTo(y: Numeric): number {
    return this.cmp(y);
  }

  eq(y: Numeric): boolean {
    return this.cmp(y) === 0;
  }

  equals(y: Numeric): boolean {
    return this.eq(y);
  }

  gt(y: Numeric): boolean {
    return this.cmp(y) > 0;
  }

  gte(y: Numeric): boolean {
    return this.cmp(y) >= 0;
  }

  lt(y: Numeric): boolean {
    return this.cmp(y) < 0;
  }

  lte(y: Numeric): boolean {
    return this.cmp(y) <= 0;
  }

  isZero(): boolean {
    return this.c === 0;
  }

  isFinite(): boolean {
    return this.x === null || this.x.isFinite();
  }

  isNaN(): boolean {
    return this.x !== null && this.x.isNaN();
  }

  isInteger(): boolean {
    return this.x !== null ? this.x.isInteger() : this.e >= 0 || this.c === 0;
  }

  isNeg(): boolean {
    return this.x !== null ? this.x.isNeg() : this.c < 0 || Object.is(this.c, -0);
  }

  isNegative(): boolean {
    return this.isNeg();
  }

  isPos(): boolean {
    return this.x !== null ? this.x.isPos() : !this.isNeg();
  }

  // ---- rounding ------------------------------------------------------------------------------------------

  /** Rounded to `dp` decimal places (rounding mode `rm`, half-even by default); not limited to PRECISION. */
  toDecimalPlaces(dp?: number, rm: number = HALF_EVEN): D {
    if (dp === undefined) return this;
    if (this.x !== null) return fromReference(this.x.toDecimalPlaces(dp, rm as Decimal.Rounding));
    if (this.e >= -dp || this.c === 0) return this;
    const q = this.roundedCoefficient(dp, rm);
    // q has at least one digit fewer than the coefficient: below 2⁵³ ÷ 10 + 1.
    return q === 0 ? new D(RAW, this.c < 0 ? -0 : 0, 0, null) : canonical(q, -dp);
  }

  /** toDecimalPlaces(dp) (half-even) as the nearest binary float, without making the rounded decimal. */
  toRoundedNumber(dp: number): number {
    if (this.x !== null) return this.toDecimalPlaces(dp).toNumber();
    if (this.e >= -dp || this.c === 0) return this.toNumber(); // already at most dp places
    const shift = -dp - this.e;
    const magnitude = Math.abs(this.c);
    if (shift <= 15 && magnitude < LIMIT && dp <= 22) {
      const q = shiftedHalfEven(magnitude, shift);
      if (q === 0) return this.c < 0 ? -0 : 0;
      const n = q / POW10[dp]!;
      return this.c < 0 ? -n : n;
    }
    const q = this.roundedCoefficient(dp, HALF_EVEN);
    if (q === 0) return this.c < 0 ? -0 : 0;
    return dp <= 22 ? q / POW10[dp]! : Number(`${q}e-${dp}`);
  }

  /**
   * This value rounded half-even to `dp` decimal places, as the whole number of 10^−dp it makes (12.345 at
   * 2 places → 1234); NaN when that number is not a safe integer or the value is not finite.
   */
  toScaledInteger(dp: number): number {
    if (this.x !== null) return NaN;
    if (this.c === 0) return 0;
    if (this.e >= -dp) {
      const shift = this.e + dp;
      if (shift > 15) return NaN;
      const q = this.c * POW10[shift]!;
      return q <= MAX && q >= -MAX ? q : NaN;
    }
    return this.roundedCoefficient(dp, HALF_EVEN);
  }

  /** The signed coefficient of this value rounded to `dp` places, at exponent −dp (when this.e < −dp). */
  private roundedCoefficient(dp: number, rm: number): number {
    const negative = this.c < 0;
    const magnitude = Math.abs(this.c);
    const shift = -dp - this.e;
    let q: number;
    if (rm === HALF_EVEN && shift <= 15 && magnitude < LIMIT) {
      q = shiftedHalfEven(magnitude, shift); // the report's rounding of a rounded result
    } else if (shift > 22) {
      q = bumps(rm, negative, false, -1) ? 1 : 0; // the magnitude is below 2⁵³, far under one half of 10²²
    } else {
      const d = POW10[shift]!;
      q = shift > 15 ? 0 : floorQuotient(magnitude, 0, d); // the magnitude has at most 16 digits
      if (shift > 15) remainder = magnitude;
      q = roundQuotient(q, d, rm, negative);
    }
    return negative ? -q : q;
  }

  toDP(dp?: number, rm?: number): D {
    return this.toDecimalPlaces(dp, rm);
  }

  /** Rounded to a whole number, half-even. */
  round(): D {
    return this.toDecimalPlaces(0, HALF_EVEN);
  }

  floor(): D {
    return this.toDecimalPlaces(0, D.ROUND_FLOOR);
  }

  ceil(): D {
    return this.toDecimalPlaces(0, D.ROUND_CEIL);
  }

  /** The multiple of `step` nearest to this value in rounding mode `rm` (half-even by default). */
  toNearest(step: Numeric, rm: number = HALF_EVEN): D {
    const y = parsed(step);
    if (this.x !== null || y.x !== null) return fromReference(toReference(this).toNearest(toReference(y), rm as Decimal.Rounding));
    if (y.c === 0) return new D(RAW, this.isNeg() ? -0 : 0, 0, null);
    const low = Math.min(this.e, y.e);
    const X = this.c * POW10[Math.min(39, this.e - low)]!;
    const Y = y.c * POW10[Math.min(39, y.e - low)]!;
    if (Math.abs(X) > MAX || Math.abs(Y) > MAX) return fromReference(toReference(this).toNearest(toReference(y), rm as Decimal.Rounding));
    const negative = (X < 0) !== (Y < 0);
    const absX = Math.abs(X);
    const absY = Math.abs(Y);
    const q = roundQuotient(floorQuotient(absX, 0, absY), absY, rm, negative);
    if (q === 0) return new D(RAW, this.isNeg() ? -0 : 0, 0, null);
    // decimal.js leaves this product exact (not rounded to PRECISION).
    const product = (negative ? -q : q) * y.c;
    if (product > MAX || product < -MAX) return fromReference(toReference(this).toNearest(toReference(y), rm as Decimal.Rounding));
    return canonicalWide(product, y.e);
  }

  // ---- conversion ----------------------------------------------------------------------------------------

  /** The nearest binary float (correctly rounded, as decimal.js's toNumber). */
  toNumber(): number {
    if (this.x !== null) return this.x.toNumber();
    const { c, e } = this;
    if (e === 0) return c;
    if (e < 0 && e >= -22) return c / POW10[-e]!;
    if (e > 0 && e <= 22) return c * POW10[e]!;
    return Number(`${c}e${e}`);
  }

  /** Plain digits, exponential notation below 10⁻⁷ or from 10²¹ (as decimal.js); "-" only when non-zero. */
  toString(): string {
    if (this.x !== null) return this.x.toString();
    const text = this.unsigned();
    return this.c < 0 ? `-${text}` : text;
  }

  /** As toString, but negative zero keeps its sign (as decimal.js's valueOf and toJSON). */
  valueOf(): string {
    if (this.x !== null) return this.x.valueOf();
    const text = this.unsigned();
    return this.isNeg() ? `-${text}` : text;
  }

  toJSON(): string {
    return this.valueOf();
  }

  /** Fixed-point text with `dp` decimals (rounding mode `rm`, half-even by default). */
  toFixed(dp?: number, rm: number = HALF_EVEN): string {
    if (this.x !== null) return dp === undefined ? this.x.toFixed() : this.x.toFixed(dp, rm as Decimal.Rounding);
    const rounded = dp === undefined ? this : this.toDecimalPlaces(dp, rm);
    const body = rounded.plain(Math.abs(rounded.c), dp ?? 0);
    return this.c < 0 ? `-${body}` : body;
  }

  [Symbol.for('nodejs.util.inspect.custom')](): string {
    return `D(${this.valueOf()})`;
  }

  /** |value| as decimal.js's toString writes it. */
  private unsigned(): string {
    const digitsText = String(Math.abs(this.c));
    const adjusted = this.e + digitsText.length - 1;
    if (adjusted <= -7 || adjusted >= 21) {
      const mantissa = digitsText.length > 1 ? `${digitsText[0]}.${digitsText.slice(1)}` : digitsText;
      return `${mantissa}e${adjusted < 0 ? '' : '+'}${adjusted}`;
    }
    return this.plain(Math.abs(this.c), 0);
  }

  /** A non-negative coefficient at this exponent in plain notation, with at least `dp` decimals. */
  private plain(magnitude: number, dp: number): string {
    const digitsText = String(magnitude);
    const e = magnitude === 0 ? 0 : this.e;
    let whole: string;
    let fraction: string;
    if (e >= 0) {
      whole = digitsText + '0'.repeat(e);
      fraction = '';
    } else if (-e >= digitsText.length) {
      whole = '0';
      fraction = '0'.repeat(-e - digitsText.length) + digitsText;
    } else {
      whole = digitsText.slice(0, digitsText.length + e);
      fraction = digitsText.slice(digitsText.length + e);
    }
    if (fraction.length < dp) fraction += '0'.repeat(dp - fraction.length);
    return fraction === '' ? whole : `${whole}.${fraction}`;
  }
}

/**
 * a·10^d + b, times 10^e, rounded to PRECISION digits (half-even), for |a|, |b| < 10¹⁵, b ≠ 0 without
 * trailing zeros, and 1 ≤ d ≤ 15 —
 * two rounded figures of different sizes, the engine's commonest sum. b splits at 10^d into q·10^d + r,
 * so the sum is S·10^d + r with S = a + q, held exactly and rounded by its own digits.
 */
function sumSplit(a: number, b: number, d: number, e: number): D {
  const unit = POW10[d]!;
  const q = Math.trunc(b / unit); // exact: b/10^d never rounds across a whole number below 10¹⁵
  let r = b - q * unit;
  let S = a + q;
  if (S > 0 && r < 0) { S -= 1; r += unit; } else if (S < 0 && r > 0) { S += 1; r -= unit; }
  const negative = S < 0 || (S === 0 && r < 0);
  const Sm = Math.abs(S);
  const rm = Math.abs(r);
  // An exact sum ends in b's last digit, which is not a zero (a·10^d ends in zeros): no canonical() pass.
  if (Sm === 0) return new D(RAW, r, e, null);
  const drop = digits(Sm) + d - PRECISION;
  if (drop <= 0) {
    const exact = Sm * unit + rm; // below 10¹⁵
    return new D(RAW, negative ? -exact : exact, e, null);
  }
  let keep: number;
  let half: number;
  if (drop <= d) {
    const cut = POW10[drop]!;
    const high = Math.floor(rm / cut);
    const rest = rm - high * cut;
    keep = Sm * POW10[d - drop]! + high;
    const twice = rest * 2;
    half = rest === 0 ? -2 : twice < cut ? -1 : twice === cut ? 0 : 1;
  } else {
    // S has 16 digits: its last digit goes too, with all of r behind it.
    keep = Math.floor(Sm / 10);
    const last = Sm - keep * 10;
    half = last === 0 && rm === 0 ? -2 : last < 5 ? -1 : last > 5 ? 1 : rm > 0 ? 1 : 0;
  }
  if (half === 1 || (half === 0 && odd(keep))) keep += 1;
  return canonical(negative ? -keep : keep, e + drop);
}

/** a·10^ea + b·10^eb for safe-integer coefficients, rounded to PRECISION digits. */
function add(a: number, ea: number, b: number, eb: number): D {
  if (ea < eb) {
    const t = a; a = b; b = t;
    const te = ea; ea = eb; eb = te;
  }
  // Now ea ≥ eb: a is scaled up by 10^d to b's exponent.
  const d = ea - eb;
  if (d === 0) {
    const s = a + b;
    if (s < LIMIT && s > -LIMIT) return canonical(s, eb); // a zero sum is +0 (−0 only for −0 + −0), as decimal.js
    if (s <= MAX && s >= -MAX) return roundLast(s, eb);
    const lo = (a - (s - (s - a))) + (b - (s - a)); // Knuth's two-sum error
    return roundPair(s, lo, eb);
  }
  // A zero (always at exponent 0) is not scaled: the other operand is the sum, however far apart they are.
  if (a === 0) return make(b, eb);
  if (b === 0) return make(a, ea);
  if (d > 22) return roundExactly(BigInt(a) * 10n ** BigInt(d) + BigInt(b), eb);
  const scaled = a * POW10[d]!;
  const sum = scaled + b;
  // Exact whenever it is below 10¹⁵: a·10^d that is not a float (its odd part above 2⁵³) exceeds 2⁵⁴, and
  // then |fl(a·10^d) + b| ≥ 2⁵⁴ − 2⁵³. It ends in b's last digit, which is not a zero: no canonical() pass.
  if (sum < LIMIT && sum > -LIMIT) return new D(RAW, sum, eb, null);
  if (scaled <= MAX && scaled >= -MAX && sum <= MAX && sum >= -MAX) return roundLast(sum, eb);
  if (d <= 15 && a < LIMIT && a > -LIMIT && b < LIMIT && b > -LIMIT) return sumSplit(a, b, d, eb);
  // Beyond 2¹⁰⁴ (or with a 16-digit b) the error terms below could reach 2⁵³: the exact slow path.
  if (scaled >= 2e31 || scaled <= -2e31 || b >= 4.5e15 || b <= -4.5e15) return roundExactly(BigInt(a) * 10n ** BigInt(d) + BigInt(b), eb);
  // Exactly: a·10^d = scaled + err (|err| ≤ 2⁵⁰), err + b is an integer below 2⁵³; then an error-free sum.
  const err = twoProductError(a, POW10[d]!, scaled);
  const tail = err + b;
  const s = scaled + tail;
  const bv = s - scaled;
  const lo = (scaled - (s - bv)) + (tail - bv);
  return roundPair(s, lo, eb);
}

SMALL_INTEGERS = Array.from({ length: 2049 }, (_, i) => new D(i - 1024));

export const ZERO = new D(0);
export const ONE = new D(1);
export const THOUSAND = new D(1000);

/** Read a JSON number or decimal string into a decimal; null when it is not a finite number. */
export function toDecimal(value: unknown): D | null {
  if (typeof value === 'number') return Number.isFinite(value) ? new D(value) : null;
  if (typeof value === 'string') {
    const text = value.trim();
    // Plain decimal text with a safe-integer coefficient (nearly every file) is read without the pattern.
    if (parseDecimal(text)) return new D(RAW, parsedC, parsedE, null);
    if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(text)) return null;
    const d = new D(text);
    return d.isFinite() ? d : null;
  }
  return null;
}

/** Sum of decimals. */
export function sum(values: Iterable<D>): D {
  let total = ZERO;
  for (const v of values) total = total.plus(v);
  return total;
}

/**
 * Round for display or for the report: a finite JSON number with `places` decimals (half-even).
 * Never returns NaN or Infinity: a non-finite input is a programming error and throws.
 */
export function round(value: D, places: number): number {
  if (value.isZero()) return 0;
  if (!value.isFinite()) throw new Error('non-finite value reached the display edge');
  const n = value.toRoundedNumber(places);
  return n === 0 ? 0 : n; // no −0
}

/**
 * round(a.div(b) × 10^shift, places) — the quotient rounded to 15 digits as `div` rounds it, × 10^shift (which
 * only moves its exponent), rounded half-even to `places`: the very float round() gives — without making a
 * decimal when a float estimate settles it. Operands whose exponents lie within ±22 read into floats
 * correctly rounded (their coefficients are safe integers), so the estimate S of s = a ÷ b × 10^(shift+places)
 * is within 4.5·10⁻¹⁶·|s| of s, and the 15-digit quotient within 5·10⁻¹⁵·|s|: when S lies further than
 * 10⁻¹⁴·|S| from every half-way point, both round to the whole number nearest S. Otherwise (a near-tie, or
 * a value that is not a plain finite decimal) the decimals decide. The report rounds every figure it
 * divides by the weight, the volume or a total this way. Example: 1 ÷ 3 × 100 at one place → 33.3.
 */
export function roundDivided(a: D, b: D, shift: number, places: number): number {
  if (a.x === null && b.x === null && b.c !== 0 && a.e >= -22 && a.e <= 22 && b.e >= -22 && b.e <= 22 && shift + places <= 22) {
    const s = (a.toNumber() / b.toNumber()) * POW10[shift + places]!;
    const k = Math.round(s);
    const size = Math.abs(s);
    if (size < 2 ** 52 && Math.abs(s - k) < 0.5 - size * 1e-14) return k === 0 ? 0 : k / POW10[places]!;
  }
  const q = a.div(b);
  return round(shift === 0 ? q : q.times(POW10[shift]!), places);
}

/**
 * Whether `product` is a × b exactly, with no rounding on the way: the coefficients' product is below 10¹⁵
 * (so `times` kept every digit) and `product` holds that value. Then product ÷ b gives a back, digit for digit.
 */
export function isUnroundedProduct(product: D, a: D, b: D): boolean {
  if (a.x !== null || b.x !== null || product.x !== null) return false;
  const p = a.c * b.c;
  if (!(p < 1e15 && p > -1e15)) return false;
  // The product's coefficient has no trailing zeros; p may have some.
  const shift = product.e - (a.e + b.e);
  return shift >= 0 && shift <= 15 && product.c * POW10[shift]! === p;
}

/** Ratio a ÷ b, or null when b is zero (callers decide what an undefined ratio means). */
export function ratio(a: D, b: D): D | null {
  return b.isZero() ? null : a.div(b);
}
