import type { D } from '../decimal.ts';
import { fmt, fmtScaled } from '../format.ts';
import type { AgeGroup } from '../order.ts';
import { doseRangeFor, DOSE_NUTRIENTS, type DoseNutrient, type Policy, type Rule } from '../policy.ts';
import { perKgOf, type Bag } from '../compute/bag.ts';
import { as, mmolToMEq } from '../units.ts';
import { NO_FIELDS, type Check, type Finding } from '../findings.ts';
import { outside, rangeText, reportedLimit, AGE_LABEL, DEFER } from './limits.ts';
import { GROUP, inBagGroups, linesIn, type InBagGroups } from './lineGroups.ts';

const LABEL: Readonly<Record<DoseNutrient, string>> = {
  fluid: 'Fluid', energy: 'Energy', protein: 'Protein (amino acids)', lipid: 'Lipid', lipidRate: 'Lipid infusion rate',
  Na: 'Sodium', K: 'Potassium', Ca: 'Calcium', Mg: 'Magnesium', phosphate: 'Phosphate (inorganic + organic)', npcToN: 'Non-protein kcal to nitrogen',
};

const DECIMALS: Readonly<Record<DoseNutrient, number>> = {
  fluid: 1, energy: 1, protein: 2, lipid: 2, lipidRate: 3, Na: 2, K: 2, Ca: 2, Mg: 2, phosphate: 2, npcToN: 0,
};

/** How a nutrient's dose is read from the bag, from the unit the policy writes its range in. */
interface DoseUnit {
  /** Per kg of dosing weight (`/kg` in the unit). */
  perKg: boolean;
  /** Ions in mEq rather than mmol. */
  mEq: boolean;
  /** The lipid rate in g/kg/h (the only rate unit it is read in). */
  perHour: boolean;
}

function doseUnit(unit: string): DoseUnit {
  return { perKg: unit.includes('/kg'), mEq: unit.startsWith('mEq'), perHour: unit === 'g/kg/h' };
}

/**
 * A nutrient's dose in the unit the policy writes its range in; null when the bag has none to
 * measure (no amino acids for NPC:N) or the unit is unknown. The bag is one day's supply, so its
 * amounts are per day; `/kg` divides by the dosing weight. Example: 2000 mL for 68 kg in
 * `mL/kg/day` → 29.41.
 */
export function doseIn(bag: Bag, nutrient: DoseNutrient, unit: string): D | null {
  return dose(bag, nutrient, doseUnit(unit));
}

function dose(bag: Bag, nutrient: DoseNutrient, unit: DoseUnit): D | null {
  let amount: D;
  switch (nutrient) {
    case 'fluid': amount = bag.finalVolumeMl; break;
    case 'energy': amount = bag.kcal.total; break;
    case 'protein': amount = bag.grams.aminoAcids; break;
    case 'lipid': amount = bag.grams.lipid; break;
    case 'lipidRate': return unit.perHour ? perKgOf(bag, bag.grams.lipid).div(bag.hours) : null;
    case 'npcToN': return bag.npcToN;
    // A sum, or a conversion, made for this dose alone: divided by the weight here (as perKgOf would), not
    // kept among the bag's per-kg figures, which hold the bag's own figures for the report to read again.
    case 'phosphate': {
      const mmol = bag.speciesMmol.phosphate.plus(bag.speciesMmol.glycerophosphate);
      return unit.perKg ? mmol.div(bag.order.patient.weightKg) : mmol;
    }
    case 'Na': case 'K': case 'Ca': case 'Mg': {
      const mmol = bag.speciesMmol[nutrient];
      if (!unit.mEq) { amount = mmol; break; }
      const mEq = mmolToMEq(nutrient, as(mmol, 'mmol'));
      return unit.perKg ? mEq.div(bag.order.patient.weightKg) : mEq;
    }
  }
  return unit.perKg ? perKgOf(bag, amount) : amount;
}

/** The lines that bring each nutrient: in the bag and in its GROUP. */
const CONTRIBUTORS: Readonly<Record<DoseNutrient, number>> = {
  fluid: 0, energy: GROUP.energy, protein: GROUP.aminoAcids, lipid: GROUP.lipid, lipidRate: GROUP.lipid,
  Na: GROUP.Na, K: GROUP.K, Ca: GROUP.Ca, Mg: GROUP.Mg, phosphate: GROUP.phosphate | GROUP.glycerophosphate,
  npcToN: GROUP.aminoAcids | GROUP.dextrose | GROUP.lipid,
};

/** One nutrient a policy ranges for an age group, with the parts of its finding that do not depend on the bag. */
interface DoseScreen {
  nutrient: DoseNutrient;
  rule: Rule;
  unit: DoseUnit;
  decimals: number;
  /** The message is `${head}${value}` and the tail for where the value falls. */
  head: string;
  above: string;
  below: string;
  within: string;
  contributors: number;
  /**
   * The bounds as whole numbers of 10^−decimals (min 0.8 at 2 decimals → 80), when both are exactly that
   * (else `scaled` is false): a dose rounded to its decimals is then screened without a decimal made for it.
   */
  scaled: boolean;
  minScaled: number | null;
  maxScaled: number | null;
}

/** A bound as a whole number of 10^−places, or NaN when it is not one (0.125 at 2 places). */
function scaledBound(bound: D | null, places: number): number {
  if (bound === null) return 0;
  const q = bound.toScaledInteger(places);
  return bound.toDecimalPlaces(places).eq(bound) && q < 1e15 && q > -1e15 ? q : NaN;
}

