import { D, ZERO } from '../decimal.ts';
import { SPECIES, isPhosphateSpecies, type SpeciesId } from '../species.ts';
import type { Catalog, Product } from '../catalog.ts';

/** Relative charge mismatch a salt stock may show and still count as one salt (labels round). */
const CHARGE_TOLERANCE = new D('0.01');

function speciesPresent(p: Product): SpeciesId[] {
  return (Object.keys(p.perMl) as SpeciesId[]).filter((s) => p.perMl[s]?.gt(0));
}

/** True when the stock's cations and anions carry equal charge (phosphate stocks: charge not defined). */
function chargeBalanced(p: Product): boolean {
  const present = speciesPresent(p);
  if (present.some(isPhosphateSpecies)) return true;
  let plus = ZERO;
  let minus = ZERO;
  for (const s of present) {
    const charge = SPECIES[s].charge ?? 0;
    const mEq = (p.perMl[s] ?? ZERO).times(Math.abs(charge));
    if (charge > 0) plus = plus.plus(mEq);
    else minus = minus.plus(mEq);
  }
  return !plus.isZero() && plus.minus(minus).abs().lte(plus.times(CHARGE_TOLERANCE));
}

/**
 * The electrolyte stocks that hold exactly these species and nothing else, found by their
 * composition (perMl), never by id: `["K", "phosphate"]` finds potassium phosphates whatever the
 * catalog calls it. Salt stocks whose charges do not balance are left out.
 */
export function stocksOf(catalog: Catalog, species: readonly SpeciesId[]): Product[] {
  return catalog.products.filter((p) => {
    if (p.role !== 'electrolyte' || p.nutrient) return false;
    const present = speciesPresent(p);
    return present.length === species.length && species.every((s) => present.includes(s)) && chargeBalanced(p);
  });
}

/**
 * Choose among stocks of one salt for an amount (mmol of `species`): the most concentrated whose
 * volume is still at least the smallest measurable volume, else the most dilute (largest volume).
 * Ties keep catalog order.
 */
export function pickStock(stocks: readonly Product[], species: SpeciesId, mmol: D, smallestMl: D): Product | null {
  const byStrength = [...stocks].sort((a, b) => (b.perMl[species] ?? ZERO).comparedTo(a.perMl[species] ?? ZERO));
  const measurable = byStrength.find((p) => mmol.div(p.perMl[species] ?? ZERO).gte(smallestMl));
  return measurable ?? byStrength[byStrength.length - 1] ?? null;
}
