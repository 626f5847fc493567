import { z } from 'zod';
import { round } from './decimal.ts';
import { SPECIES, SPECIES_IDS, isCharged, speciesRecord, type SpeciesId } from './species.ts';
import { lineShare, perKgOf, perLitreOf, mmHgPerMOsmPerL, type Bag, type BagLine } from './compute/bag.ts';
import { ruleFor, SEVERITIES, type Policy } from './policy.ts';
import type { Catalog } from './catalog.ts';
import type { Finding, Verdict } from './findings.ts';
import { AGE_GROUPS, ROUTES, type BaseUnit } from './order.ts';
import { as, mmolToMEq } from './units.ts';
import { predictedOsmolalityField, predictedOsmolalityReportSchema } from './compute/osmolality.ts';
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

/** Every species' totals, each rounded once; a species the bag does not hold is 0 throughout. */
function speciesTotals(bag: Bag): SpeciesTotals {
  const n = SPECIES_IDS.length;
  const perL = new Array<number>(n).fill(0);
  const mEqPerL = new Array<number>(n).fill(0);
  const perDay = new Array<number>(n).fill(0);
  const perKg = new Array<number>(n).fill(0);
  for (let k = 0; k < n; k++) {
    const s = SPECIES_IDS[k]!;
    const mmol = bag.speciesMmol[s];
    if (mmol.isZero()) continue;
    const litre = perLitreOf(bag, mmol);
    perL[k] = round(litre, 2);
    // A monovalent ion's mEq is its mmol (× 1 changes no digit).
    mEqPerL[k] = !isCharged(s) ? 0 : Math.abs(SPECIES[s].charge ?? 0) === 1 ? perL[k]! : round(mmolToMEq(s, as(litre, 'mmol')), 2);
    perDay[k] = round(mmol, 2);
    perKg[k] = round(perKgOf(bag, mmol), 3);
  }
  return { mmolPerL: speciesRecord(perL), mEqPerL: speciesRecord(mEqPerL), mmolPerDay: speciesRecord(perDay), mmolPerKgPerDay: speciesRecord(perKg) };
}

// "mEq" → "mEq/kg": the per-kg unit of each base unit, written once.
const PER_KG_UNIT: Readonly<Record<BaseUnit, string>> = { mL: 'mL/kg', g: 'g/kg', mEq: 'mEq/kg', mmol: 'mmol/kg' };

/** One line of the report; a figure shared by two fields is rounded once. */
function reportLine(bag: Bag, l: BagLine): Report['lines'][number] {
  const line = l.line;
  const w = bag.order.patient.weightKg;
  const amount = line.kind === 'amount' ? round(line.amount, 4) : null;
  const particleMOsm = round(l.particleMOsm, 2);
  // A stock without a label value counts its particles in the label sum: the same decimal.
  const labelMOsm = l.labelMOsm === l.particleMOsm ? particleMOsm : round(l.labelMOsm, 2);
  // A line not ordered per kg delivers its amount per day as written: the same decimal.
  const perDay = l.perDay
    ? { amount: amount !== null && line.kind === 'amount' && l.perDay.amount === line.amount ? amount : round(l.perDay.amount, 4), unit: l.perDay.unit }
    : null;
  return {
    index: line.index,
    product: l.product.id,
    name: l.product.name,
    role: l.product.role,
    strength: l.product.strength,
    fill: line.kind === 'fill',
    amount,
    unit: line.kind === 'amount' ? line.unit : null,
    species: line.kind === 'amount' ? line.species : null,
    perDay,
    perKgPerDay: l.perDay ? { amount: round(l.perDay.amount.div(w), 4), unit: PER_KG_UNIT[l.perDay.unit] } : null,
    volumeMl: round(l.volumeMl, 2),
    mOsm: bag.osmolarity.method === 'particle' ? particleMOsm : labelMOsm,
    particleMOsm,
    labelMOsm,
    sharePercent: round(lineShare(bag, l).times(100), 1),
    kcal: round(l.kcal, 1),
  };
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
  const information: Report['information'] = {
    osmoticPressureMmHg: round(bag.osmoticPressureMmHg, 0),
    mmHgPerMOsmPerL: round(mmHgPerMOsmPerL(temp), 2),
    temperatureC: round(temp, 1),
    plasmaOsmolality: { min: round(plasma.min, 0), max: round(plasma.max, 0), unit: plasma.unit, source: plasma.source },
    timesPlasma: { low: round(reported.div(plasma.max), 2), high: round(reported.div(plasma.min), 2) },
  };
  const predicted = predictedOsmolalityField(bag).predictedOsmolality;
  if (predicted) information.predictedOsmolality = predicted;
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
    lines: bag.lines.map((l) => reportLine(bag, l)),
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
      gramsPerKg: { dextrose: round(perKgOf(bag, bag.grams.dextrose), 3), aminoAcids: round(perKgOf(bag, bag.grams.aminoAcids), 3), lipid: round(perKgOf(bag, bag.grams.lipid), 3) },
      kcal: {
        dextrose: round(bag.kcal.dextrose, 1), aminoAcids: round(bag.kcal.aminoAcids, 1), lipid: round(bag.kcal.lipid, 1),
        other: round(bag.kcal.other, 1), total: round(bag.kcal.total, 1), nonProtein: round(bag.kcal.nonProtein, 1),
      },
      kcalPerKg: round(perKgOf(bag, bag.kcal.total), 1),
      nitrogenG: round(bag.nitrogenG, 2),
      npcToN: bag.npcToN ? round(bag.npcToN, 0) : null,
      girMgPerKgPerMin: round(bag.girMgPerKgPerMin, 2),
      fluidMlPerKg: round(perKgOf(bag, V), 1),
      aluminumMcgPerKgPerDay: round(bag.aluminumMcgPerKgPerDay, 2),
    },
    information,
    findings: findings.map((f) => {
      const out: Report['findings'][number] = {
        code: f.code, severity: f.severity,
        value: f.value ? round(f.value, f.decimals) : null,
        limit: f.limit ? round(f.limit, f.decimals) : null,
        unit: f.unit, message: f.message, source: f.source, lines: f.lines, fields: f.fields,
      };
      if (f.nutrient !== undefined) out.nutrient = f.nutrient;
      if (f.screen !== undefined) out.screen = f.screen;
      return out;
    }),
    verdict,
  };
}

/** Display label of a species for tables. */
export function speciesLabel(s: SpeciesId): string {
  return SPECIES[s].label;
}