function doseScreen(nutrient: DoseNutrient, rule: Rule, ageGroup: AgeGroup): DoseScreen {
  const unit = ` ${rule.unit}`;
  const range = rangeText(rule);
  // NPC:N is information with a usual range; the doses are screened against the age group's range.
  const usual = nutrient === 'npcToN';
  const forWho = usual ? 'the usual range' : `the range for ${AGE_LABEL[ageGroup]}`;
  const minScaled = scaledBound(rule.min, DECIMALS[nutrient]);
  const maxScaled = scaledBound(rule.max, DECIMALS[nutrient]);
  return {
    nutrient, rule, unit: doseUnit(rule.unit), decimals: DECIMALS[nutrient], head: `${LABEL[nutrient]} `,
    above: usual ? `${unit} is above ${forWho}, ${range}.` : `${unit} is above ${forWho}, ${range}: confirm it is intended (for example replacement of losses). ${DEFER}`,
    below: usual ? `${unit} is below ${forWho}, ${range}.` : `${unit} is below ${forWho}, ${range}: confirm it is intended or given another way. ${DEFER}`,
    within: `${unit} is within ${forWho}, ${range}.`,
    contributors: CONTRIBUTORS[nutrient],
    scaled: !Number.isNaN(minScaled) && !Number.isNaN(maxScaled),
    minScaled: rule.min ? minScaled : null,
    maxScaled: rule.max ? maxScaled : null,
  };
}

// The screens of each policy and age group, in DOSE_NUTRIENTS order, worked out on first use: a policy is an
// immutable value (a new file or edit is parsed into a new one), and every bag of the age group is screened
// against the same ranges with the same words.
const screensByPolicy = new WeakMap<Policy, Partial<Record<AgeGroup, readonly DoseScreen[]>>>();

function doseScreens(policy: Policy, ageGroup: AgeGroup): readonly DoseScreen[] {
  let byAge = screensByPolicy.get(policy);
  if (!byAge) {
    byAge = {};
    screensByPolicy.set(policy, byAge);
  }
  let screens = byAge[ageGroup];
  if (!screens) {
    screens = DOSE_NUTRIENTS.flatMap((nutrient) => {
      const rule = doseRangeFor(policy, nutrient, ageGroup);
      return rule && (rule.min || rule.max) ? [doseScreen(nutrient, rule, ageGroup)] : [];
    });
    byAge[ageGroup] = screens;
  }
  return screens;
}

const FLUID_FIELDS = ['volumeMl'];
const RATE_FIELDS = ['hours'];

function rangeFinding(bag: Bag, screen: DoseScreen, lines: InBagGroups): Finding | null {
  const { nutrient, rule, decimals } = screen;
  const value = dose(bag, nutrient, screen.unit);
  if (value === null) return null;
  // Nothing of it in the bag and no minimum: there is nothing to screen (e.g. lipid given separately).
  if (value.isZero() && !rule.min) return null;
  // A dose is screened as it is shown: measured volumes (10 mEq calcium → 21.5 mL → 9.9975 mEq) that
  // display as the limit meet it, so the pharmacist never reads "10.00 against 10" as a warning. The
  // shown dose is the whole number q of 10^−decimals, and its text is written from q (as fmt would).
  const q = value.toScaledInteger(decimals);
  let crossed: 'min' | 'max' | null;
  let text: string;
  if (screen.scaled && q < 1e15 && q > -1e15) {
    const { minScaled, maxScaled } = screen;
    crossed = minScaled !== null && q < minScaled ? 'min' : maxScaled !== null && q > maxScaled ? 'max' : null;
    text = fmtScaled(q, decimals);
  } else {
    const shown = value.toDecimalPlaces(decimals);
    crossed = outside(shown, rule);
    text = fmt(shown, decimals);
  }
  // The finding as fromRule makes it, its fields in the same order, made here without a parts object:
  // a dose range makes about ten findings for every bag.
  return {
    code: 'dose-range', severity: crossed === null ? 'info' : rule.severity, unit: rule.unit, source: rule.source,
    value, limit: reportedLimit(rule, crossed), decimals,
    message: screen.head + text + (crossed === 'max' ? screen.above : crossed === 'min' ? screen.below : screen.within),
    lines: linesIn(lines, screen.contributors),
    fields: nutrient === 'fluid' ? FLUID_FIELDS : nutrient === 'lipidRate' ? RATE_FIELDS : NO_FIELDS,
    nutrient,
  };
}

/**
 * Dose ranges (`dose-range`): one finding per nutrient the policy ranges for the age group —
 * fluid, energy, protein, lipid (per day and per hour at the bag's rate), sodium, potassium,
 * calcium, magnesium, phosphate (inorganic and organic) — in the policy's unit, per kg per day
 * or per day; NPC:N as information. Within the range a finding is information.
 */
export const doseRange: Check = (bag, policy) => {
  if (bag.finalVolumeMl.isZero()) return [];
  const screens = doseScreens(policy, bag.order.patient.ageGroup);
  const lines = inBagGroups(bag);
  const out: Finding[] = [];
  for (let i = 0; i < screens.length; i++) {
    const f = rangeFinding(bag, screens[i]!, lines);
    if (f) out.push(f);
  }
  return out;
};
