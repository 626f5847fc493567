import { z } from 'zod';
import { isUnroundedProduct, round, roundDivided, type D } from './decimal.ts';
import { SPECIES, SPECIES_IDS, isCharged, speciesRecord, speciesRow, type SpeciesId } from './species.ts';
import { perLitreOf, mmHgPerMOsmPerL, type Bag, type BagLine } from './compute/bag.ts';
import { ruleFor, SEVERITIES, type Policy } from './policy.ts';
import type { Catalog } from './catalog.ts';
import type { Finding, Verdict } from './findings.ts';
import { AGE_GROUPS, ROUTES, type AgeGroup, type BaseUnit } from './order.ts';
import { as, mmolToMEq } from './units.ts';
import { predictedOsmolalityReport, predictedOsmolalityReportSchema } from './compute/osmolality.ts';
import { assertNever } from './problems.ts';
import { suggestionReport, suggestionReportSchema } from './solve/report.ts';
import type { Suggestion } from './solve/suggestion.ts';

const num = z.number().refine(Number.isFinite, 'must be a finite number');
const speciesNumbers = z.record(z.enum(SPECIES_IDS), num);
const amountUnit = z.object({ amount: num, unit: z.string() });

/** The report v1 (what the engine returns; `osmocount check --json` prints it). */
export const reportSchema = z.object({
  format: z.literal('osmocount-report'),
  version: z.literal(1),
  order: z.string(),
  patient: z.object({ id: z.string(), name: z.string().nullable(), location: z.string().nullable(), weightKg: num, ageGroup: z.enum(AGE_GROUPS) }),
  route: z.enum(ROUTES),
  catalog: z.string(),
  policy: z.string(),
  volumeMl: num,
  hours: num,
  rateMlPerHour: num,
  lines: z.array(z.object({
    index: z.number().int(),
    product: z.string(),
    name: z.string(),
    role: z.string(),
    strength: z.string().nullable(),
    fill: z.boolean(),
    amount: num.nullable(),
    unit: z.string().nullable(),
    species: z.string().nullable(),
    perDay: amountUnit.nullable(),
    perKgPerDay: amountUnit.nullable(),
    volumeMl: num,
    mOsm: num,
    particleMOsm: num,
    labelMOsm: num,
    sharePercent: num,
    kcal: num,
  })),
  osmolarity: z.object({
    particle: num, labelSum: num, reported: num,
    method: z.enum(['particle', 'labelSum']),
    spread: num,
    /** mOsm in the whole bag under the reported method. */
    totalMOsm: num,
    peripheralLimit: num.nullable(),
  }),
  totals: z.object({
    mmolPerL: speciesNumbers,
    mEqPerL: speciesNumbers,
    mmolPerDay: speciesNumbers,
    mmolPerKgPerDay: speciesNumbers,
    dextrosePercent: num, aminoAcidPercent: num, lipidPercent: num,
    grams: z.object({ dextrose: num, aminoAcids: num, lipid: num }),
    gramsPerKg: z.object({ dextrose: num, aminoAcids: num, lipid: num }),
    kcal: z.object({ dextrose: num, aminoAcids: num, lipid: num, other: num, total: num, nonProtein: num }),
    kcalPerKg: num,
    nitrogenG: num,
    npcToN: num.nullable(),
    girMgPerKgPerMin: num,
    fluidMlPerKg: num,
    aluminumMcgPerKgPerDay: num,
  }),
  information: z.object({
    osmoticPressureMmHg: num,
    mmHgPerMOsmPerL: num,
    temperatureC: num,
    plasmaOsmolality: z.object({ min: num, max: num, unit: z.string(), source: z.string() }),
    timesPlasma: z.object({ low: num, high: num }),
    predictedOsmolality: predictedOsmolalityReportSchema.optional(),
  }),
  findings: z.array(z.object({
    code: z.string(),
    severity: z.enum(SEVERITIES),
    value: num.nullable(),
    limit: num.nullable(),
    unit: z.string().nullable(),
    message: z.string(),
    source: z.string(),
    nutrient: z.string().optional(),
    screen: z.string().optional(),
    lines: z.array(z.number().int()),
    fields: z.array(z.string()),
  })),
  verdict: z.enum(['pass', 'warn', 'block']),
  suggestions: z.array(suggestionReportSchema).optional(),
});
export type Report = z.infer<typeof reportSchema>;

type SpeciesTotals = Pick<Report['totals'], 'mmolPerL' | 'mEqPerL' | 'mmolPerDay' | 'mmolPerKgPerDay'>;

