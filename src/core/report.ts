import { z } from 'zod';
import { isUnroundedProduct, round, roundDivided, type D } from './decimal.ts';
import { SPECIES, SPECIES_IDS, isCharged, speciesRecord, type SpeciesId } from './species.ts';
import { perLitreOf, mmHgPerMOsmPerL, type Bag, type BagLine } from './compute/bag.ts';
import { ruleFor, SEVERITIES, type Policy } from './policy.ts';
import type { Catalog } from './catalog.ts';
import type { Finding, Verdict } from './findings.ts';
import { AGE_GROUPS, ROUTES, type BaseUnit } from './order.ts';
import { as, mmolToMEq } from './units.ts';
import { predictedOsmolalityReport, predictedOsmolalityReportSchema } from './compute/osmolality.ts';
import { suggestionReportSchema } from './solve/report.ts';

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
  for (let k = 0; k < n; k++) {
    const s = SPECIES_IDS[k]!;
    const mmol = bag.speciesMmol[s];
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
      mEqPerLRow[k] = round(mmolToMEq(s, as(litre, 'mmol')), 2);
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

// "mEq" → "mEq/kg": the per-kg unit of each base unit, written once.
const PER_KG_UNIT: Readonly<Record<BaseUnit, string>> = { mL: 'mL/kg', g: 'g/kg', mEq: 'mEq/kg', mmol: 'mmol/kg' };

/**
 * A per-kg line's amount per kg per day, rounded to 4 places, when it is the ordered amount itself: the
 * per-day amount is the ordered amount × weight, and when that product is exact (its coefficients'
 * product below 10¹⁵), ÷ weight gives the ordered amount back, digit for digit. Null otherwise.
 */
function orderedPerKg(ordered: D, orderedRounded: number, perDay: D, w: D): number | null {
  return isUnroundedProduct(perDay, ordered, w) ? orderedRounded : null;
}

/**
 * One line of the report; a figure shared by two fields is rounded once. `particle`: the bag reports the
 * particle osmolarity; `total`: the bag's mOsm under its method (a line's share is its part of it).
 */
function reportLine(l: BagLine, particle: boolean, total: D, w: D): Report['lines'][number] {
  const line = l.line;
  const isAmount = line.kind === 'amount';
  const amount = isAmount ? round(line.amount, 4) : null;
  const particleMOsm = round(l.particleMOsm, 2);
  // A stock without a label value counts its particles in the label sum: the same decimal.
  const labelMOsm = l.labelMOsm === l.particleMOsm ? particleMOsm : round(l.labelMOsm, 2);
  let perDay: Report['lines'][number]['perDay'] = null;
  let perKgPerDay: Report['lines'][number]['perKgPerDay'] = null;
  if (l.perDay) {
    const perDayAmount = l.perDay.amount;
    // A line not ordered per kg delivers its amount per day as written: the same decimal.
    const ordered = amount !== null && isAmount && perDayAmount === line.amount;
    perDay = { amount: ordered ? amount : round(perDayAmount, 4), unit: l.perDay.unit };
    const perKg = amount !== null && isAmount && !ordered ? orderedPerKg(line.amount, amount, perDayAmount, w) : null;
    perKgPerDay = { amount: perKg ?? roundDivided(perDayAmount, w, 0, 4), unit: PER_KG_UNIT[l.perDay.unit] };
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
    sharePercent: total.isZero() ? 0 : roundDivided(particle ? l.particleMOsm : l.labelMOsm, total, 2, 1),
    kcal: round(l.kcal, 1),
  };
}

/** Every line of the report, in the bag's order. */
function reportLines(bag: Bag): Report['lines'] {
  const particle = bag.osmolarity.method === 'particle';
  const total = particle ? bag.totalMOsm.particle : bag.totalMOsm.labelSum;
  const w = bag.order.patient.weightKg;
  const lines = bag.lines;
  const out: Report['lines'] = [];
  for (let i = 0; i < lines.length; i++) out.push(reportLine(lines[i]!, particle, total, w));
  return out;
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

/** Round the bag and its findings into the report, once, at this edge. */
export function toReport(bag: Bag, findings: Finding[], verdict: Verdict, catalog: Catalog, policy: Policy): Report {
  const o = bag.order;
  const w = o.patient.weightKg;
  const V = bag.finalVolumeMl;
  const limit = ruleFor(policy, 'osmolarity-peripheral', o.patient.ageGroup)?.max ?? null;
  const plasma = policy.reference.plasmaOsmolality;
  const temp = policy.reference.osmoticPressureTemperatureC.value;
  const reported = bag.osmolarity.reported;
  const species = speciesTotals(bag);
  const osmoticPressureMmHg = round(bag.osmoticPressureMmHg, 0);
  const mmHg = round(mmHgPerMOsmPerL(temp), 2);
  const temperatureC = round(temp, 1);
  const plasmaOsmolality = { min: round(plasma.min, 0), max: round(plasma.max, 0), unit: plasma.unit, source: plasma.source };
  const timesPlasma = { low: roundDivided(reported, plasma.max, 0, 2), high: roundDivided(reported, plasma.min, 0, 2) };
  const predictedOsmolality = predictedOsmolalityReport(bag);
  // One literal with or without the prediction (a key added to a finished literal goes to a separate store).
  const information: Report['information'] = predictedOsmolality
    ? { osmoticPressureMmHg, mmHgPerMOsmPerL: mmHg, temperatureC, plasmaOsmolality, timesPlasma, predictedOsmolality }
    : { osmoticPressureMmHg, mmHgPerMOsmPerL: mmHg, temperatureC, plasmaOsmolality, timesPlasma };
  return {
    format: 'osmocount-report',
    version: 1,
    order: o.id,
    patient: { id: o.patient.id, name: o.patient.name, location: o.patient.location, weightKg: round(w, 3), ageGroup: o.patient.ageGroup },
    route: o.route,
    catalog: catalog.id,
    policy: policy.id,
    volumeMl: round(V, 2),
    hours: round(bag.hours, 2),
    rateMlPerHour: round(bag.rateMlPerHour, 2),
    lines: reportLines(bag),
    osmolarity: {
      particle: round(bag.osmolarity.particle, 1),
      labelSum: round(bag.osmolarity.labelSum, 1),
      reported: round(reported, 1),
      method: bag.osmolarity.method,
      spread: round(bag.osmolarity.labelSum.minus(bag.osmolarity.particle), 1),
      totalMOsm: round(bag.osmolarity.method === 'particle' ? bag.totalMOsm.particle : bag.totalMOsm.labelSum, 1),
      peripheralLimit: limit ? round(limit, 1) : null,
    },
    totals: {
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
    },
    information,
    findings: findings.map(reportFinding),
    verdict,
  };
}

/** Display label of a species for tables. */
export function speciesLabel(s: SpeciesId): string {
  return SPECIES[s].label;
}
