import { ZERO, type D } from '../decimal.ts';
import { fmt } from '../format.ts';
import { ruleFor, type Policy, type Rule } from '../policy.ts';
import type { Route } from '../order.ts';
import { perLitreOf, type Bag, type BagLine } from '../compute/bag.ts';
import { as, mmolToMEq } from '../units.ts';
import type { Product } from '../catalog.ts';
import { fromRule, NO_LINES, type Check, type Finding } from '../findings.ts';
import { kept, outside, settled, DEFER, numberText, type ScreenWords } from './limits.ts';
import { anyIn, GROUP, inBagGroups, linesIn, type InBagGroups } from './lineGroups.ts';
import { curveFor, readCurve } from './solubilityCurve.ts';

/** Calcium and phosphate of a bag as the screens read them, per litre of the final volume. */
export interface CalciumPhosphateLevels {
  calciumMmolPerL: D;
  calciumMEqPerL: D;
  /** Inorganic phosphate (sodium/potassium phosphates), mmol P/L: the only phosphate the screens count. */
  inorganicPhosphateMmolPerL: D;
  /** Organic phosphate (glycerophosphate), mmol P/L: reported separately, never in the inorganic term. */
  organicPhosphateMmolPerL: D;
}

/** Calcium (mmol/L and mEq/L) and phosphate, inorganic and organic, of the bag. */
export function calciumPhosphateLevels(bag: Bag): CalciumPhosphateLevels {
  const calciumMmolPerL = perLitreOf(bag, bag.speciesMmol.Ca);
  return {
    calciumMmolPerL,
    calciumMEqPerL: mmolToMEq('Ca', as(calciumMmolPerL, 'mmol')),
    inorganicPhosphateMmolPerL: perLitreOf(bag, bag.speciesMmol.phosphate),
    organicPhosphateMmolPerL: perLitreOf(bag, bag.speciesMmol.glycerophosphate),
  };
}

const SCREENS_ONLY = 'These are screens only: the solubility curve of the amino-acid product in this bag, at its amino-acid %, temperature and hang time, decides.';

// Each rule's words after the figures, made once: the product rule is the route's own
// (calcium-phosphate-product-central or -peripheral), so its words name the route it is read for.
const productWords = new WeakMap<Rule, ScreenWords>();
const sumWords = new WeakMap<Rule, ScreenWords>();

function productWordsOf(rule: Rule, route: Route): ScreenWords {
  const bound = numberText(rule.max ?? ZERO);
  return { over: ` mmol²/L², over the ${route} product screen of ${bound}.`, within: ` mmol²/L², within the ${route} product screen of ${bound}.` };
}
const centralProductWords = (rule: Rule): ScreenWords => productWordsOf(rule, 'central');
const peripheralProductWords = (rule: Rule): ScreenWords => productWordsOf(rule, 'peripheral');

function sumWordsOf(rule: Rule): ScreenWords {
  const bound = numberText(rule.max ?? ZERO);
  return { over: `, over the sum screen of ${bound}. ${SCREENS_ONLY} ${DEFER}`, within: `, within the sum screen of ${bound}. ${SCREENS_ONLY} ${DEFER}` };
}

const SCREENS_ONLY_DEFER = ` ${SCREENS_ONLY} ${DEFER}`;
const CHLORIDE_MESSAGE = `Calcium chloride with inorganic phosphate: calcium chloride dissociates more than calcium gluconate, so less phosphate stays in solution, whatever the screens above say. Use calcium gluconate, or confirm this combination against a solubility curve made with calcium chloride. ${DEFER}`;

/** What aminoAcidsOf gives for a bag holding more than one amino-acid product. */
const MIXED = 'mixed';

/** The bag's amino-acid product; MIXED when it holds more than one, null without amino acids. */
function aminoAcidsOf(lines: InBagGroups): Product | typeof MIXED | null {
  let product: Product | null = null;
  for (let i = 0; i < lines.count; i++) {
    if ((lines.groups[i]! & GROUP.aminoAcids) === 0) continue;
    const p = lines.product[i]!;
    if (!product || product.id === p.id) product = p;
    else return MIXED;
  }
  return product;
}