// How each species' mEq/L is written, by index in SPECIES_IDS: 0 when it has no charge, 1 when it is
// monovalent (its mEq is its mmol: × 1 changes no digit), 2 when its mmol/L is multiplied by its valence.
const MEQ_RULE: readonly number[] = SPECIES_IDS.map((s) => (!isCharged(s) ? 0 : Math.abs(SPECIES[s].charge ?? 0) === 1 ? 1 : 2));

// Scratch rows for speciesTotals, reused by every call: speciesRecord copies their values out.
const perLRow: number[] = SPECIES_IDS.map(() => 0);
const mEqPerLRow: number[] = SPECIES_IDS.map(() => 0);
const perDayRow: number[] = SPECIES_IDS.map(() => 0);
const perKgRow: number[] = SPECIES_IDS.map(() => 0);

/** Every species' totals, each rounded once; a species the bag does not hold is 0 throughout. */
function speciesTotals(bag: Bag): SpeciesTotals {
  const n = SPECIES_IDS.length;
  const V = bag.finalVolumeMl;
  const w = bag.order.patient.weightKg;
  const mmolRow = speciesRow(bag.speciesMmol);
  for (let k = 0; k < n; k++) {
    const mmol = mmolRow[k]!;
    if (mmol.isZero()) {
      perLRow[k] = 0;
      mEqPerLRow[k] = 0;
      perDayRow[k] = 0;
      perKgRow[k] = 0;
      continue;
    }
    if (MEQ_RULE[k] === 2) {
      const litre = perLitreOf(bag, mmol);
      perLRow[k] = round(litre, 2);
      mEqPerLRow[k] = round(mmolToMEq(SPECIES_IDS[k]!, as(litre, 'mmol')), 2);
    } else {
      // mmol ÷ V × 1000, as perLitreOf makes it, rounded without the decimal when a float settles it.
      const perL = V.isZero() ? 0 : roundDivided(mmol, V, 3, 2);
      perLRow[k] = perL;
      mEqPerLRow[k] = MEQ_RULE[k] === 1 ? perL : 0;
    }
    perDayRow[k] = round(mmol, 2);
    perKgRow[k] = roundDivided(mmol, w, 0, 3);
  }
  return { mmolPerL: speciesRecord(perLRow), mEqPerL: speciesRecord(mEqPerLRow), mmolPerDay: speciesRecord(perDayRow), mmolPerKgPerDay: speciesRecord(perKgRow) };
}

/** The per-kg unit of a base unit ("mEq" → "mEq/kg"), each written once. */
function perKgUnit(unit: BaseUnit): string {
  switch (unit) {
    case 'mL': return 'mL/kg';
    case 'g': return 'g/kg';
    case 'mEq': return 'mEq/kg';
    case 'mmol': return 'mmol/kg';
    default: return assertNever(unit);
  }
}

/**
 * A per-kg line's amount per kg per day, rounded to 4 places, when it is the ordered amount itself: the
 * per-day amount is the ordered amount × weight, and when that product is exact (its coefficients'
 * product below 10¹⁵), ÷ weight gives the ordered amount back, digit for digit. Null otherwise.
 */
function orderedPerKg(ordered: D, orderedRounded: number, perDay: D, w: D): number | null {
  return isUnroundedProduct(perDay, ordered, w) ? orderedRounded : null;
}

/** Whether two decimals hold the same coefficient and exponent (the same value, without a comparison). */
function sameDigits(a: D, b: D): boolean {
  return a === b || (a.x === null && b.x === null && a.c === b.c && a.e === b.e);
}

/**
 * One line of the report; a figure shared by two fields is rounded once. `particle`: the bag reports the
 * particle osmolarity; `total`: the bag's mOsm under its method (a line's share is its part of it), null
 * when that is zero.
 */
