import { D, ZERO, THOUSAND } from '../decimal.ts';
import { SPECIES_IDS, speciesRecord, type SpeciesId } from '../species.ts';
import type { Order, OrderLine, BaseUnit, Route } from '../order.ts';
import type { Policy } from '../policy.ts';
import type { Product } from '../catalog.ts';
import { lineVolumeMl, perDayAmount } from './volumes.ts';
import { stockFigures, type StockFigures } from './stock.ts';

/** One line of the computed bag: how much stock goes in and what it brings. */
export interface BagLine {
  line: OrderLine;
  product: Product;
  /** The stock's per-mL figures and the species it holds. */
  stock: StockFigures;
  volumeMl: D;
  /** True when the line puts volume in the bag (above zero): the lines a finding names are among these. */
  inBag: boolean;
  /** The ordered amount per day in the line's base unit (null for the fill line). */
  perDay: { amount: D; unit: BaseUnit } | null;
  /** Ideal particles this line adds, mOsm (volume × the stock's particles per mL). */
  particleMOsm: D;
  /** Labelled osmolarity × volume, mOsm; the particle value when the stock has no label value. */
  labelMOsm: D;
  /** True when the stock has no labelled osmolarity (and is not water). */
  labelMissing: boolean;
  kcal: D;
  aluminumMcg: D;
}

export interface Osmolarity {
  particle: D;
  labelSum: D;
  reported: D;
  method: 'particle' | 'labelSum';
}

export type EnergySource = 'dextrose' | 'aminoAcids' | 'lipid' | 'other';

/** The bag as the engine computes it, at full precision. */
export interface Bag {
  order: Order;
  lines: BagLine[];
  /** Volume the bag really holds, mL (the ordered volume, or the sum of lines when they overflow or no line fills). */
  finalVolumeMl: D;
  /** Sum of the non-fill lines, mL. */
  addedVolumeMl: D;
  hours: D;
  rateMlPerHour: D;
  /** mmol per bag of every species. */
  speciesMmol: Record<SpeciesId, D>;
  grams: { dextrose: D; aminoAcids: D; lipid: D };
  percent: { dextrose: D; aminoAcids: D; lipid: D };
  kcal: Record<EnergySource, D> & { total: D; nonProtein: D };
  nitrogenG: D;
  /** Non-protein kcal per g nitrogen; null without amino acids. */
  npcToN: D | null;
  /** Glucose infusion rate, mg/kg/min over the infusion hours. */
  girMgPerKgPerMin: D;
  osmolarity: Osmolarity;
  /** mOsm in the whole bag by each method. */
  totalMOsm: { particle: D; labelSum: D };
  /** Ideal osmotic pressure at the policy's temperature, mmHg (van 't Hoff). */
  osmoticPressureMmHg: D;
  /** µg of aluminum in the whole bag (Σ each stock's labelled maximum × its volume). */
  aluminumMcg: D;
  aluminumMcgPerKgPerDay: D;
  /**
   * Figures of this bag divided once and kept (see perKgOf, perLitreOf), with the weight and volume they
   * were divided by: a copy of the bag on another route shares them, a copy with another weight does not.
   */
  readonly derived: { readonly weightKg: D; readonly finalVolumeMl: D; readonly perKg: Memo; readonly perLitre: Memo };
}

// Gas constant in L·mmHg/(mol·K): 8.314462618 J/(mol·K) ÷ 133.322387415 Pa/mmHg × 1000 L/m³ (CODATA 2018; exact SI definitions).
const R_L_MMHG = new D('8.314462618').div('133.322387415').times(1000);
const KELVIN = new D('273.15');

// The factor for each temperature decimal a policy holds, worked out once (decimals are immutable).
const mmHgFactors = new WeakMap<D, D>();

/** mmHg per mOsm/L at a temperature (°C), ideal solution: π = c·R·T. At 37 °C ≈ 19.34. */
export function mmHgPerMOsmPerL(temperatureC: D): D {
  let factor = mmHgFactors.get(temperatureC);
  if (!factor) {
    factor = R_L_MMHG.times(temperatureC.plus(KELVIN)).div(1000);
    mmHgFactors.set(temperatureC, factor);
  }
  return factor;
}