/** How the product screen's message ends when a note on the curve goes before the deference. */
function withNote(note: string): string {
  return ` ${SCREENS_ONLY} ${note} ${DEFER}`;
}

const NO_AMINO_ACIDS_END = withNote('The bag has no amino acids: published curves do not cover it.');
const MIXED_END = withNote('The bag mixes amino-acid products: no single product curve applies.');

// For each amino-acid product, the end of the message when the policy holds no curve for it (made once).
const noCurveEnds = new WeakMap<Product, string>();

function noCurveEndOf(product: Product): string {
  return withNote(`No solubility curve for ${product.name} is on file in the policy: check the published curve.`);
}

/**
 * What the calcium–phosphate screens of a bag read whatever its route: the levels and their texts, the
 * lines the product, sum and curve screens name, and the curve screen. `on` holds what they were worked
 * out from (see sharedOf).
 */
interface Shared {
  on: { lines: readonly BagLine[]; speciesMmol: Bag['speciesMmol']; finalVolumeMl: D; percent: Bag['percent']; patient: Bag['order']['patient']; policy: Policy };
  lv: CalciumPhosphateLevels;
  calciumText: string;
  /** '' without inorganic phosphate. */
  inorganicText: string;
  /** '' without organic phosphate. */
  organicText: string;
  caAndP: number[];
  curve: Finding | string | null;
}

// The last bag's shared part: the product screen and the others run one after the other on a bag, and the
// solver's route re-check of a bag on another route (which shares the bag's figures) runs the product screen alone.
let last: Shared | null = null;

/**
 * The shared part of the screens for a bag; null when no screen applies (no calcium, or no phosphate).
 * Kept for the last bag, and given again for a bag made of the same figures (the same bag on another
 * route): a bag's figures are never changed once computed, and the policy is an immutable value.
 */
function sharedOf(bag: Bag, policy: Policy): Shared | null {
  const on = last?.on;
  if (on && on.lines === bag.lines && on.speciesMmol === bag.speciesMmol && on.finalVolumeMl === bag.finalVolumeMl
    && on.percent === bag.percent && on.patient === bag.order.patient && on.policy === policy) return last;
  const lv = calciumPhosphateLevels(bag);
  const pInorganic = lv.inorganicPhosphateMmolPerL;
  const pOrganic = lv.organicPhosphateMmolPerL;
  if (!lv.calciumMmolPerL.gt(0) || !(pInorganic.gt(0) || pOrganic.gt(0))) return null;
  const lines = inBagGroups(bag);
  // The calcium lines, then the inorganic phosphate ones: the lines the product, sum and curve screens name.
  const caAndP = pInorganic.gt(0) ? linesIn(lines, GROUP.Ca, GROUP.phosphate) : NO_LINES;
  last = {
    on: { lines: bag.lines, speciesMmol: bag.speciesMmol, finalVolumeMl: bag.finalVolumeMl, percent: bag.percent, patient: bag.order.patient, policy },
    lv,
    calciumText: fmt(lv.calciumMmolPerL, 2),
    inorganicText: pInorganic.gt(0) ? fmt(pInorganic, 2) : '',
    organicText: pOrganic.gt(0) ? fmt(pOrganic, 2) : '',
    caAndP,
    curve: curveScreen(bag, policy, lv, lines, caAndP),
  };
  return last;
}

/**
 * The calcium–phosphate product screen (`calcium-phosphate`, screen `product`): the Knight 1983 product of
 * calcium and inorganic phosphate (mmol/L × mmol/L) against the route's limit. The one screen that reads
 * the route; calciumPhosphateScreens has the others, whose findings follow this one.
 */