function reportLine(l: BagLine, particle: boolean, total: D | null, w: D): Report['lines'][number] {
  const line = l.line;
  const isAmount = line.kind === 'amount';
  const amount = isAmount ? round(line.amount, 4) : null;
  const particleMOsm = round(l.particleMOsm, 2);
  // A stock whose label value is its particles' (or that has none) gives the same digits twice.
  const labelMOsm = sameDigits(l.labelMOsm, l.particleMOsm) ? particleMOsm : round(l.labelMOsm, 2);
  let perDay: Report['lines'][number]['perDay'] = null;
  let perKgPerDay: Report['lines'][number]['perKgPerDay'] = null;
  if (l.perDay) {
    const perDayAmount = l.perDay.amount;
    // A line not ordered per kg delivers its amount per day as written: the same decimal.
    const ordered = amount !== null && isAmount && perDayAmount === line.amount;
    perDay = { amount: ordered ? amount : round(perDayAmount, 4), unit: l.perDay.unit };
    const perKg = amount !== null && isAmount && !ordered ? orderedPerKg(line.amount, amount, perDayAmount, w) : null;
    perKgPerDay = { amount: perKg ?? roundDivided(perDayAmount, w, 0, 4), unit: perKgUnit(l.perDay.unit) };
  }
  return {
    index: line.index,
    product: l.product.id,
    name: l.product.name,
    role: l.product.role,
    strength: l.product.strength,
    fill: !isAmount,
    amount,
    unit: isAmount ? line.unit : null,
    species: isAmount ? line.species : null,
    perDay,
    perKgPerDay,
    volumeMl: round(l.volumeMl, 2),
    mOsm: particle ? particleMOsm : labelMOsm,
    particleMOsm,
    labelMOsm,
    sharePercent: total === null ? 0 : roundDivided(particle ? l.particleMOsm : l.labelMOsm, total, 2, 1),
    kcal: round(l.kcal, 1),
  };
}

/** Every line of the report, in the bag's order. */
function reportLines(bag: Bag): Report['lines'] {
  const particle = bag.osmolarity.method === 'particle';
  const total = particle ? bag.totalMOsm.particle : bag.totalMOsm.labelSum;
  const share = total.isZero() ? null : total;
  const w = bag.order.patient.weightKg;
  return bag.lines.map((l) => reportLine(l, particle, share, w));
}

/**
 * One finding of the report: its decimals rounded, its optional keys last (where the report has always
 * written them). Each mix of optional keys is one literal: a key added to a finished literal would go to a
 * separate property store.
 */
function reportFinding(f: Finding): Report['findings'][number] {
  const value = f.value ? round(f.value, f.decimals) : null;
  const limit = f.limit ? round(f.limit, f.decimals) : null;
  const { nutrient, screen } = f;
  if (nutrient === undefined && screen === undefined) {
    return { code: f.code, severity: f.severity, value, limit, unit: f.unit, message: f.message, source: f.source, lines: f.lines, fields: f.fields };
  }
  if (screen === undefined) {
    return { code: f.code, severity: f.severity, value, limit, unit: f.unit, message: f.message, source: f.source, lines: f.lines, fields: f.fields, nutrient };
  }
  if (nutrient === undefined) {
    return { code: f.code, severity: f.severity, value, limit, unit: f.unit, message: f.message, source: f.source, lines: f.lines, fields: f.fields, screen };
  }
  return { code: f.code, severity: f.severity, value, limit, unit: f.unit, message: f.message, source: f.source, lines: f.lines, fields: f.fields, nutrient, screen };
}

/** A policy's figures that every report under it shows, each rounded once. */
interface PolicyFigures {
  plasmaMin: number;
  plasmaMax: number;
  temperatureC: number;
  mmHgPerMOsmPerL: number;
  /** The peripheral osmolarity limit by age group, rounded; null where the policy has none. */
  peripheralLimit: Readonly<Record<AgeGroup, number | null>>;
}

// Policies are immutable once parsed, so their rounded figures are kept for as long as the policy lives.
const policyFigures = new WeakMap<Policy, PolicyFigures>();

function figuresOf(policy: Policy): PolicyFigures {
  const kept = policyFigures.get(policy);
  if (kept !== undefined) return kept;
  const plasma = policy.reference.plasmaOsmolality;
  const temp = policy.reference.osmoticPressureTemperatureC.value;
  const limit = (age: AgeGroup): number | null => {
    const max = ruleFor(policy, 'osmolarity-peripheral', age)?.max ?? null;
    return max ? round(max, 1) : null;
  };
  const f: PolicyFigures = {
    plasmaMin: round(plasma.min, 0),
    plasmaMax: round(plasma.max, 0),
    temperatureC: round(temp, 1),
    mmHgPerMOsmPerL: round(mmHgPerMOsmPerL(temp), 2),
    peripheralLimit: { adult: limit('adult'), child: limit('child'), 'term-neonate': limit('term-neonate'), 'preterm-neonate': limit('preterm-neonate') },
  };
  policyFigures.set(policy, f);
  return f;
}

/**
 * Round the bag, its findings and its suggestions (if any: `suggestions` is left out of a report without
 * them) into the report, once, at this edge.
 */