/** x per litre of the bag (x ÷ V × 1000); zero for an empty bag. */
export function perLitre(x: D, volumeMl: D): D {
  return volumeMl.isZero() ? ZERO : x.div(volumeMl).times(THOUSAND);
}

/** Zero of every species, in SPECIES_IDS order: the start of a bag's running totals (copied, never written). */
const NO_SPECIES: readonly D[] = SPECIES_IDS.map(() => ZERO);

/** The larger of two decimals (the first when they are equal), without D.max's argument list. */
function larger(a: D, b: D): D {
  return a.cmp(b) < 0 ? b : a;
}

function percentOf(grams: D, volumeMl: D): D {
  return volumeMl.isZero() ? ZERO : grams.div(volumeMl).times(100);
}

function makeLine(line: OrderLine, volumeMl: D, perDay: BagLine['perDay']): BagLine {
  const product = line.product;
  const particleMOsm = product.particlePerMl.times(volumeMl);
  const labelMissing = product.mOsmPerMl === null && product.role !== 'water';
  const stock = stockFigures(product);
  return {
    line, product, stock, volumeMl, inBag: volumeMl.gt(ZERO), perDay, particleMOsm,
    labelMOsm: product.mOsmPerMl ? product.mOsmPerMl.times(volumeMl) : particleMOsm,
    labelMissing,
    kcal: stock.kcalPerMl ? stock.kcalPerMl.times(volumeMl) : ZERO,
    aluminumMcg: lineAluminumMcg(product, stock, volumeMl),
  };
}

/** µg of aluminum a line brings: the stock's labelled µg/L × its volume ÷ 1000. */
function lineAluminumMcg(product: Product, stock: StockFigures, volumeMl: D): D {
  if (stock.aluminumMcgPerMl) return stock.aluminumMcgPerMl.times(volumeMl);
  return product.aluminumMcgPerL ? product.aluminumMcgPerL.times(volumeMl).div(THOUSAND) : ZERO;
}

/**
 * The computed line of `like` for the same order line, when `like` was computed at the same weight: a
 * line's figures depend on nothing else (the fill's do, and it is never taken). `at` is where it
 * should sit when the lines come in the same order.
 */
function knownLine(like: readonly BagLine[], line: OrderLine, at: number): BagLine | null {
  const expected = like[at];
  if (expected && expected.line === line) return expected;
  for (let i = 0; i < like.length; i++) if (like[i]!.line === line) return like[i]!;
  return null;
}

/**
 * Turn a validated order into its bag: each line's stock volume, the fill, every species, both
 * osmolarities, concentrations, energy, nitrogen, GIR. Pure; full decimal precision.
 * `like`: a bag of an order this one was made from (the solver's proposals change the volume or one
 * line); its lines that this order holds unchanged, at the same weight, are taken as they are.
 */