export const calciumPhosphateProduct: Check = (bag, policy) => {
  if (bag.finalVolumeMl.isZero()) return [];
  const s = sharedOf(bag, policy);
  if (!s || s.inorganicText === '') return [];
  const route = bag.order.route;
  const productRule = ruleFor(policy, route === 'central' ? 'calcium-phosphate-product-central' : 'calcium-phosphate-product-peripheral', bag.order.patient.ageGroup);
  if (!productRule?.max) return [];
  const { lv, curve } = s;
  const product = lv.calciumMmolPerL.times(lv.inorganicPhosphateMmolPerL);
  const over = outside(product, productRule) === 'max';
  const words = kept(productWords, productRule, route === 'central' ? centralProductWords : peripheralProductWords);
  const organicNote = s.organicText === '' ? '' : ` Organic phosphate (glycerophosphate) ${s.organicText} mmol/L is not counted in the inorganic term.`;
  return [fromRule('calcium-phosphate', productRule, {
    value: product, limit: productRule.max, decimals: 1, screen: 'product',
    message: `Ca × P = ${s.calciumText} mmol/L calcium × ${s.inorganicText} mmol/L inorganic phosphate = ${fmt(product, 1)}${over ? words.over : words.within}${organicNote}${typeof curve === 'string' ? curve : SCREENS_ONLY_DEFER}`,
    lines: s.caAndP,
    within: !over,
  })];
};

/**
 * The calcium–phosphate screens that do not read the route (`calcium-phosphate`): the sum screen
 * (Ca mEq/L + P mmol/L), organic phosphate reported separately, calcium chloride with inorganic
 * phosphate, the amino-acid product's solubility curve when the policy holds one, and the 3-in-1 note
 * (a precipitate cannot be seen in an emulsion). Each screen within its limit is reported as
 * information; limits, severities and sources come from the policy.
 */
export const calciumPhosphateScreens: Check = (bag, policy) => {
  if (bag.finalVolumeMl.isZero()) return [];
  const s = sharedOf(bag, policy);
  if (!s) return [];
  const { lv, inorganicText, organicText } = s;
  const pInorganic = lv.inorganicPhosphateMmolPerL;
  const pOrganic = lv.organicPhosphateMmolPerL;
  const age = bag.order.patient.ageGroup;
  const lines = inBagGroups(bag);
  const out: Finding[] = [];

  if (inorganicText !== '') {
    const sumRule = ruleFor(policy, 'calcium-phosphate-sum', age);
    if (sumRule?.max) {
      const total = lv.calciumMEqPerL.plus(pInorganic);
      const over = outside(total, sumRule) === 'max';
      const words = kept(sumWords, sumRule, sumWordsOf);
      out.push(fromRule('calcium-phosphate', sumRule, {
        value: total, limit: sumRule.max, decimals: 1, screen: 'sum',
        message: `Ca + P = ${fmt(lv.calciumMEqPerL, 2)} mEq/L calcium + ${inorganicText} mmol/L inorganic phosphate = ${fmt(total, 1)}${over ? words.over : words.within}`,
        lines: s.caAndP,
        within: !over,
      }));
    }
    const chlorideRule = ruleFor(policy, 'calcium-chloride-phosphate', age);
    if (chlorideRule && anyIn(lines, GROUP.calciumChloride)) {
      out.push(fromRule('calcium-phosphate', chlorideRule, {
        value: null, limit: null, decimals: 0, screen: 'calcium-chloride',
        message: CHLORIDE_MESSAGE,
        lines: linesIn(lines, GROUP.calciumChloride, GROUP.phosphate),
      }));
    }
  }

  if (organicText !== '') {
    const organicRule = ruleFor(policy, 'calcium-phosphate-organic', age);
    if (organicRule) {
      const over = outside(pOrganic, organicRule) === 'max';
      const noInorganic = inorganicText !== '' ? '' : ' With no inorganic phosphate, the inorganic screens are not triggered.';
      const limitText = organicRule.max ? ` Tested up to ${numberText(organicRule.max)} mmol/L${over ? ': this bag is beyond what was tested' : ''} (calcium here ${s.calciumText} mmol/L).` : '';
      out.push(fromRule('calcium-phosphate', organicRule, {
        value: pOrganic, limit: organicRule.max, decimals: 2, screen: 'organic-phosphate',
        message: `Organic phosphate (glycerophosphate) ${organicText} mmol/L is reported separately: organic phosphate salts stay in solution with calcium far above inorganic ones.${limitText}${noInorganic} ${DEFER}`,
        lines: linesIn(lines, GROUP.glycerophosphate, GROUP.Ca),
        within: !over,
      }));
    }
  }

  if (s.curve !== null && typeof s.curve !== 'string') out.push(s.curve);

  const lipidRule = ruleFor(policy, 'calcium-phosphate-in-lipid', age);
  if (lipidRule && bag.grams.lipid.gt(0)) {
    out.push(fromRule('calcium-phosphate', lipidRule, {
      value: null, limit: null, decimals: 0, screen: 'hidden-by-lipid',
      message: 'This is a 3-in-1: a calcium phosphate precipitate cannot be seen in the emulsion, so visual inspection cannot rule it out. Rely on the curve and the screens, and use the in-line filter the policy requires.',
      lines: linesIn(lines, GROUP.Ca, GROUP.phosphate, GROUP.glycerophosphate),
    }));
  }
  return out;
};

