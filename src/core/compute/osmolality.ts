import { z } from 'zod';
import { D, ZERO, round } from '../decimal.ts';
import { SPECIES, type SpeciesId } from '../species.ts';
import { perLitre, perLitreOf, type Bag } from './bag.ts';
import { stockFigures } from './stock.ts';
import type { Product } from '../catalog.ts';

/** One published way of estimating the osmolality a bag would measure, with how far to trust it. */
export interface OsmolalityEstimate {
  method: 'osmotic-coefficient' | 'pereira-da-silva-2004';
  label: string;
  value: D;
  unit: 'mOsm/kg';
  source: string;
  /** How well the method's inputs are confirmed (shown beside the figure). */
  status: string;
  notes: string[];
}

/** Predicted osmolality: information only, never a check. */
export interface PredictedOsmolality {
  estimates: OsmolalityEstimate[];
  note: string;
}

/** Osmotic coefficient φ of a salt, matched to a stock whose dissolved species are exactly these. */
interface Coefficient { solute: string; species: readonly SpeciesId[]; phi: D }

const COEFFICIENT_SOURCE = 'osmotic coefficients of physiological solutes at 37 °C, plasma-like concentration (University of British Columbia Zoology teaching table, from standard physical-chemistry data)';

// φ at 37 °C from the teaching table above: NaCl 0.93, KCl 0.92, KH2PO4 0.87, CaCl2 0.86, MgCl2 0.89,
// Na2SO4 0.74, MgSO4 0.58, glucose 1.01.
const COEFFICIENTS: readonly Coefficient[] = [
  { solute: 'NaCl', species: ['Na', 'Cl'], phi: new D('0.93') },
  { solute: 'KCl', species: ['K', 'Cl'], phi: new D('0.92') },
  { solute: 'KH2PO4', species: ['K', 'phosphate'], phi: new D('0.87') },
  { solute: 'CaCl2', species: ['Ca', 'Cl'], phi: new D('0.86') },
  { solute: 'MgCl2', species: ['Mg', 'Cl'], phi: new D('0.89') },
  { solute: 'Na2SO4', species: ['Na', 'sulfate'], phi: new D('0.74') },
  { solute: 'MgSO4', species: ['Mg', 'sulfate'], phi: new D('0.58') },
];
const GLUCOSE_PHI = new D('1.01');
const COEFFICIENT_NOTE = 'φ values are for plasma-like concentrations; PN is far more concentrated, so this is an approximation.';

// Glucose anhydrous 180.16 g/mol, monohydrate 198.17 g/mol (IUPAC atomic weights).
const ANHYDROUS_PER_MONOHYDRATE = new D('180.16').div('198.17');

/**
 * What one stock adds to the osmotic-coefficient sum, worked out once per product (products are immutable).
 * Every flag holds for a line of the stock that is in the bag (volume above zero).
 */
interface StockTerms {
  /** False when the stock adds no particles (none per mL): its lines add nothing. */
  counts: boolean;
  /** The nutrient's own mOsm per mL, when above zero; null without a nutrient or when it adds none. */
  nutrientPerMl: D | null;
  /**
   * The nutrient is all the stock's particles (its mOsm/mL is the stock's particles per mL, digit for
   * digit): a line's nutrient mOsm (that figure × the volume) is then its particle mOsm (the stock's
   * particles per mL × the volume, as computeBag makes it), the same decimal, and its ions add zero.
   */
  nutrientOnly: boolean;
  /** The nutrient is glucose (φ 1.01); any other nutrient counts as ideal. */
  glucose: boolean;
  /** Where the stock's dissolved ions' salt stands in the φ table; −1 when the table has none (ideal). */
  ion: number;
  /** The nutrient adds particles and has no φ (not glucose): the stock is named as counted ideal. */
  idealNutrient: boolean;
}

const terms = new WeakMap<Product, StockTerms>();

/** Where a stock's dissolved ions stand in the φ table (the salt whose species match exactly), else −1. */
function ionCoefficient(product: Product): number {
  const present = [...stockFigures(product).holds].sort();
  return COEFFICIENTS.findIndex((c) => c.species.length === present.length && [...c.species].sort().every((s, i) => s === present[i]));
}

