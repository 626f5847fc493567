import { D, ZERO } from '../decimal.ts';
import { fmt } from '../format.ts';
import { doseRangeFor, DOSE_NUTRIENTS, type DoseNutrient, type Rule } from '../policy.ts';
import { perKgOf, type Bag, type BagLine } from '../compute/bag.ts';
import type { SpeciesId } from '../species.ts';
import { as, mmolToMEq } from '../units.ts';
import { fromRule, type Check, type Finding } from '../findings.ts';
import { asInfo, outside, rangeText, reportedLimit, AGE_LABEL, DEFER } from './limits.ts';

const LABEL: Readonly<Record<DoseNutrient, string>> = {
  fluid: 'Fluid', energy: 'Energy', protein: 'Protein (amino acids)', lipid: 'Lipid', lipidRate: 'Lipid infusion rate',
  Na: 'Sodium', K: 'Potassium', Ca: 'Calcium', Mg: 'Magnesium', phosphate: 'Phosphate (inorganic + organic)', npcToN: 'Non-protein kcal to nitrogen',
};

const DECIMALS: Readonly<Record<DoseNutrient, number>> = {
  fluid: 1, energy: 1, protein: 2, lipid: 2, lipidRate: 3, Na: 2, K: 2, Ca: 2, Mg: 2, phosphate: 2, npcToN: 0,
};

const ION: Partial<Record<DoseNutrient, SpeciesId>> = { Na: 'Na', K: 'K', Ca: 'Ca', Mg: 'Mg' };

/**
 * A nutrient's dose in the unit the policy writes its range in; null when the bag has none to
 * measure (no amino acids for NPC:N) or the unit is unknown. The bag is one day's supply, so its
 * amounts are per day; `/kg` divides by the dosing weight. Example: 2000 mL for 68 kg in
 * `mL/kg/day` → 29.41.
 */
export function doseIn(bag: Bag, nutrient: DoseNutrient, unit: string): D | null {
  const perKg = unit.includes('/kg');
  const scale = (x: D) => (perKg ? perKgOf(bag, x) : x);
  switch (nutrient) {
    case 'fluid': return scale(bag.finalVolumeMl);
    case 'energy': return scale(bag.kcal.total);
    case 'protein': return scale(bag.grams.aminoAcids);
    case 'lipid': return scale(bag.grams.lipid);
    case 'lipidRate': return unit === 'g/kg/h' ? perKgOf(bag, bag.grams.lipid).div(bag.hours) : null;
    case 'phosphate': return scale(bag.speciesMmol.phosphate.plus(bag.speciesMmol.glycerophosphate));
    case 'npcToN': return bag.npcToN;
    case 'Na': case 'K': case 'Ca': case 'Mg': {
      const mmol = bag.speciesMmol[nutrient];
      return scale(unit.startsWith('mEq') ? mmolToMEq(nutrient, as(mmol, 'mmol')) : mmol);
    }
  }
}

function contributes(l: BagLine, nutrient: DoseNutrient): boolean {
  const ion = ION[nutrient];
  if (ion) return l.stock.holds.has(ion);
  switch (nutrient) {
    case 'protein': return l.product.role === 'amino-acids';
    case 'lipid': case 'lipidRate': return l.product.role === 'lipid';
    case 'phosphate': return l.stock.holds.has('phosphate') || l.stock.holds.has('glycerophosphate');
    case 'energy': return l.kcal.gt(ZERO);
    case 'npcToN': return l.product.role === 'amino-acids' || l.product.role === 'dextrose' || l.product.role === 'lipid';
    default: return false;
  }
}

function contributingLines(bag: Bag, nutrient: DoseNutrient): number[] {
  const out: number[] = [];
  for (const l of bag.lines) if (l.inBag && contributes(l, nutrient)) out.push(l.line.index);
  return out;
}

function rangeFinding(bag: Bag, nutrient: DoseNutrient, rule: Rule): Finding | null {
  const value = doseIn(bag, nutrient, rule.unit);
  if (value === null) return null;
  // Nothing of it in the bag and no minimum: there is nothing to screen (e.g. lipid given separately).
  if (value.isZero() && !rule.min) return null;
  const decimals = DECIMALS[nutrient];
  // A dose is screened as it is shown: measured volumes (10 mEq calcium → 21.5 mL → 9.9975 mEq) that
  // display as the limit meet it, so the pharmacist never reads "10.00 against 10" as a warning.
  const crossed = outside(value.toDecimalPlaces(decimals), rule);
  const shown = `${LABEL[nutrient]} ${fmt(value, decimals)} ${rule.unit}`;
  const who = AGE_LABEL[bag.order.patient.ageGroup];
  const range = rangeText(rule);
  const message = nutrient === 'npcToN'
    ? crossed ? `${shown} is ${crossed === 'max' ? 'above' : 'below'} the usual range, ${range}.` : `${shown} is within the usual range, ${range}.`
    : crossed === 'max'
      ? `${shown} is above the range for ${who}, ${range}: confirm it is intended (for example replacement of losses). ${DEFER}`
      : crossed === 'min'
        ? `${shown} is below the range for ${who}, ${range}: confirm it is intended or given another way. ${DEFER}`
        : `${shown} is within the range for ${who}, ${range}.`;
  const f = fromRule('dose-range', rule, {
    value, limit: reportedLimit(rule, crossed), decimals, message, nutrient,
    lines: contributingLines(bag, nutrient),
    fields: nutrient === 'fluid' ? ['volumeMl'] : nutrient === 'lipidRate' ? ['hours'] : [],
  });
  return crossed ? f : asInfo(f);
}

/**
 * Dose ranges (`dose-range`): one finding per nutrient the policy ranges for the age group —
 * fluid, energy, protein, lipid (per day and per hour at the bag's rate), sodium, potassium,
 * calcium, magnesium, phosphate (inorganic and organic) — in the policy's unit, per kg per day
 * or per day; NPC:N as information. Within the range a finding is information.
 */
export const doseRange: Check = (bag, policy) => {
  if (bag.finalVolumeMl.isZero()) return [];
  const out: Finding[] = [];
  for (const nutrient of DOSE_NUTRIENTS) {
    const rule = doseRangeFor(policy, nutrient, bag.order.patient.ageGroup);
    if (!rule || (!rule.min && !rule.max)) continue;
    const f = rangeFinding(bag, nutrient, rule);
    if (f) out.push(f);
  }
  return out;
};
