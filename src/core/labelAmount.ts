import { D, round } from './decimal.ts';
import { SPECIES, isCharged, isPhosphateSpecies, isSpeciesId, type SpeciesId } from './species.ts';
import { NUTRIENT_ROLES, type Product } from './catalog.ts';
import type { Report } from './report.ts';

type ReportLine = Report['lines'][number];

/** An amount per day as a label prints it, and the same per kg per day. */
export interface LabelQuantity {
  perDay: number;
  perKgPerDay: number;
  unit: string;
  /** The species the amount counts (mEq/mmol amounts), e.g. `phosphate` for a phosphate salt. */
  species: SpeciesId | null;
}

/** How one order line reads on the bag label. */
export interface LabelAmount {
  amount: LabelQuantity;
  /** The amount as ordered, when the label shows it in another unit (e.g. lipid 250 mL shown as 50 g). */
  ordered: LabelQuantity | null;
  /** The cation a phosphate salt brings with it, in mEq (e.g. potassium phosphates 15 mmol → 22 mEq K). */
  includes: LabelQuantity | null;
}

const CATIONS: readonly SpeciesId[] = ['Na', 'K', 'Mg', 'Ca'];

function quantity(perDay: D, weightKg: D, unit: string, species: SpeciesId | null): LabelQuantity {
  return { perDay: round(perDay, 4), perKgPerDay: round(perDay.div(weightKg), 4), unit, species };
}

/** mmol of `species` in an ordered amount (mL of stock, or mEq/mmol of the ordered species); null when it cannot be known. */
function mmolOf(species: SpeciesId, product: Product, amount: D, unit: string, ordered: SpeciesId | null): D | null {
  const perMl = product.perMl[species];
  if (!perMl || perMl.isZero()) return null;
  if (unit === 'mL') return amount.times(perMl);
  if (!ordered) return null;
  const orderedPerMl = product.perMl[ordered];
  if (!orderedPerMl || orderedPerMl.isZero()) return null;
  let orderedMmol: D;
  if (unit === 'mmol') orderedMmol = amount;
  else if (unit === 'mEq' && isCharged(ordered)) orderedMmol = amount.div(Math.abs(SPECIES[ordered].charge ?? 1));
  else return null;
  return orderedMmol.times(perMl).div(orderedPerMl);
}

function mEq(species: SpeciesId, mmol: D): D {
  return mmol.times(Math.abs(SPECIES[species].charge ?? 0));
}

/**
 * The label's amount for a report line, in the units the label uses (field guide §8.1, ASPEN label
 * practice): nutrients in grams; a phosphate salt in mmol of phosphate, with the cation it brings in
 * mEq; other salts in mEq of their cation (mmol when ordered in mmol); additives as ordered.
 * Returns null for the fill water (the label shows the bag's total volume instead) and for a line
 * without an amount. Without the catalog product the line is shown as ordered.
 * Example: lipid 20% (0.2 g/mL) ordered as 250 mL → 50 g, ordered 250 mL.
 */
export function labelAmount(line: ReportLine, product: Product | undefined, weightKg: number): LabelAmount | null {
  if (line.fill || !line.perDay || line.role === 'water') return null;
  const w = new D(weightKg);
  const amount = new D(line.perDay.amount);
  const unit = line.perDay.unit;
  const orderedSpecies = line.species !== null && isSpeciesId(line.species) ? line.species : product?.orderSpecies ?? null;
  const asOrdered = quantity(amount, w, unit, unit === 'mEq' || unit === 'mmol' ? orderedSpecies : null);
  if (!product) return { amount: asOrdered, ordered: null, includes: null };

  if (NUTRIENT_ROLES.includes(product.role)) {
    if (unit === 'g' || !product.nutrient) return { amount: asOrdered, ordered: null, includes: null };
    return { amount: quantity(amount.times(product.nutrient.gramsPerMl), w, 'g', null), ordered: asOrdered, includes: null };
  }

  if (product.role === 'electrolyte') {
    const phosphate = (['phosphate', 'glycerophosphate'] as const).find((s) => product.perMl[s]?.gt(0));
    if (phosphate) {
      const phosMmol = unit === 'mmol' && orderedSpecies && isPhosphateSpecies(orderedSpecies) ? amount : mmolOf(phosphate, product, amount, unit, orderedSpecies);
      if (!phosMmol) return { amount: asOrdered, ordered: null, includes: null };
      const cation = CATIONS.find((s) => product.perMl[s]?.gt(0));
      const cationMmol = cation ? mmolOf(cation, product, phosMmol, 'mmol', phosphate) : null;
      const converted = !(unit === 'mmol' && orderedSpecies === phosphate);
      return {
        amount: quantity(phosMmol, w, 'mmol', phosphate),
        ordered: converted ? asOrdered : null,
        includes: cation && cationMmol ? quantity(mEq(cation, cationMmol), w, 'mEq', cation) : null,
      };
    }
    if (unit === 'mL' && product.orderSpecies && isCharged(product.orderSpecies)) {
      const s = product.orderSpecies;
      const mmol = mmolOf(s, product, amount, 'mL', null);
      if (mmol) return { amount: quantity(mEq(s, mmol), w, 'mEq', s), ordered: asOrdered, includes: null };
    }
  }
  return { amount: asOrdered, ordered: null, includes: null };
}
