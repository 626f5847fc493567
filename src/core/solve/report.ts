import { z } from 'zod';
import { round } from '../decimal.ts';
import { SEVERITIES } from '../policy.ts';
import { ROUTES } from '../order.ts';
import type { Finding } from '../findings.ts';
import type { Change, Snapshot, Suggestion } from './suggestion.ts';

const num = z.number().refine(Number.isFinite, 'must be a finite number');

const snapshotSchema = z.object({
  osmolarity: num,
  osmolarityLimit: num.nullable(),
  verdict: z.enum(['pass', 'warn', 'block']),
  volumeMl: num,
  fluidMlPerKgPerDay: num,
  kcal: num,
  kcalPerKgPerDay: num,
  girMgPerKgPerMin: num,
  dextroseG: num,
});

const changeSchema = z.discriminatedUnion('field', [
  z.object({ field: z.literal('volumeMl'), from: num.nullable(), to: num, unit: z.literal('mL'), addsFillLine: z.string().nullable() }),
  z.object({ field: z.literal('amount'), line: z.number().int(), product: z.string(), from: num, to: num, unit: z.string(), gramsPerDayFrom: num, gramsPerDayTo: num }),
  z.object({ field: z.literal('route'), from: z.enum(ROUTES), to: z.enum(ROUTES) }),
]);

const findingSummarySchema = z.object({
  code: z.string(),
  severity: z.enum(SEVERITIES),
  nutrient: z.string().optional(),
  screen: z.string().optional(),
  message: z.string(),
});

/** One entry of the report's optional `suggestions` array (a proposal, or why one cannot be made). */
export const suggestionReportSchema = z.discriminatedUnion('status', [
  z.object({
    kind: z.enum(['final-volume', 'dextrose', 'peripheral-route']),
    status: z.literal('proposal'),
    message: z.string(),
    change: changeSchema,
    before: snapshotSchema,
    after: snapshotSchema,
    passesOsmolarity: z.boolean(),
    findingsAppear: z.array(findingSummarySchema),
    findingsDisappear: z.array(findingSummarySchema),
    notes: z.array(z.string()),
    applied: z.literal(false),
  }),
  z.object({
    kind: z.enum(['final-volume', 'dextrose', 'peripheral-route']),
    status: z.literal('unavailable'),
    message: z.string(),
    notes: z.array(z.string()),
  }),
]);
export type SuggestionReport = z.infer<typeof suggestionReportSchema>;

function snapshotReport(s: Snapshot): z.infer<typeof snapshotSchema> {
  return {
    osmolarity: round(s.osmolarity, 1),
    osmolarityLimit: s.osmolarityLimit ? round(s.osmolarityLimit, 1) : null,
    verdict: s.verdict,
    volumeMl: round(s.volumeMl, 2),
    fluidMlPerKgPerDay: round(s.fluidMlPerKgPerDay, 1),
    kcal: round(s.kcal, 1),
    kcalPerKgPerDay: round(s.kcalPerKgPerDay, 1),
    girMgPerKgPerMin: round(s.girMgPerKgPerMin, 2),
    dextroseG: round(s.dextroseG, 2),
  };
}

/** Whether two snapshots hold the very same figures (a route change keeps the bag's): only the verdict may differ. */
function sameFigures(a: Snapshot, b: Snapshot): boolean {
  return a.osmolarity === b.osmolarity && a.osmolarityLimit === b.osmolarityLimit && a.volumeMl === b.volumeMl
    && a.fluidMlPerKgPerDay === b.fluidMlPerKgPerDay && a.kcal === b.kcal && a.kcalPerKgPerDay === b.kcalPerKgPerDay
    && a.girMgPerKgPerMin === b.girMgPerKgPerMin && a.dextroseG === b.dextroseG;
}

function changeReport(c: Change): z.infer<typeof changeSchema> {
  switch (c.field) {
    case 'volumeMl': return { field: 'volumeMl', from: c.from ? round(c.from, 2) : null, to: round(c.to, 2), unit: 'mL', addsFillLine: c.addsFillLine };
    case 'amount': return { field: 'amount', line: c.line, product: c.product, from: round(c.from, 4), to: round(c.to, 4), unit: c.unit, gramsPerDayFrom: round(c.gramsPerDayFrom, 2), gramsPerDayTo: round(c.gramsPerDayTo, 2) };
    case 'route': return { field: 'route', from: c.from, to: c.to };
  }
}

/**
 * A finding named in a proposal, its optional keys last (where the report has always written them). Each mix
 * of optional keys is one literal: a key added to a finished literal would go to a separate property store.
 */
function findingSummary(f: Finding): z.infer<typeof findingSummarySchema> {
  const { nutrient, screen } = f;
  if (nutrient === undefined && screen === undefined) return { code: f.code, severity: f.severity, message: f.message };
  if (screen === undefined) return { code: f.code, severity: f.severity, message: f.message, nutrient };
  if (nutrient === undefined) return { code: f.code, severity: f.severity, message: f.message, screen };
  return { code: f.code, severity: f.severity, message: f.message, nutrient, screen };
}

/** A suggestion rounded for the report, once, at this edge. */
export function suggestionReport(s: Suggestion): SuggestionReport {
  if (s.status === 'unavailable') return { kind: s.kind, status: 'unavailable', message: s.message, notes: s.notes };
  const before = snapshotReport(s.before);
  return {
    kind: s.kind, status: 'proposal', message: s.message,
    change: changeReport(s.change),
    before,
    after: sameFigures(s.before, s.after) ? { ...before, verdict: s.after.verdict } : snapshotReport(s.after),
    passesOsmolarity: s.passesOsmolarity,
    findingsAppear: s.appears.map(findingSummary),
    findingsDisappear: s.disappears.map(findingSummary),
    notes: s.notes,
    applied: false,
  };
}
