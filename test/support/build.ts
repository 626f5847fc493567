import { D } from '../../src/core/decimal.ts';
import { makeCatalog, particlesPerMl, defaultOrderSpecies, type Product, type Role, type Salt } from '../../src/core/catalog.ts';
import type { SpeciesId } from '../../src/core/species.ts';
import { speciesFromSalts } from '../../src/core/salts.ts';
import { DEFAULT_POLICY } from '../../src/defaults.ts';
import { checkOrder } from '../../src/core/evaluate.ts';
import type { Policy } from '../../src/core/policy.ts';

/** A test product in engine form; numbers as strings or numbers. */
export function product(p: {
  id: string; role?: Role; perMl?: Partial<Record<SpeciesId, string | number>>; salts?: Salt[];
  nutrient?: { gramsPerMl: string | number; mOsmPerGram: string | number; kcalPerGram?: string | number };
  mOsmPerMl?: string | number; kcalPerMl?: string | number; aluminumMcgPerL?: string | number;
}): Product {
  const perMl: Partial<Record<SpeciesId, D>> = p.salts ? speciesFromSalts(p.salts) : {};
  for (const [k, v] of Object.entries(p.perMl ?? {})) perMl[k as SpeciesId] = new D(v as string | number);
  const nutrient = p.nutrient
    ? { gramsPerMl: new D(p.nutrient.gramsPerMl), mOsmPerGram: new D(p.nutrient.mOsmPerGram), basis: 'hydrous' as const, kcalPerGram: p.nutrient.kcalPerGram === undefined ? null : new D(p.nutrient.kcalPerGram) }
    : null;
  return {
    id: p.id, name: p.id, role: p.role ?? 'electrolyte', perMl, nutrient,
    mOsmPerMl: p.mOsmPerMl === undefined ? null : new D(p.mOsmPerMl),
    kcalPerMl: p.kcalPerMl === undefined ? null : new D(p.kcalPerMl),
    aluminumMcgPerL: p.aluminumMcgPerL === undefined ? null : new D(p.aluminumMcgPerL),
    orderSpecies: defaultOrderSpecies(perMl), strength: null, salts: p.salts ?? [], sources: {},
    particlePerMl: particlesPerMl(perMl, nutrient),
  };
}

/** A salt with its molar mass (tests pass a reference library's value). */
export function salt(name: string, formula: string, molarMass: number | string, mgPerMl: number | string, yields: Partial<Record<SpeciesId, number>>): Salt {
  const y: Partial<Record<SpeciesId, D>> = {};
  for (const [k, v] of Object.entries(yields)) y[k as SpeciesId] = new D(v);
  return { name, formula, molarMass: new D(molarMass), mgPerMl: new D(mgPerMl), yields: y };
}

export const WATER = product({ id: 'water', role: 'water', mOsmPerMl: 0 });

/** Evaluate an order file against test products; throws with the problems if the order is invalid. */
export function evaluate(products: Product[], order: Record<string, unknown>, policy: Policy = DEFAULT_POLICY) {
  const r = checkOrder({ id: 'T-1', patient: { id: 'P-1', weightKg: 70, ageGroup: 'adult' }, route: 'central', ...order }, makeCatalog([...products, WATER]), policy);
  if (!r.ok) throw new Error(r.problems.map((p) => `${p.path}: ${p.message}`).join('\n'));
  return r.value;
}