export function computeBag(order: Order, policy: Policy, like?: Bag): Bag {
  const weight = order.patient.weightKg;
  const known = like && like.order.patient.weightKg.eq(weight) ? like.lines : null;
  // The lines in order; the fill line's volume needs the sum of the others, so its place is kept and
  // filled after (a splice would copy the array).
  const lines: (BagLine | null)[] = [];
  let fillLine: OrderLine | null = null;
  let fillAt = -1;
  let addedVolumeMl = ZERO;
  for (const line of order.lines) {
    if (line.kind === 'fill') {
      fillLine = line; // an order has one fill at most (parseOrder says so)
      if (order.volumeMl && fillAt === -1) {
        fillAt = lines.length;
        lines.push(null);
      }
      continue;
    }
    let bagLine = known ? knownLine(known, line, lines.length) : null;
    if (!bagLine) {
      const perDay = perDayAmount(line, weight);
      bagLine = makeLine(line, lineVolumeMl(line, weight, perDay), perDay);
    }
    addedVolumeMl = addedVolumeMl.plus(bagLine.volumeMl);
    lines.push(bagLine);
  }
  let finalVolumeMl = addedVolumeMl;
  if (fillLine && order.volumeMl) {
    lines[fillAt] = makeLine(fillLine, larger(order.volumeMl.minus(addedVolumeMl), ZERO), null);
    finalVolumeMl = larger(order.volumeMl, addedVolumeMl);
  }
  const bagLines = lines as BagLine[]; // every place is taken now

  // Running totals in plain locals and an array by species index (records keyed by a variable are slow
  // to write); the species record is built once at the end.
  const mmol: D[] = NO_SPECIES.slice();
  let dextroseG = ZERO;
  let aminoAcidsG = ZERO;
  let lipidG = ZERO;
  let dextroseKcal = ZERO;
  let aminoAcidsKcal = ZERO;
  let lipidKcal = ZERO;
  let otherKcal = ZERO;
  let particle = ZERO;
  let label = ZERO;
  let aluminum = ZERO;
  for (let i = 0; i < bagLines.length; i++) {
    const l = bagLines[i]!;
    const v = l.volumeMl;
    const held = l.stock.perMlByIndex;
    for (let j = 0; j < held.length; j++) {
      const [k, perMl] = held[j]!;
      mmol[k] = mmol[k]!.plus(perMl.times(v));
    }
    const role = l.product.role;
    const n = l.product.nutrient;
    if (n) {
      const g = n.gramsPerMl.times(v);
      if (role === 'dextrose') dextroseG = dextroseG.plus(g);
      else if (role === 'amino-acids') aminoAcidsG = aminoAcidsG.plus(g);
      else if (role === 'lipid') lipidG = lipidG.plus(g);
    }
    if (!l.kcal.isZero()) {
      if (role === 'dextrose') dextroseKcal = dextroseKcal.plus(l.kcal);
      else if (role === 'amino-acids') aminoAcidsKcal = aminoAcidsKcal.plus(l.kcal);
      else if (role === 'lipid') lipidKcal = lipidKcal.plus(l.kcal);
      else otherKcal = otherKcal.plus(l.kcal);
    }
    particle = particle.plus(l.particleMOsm);
    label = label.plus(l.labelMOsm);
    aluminum = aluminum.plus(l.aluminumMcg);
  }
  const speciesMmol = speciesRecord(mmol);
  const grams = { dextrose: dextroseG, aminoAcids: aminoAcidsG, lipid: lipidG };
  const particleOsm = perLitre(particle, finalVolumeMl);
  const labelOsm = perLitre(label, finalVolumeMl);
  const method: Osmolarity['method'] =
    policy.reportedOsmolarity === 'higher' ? (labelOsm.gt(particleOsm) ? 'labelSum' : 'particle') : policy.reportedOsmolarity;
  const reported = method === 'particle' ? particleOsm : labelOsm;
  const nitrogenG = grams.aminoAcids.div(policy.reference.gramsAminoAcidPerGramNitrogen.value);
  const nonProtein = dextroseKcal.plus(lipidKcal);
  const minutes = order.hours.times(60);
  return {
    order, lines: bagLines, finalVolumeMl, addedVolumeMl,
    hours: order.hours,
    rateMlPerHour: finalVolumeMl.div(order.hours),
    speciesMmol, grams,
    percent: {
      dextrose: percentOf(grams.dextrose, finalVolumeMl),
      aminoAcids: percentOf(grams.aminoAcids, finalVolumeMl),
      lipid: percentOf(grams.lipid, finalVolumeMl),
    },
    kcal: {
      dextrose: dextroseKcal, aminoAcids: aminoAcidsKcal, lipid: lipidKcal, other: otherKcal,
      total: dextroseKcal.plus(aminoAcidsKcal).plus(lipidKcal).plus(otherKcal), nonProtein,
    },
    nitrogenG,
    npcToN: nitrogenG.isZero() ? null : nonProtein.div(nitrogenG),
    girMgPerKgPerMin: grams.dextrose.times(THOUSAND).div(weight.times(minutes)),
    osmolarity: { particle: particleOsm, labelSum: labelOsm, reported, method },
    totalMOsm: { particle, labelSum: label },
    osmoticPressureMmHg: reported.times(mmHgPerMOsmPerL(policy.reference.osmoticPressureTemperatureC.value)),
    aluminumMcg: aluminum,
    aluminumMcgPerKgPerDay: aluminum.div(weight),
    derived: { weightKg: weight, finalVolumeMl, perKg: { keys: [], values: [] }, perLitre: { keys: [], values: [] } },
  };
}

