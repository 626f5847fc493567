import { roundDivided, ZERO } from '../decimal.ts';
import { fmt } from '../format.ts';
import { ruleFor, type Rule } from '../policy.ts';
import type { Bag, BagLine } from '../compute/bag.ts';
import { fromRule, NO_LINES, type Check } from '../findings.ts';
import { kept, settled, DEFER, numberText, type ScreenWords } from './limits.ts';

/** How many contributors a message names. */
const TOP = 3;

/**
 * Put a line among the largest contributors `top` (at most TOP, most aluminum first), where a stable
 * sort of every line by descending aluminum would put it: after the lines with as much or more.
 */
function rank(top: BagLine[], l: BagLine): void {
  let at = top.length;
  while (at > 0 && top[at - 1]!.aluminumMcg.cmp(l.aluminumMcg) < 0) at--;
  if (at >= TOP) return;
  if (top.length < TOP) top.push(l);
  for (let i = top.length - 1; i > at; i--) top[i] = top[i - 1]!;
  top[at] = l;
}

const NO_VALUE = `No stock in this bag has an aluminum value in the catalog, so exposure cannot be estimated. Add each stock's labelled "contains no more than … µg/L" value. ${DEFER}`;
const CONSIDER = ` Consider lower-aluminum stocks. ${DEFER}`;

// Each rule's words after the figure, made once.
const limitWords = new WeakMap<Rule, ScreenWords>();

function limitWordsOf(rule: Rule): ScreenWords {
  const bound = numberText(rule.max ?? ZERO);
  return {
    over: ` µg/kg/day is at or above the limit of ${bound} µg/kg/day: it accumulates, above all with immature or impaired kidneys.`,
    within: ` µg/kg/day is below the limit of ${bound} µg/kg/day.`,
  };
}

function inBagLines(bag: Bag): number[] {
  const out: number[] = [];
  for (const l of bag.lines) if (l.inBag) out.push(l.line.index);
  return out;
}

/**
 * Aluminum exposure (`aluminum`), µg/kg/day: Σ each stock's labelled maximum (µg/L) × its volume,
 * ÷ the dosing weight (the bag is one day's supply). It flags at or above the policy limit
 * (21 CFR 201.323: more than 4–5 µg/kg/day accumulates), names the top contributors, and lists
 * the stocks in the bag without an aluminum value (the figure is then a lower bound).
 */
export const aluminum: Check = (bag, policy) => {
  const rule = ruleFor(policy, 'aluminum', bag.order.patient.ageGroup);
  if (!rule?.max || bag.finalVolumeMl.isZero()) return [];
  // One pass over the lines in the bag: which have a value, the largest contributors, the stocks without one.
  let known = false;
  const top: BagLine[] = [];
  // The stocks without a value, as the message lists them ("a; b; c"; Array join is slow for so few).
  let missing = '';
  for (const l of bag.lines) {
    if (!l.inBag) continue;
    if (l.product.aluminumMcgPerL === null) {
      missing = missing === '' ? l.product.name : `${missing}; ${l.product.name}`;
      continue;
    }
    known = true;
    if (l.aluminumMcg.gt(ZERO)) rank(top, l);
  }
  if (!known) {
    return [fromRule('aluminum', rule, {
      value: null, limit: rule.max, decimals: 2,
      message: NO_VALUE,
      lines: inBagLines(bag),
    })];
  }
  const value = bag.aluminumMcgPerKgPerDay;
  const total = bag.aluminumMcg;
  let topText = '';
  for (const l of top) {
    // The share, as fmt(aluminum ÷ total × 100, 0) writes it, without the decimals made for it.
    topText += `${topText === '' ? ' Largest contributors: ' : '; '}${l.product.name} ${fmt(l.aluminumMcg, 1)} µg (${String(roundDivided(l.aluminumMcg, total, 2, 0))}%)`;
  }
  if (topText !== '') topText += '.';
  const missingText = missing === '' ? '' : ` No aluminum value in the catalog for: ${missing} — the figure is a lower bound.`;
  const atOrOver = settled(value).gte(rule.max);
  const words = kept(limitWords, rule, limitWordsOf);
  let lines = NO_LINES;
  if (atOrOver && top.length > 0) {
    lines = [];
    for (const l of top) lines.push(l.line.index);
  }
  return [fromRule('aluminum', rule, {
    value, limit: rule.max, decimals: 2,
    message: atOrOver
      ? `Aluminum ${fmt(value, 2)}${words.over}${topText}${missingText}${CONSIDER}`
      : `Aluminum ${fmt(value, 2)}${words.within}${topText}${missingText}`,
    lines,
    within: !atOrOver,
  })];
};
