import { ZERO } from '../decimal.ts';
import { fmt } from '../format.ts';
import { ruleFor } from '../policy.ts';
import type { Rule } from '../policy.ts';
import { perLitreOf } from '../compute/bag.ts';
import { fromRule, type Check } from '../findings.ts';
import { kept, outside, AGE_LABEL, DEFER, numberText } from './limits.ts';
import { GROUP, inBagGroups, linesIn } from './lineGroups.ts';

const FIELDS = ['route', 'volumeMl'];

// Each rule's words after the figure when within it, made once.
const withinWords = new WeakMap<Rule, string>();

function withinWordsOf(rule: Rule): string {
  return ` mmol/L is within the peripheral limit of ${numberText(rule.max ?? ZERO)} mmol/L.`;
}

/**
 * Potassium concentration on a peripheral bag (`potassium-peripheral`), mmol/L, against the age
 * group's limit. No PN guideline sets one: the shipped limits are derived from the potassium
 * phosphates label's maximum peripheral concentrations, and the policy's source says so.
 */
export const potassiumPeripheral: Check = (bag, policy) => {
  if (bag.order.route !== 'peripheral' || bag.finalVolumeMl.isZero()) return [];
  const rule = ruleFor(policy, 'potassium-peripheral', bag.order.patient.ageGroup);
  const k = perLitreOf(bag, bag.speciesMmol.K);
  if (!rule?.max || !k.gt(0)) return [];
  const over = outside(k, rule) === 'max';
  return [fromRule('potassium-peripheral', rule, {
    value: k, limit: rule.max, decimals: 1,
    message: over
      ? `Potassium ${fmt(k, 1)} mmol/L is over the peripheral limit of ${numberText(rule.max)} mmol/L for ${AGE_LABEL[bag.order.patient.ageGroup]}: concentrated potassium irritates a peripheral vein. Give it centrally, raise the volume or lower the potassium. ${DEFER}`
      : `Potassium ${fmt(k, 1)}${kept(withinWords, rule, withinWordsOf)}`,
    // The lines whose stock holds potassium (the solver's route re-check reads the lines its bag was checked for).
    lines: linesIn(inBagGroups(bag), GROUP.K),
    fields: FIELDS,
    within: !over,
  })];
};
