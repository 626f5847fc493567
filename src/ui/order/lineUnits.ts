// Which units and species make sense for a stock, so the unit picker offers only those.
// The engine refuses the rest anyway (parseOrder); this keeps the choices honest before that.
import { NUTRIENT_ROLES, type Product } from '../../core/catalog.ts';
import { isCharged, isPhosphateSpecies, SPECIES_IDS, type SpeciesId } from '../../core/species.ts';
import type { LineUnit } from '../../core/order.ts';

/** The unit picker's extra choice that turns a line into the fill line. */
export const FILL = 'fill';
export type UnitChoice = LineUnit | typeof FILL;

function present(product: Product): SpeciesId[] {
  const all = SPECIES_IDS.filter((s) => product.perMl[s]?.gt(0));
  // The product's order species first: it is what mEq/mmol count unless told otherwise.
  return product.orderSpecies ? [product.orderSpecies, ...all.filter((s) => s !== product.orderSpecies)] : all;
}

/** True for stocks whose amount is written in grams of nutrient (dextrose, amino acids, lipid). */
export function isNutrientStock(product: Product): boolean {
  return NUTRIENT_ROLES.includes(product.role);
}

/**
 * Species a line of this product may count in `mEq` or `mmol`: the ions it contains, phosphate species
 * never in mEq, uncharged species never in mEq. Nutrient stocks and water are not ordered by an ion.
 */
export function speciesChoices(product: Product, base: 'mEq' | 'mmol'): SpeciesId[] {
  if (isNutrientStock(product) || product.role === 'water' || product.orderSpecies === null) return [];
  return present(product).filter((s) => (base === 'mEq' ? isCharged(s) && !isPhosphateSpecies(s) : true));
}

/**
 * Units offered for a product: `g` only for nutrient stocks; `mEq`/`mmol` only where the stock has an
 * order species (and `mEq` only where one of its ions has a charge); `mL` always; each with its per-kg form.
 */
export function unitChoices(product: Product | undefined): LineUnit[] {
  if (!product) return ['mL', 'mL/kg'];
  const out: LineUnit[] = [];
  if (isNutrientStock(product)) out.push('g', 'g/kg');
  if (speciesChoices(product, 'mEq').length > 0) out.push('mEq', 'mEq/kg');
  if (speciesChoices(product, 'mmol').length > 0) out.push('mmol', 'mmol/kg');
  out.push('mL', 'mL/kg');
  return out;
}

/** The unit a new line of this product starts with: grams of nutrient, else its order species' unit, else mL. */
export function defaultUnit(product: Product, perKg: boolean): LineUnit {
  const choices = unitChoices(product);
  const base = choices[0] ?? 'mL';
  const preferred = product.orderSpecies && isPhosphateSpecies(product.orderSpecies) && choices.includes('mmol') ? 'mmol' : base;
  return (perKg ? `${preferred}/kg` : preferred) as LineUnit;
}

/** The species text a line needs for a unit: empty (the product's default) when that default fits. */
export function fittingSpecies(product: Product, unit: LineUnit, current: string | undefined): string | undefined {
  const base = unit.replace('/kg', '');
  if (base !== 'mEq' && base !== 'mmol') return undefined;
  const choices = speciesChoices(product, base);
  if (current && (choices as string[]).includes(current)) return current;
  if (product.orderSpecies && choices.includes(product.orderSpecies)) return undefined;
  return choices[0];
}
