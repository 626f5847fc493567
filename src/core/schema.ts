import { z } from 'zod';
import { D, toDecimal } from './decimal.ts';
import { formatPath, type Problem, type Result } from './problems.ts';

type Bound = { min?: number; gt?: number; max?: number };

function describe(b: Bound): string {
  const low = b.gt !== undefined ? `> ${b.gt}` : b.min !== undefined ? `≥ ${b.min}` : null;
  if (low && b.max !== undefined) return `must be a number ${low} and ≤ ${b.max}`;
  if (low) return `must be a number ${low}`;
  if (b.max !== undefined) return `must be a number ≤ ${b.max}`;
  return 'must be a number';
}

/**
 * A reader of one bounded decimal field: the decimal, or null when the value is not a finite number
 * or is out of range. The bounds are made into decimals once, here, not at every comparison.
 */
export function decimalReader(bound: Bound = {}): (value: unknown) => D | null {
  const gt = bound.gt === undefined ? null : new D(bound.gt);
  const min = bound.min === undefined ? null : new D(bound.min);
  const max = bound.max === undefined ? null : new D(bound.max);
  // A lower bound of zero (most amounts) is settled by the coefficient's sign.
  const minZero = min !== null && min.isZero();
  return (value) => {
    const d = toDecimal(value);
    if (d === null || (gt !== null && d.lte(gt)) || (max !== null && d.gt(max))) return null;
    if (min !== null && (minZero && d.x === null ? d.c < 0 : d.lt(min))) return null;
    return d;
  };
}

/**
 * A JSON number or decimal string, read straight into a decimal (never through float arithmetic).
 * One clear message when it is missing, not a number, or out of range.
 */
export function decimal(bound: Bound = {}) {
  const message = describe(bound);
  const read = decimalReader(bound);
  return z.unknown().transform((value, ctx): D => {
    const d = read(value);
    if (d === null) {
      ctx.addIssue({ code: 'custom', message: value === undefined ? `is required (${message})` : message });
      return z.NEVER;
    }
    return d;
  });
}

/** Optional variant: absent stays absent. */
export function optionalDecimal(bound: Bound = {}) {
  return decimal(bound).optional();
}

export const idPattern = /^[a-z0-9]+(-[a-z0-9]+)*$/;

/** zod issues → `path: message` problems (zod already reports every issue, not just the first). */
export function zodProblems(error: z.ZodError, prefix: readonly PropertyKey[] = []): Problem[] {
  return error.issues.map((issue) => ({
    path: formatPath([...prefix, ...issue.path]),
    message: friendlyMessage(issue),
  }));
}

function friendlyMessage(issue: z.core.$ZodIssue): string {
  switch (issue.code) {
    case 'invalid_type':
      return issue.input === undefined ? `is required (${issue.expected})` : `must be ${article(issue.expected)}`;
    case 'invalid_value': {
      const choices = issue.values.map((v) => JSON.stringify(v)).join(', ');
      return issue.input === undefined ? `is required (one of ${choices})` : `must be one of ${choices}`;
    }
    case 'unrecognized_keys':
      return `unknown field${issue.keys.length > 1 ? 's' : ''} ${issue.keys.join(', ')}`;
    default:
      return issue.message;
  }
}

function article(expected: string): string {
  return /^[aeiou]/.test(expected) ? `an ${expected}` : `a ${expected}`;
}

/** Run a schema and return its typed output or every problem as data; never throws on input. */
export function parseWith<S extends z.ZodType>(schema: S, input: unknown): Result<z.output<S>> {
  const parsed = schema.safeParse(input, { reportInput: true });
  return parsed.success ? { ok: true, value: parsed.data } : { ok: false, problems: zodProblems(parsed.error) };
}
