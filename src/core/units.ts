import { D } from './decimal.ts';
import { SPECIES, type SpeciesId } from './species.ts';

declare const brand: unique symbol;
/** A decimal that carries its unit in the type, so mEq cannot be passed where mmol is expected. */
export type Quantity<U extends string> = D & { readonly [brand]: U };

export type Mmol = Quantity<'mmol'>;
export type MEq = Quantity<'mEq'>;
export type Mg = Quantity<'mg'>;
export type Ml = Quantity<'mL'>;
export type Grams = Quantity<'g'>;

/** Tag a decimal with its unit (the only cast between plain decimals and quantities). */
export function as<U extends string>(value: D, _unit: U): Quantity<U> {
  return value as Quantity<U>;
}

/** Error for a conversion that has no meaning (mEq of a species without a defined charge). */
export class UnitError extends Error {}

// |charge| of every charged species, as decimals made once.
const VALENCES: Partial<Record<SpeciesId, D>> = {};
for (const s of Object.values(SPECIES)) if (s.charge !== null && s.charge !== 0) VALENCES[s.id] = new D(Math.abs(s.charge));

function valence(species: SpeciesId): D {
  const v = VALENCES[species];
  if (!v) throw new UnitError(`${SPECIES[species].label} has no defined charge: order it in mmol, not mEq`);
  return v;
}

/** mEq → mmol (divide by |charge|). Phosphate species have no mEq. Example: 10 mEq Ca → 5 mmol. */
export function mEqToMmol(species: SpeciesId, amount: MEq): Mmol {
  return as(amount.div(valence(species)), 'mmol');
}

/** mmol → mEq (multiply by |charge|). Example: 2.03 mmol Mg → 4.06 mEq. */
export function mmolToMEq(species: SpeciesId, amount: Mmol): MEq {
  return as(amount.times(valence(species)), 'mEq');
}

/** mg → mmol by the species' molar mass. Example: 93 mg P → 3.0 mmol. */
export function mgToMmol(species: SpeciesId, amount: Mg): Mmol {
  return as(amount.div(SPECIES[species].molarMass), 'mmol');
}

/** mmol → mg by the species' molar mass. */
export function mmolToMg(species: SpeciesId, amount: Mmol): Mg {
  return as(amount.times(SPECIES[species].molarMass), 'mg');
}

/** A per-kg amount times the dosing weight gives the per-day (per-bag) amount. */
export function perKgToPerDay<U extends string>(amount: Quantity<U>, weightKg: D): Quantity<U> {
  return amount.times(weightKg) as Quantity<U>;
}

/** A per-day amount divided by the dosing weight gives the per-kg amount. */
export function perDayToPerKg<U extends string>(amount: Quantity<U>, weightKg: D): Quantity<U> {
  return amount.div(weightKg) as Quantity<U>;
}