/**
 * The same bag for the same order on another route: every figure is shared (none depends on the route),
 * only the order's route differs. Written field by field: a spread of an object this size is a slow
 * generic copy, and the solver asks this of every central bag.
 */
export function bagOnRoute(bag: Bag, route: Route): Bag {
  const o = bag.order;
  const order: Order = { id: o.id, patient: o.patient, route, volumeMl: o.volumeMl, hours: o.hours, lines: o.lines, ions: o.ions, note: o.note };
  return {
    order, lines: bag.lines, finalVolumeMl: bag.finalVolumeMl, addedVolumeMl: bag.addedVolumeMl, hours: bag.hours,
    rateMlPerHour: bag.rateMlPerHour, speciesMmol: bag.speciesMmol, grams: bag.grams, percent: bag.percent, kcal: bag.kcal,
    nitrogenG: bag.nitrogenG, npcToN: bag.npcToN, girMgPerKgPerMin: bag.girMgPerKgPerMin, osmolarity: bag.osmolarity,
    totalMOsm: bag.totalMOsm, osmoticPressureMmHg: bag.osmoticPressureMmHg, aluminumMcg: bag.aluminumMcg,
    aluminumMcgPerKgPerDay: bag.aluminumMcgPerKgPerDay, derived: bag.derived,
  };
}

/**
 * Figures of one bag worked out once: the decimal divided (keys[i], compared by identity: decimals are
 * immutable) and the result (values[i]). A bag holds a few dozen; a scan of two short arrays is cheaper
 * to build and to search than a Map.
 */
export interface Memo { readonly keys: D[]; readonly values: D[] }

// Figures that several checks and the report read (a species per litre, a dose per kg), each worked out
// once per bag and kept in the bag's own memo.
function memo(known: Memo, x: D, compute: (x: D, by: D) => D, by: D): D {
  const keys = known.keys;
  for (let i = keys.length - 1; i >= 0; i--) if (keys[i] === x) return known.values[i]!;
  const value = compute(x, by);
  keys.push(x);
  known.values.push(value);
  return value;
}

const divide = (x: D, by: D): D => x.div(by);

/** A figure of the bag per kg of dosing weight (x ÷ weight), worked out once per bag and figure. */
export function perKgOf(bag: Bag, x: D): D {
  const weight = bag.order.patient.weightKg;
  return bag.derived.weightKg === weight ? memo(bag.derived.perKg, x, divide, weight) : x.div(weight);
}

/** A figure of the bag per litre of its final volume (see perLitre), worked out once per bag and figure. */
export function perLitreOf(bag: Bag, x: D): D {
  const volume = bag.finalVolumeMl;
  return bag.derived.finalVolumeMl === volume ? memo(bag.derived.perLitre, x, perLitre, volume) : perLitre(x, volume);
}

/** A line's mOsm under the reported method. */
export function lineMOsm(bag: Bag, line: BagLine): D {
  return bag.osmolarity.method === 'particle' ? line.particleMOsm : line.labelMOsm;
}

/** A line's share of the bag's mOsm under the reported method, as a fraction 0–1. */
export function lineShare(bag: Bag, line: BagLine): D {
  const total = bag.osmolarity.method === 'particle' ? bag.totalMOsm.particle : bag.totalMOsm.labelSum;
  return total.isZero() ? ZERO : lineMOsm(bag, line).div(total);
}
