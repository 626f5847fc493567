import { D, ZERO } from '../decimal.ts';
import { fmt } from '../format.ts';
import { ruleFor, type Rule, type RuleCode } from '../policy.ts';
import { perLitre, type Bag } from '../compute/bag.ts';
import { fromRule, type Check, type Finding } from '../findings.ts';
import { kept, outside, rangeText, reportedLimit, DEFER, numberText, type ScreenWords } from './limits.ts';
import { GROUP, inBagGroups, linesIn, type InBagGroups } from './lineGroups.ts';

// Dextrose monohydrate C6H12O6·H2O 198.17 g/mol and anhydrous glucose 180.16 g/mol (IUPAC atomic weights):
// the ASPEN minimum is written for the monohydrate, so anhydrous grams count × 198.17/180.16.
const MONOHYDRATE_PER_ANHYDROUS = new D('198.17').div('180.16');
const CATIONS = GROUP.Na | GROUP.K | GROUP.Ca | GROUP.Mg;

/** Final dextrose % counted as monohydrate (hydrous) dextrose, the basis of the ASPEN 2014 minimum. */
export function dextroseMonohydratePercent(bag: Bag): D {
  if (bag.finalVolumeMl.isZero()) return ZERO;
  let grams = ZERO;
  for (const l of bag.lines) {
    const n = l.product.nutrient;
    if (l.product.role !== 'dextrose' || !n) continue;
    const g = n.gramsPerMl.times(l.volumeMl);
    grams = grams.plus(n.basis === 'anhydrous' ? g.times(MONOHYDRATE_PER_ANHYDROUS) : g);
  }
  return grams.div(bag.finalVolumeMl).times(100);
}

/** Cation loads of a bag, mmol/L: monovalent (Na + K), divalent (Ca + Mg), trivalent (none in the species table). */
export function cationLoads(bag: Bag): { monovalent: D; divalent: D; trivalent: D } {
  const V = bag.finalVolumeMl;
  const m = bag.speciesMmol;
  return { monovalent: perLitre(m.Na.plus(m.K), V), divalent: perLitre(m.Ca.plus(m.Mg), V), trivalent: ZERO };
}

/**
 * Critical aggregation number, mmol/L: CAN = a + 64·b + 729·c for mono-, di- and trivalent
 * cations (Schulze–Hardy weights z⁶). Example: a 53.3, b 3.86, c 0 → 300.3.
 */
export function criticalAggregationNumber(loads: { monovalent: D; divalent: D; trivalent: D }): D {
  return loads.monovalent.plus(loads.divalent.times(64)).plus(loads.trivalent.times(729));
}

/** One of the three minimums: its rule, the words that open its message, its nutrient and screen, and the group of its lines. */
interface Minimum { id: RuleCode; head: string; nutrient: string; screen: string; group: number }

const MINIMUMS: readonly Minimum[] = [
  { id: 'tna-amino-acids-min', head: '3-in-1 final amino acids ', nutrient: 'amino-acids', screen: 'amino-acids-minimum', group: GROUP.aminoAcids },
  { id: 'tna-dextrose-min', head: '3-in-1 final dextrose (as monohydrate) ', nutrient: 'dextrose', screen: 'dextrose-minimum', group: GROUP.dextrose },
  { id: 'tna-lipid-min', head: '3-in-1 final lipid ', nutrient: 'lipid', screen: 'lipid-minimum', group: GROUP.lipid },
];

// Each rule's words after the figure, made once.
const minimumWords = new WeakMap<Rule, ScreenWords>();
const divalentWords = new WeakMap<Rule, ScreenWords>();

function minimumWordsOf(rule: Rule): ScreenWords {
  return {
    over: `% is below the stability minimum of ${numberText(rule.min ?? ZERO)}%: the emulsion is less likely to stay stable for the usual hang and storage time. Consider a 2-in-1 with the lipid given separately, or shorten the storage time. ${DEFER}`,
    within: `% meets the stability minimum (${rangeText(rule)}).`,
  };
}