/**
 * Calcium–phosphate screens (`calcium-phosphate`), all of them in the order a report lists them: the
 * product screen (calciumPhosphateProduct), then the others (calciumPhosphateScreens).
 */
export const calciumPhosphate: Check = (bag, policy) => {
  const product = calciumPhosphateProduct(bag, policy);
  const rest = calciumPhosphateScreens(bag, policy);
  if (product.length === 0) return rest;
  for (const f of rest) product.push(f);
  return product;
};

/**
 * The solubility-curve screen: its finding when a curve applies; else, when the policy screens by curve,
 * how the product screen's message ends (a note on the curve, then the deference); else null.
 */
function curveScreen(bag: Bag, policy: Policy, lv: CalciumPhosphateLevels, inBag: InBagGroups, caAndP: number[]): Finding | string | null {
  const rule = ruleFor(policy, 'calcium-phosphate-curve', bag.order.patient.ageGroup);
  if (!rule || !lv.inorganicPhosphateMmolPerL.gt(0)) return null;
  const only = aminoAcidsOf(inBag);
  if (!only) return NO_AMINO_ACIDS_END;
  if (only === MIXED) return MIXED_END;
  const aaPercent = bag.percent.aminoAcids;
  const curve = curveFor(policy.solubilityCurves, only.id, aaPercent);
  if (!curve) {
    let productHasCurves = false;
    for (const c of policy.solubilityCurves) if (c.aminoAcidProduct === only.id) productHasCurves = true;
    return productHasCurves
      ? withNote(`The policy's curves for ${only.name} start above this bag's ${fmt(aaPercent, 2)}% amino acids: check the published curve.`)
      : kept(noCurveEnds, only, noCurveEndOf);
  }
  const p = lv.inorganicPhosphateMmolPerL;
  const ca = lv.calciumMEqPerL;
  const reading = readCurve(curve, ca);
  const conditions = [curve.temperatureC ? `${numberText(curve.temperatureC)} °C` : '', curve.hours ? `${numberText(curve.hours)} h` : ''].filter((x) => x !== '').join(', ');
  const curveName = `the ${curve.id} curve (${only.name} at ${numberText(curve.aminoAcidPercent)}% amino acids${conditions ? `, ${conditions}` : ''}; ${curve.source})`;
  const source = `${rule.source}; curve: ${curve.source}`;
  if (reading.where === 'beyond-last-point') {
    return fromRule('calcium-phosphate', rule, {
      value: ca, limit: reading.lastCalciumMEqPerL, decimals: 2, screen: 'solubility-curve',
      message: `Calcium ${fmt(ca, 2)} mEq/L is beyond the last point of ${curveName}: the curve does not show any phosphate compatible at this calcium. ${DEFER}`,
      lines: caAndP, unit: 'mEq/L', source,
    });
  }
  const limit = reading.maxPhosphateMmolPerL;
  const margin = limit.minus(p);
  const over = settled(p).gt(settled(limit));
  const below = reading.where === 'below-first-point' ? ` (calcium is below the curve's first point, whose phosphate is used)` : '';
  return fromRule('calcium-phosphate', rule, {
    value: p, limit, decimals: 2, screen: 'solubility-curve',
    message: `Inorganic phosphate ${fmt(p, 2)} mmol/L against ${curveName}: at ${fmt(ca, 2)} mEq/L calcium the curve allows ${fmt(limit, 2)} mmol/L${below}; ${over ? `over it by ${fmt(margin.neg(), 2)}` : `margin ${fmt(margin, 2)}`} mmol/L. ${DEFER}`,
    lines: caAndP, unit: 'mmol/L', source, within: !over,
  });
}
