import { z } from 'zod';
import { D, ZERO, sum } from './decimal.ts';
import { SPECIES_IDS, isPhosphateSpecies, isCharged, type SpeciesId } from './species.ts';
import { decimal, optionalDecimal, idPattern, parseWith } from './schema.ts';
import type { Problem, Result } from './problems.ts';

export const ROLES = ['dextrose', 'amino-acids', 'lipid', 'electrolyte', 'additive', 'water'] as const;
/** What a stock is for: it decides which nutrient `g` counts and where the product sits on a label. */
export type Role = (typeof ROLES)[number];
export const NUTRIENT_ROLES: readonly Role[] = ['dextrose', 'amino-acids', 'lipid'];

const speciesEnum = z.enum(SPECIES_IDS);

// Upper bounds are physical (no stock holds more than 100 mmol of a species or 1.5 g of nutrient per mL).
const perMlSchema = z.record(z.string(), decimal({ min: 0, max: 100 }));

const saltSchema = z.strictObject({
  name: z.string().min(1),
  formula: z.string().min(1),
  molarMass: decimal({ gt: 0 }),
  mgPerMl: decimal({ min: 0 }),
  yields: z.record(z.string(), decimal({ gt: 0 })),
});

const productSchema = z.object({
  id: z.string().regex(idPattern, 'must be lowercase letters, digits and single dashes'),
  name: z.string().trim().min(1, 'must not be empty'),
  role: z.enum(ROLES),
  perMl: perMlSchema.optional(),
  nutrient: z.strictObject({
    gramsPerMl: decimal({ gt: 0, max: 1.5 }),
    mOsmPerGram: decimal({ min: 0, max: 100 }),
    basis: z.enum(['hydrous', 'anhydrous']).optional(),
    kcalPerGram: optionalDecimal({ min: 0, max: 20 }),
  }).optional(),
  mOsmPerMl: optionalDecimal({ min: 0, max: 100 }),
  kcalPerMl: optionalDecimal({ min: 0, max: 20 }),
  aluminumMcgPerL: optionalDecimal({ min: 0, max: 1000000 }),
  orderSpecies: speciesEnum.optional(),
  strength: z.string().optional(),
  salts: z.array(saltSchema).optional(),
  sources: z.record(z.string(), z.string()).optional(),
});

export const catalogFileSchema = z.object({
  format: z.literal('osmocount-catalog'),
  version: z.literal(1),
  id: z.string().optional(),
  name: z.string().optional(),
  products: z.array(productSchema).min(1, 'must list at least one product'),
});

/** A salt that a stock is made from, for reproducing its composition and label from chemistry. */
export interface Salt {
  name: string;
  formula: string;
  molarMass: D;
  mgPerMl: D;
  yields: Partial<Record<SpeciesId, D>>;
}

/** One stock product on the shelf, as the engine uses it (all numbers exact decimals). */
export interface Product {
  id: string;
  name: string;
  role: Role;
  /** mmol per mL of each dissolved species other than the main nutrient. */
  perMl: Partial<Record<SpeciesId, D>>;
  nutrient: { gramsPerMl: D; mOsmPerGram: D; basis: 'hydrous' | 'anhydrous' | null; kcalPerGram: D | null } | null;
  mOsmPerMl: D | null;
  kcalPerMl: D | null;
  aluminumMcgPerL: D | null;
  /** The species an mEq/mmol line counts by default; null when the stock has none. */
  orderSpecies: SpeciesId | null;
  strength: string | null;
  salts: Salt[];
  sources: Record<string, string>;
  /** Precomputed ideal particles per mL (Σ perMl + nutrient g/mL × mOsm/g), mOsm/mL. */
  particlePerMl: D;
}

export interface Catalog {
  id: string;
  name: string;
  products: Product[];
  byId: ReadonlyMap<string, Product>;
}

/** Default order species: the first cation in perMl, else phosphate or glycerophosphate where present. */
export function defaultOrderSpecies(perMl: Partial<Record<SpeciesId, D>>): SpeciesId | null {
  const present = (Object.keys(perMl) as SpeciesId[]).filter((s) => perMl[s]?.gt(0));
  const cation = present.find((s) => isCharged(s) && (s === 'Na' || s === 'K' || s === 'Ca' || s === 'Mg'));
  if (cation) return cation;
  return present.find(isPhosphateSpecies) ?? null;
}

