import { ZERO } from '../decimal.ts';
import { fmt } from '../format.ts';
import { ruleFor } from '../policy.ts';
import { fromRule, type Check } from '../findings.ts';
import { asInfo, settled, DEFER } from './limits.ts';

/** How many contributors a message names. */
const TOP = 3;

/**
 * Aluminum exposure (`aluminum`), µg/kg/day: Σ each stock's labelled maximum (µg/L) × its volume,
 * ÷ the dosing weight (the bag is one day's supply). It flags at or above the policy limit
 * (21 CFR 201.323: more than 4–5 µg/kg/day accumulates), names the top contributors, and lists
 * the stocks in the bag without an aluminum value (the figure is then a lower bound).
 */
export const aluminum: Check = (bag, policy) => {
  const rule = ruleFor(policy, 'aluminum', bag.order.patient.ageGroup);
  if (!rule?.max || bag.finalVolumeMl.isZero()) return [];
  const inBag = bag.lines.filter((l) => l.inBag);
  const missing = inBag.filter((l) => l.product.aluminumMcgPerL === null);
  const known = inBag.filter((l) => l.product.aluminumMcgPerL !== null);
  if (known.length === 0) {
    return [fromRule('aluminum', rule, {
      value: null, limit: rule.max, decimals: 2,
      message: `No stock in this bag has an aluminum value in the catalog, so exposure cannot be estimated. Add each stock's labelled "contains no more than … µg/L" value. ${DEFER}`,
      lines: inBag.map((l) => l.line.index),
    })];
  }
  const value = bag.aluminumMcgPerKgPerDay;
  const total = bag.aluminumMcg;
  const top = known.filter((l) => l.aluminumMcg.gt(ZERO)).sort((a, b) => b.aluminumMcg.cmp(a.aluminumMcg)).slice(0, TOP);
  const topText = top.length === 0
    ? ''
    : ` Largest contributors: ${top.map((l) => `${l.product.name} ${fmt(l.aluminumMcg, 1)} µg (${fmt(l.aluminumMcg.div(total).times(100), 0)}%)`).join('; ')}.`;
  const missingText = missing.length === 0
    ? ''
    : ` No aluminum value in the catalog for: ${missing.map((l) => l.product.name).join('; ')} — the figure is a lower bound.`;
  const atOrOver = settled(value).gte(rule.max);
  const f = fromRule('aluminum', rule, {
    value, limit: rule.max, decimals: 2,
    message: atOrOver
      ? `Aluminum ${fmt(value, 2)} µg/kg/day is at or above the limit of ${rule.max.toString()} µg/kg/day: it accumulates, above all with immature or impaired kidneys.${topText}${missingText} Consider lower-aluminum stocks. ${DEFER}`
      : `Aluminum ${fmt(value, 2)} µg/kg/day is below the limit of ${rule.max.toString()} µg/kg/day.${topText}${missingText}`,
    lines: (atOrOver ? top : []).map((l) => l.line.index),
  });
  return [atOrOver ? f : asInfo(f)];
};
