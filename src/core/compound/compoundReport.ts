import { z } from 'zod';
import { round, type D } from '../decimal.ts';
import { AGE_GROUPS } from '../order.ts';
import { MIX_GROUPS, PHOSPHATE_SALTS } from './compoundingPolicy.ts';
import { ION_KEYS, type IonKey, type IonTable, type IonsJson } from './ions.ts';
import type { CompoundResult } from './compoundOrder.ts';

const num = z.number().refine(Number.isFinite, 'must be a finite number');
const ionTable = z.object({ Na: num, K: num, Ca: num, Mg: num, phosphate: num, Cl: num, acetate: num });
const ionKey = z.enum(ION_KEYS);
const anions = z.union([
  z.enum(['chloride', 'acetate', 'balanced']),
  z.object({ acetate: num }), z.object({ chloride: num }), z.object({ chlorideToAcetate: num }),
]);
const ionsBlock = z.object({
  per: z.enum(['day', 'kg']), Na: num.optional(), K: num.optional(), Ca: num.optional(), Mg: num.optional(), phosphate: num.optional(),
  phosphateSalt: z.enum([...PHOSPHATE_SALTS, 'auto']), anions,
});

/**
 * What `osmocount compound --json` prints (exchange format "Ion order"): `order`, `lines`,
 * `ordered`, `delivered`, `problems`, plus optional detail — per-kg figures, the figures before
 * rounding, each line's rounding effect, the proposal and the mixing sequence.
 */
export const compoundReportSchema = z.object({
  format: z.literal('osmocount-compound'),
  version: z.literal(1),
  order: z.string(),
  patient: z.object({ id: z.string(), weightKg: num, ageGroup: z.enum(AGE_GROUPS) }),
  per: z.enum(['day', 'kg']),
  feasible: z.boolean(),
  lines: z.array(z.object({
    index: z.number().int(),
    product: z.string(),
    name: z.string(),
    amount: num,
    unit: z.enum(['mEq', 'mmol']),
    species: z.string(),
    volumeMl: num,
    exactVolumeMl: num,
    measuredAmount: num,
    belowMeasurable: z.boolean(),
  })),
  ordered: ionTable,
  /** Ions with no ordered amount (absent from the ion order; chloride and acetate under a preference); shown as 0 in `ordered`. */
  unordered: z.array(ionKey),
  delivered: ionTable,
  deliveredBeforeRounding: ionTable,
  otherLines: ionTable,
  orderedPerKg: ionTable.optional(),
  deliveredPerKg: ionTable.optional(),
  rounding: z.array(z.object({
    index: z.number().int(),
    product: z.string(),
    exactVolumeMl: num,
    volumeMl: num,
    doses: z.array(z.object({ ion: ionKey, unit: z.enum(['mEq', 'mmol']), exact: num, measured: num, change: num })),
  })),
  problems: z.array(z.object({
    code: z.string(),
    severity: z.enum(['block', 'warn']),
    ion: ionKey.nullable(),
    path: z.string(),
    message: z.string(),
    source: z.string(),
    proposal: z.object({ text: z.string(), change: ionsBlock.partial() }).optional(),
  })),
  proposal: ionsBlock.nullable(),
  sequence: z.array(z.object({
    step: z.number().int(),
    groups: z.array(z.enum(MIX_GROUPS)),
    lines: z.array(z.object({ index: z.number().int(), product: z.string(), name: z.string() })),
    mixAfter: z.boolean(),
    reason: z.string(),
    source: z.string(),
  })),
});
export type CompoundReport = z.infer<typeof compoundReportSchema>;

const AMOUNT_PLACES = 2;
const VOLUME_PLACES = 3;

function table(t: IonTable, places = AMOUNT_PLACES): Record<IonKey, number> {
  const out = {} as Record<IonKey, number>;
  for (const k of ION_KEYS) out[k] = round(t[k], places);
  return out;
}

function perKg(t: IonTable, w: D): IonTable {
  const out = { ...t };
  for (const k of ION_KEYS) out[k] = t[k].div(w);
  return out;
}

/** Round a compound result once, at this edge: amounts to 0.01, volumes to 0.001 mL (per kg to 0.001). */
export function toCompoundReport(r: CompoundResult): CompoundReport {
  const o = r.order;
  const w = o.patient.weightKg;
  const per = r.targets?.per ?? o.ions?.per ?? 'day';
  const report: CompoundReport = {
    format: 'osmocount-compound',
    version: 1,
    order: o.id,
    patient: { id: o.patient.id, weightKg: round(w, 3), ageGroup: o.patient.ageGroup },
    per,
    feasible: r.feasible,
    lines: r.lines.map((l) => ({
      index: l.index, product: l.product.id, name: l.product.name,
      amount: round(l.amount, AMOUNT_PLACES), unit: l.unit, species: l.species,
      volumeMl: round(l.volumeMl, VOLUME_PLACES), exactVolumeMl: round(l.exactVolumeMl, VOLUME_PLACES),
      measuredAmount: round(l.measuredAmount, AMOUNT_PLACES), belowMeasurable: l.belowMeasurable,
    })),
    ordered: table(r.ordered),
    unordered: r.unordered,
    delivered: table(r.delivered),
    deliveredBeforeRounding: table(r.deliveredExact),
    otherLines: table(r.otherLines),
    rounding: r.lines.map((l) => ({
      index: l.index, product: l.product.id,
      exactVolumeMl: round(l.exactVolumeMl, VOLUME_PLACES), volumeMl: round(l.volumeMl, VOLUME_PLACES),
      doses: ION_KEYS.filter((k) => l.ionsExact[k].gt(0)).map((k) => ({
        ion: k, unit: k === 'phosphate' ? 'mmol' as const : 'mEq' as const,
        exact: round(l.ionsExact[k], AMOUNT_PLACES), measured: round(l.ionsMeasured[k], AMOUNT_PLACES),
        change: round(l.ionsMeasured[k].minus(l.ionsExact[k]), AMOUNT_PLACES),
      })),
    })),
    problems: r.problems.map((p) => {
      const out: CompoundReport['problems'][number] = { code: p.code, severity: p.severity, ion: p.ion, path: p.path, message: p.message, source: p.source };
      if (p.proposal) out.proposal = { text: p.proposal.text, change: p.proposal.change };
      return out;
    }),
    proposal: r.proposal satisfies IonsJson | null,
    sequence: r.sequence,
  };
  if (per === 'kg') {
    report.orderedPerKg = table(perKg(r.ordered, w), 3);
    report.deliveredPerKg = table(perKg(r.delivered, w), 3);
  }
  return report;
}
