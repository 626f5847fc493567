import { z } from 'zod';
import { D } from './decimal.ts';
import { optionalDecimal } from './schema.ts';
import type { Policy } from './policy.ts';
import type { Result } from './problems.ts';

// The policy's `beyondUse` block: how long a compounded bag may be kept, under which storage
// condition, each duration with its source; and the storage instruction printed on the label.

const stepSchema = z.strictObject({
  label: z.string().trim().min(1, 'must say how the bag is kept, e.g. "at room temperature" or "refrigerated"'),
  temperature: z.string().trim().min(1, 'must give the temperature range, e.g. "20–25 °C"'),
  hours: optionalDecimal({ gt: 0, max: 8760 }),
  days: optionalDecimal({ gt: 0, max: 365 }),
  source: z.string().trim().min(1, 'must name the source of the duration (or "common practice")'),
});

const conditionSchema = stepSchema.extend({
  id: z.string().regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, 'must be lowercase letters, digits and single dashes'),
  afterRemoval: stepSchema.optional(),
});

/** The policy file's `beyondUse` block (exactly one of `hours` or `days` per duration). */
export const beyondUseSchema = z.strictObject({
  conditions: z.array(conditionSchema).min(1, 'must list at least one storage condition'),
  storage: z.strictObject({
    text: z.string().trim().min(1, 'must say how to store the bag'),
    source: z.string().trim().min(1, 'must name the source (or "common practice")'),
  }),
}).superRefine((block, ctx) => {
  const oneDuration = (s: { hours?: D | undefined; days?: D | undefined }, path: (string | number)[]) => {
    if ((s.hours === undefined) === (s.days === undefined)) ctx.addIssue({ code: 'custom', path, message: 'needs exactly one of hours or days' });
  };
  const seen = new Set<string>();
  block.conditions.forEach((c, i) => {
    oneDuration(c, ['conditions', i]);
    if (c.afterRemoval) oneDuration(c.afterRemoval, ['conditions', i, 'afterRemoval']);
    if (seen.has(c.id)) ctx.addIssue({ code: 'custom', path: ['conditions', i, 'id'], message: `"${c.id}" is listed twice` });
    seen.add(c.id);
  });
});

/** A storage duration: a number of hours or of days (days are 24 elapsed hours each). */
export interface Duration {
  amount: D;
  unit: 'h' | 'days';
}

/** One leg of storage: where the bag is kept, for how long, and who says so. */
export interface StorageStep {
  label: string;
  temperature: string;
  duration: Duration;
  source: string;
}

/** A storage condition of the policy, with what is allowed after the bag leaves it (e.g. 24 h out of the refrigerator). */
export interface StorageCondition extends StorageStep {
  id: string;
  afterRemoval: StorageStep | null;
}

/** The validated `beyondUse` block. */
export interface BeyondUsePolicy {
  conditions: StorageCondition[];
  storage: { text: string; source: string };
}

type StepInput = z.output<typeof stepSchema>;

function toStep(s: StepInput): StorageStep {
  // The schema guarantees exactly one of hours and days.
  const duration: Duration = s.hours !== undefined ? { amount: s.hours, unit: 'h' } : { amount: s.days as D, unit: 'days' };
  return { label: s.label, temperature: s.temperature, duration, source: s.source };
}

/** The parsed block in engine form. */
export function toBeyondUsePolicy(input: z.output<typeof beyondUseSchema>): BeyondUsePolicy {
  return {
    conditions: input.conditions.map((c) => ({ id: c.id, ...toStep(c), afterRemoval: c.afterRemoval ? toStep(c.afterRemoval) : null })),
    storage: { text: input.storage.text, source: input.storage.source },
  };
}

/** The beyond-use date and time of a bag under one storage condition. */
export interface BeyondUseDate {
  condition: StorageCondition;
  /** The instant the bag must be used by (or discarded), if kept under this condition from compounding on. */
  until: Date;
}

const MS_PER_HOUR = 3_600_000;

/** Elapsed milliseconds of a duration (whole milliseconds; a day is 24 h). */
export function durationMs(d: Duration): number {
  const hours = d.unit === 'h' ? d.amount : d.amount.times(24);
  return hours.times(MS_PER_HOUR).round().toNumber();
}

/**
 * Beyond-use date/times of a bag compounded at `compoundedAt`, one per storage condition of the
 * policy, as elapsed time (an instant, so clock changes do not shorten or stretch it).
 * Example: compounded 2 Dec 2026 19:00 UTC, 30 h at room temperature → 4 Dec 2026 01:00 UTC.
 * A policy without a `beyondUse` block gives no dates (the label then asks for a handwritten BUD).
 */
export function beyondUse(compoundedAt: Date, policy: Policy): Result<BeyondUseDate[]> {
  const start = compoundedAt.getTime();
  if (!Number.isFinite(start)) return { ok: false, problems: [{ path: 'compoundedAt', message: 'is not a valid date and time' }] };
  const block = policy.beyondUse;
  if (!block) return { ok: true, value: [] };
  const value = block.conditions.map((condition) => ({ condition, until: new Date(start + durationMs(condition.duration)) }));
  if (value.some((b) => !Number.isFinite(b.until.getTime()))) return { ok: false, problems: [{ path: 'compoundedAt', message: 'is too far in the future to add a beyond-use time to' }] };
  return { ok: true, value };
}
