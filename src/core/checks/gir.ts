import { fmt, fmtTrim } from '../format.ts';
import { girRuleFor } from '../policy.ts';
import { fromRule, type Check } from '../findings.ts';
import { outside, rangeText, reportedLimit, AGE_LABEL, DEFER, numberText } from './limits.ts';
import { GROUP, inBagGroups, linesIn } from './lineGroups.ts';

const FIELDS = ['hours'];

/**
 * Glucose infusion rate (`gir`) against the age group's range, or for children the range of
 * their weight band when the policy has bands. GIR = dextrose g × 1000 ÷ (kg × minutes of
 * infusion). Within the range it is reported as information.
 */
export const gir: Check = (bag, policy) => {
  if (!bag.grams.dextrose.gt(0)) return [];
  const { ageGroup, weightKg } = bag.order.patient;
  const rule = girRuleFor(policy, ageGroup, weightKg);
  if (!rule || (!rule.min && !rule.max)) return [];
  const value = bag.girMgPerKgPerMin;
  const crossed = outside(value, rule);
  const band = 'upToKg' in rule ? (rule.upToKg ? ` (weight band up to ${numberText(rule.upToKg)} kg)` : ' (heaviest weight band)') : '';
  const who = `${AGE_LABEL[ageGroup]} of ${fmtTrim(weightKg, 3)} kg${band}`;
  const range = rangeText(rule);
  const message = crossed === 'max'
    ? `GIR ${fmt(value, 2)} mg/kg/min is above the range for ${who}, ${range}: more glucose than can be oxidised (hyperglycaemia, fat deposition). Lower the dextrose or lengthen the infusion. ${DEFER}`
    : crossed === 'min'
      ? `GIR ${fmt(value, 2)} mg/kg/min is below the range for ${who}, ${range}: a risk of hypoglycaemia unless glucose comes from another infusion. ${DEFER}`
      : `GIR ${fmt(value, 2)} mg/kg/min is within the range for ${who}, ${range}.`;
  return [fromRule('gir', rule, {
    value, limit: reportedLimit(rule, crossed), decimals: 2, message,
    lines: linesIn(inBagGroups(bag), GROUP.dextrose),
    fields: FIELDS,
    within: crossed === null,
  })];
};
