import { D, ZERO } from '../decimal.ts';
import { as, mEqToMmol, type MEq } from '../units.ts';
import { baseUnit, isPerKg, type OrderLine, type BaseUnit } from '../order.ts';

/** A line's amount per day (per bag) in its base unit: per-kg amounts are multiplied by the weight. */
export function perDayAmount(line: Extract<OrderLine, { kind: 'amount' }>, weightKg: D): { amount: D; unit: BaseUnit } {
  return { amount: isPerKg(line.unit) ? line.amount.times(weightKg) : line.amount, unit: baseUnit(line.unit) };
}

/**
 * Stock volume (mL) that delivers a line's amount (`perDay`: its per-day amount, when already worked out).
 * Example: 150 g from dextrose 70% (0.7 g/mL) → 214.2857… mL; 15 mmol phosphate at 3 mmol/mL → 5 mL.
 */
export function lineVolumeMl(line: Extract<OrderLine, { kind: 'amount' }>, weightKg: D, perDay = perDayAmount(line, weightKg)): D {
  const { amount, unit } = perDay;
  const product = line.product;
  switch (unit) {
    case 'mL':
      return amount;
    case 'g':
      // parseOrder guarantees a nutrient for `g` lines.
      return product.nutrient ? amount.div(product.nutrient.gramsPerMl) : ZERO;
    case 'mEq':
    case 'mmol': {
      const species = line.species;
      const perMl = species ? product.perMl[species] : undefined;
      if (!species || !perMl || perMl.isZero()) return ZERO;
      const mmol = unit === 'mEq' ? mEqToMmol(species, as<'mEq'>(amount, 'mEq') as MEq) : amount;
      return mmol.div(perMl);
    }
  }
}