/** Ideal particles per mL: every dissolved species counts once, plus the nutrient's own particles. */
export function particlesPerMl(perMl: Partial<Record<SpeciesId, D>>, nutrient: Product['nutrient']): D {
  const ions = sum(Object.values(perMl).filter((v): v is D => v !== undefined));
  return nutrient ? ions.plus(nutrient.gramsPerMl.times(nutrient.mOsmPerGram)) : ions;
}

type ProductInput = z.output<typeof productSchema>;

function toProduct(p: ProductInput, index: number, problems: Problem[]): Product {
  const at = `products[${index}]`;
  const perMl: Partial<Record<SpeciesId, D>> = {};
  for (const [key, value] of Object.entries(p.perMl ?? {})) {
    if ((SPECIES_IDS as readonly string[]).includes(key)) perMl[key as SpeciesId] = value;
    else problems.push({ path: `${at}.perMl.${key}`, message: `unknown species "${key}" (known: ${SPECIES_IDS.join(', ')})` });
  }
  const salts: Salt[] = (p.salts ?? []).map((s, j) => {
    const yields: Partial<Record<SpeciesId, D>> = {};
    for (const [key, value] of Object.entries(s.yields)) {
      if ((SPECIES_IDS as readonly string[]).includes(key)) yields[key as SpeciesId] = value;
      else problems.push({ path: `${at}.salts[${j}].yields.${key}`, message: `unknown species "${key}"` });
    }
    return { name: s.name, formula: s.formula, molarMass: s.molarMass, mgPerMl: s.mgPerMl, yields };
  });
  const isNutrientRole = NUTRIENT_ROLES.includes(p.role);
  if (isNutrientRole && !p.nutrient) problems.push({ path: `${at}.nutrient`, message: `is required for a ${p.role} product` });
  if (!isNutrientRole && p.nutrient) problems.push({ path: `${at}.nutrient`, message: `only dextrose, amino-acids and lipid products carry a nutrient` });
  if (p.role === 'dextrose' && p.nutrient && !p.nutrient.basis) problems.push({ path: `${at}.nutrient.basis`, message: 'is required for dextrose: "hydrous" or "anhydrous"' });
  if (p.orderSpecies && !perMl[p.orderSpecies]?.gt(0)) problems.push({ path: `${at}.orderSpecies`, message: `"${p.orderSpecies}" is not in this product's perMl` });
  const nutrient = p.nutrient
    ? { gramsPerMl: p.nutrient.gramsPerMl, mOsmPerGram: p.nutrient.mOsmPerGram, basis: p.nutrient.basis ?? null, kcalPerGram: p.nutrient.kcalPerGram ?? null }
    : null;
  return {
    id: p.id, name: p.name, role: p.role, perMl, nutrient,
    mOsmPerMl: p.mOsmPerMl ?? null,
    kcalPerMl: p.kcalPerMl ?? null,
    aluminumMcgPerL: p.aluminumMcgPerL ?? null,
    orderSpecies: p.orderSpecies ?? defaultOrderSpecies(perMl),
    strength: p.strength ?? null,
    salts,
    sources: p.sources ?? {},
    particlePerMl: particlesPerMl(perMl, nutrient),
  };
}

/** Build a catalog from products already in engine form (tests, the catalog editor). */
export function makeCatalog(products: Product[], id = 'catalog', name = 'Catalog'): Catalog {
  return { id, name, products, byId: new Map(products.map((p) => [p.id, p])) };
}

/** Validate a catalog file; an invalid file is rejected whole with every problem listed. */
export function parseCatalog(input: unknown): Result<Catalog> {
  const parsed = parseWith(catalogFileSchema, input);
  if (!parsed.ok) return parsed;
  const problems: Problem[] = [];
  const seen = new Set<string>();
  const products = parsed.value.products.map((p, i) => {
    if (seen.has(p.id)) problems.push({ path: `products[${i}].id`, message: `duplicate id "${p.id}"` });
    seen.add(p.id);
    return toProduct(p, i, problems);
  });
  if (problems.length > 0) return { ok: false, problems };
  return { ok: true, value: makeCatalog(products, parsed.value.id ?? 'catalog', parsed.value.name ?? 'Catalog') };
}

/** Zero-safe read of a product's mmol/mL of one species. */
export function perMlOf(product: Product, species: SpeciesId): D {
  return product.perMl[species] ?? ZERO;
}