/** A stock's terms, computed on first use and kept for the product's lifetime. */
function stockTerms(product: Product): StockTerms {
  let t = terms.get(product);
  if (t === undefined) {
    const perMl = stockFigures(product).nutrientMOsmPerMl;
    const nutrientPerMl = product.nutrient && perMl.gt(ZERO) ? perMl : null;
    const dextrose = product.role === 'dextrose';
    const p = product.particlePerMl;
    t = {
      counts: p.gt(ZERO),
      nutrientPerMl,
      nutrientOnly: nutrientPerMl !== null && nutrientPerMl.x === null && p.x === null && nutrientPerMl.c === p.c && nutrientPerMl.e === p.e,
      glucose: dextrose,
      ion: ionCoefficient(product),
      idealNutrient: nutrientPerMl !== null && !dextrose,
    };
    terms.set(product, t);
  }
  return t;
}

/**
 * Osmotic-coefficient estimate: each line's ideal particles × the φ of its salt (glucose 1.01),
 * ÷ the final volume. Particles with no φ in the table count as ideal (φ = 1) and are named.
 * Example: 1000 mL holding 154 mmol NaCl (308 ideal mOsm) → 308 × 0.93 = 286.4.
 */
export function osmoticCoefficientEstimate(bag: Bag): OsmolalityEstimate {
  // The stocks counted as ideal, named in line order ("; " between names); null while there are none.
  let uncounted: string | null = null;
  // The particles are summed by coefficient first (the table's salts, glucose, and ideal), then each sum
  // is multiplied by its φ once: Σ φ·xᵢ = φ·Σ xᵢ, with one multiplication per coefficient, not per line.
  const byCoefficient: D[] = COEFFICIENTS.map(() => ZERO);
  let glucose = ZERO;
  let ideal = ZERO;
  const lines = bag.lines;
  for (let i = 0; i < lines.length; i++) {
    const l = lines[i]!;
    if (!l.inBag) continue;
    const t = stockTerms(l.product);
    // In the bag, a line's particles are above zero exactly when its stock's are.
    if (!t.counts) continue;
    let ionMOsm = l.particleMOsm;
    if (t.nutrientPerMl !== null) {
      const nutrientMOsm = t.nutrientOnly ? l.particleMOsm : t.nutrientPerMl.times(l.volumeMl);
      if (t.glucose) glucose = glucose.plus(nutrientMOsm);
      else ideal = ideal.plus(nutrientMOsm);
      ionMOsm = t.nutrientOnly ? ZERO : l.particleMOsm.minus(nutrientMOsm);
    }
    if (!ionMOsm.isZero()) {
      if (t.ion >= 0) byCoefficient[t.ion] = byCoefficient[t.ion]!.plus(ionMOsm);
      else ideal = ideal.plus(ionMOsm);
    }
    if (t.idealNutrient || (t.ion < 0 && ionMOsm.gt(ZERO))) uncounted = uncounted === null ? l.product.name : `${uncounted}; ${l.product.name}`;
  }
  // A zero sum, or φ = 1, would change no digit of the total: both are left out.
  let total = ideal;
  if (!glucose.isZero()) total = total.plus(glucose.times(GLUCOSE_PHI));
  for (let k = 0; k < byCoefficient.length; k++) {
    const x = byCoefficient[k]!;
    if (!x.isZero()) total = total.plus(x.times(COEFFICIENTS[k]!.phi));
  }
  const notes = uncounted === null ? [COEFFICIENT_NOTE] : [COEFFICIENT_NOTE, `No coefficient in the table, counted as ideal (φ = 1): ${uncounted}.`];
  return {
    method: 'osmotic-coefficient',
    label: 'Osmotic-coefficient estimate',
    value: perLitre(total, bag.finalVolumeMl),
    unit: 'mOsm/kg',
    source: COEFFICIENT_SOURCE,
    status: 'coefficients confirmed in a published table; their use for PN is an estimate',
    notes,
  };
}

/**
 * Pereira-da-Silva 2004 equation for neonatal 2-in-1 PN, fitted to measured osmolality:
 * amino acids (g/L) × 8 + glucose (g/L) × 7 + sodium (mmol/L) × 2 + phosphorus (mg/L) × 0.2 − 50.
 * Glucose is taken as anhydrous (an unverified reading of the paper); phosphorus counts both
 * phosphate species at 30.974 mg per mmol. Example: 25 g/L AA, 80 g/L glucose, 30 mmol/L Na,
 * 310 mg/L P → 200 + 560 + 60 + 62 − 50 = 832. Null when the result is not positive.
 */