function divalentWordsOf(rule: Rule): ScreenWords {
  return {
    over: ` mmol/L are over the 3-in-1 limit of ${numberText(rule.max ?? ZERO)} mmol/L: divalent cations destabilise the emulsion. ${DEFER}`,
    within: ` mmol/L are within the 3-in-1 limit (${rangeText(rule)}).`,
  };
}

// The critical aggregation number's words after its figure: the formula's legend, the threshold, and
// whether the figure is over it.
const canWords = new WeakMap<Rule, ScreenWords>();

function canWordsOf(rule: Rule): ScreenWords {
  const legend = ' mmol/L (a: Na + K, b: Ca + Mg, c: trivalent cations, each mmol/L)';
  const threshold = rule.max ? `; the policy's threshold is ${numberText(rule.max)}` : '; no threshold is set, as no reliable published one exists';
  return { over: `${legend}${threshold}. It is over the threshold. ${DEFER}`, within: `${legend}${threshold}.` };
}

function minimumFinding(rule: Rule | null, value: D, minimum: Minimum, lines: InBagGroups): Finding | null {
  if (!rule?.min) return null;
  const crossed = outside(value, rule);
  const words = kept(minimumWords, rule, minimumWordsOf);
  return fromRule('tna-stability', rule, {
    value, limit: reportedLimit(rule, crossed), decimals: 2, screen: minimum.screen, nutrient: minimum.nutrient,
    message: minimum.head + fmt(value, 2) + (crossed === 'min' ? words.over : words.within),
    lines: linesIn(lines, minimum.group), within: crossed === null,
  });
}

/**
 * 3-in-1 stability (`tna-stability`), for bags with lipid: final amino acids, dextrose
 * (as monohydrate) and lipid against the policy's minimums (ASPEN 2014: 4%, 10%, 2%), the
 * divalent cation load (Ca + Mg mmol/L) against its limit, and the critical aggregation number
 * shown as information with its formula (a threshold only when the policy sets one).
 */
export const tnaStability: Check = (bag, policy) => {
  if (!bag.grams.lipid.gt(0) || bag.finalVolumeMl.isZero()) return [];
  const age = bag.order.patient.ageGroup;
  const lines = inBagGroups(bag);
  const out: Finding[] = [];
  for (let i = 0; i < MINIMUMS.length; i++) {
    const minimum = MINIMUMS[i]!;
    const value = i === 0 ? bag.percent.aminoAcids : i === 1 ? dextroseMonohydratePercent(bag) : bag.percent.lipid;
    const f = minimumFinding(ruleFor(policy, minimum.id, age), value, minimum, lines);
    if (f) out.push(f);
  }
  const loads = cationLoads(bag);
  const divalentText = fmt(loads.divalent, 2);
  const divalentRule = ruleFor(policy, 'tna-divalent', age);
  if (divalentRule?.max) {
    const crossed = outside(loads.divalent, divalentRule);
    const words = kept(divalentWords, divalentRule, divalentWordsOf);
    out.push(fromRule('tna-stability', divalentRule, {
      value: loads.divalent, limit: divalentRule.max, decimals: 2, screen: 'divalent-cations',
      message: `Divalent cations (calcium + magnesium) ${divalentText}${crossed ? words.over : words.within}`,
      lines: linesIn(lines, GROUP.Ca | GROUP.Mg),
      within: crossed === null,
    }));
  }
  const canRule = ruleFor(policy, 'tna-can', age);
  if (canRule) {
    const can = criticalAggregationNumber(loads);
    const crossed = canRule.max ? outside(can, canRule) : null;
    const words = kept(canWords, canRule, canWordsOf);
    out.push(fromRule('tna-stability', canRule, {
      value: can, limit: canRule.max, decimals: 1, screen: 'critical-aggregation-number',
      message: `Critical aggregation number (information): CAN = a + 64b + 729c = ${fmt(loads.monovalent, 2)} + 64 × ${divalentText} + 729 × ${fmt(loads.trivalent, 2)} = ${fmt(can, 1)}${crossed ? words.over : words.within}`,
      lines: linesIn(lines, CATIONS),
      within: crossed === null,
    }));
  }
  return out;
};
