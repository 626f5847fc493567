import { ZERO, THOUSAND, type D } from '../decimal.ts';
import { SPECIES_IDS, type SpeciesId } from '../species.ts';
import type { Product } from '../catalog.ts';

/** What a stock brings per mL, worked out once per product and read by every bag that holds it. */
export interface StockFigures {
  /** The species the stock holds (perMl above zero): the lines a check names are found by these. */
  holds: ReadonlySet<SpeciesId>;
  /** Every perMl entry of the stock, in the catalog's order. */
  perMl: readonly (readonly [SpeciesId, D])[];
  /** The same entries by the species' index in SPECIES_IDS (for totals kept in an array). */
  perMlByIndex: readonly (readonly [number, D])[];
  /** kcal per mL: the labelled figure, else the nutrient's kcal/g × g/mL; null when the stock has neither. */
  kcalPerMl: D | null;
  /** The nutrient's own particles per mL (g/mL × mOsm/g), mOsm/mL; zero without a nutrient. */
  nutrientMOsmPerMl: D;
  /**
   * The labelled aluminum maximum per mL (µg/L ÷ 1000), when that division is exact (it is for any
   * value of 28 significant digits or fewer): then × volume gives, digit for digit, µg/L × volume ÷ 1000.
   * Null when the stock has no aluminum value or the division would round.
   */
  aluminumMcgPerMl: D | null;
}

/** µg/L ÷ 1000, or null when the quotient is not exact. */
function exactPerMl(perL: D | null): D | null {
  if (!perL) return null;
  const perMl = perL.div(THOUSAND);
  return perMl.times(THOUSAND).eq(perL) ? perMl : null;
}

// Products are immutable values (an edited catalog holds new product objects), so figures never go stale;
// a catalog that is no longer used takes its figures with it.
const figures = new WeakMap<Product, StockFigures>();

function figuresOf(product: Product): StockFigures {
  const perMl = (Object.keys(product.perMl) as SpeciesId[]).flatMap((s) => {
    const value = product.perMl[s];
    return value ? [[s, value] as const] : [];
  });
  const n = product.nutrient;
  return {
    holds: new Set(perMl.filter(([, value]) => value.gt(ZERO)).map(([s]) => s)),
    perMl,
    perMlByIndex: perMl.map(([s, value]) => [SPECIES_IDS.indexOf(s), value] as const),
    kcalPerMl: product.kcalPerMl ?? (n?.kcalPerGram ? n.kcalPerGram.times(n.gramsPerMl) : null),
    nutrientMOsmPerMl: n ? n.gramsPerMl.times(n.mOsmPerGram) : ZERO,
    aluminumMcgPerMl: exactPerMl(product.aluminumMcgPerL),
  };
}

/**
 * A stock's per-mL figures, computed on first use and kept for the product's lifetime.
 * Example: dextrose 70% with no labelled kcal and 3.4 kcal/g → 2.38 kcal/mL.
 */
export function stockFigures(product: Product): StockFigures {
  let f = figures.get(product);
  if (!f) {
    f = figuresOf(product);
    figures.set(product, f);
  }
  return f;
}