export function toReport(bag: Bag, findings: readonly Finding[], verdict: Verdict, catalog: Catalog, policy: Policy, suggestions: readonly Suggestion[] = []): Report {
  const o = bag.order;
  const w = o.patient.weightKg;
  const V = bag.finalVolumeMl;
  const figures = figuresOf(policy);
  const plasma = policy.reference.plasmaOsmolality;
  const reported = bag.osmolarity.reported;
  const species = speciesTotals(bag);
  const osmoticPressureMmHg = round(bag.osmoticPressureMmHg, 0);
  const plasmaOsmolality = { min: figures.plasmaMin, max: figures.plasmaMax, unit: plasma.unit, source: plasma.source };
  const timesPlasma = { low: roundDivided(reported, plasma.max, 0, 2), high: roundDivided(reported, plasma.min, 0, 2) };
  const predictedOsmolality = predictedOsmolalityReport(bag);
  const mmHg = figures.mmHgPerMOsmPerL;
  const temperatureC = figures.temperatureC;
  // One literal with or without the prediction (a key added to a finished literal goes to a separate store).
  const information: Report['information'] = predictedOsmolality
    ? { osmoticPressureMmHg, mmHgPerMOsmPerL: mmHg, temperatureC, plasmaOsmolality, timesPlasma, predictedOsmolality }
    : { osmoticPressureMmHg, mmHgPerMOsmPerL: mmHg, temperatureC, plasmaOsmolality, timesPlasma };
  const patient = { id: o.patient.id, name: o.patient.name, location: o.patient.location, weightKg: round(w, 3), ageGroup: o.patient.ageGroup };
  const volumeMl = round(V, 2);
  const hours = round(bag.hours, 2);
  const rateMlPerHour = round(bag.rateMlPerHour, 2);
  const lines = reportLines(bag);
  const osmolarity = {
    particle: round(bag.osmolarity.particle, 1),
    labelSum: round(bag.osmolarity.labelSum, 1),
    reported: round(reported, 1),
    method: bag.osmolarity.method,
    spread: round(bag.osmolarity.labelSum.minus(bag.osmolarity.particle), 1),
    totalMOsm: round(bag.osmolarity.method === 'particle' ? bag.totalMOsm.particle : bag.totalMOsm.labelSum, 1),
    peripheralLimit: figures.peripheralLimit[o.patient.ageGroup],
  };
  const totals = {
    mmolPerL: species.mmolPerL,
    mEqPerL: species.mEqPerL,
    mmolPerDay: species.mmolPerDay,
    mmolPerKgPerDay: species.mmolPerKgPerDay,
    dextrosePercent: round(bag.percent.dextrose, 2),
    aminoAcidPercent: round(bag.percent.aminoAcids, 2),
    lipidPercent: round(bag.percent.lipid, 2),
    grams: { dextrose: round(bag.grams.dextrose, 2), aminoAcids: round(bag.grams.aminoAcids, 2), lipid: round(bag.grams.lipid, 2) },
    gramsPerKg: { dextrose: roundDivided(bag.grams.dextrose, w, 0, 3), aminoAcids: roundDivided(bag.grams.aminoAcids, w, 0, 3), lipid: roundDivided(bag.grams.lipid, w, 0, 3) },
    kcal: {
      dextrose: round(bag.kcal.dextrose, 1), aminoAcids: round(bag.kcal.aminoAcids, 1), lipid: round(bag.kcal.lipid, 1),
      other: round(bag.kcal.other, 1), total: round(bag.kcal.total, 1), nonProtein: round(bag.kcal.nonProtein, 1),
    },
    kcalPerKg: roundDivided(bag.kcal.total, w, 0, 1),
    nitrogenG: round(bag.nitrogenG, 2),
    npcToN: bag.npcToN ? round(bag.npcToN, 0) : null,
    girMgPerKgPerMin: round(bag.girMgPerKgPerMin, 2),
    fluidMlPerKg: roundDivided(V, w, 0, 1),
    aluminumMcgPerKgPerDay: round(bag.aluminumMcgPerKgPerDay, 2),
  };
  const reportedFindings = findings.map(reportFinding);
  // One literal with or without suggestions, which come last (where the report has always written them).
  return suggestions.length === 0
    ? {
      format: 'osmocount-report', version: 1, order: o.id, patient, route: o.route, catalog: catalog.id, policy: policy.id,
      volumeMl, hours, rateMlPerHour, lines, osmolarity, totals, information, findings: reportedFindings, verdict,
    }
    : {
      format: 'osmocount-report', version: 1, order: o.id, patient, route: o.route, catalog: catalog.id, policy: policy.id,
      volumeMl, hours, rateMlPerHour, lines, osmolarity, totals, information, findings: reportedFindings, verdict,
      suggestions: suggestions.map(suggestionReport),
    };
}

/** Display label of a species for tables. */
export function speciesLabel(s: SpeciesId): string {
  return SPECIES[s].label;
}