export function pereiraDaSilvaEstimate(bag: Bag): OsmolalityEstimate | null {
  const V = bag.finalVolumeMl;
  let glucoseG = ZERO;
  for (const l of bag.lines) {
    const n = l.product.nutrient;
    if (l.product.role !== 'dextrose' || !n) continue;
    const g = n.gramsPerMl.times(l.volumeMl);
    glucoseG = glucoseG.plus(n.basis === 'hydrous' ? g.times(ANHYDROUS_PER_MONOHYDRATE) : g);
  }
  const phosphorusMgPerL = perLitre(bag.speciesMmol.phosphate.plus(bag.speciesMmol.glycerophosphate), V).times(SPECIES.phosphate.molarMass);
  const value = perLitre(bag.grams.aminoAcids, V).times(8)
    .plus(perLitre(glucoseG, V).times(7))
    .plus(perLitreOf(bag, bag.speciesMmol.Na).times(2))
    .plus(phosphorusMgPerL.times('0.2'))
    .minus(50);
  if (!value.gt(0)) return null;
  const notes = [
    'Fitted to measured osmolality of neonatal 2-in-1 PN; coefficients sit above the ideal values on purpose.',
    'Glucose counted as anhydrous (the paper\'s basis is not confirmed).',
  ];
  if (bag.grams.lipid.gt(0)) notes.push('This bag holds lipid, which the equation was not fitted on.');
  return {
    method: 'pereira-da-silva-2004',
    label: 'Pereira-da-Silva 2004 equation (neonatal)',
    value,
    unit: 'mOsm/kg',
    source: 'Pereira-da-Silva et al., JPEN 2004;28:34 (neonatal 2-in-1 PN without lipid)',
    status: 'equation from memory, corroborated by secondary sources; satisfactory for 3 of 6 formulations in one comparison (Madé 2018)',
    notes,
  };
}

const UNDERESTIMATE_NOTE = 'Calculated osmolarity under-estimates measured osmolality in concentrated PN, more so as concentration rises (Borenstein 2018: below the measured value in every one of 363 neonatal bags; JPEN 2016: by up to 16.7-33.2% in concentrated pediatric PN). These are estimates only: measure on an osmometer when it matters.';

/** Whether the Pereira-da-Silva equation applies: it was fitted on neonatal bags only. */
function isNeonatal(bag: Bag): boolean {
  const age = bag.order.patient.ageGroup;
  return age === 'term-neonate' || age === 'preterm-neonate';
}

/** Every estimate that applies to the bag (Pereira-da-Silva for neonatal bags only); null for an empty bag. */
export function predictOsmolality(bag: Bag): PredictedOsmolality | null {
  if (bag.finalVolumeMl.isZero()) return null;
  const estimates = [osmoticCoefficientEstimate(bag)];
  if (isNeonatal(bag)) {
    const p = pereiraDaSilvaEstimate(bag);
    if (p) estimates.push(p);
  }
  return { estimates, note: UNDERESTIMATE_NOTE };
}

const num = z.number().refine(Number.isFinite, 'must be a finite number');

/** `information.predictedOsmolality` in the report (optional: absent for an empty bag). */
export const predictedOsmolalityReportSchema = z.object({
  estimates: z.array(z.object({
    method: z.enum(['osmotic-coefficient', 'pereira-da-silva-2004']),
    label: z.string(),
    value: num,
    unit: z.literal('mOsm/kg'),
    source: z.string(),
    status: z.string(),
    notes: z.array(z.string()),
  })),
  note: z.string(),
});

type EstimateReport = z.infer<typeof predictedOsmolalityReportSchema>['estimates'][number];

/** One estimate as the report shows it, rounded to 0.1 mOsm/kg. */
function reportEstimate(e: OsmolalityEstimate): EstimateReport {
  return { method: e.method, label: e.label, value: round(e.value, 1), unit: e.unit, source: e.source, status: e.status, notes: e.notes };
}

/** `information.predictedOsmolality` of a bag's report, rounded at this edge to 0.1 mOsm/kg; null when nothing is predicted. */
export function predictedOsmolalityReport(bag: Bag): z.infer<typeof predictedOsmolalityReportSchema> | null {
  const p = predictOsmolality(bag);
  return p ? { estimates: p.estimates.map(reportEstimate), note: p.note } : null;
}

/** The report field for a bag (see predictedOsmolalityReport); `{}` when nothing is predicted. */
export function predictedOsmolalityField(bag: Bag): { predictedOsmolality?: z.infer<typeof predictedOsmolalityReportSchema> } {
  const p = predictedOsmolalityReport(bag);
  return p ? { predictedOsmolality: p } : {};
}
