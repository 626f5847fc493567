import { D, ZERO } from './decimal.ts';
import type { SpeciesId } from './species.ts';
import type { Salt } from './catalog.ts';

/**
 * mmol per mL of each species delivered by a stock's salts: Σ (mg/mL ÷ g/mol) × particles of that species.
 * Example: sodium chloride 234 mg/mL (58.44 g/mol) → Na 4.004, Cl 4.004 mmol/mL.
 */
export function speciesFromSalts(salts: readonly Salt[]): Partial<Record<SpeciesId, D>> {
  const out: Partial<Record<SpeciesId, D>> = {};
  for (const salt of salts) {
    const mmolPerMl = salt.mgPerMl.div(salt.molarMass);
    for (const [species, count] of Object.entries(salt.yields) as [SpeciesId, D][]) {
      out[species] = (out[species] ?? ZERO).plus(mmolPerMl.times(count));
    }
  }
  return out;
}

/**
 * Ideal osmolarity of a stock from its salts (USP ‹785›: g/L ÷ MW × particles × 1000), mOsm/L.
 * Example: sodium chloride 23.4% → 8008 mOsm/L, the labelled value.
 */
export function idealOsmolarityFromSalts(salts: readonly Salt[]): D {
  let total = ZERO;
  for (const v of Object.values(speciesFromSalts(salts))) if (v) total = total.plus(v);
  return total.times(1000);
}
