import { ruleFor } from '../policy.ts';
import { fmt } from '../format.ts';
import { fromRule, type Check } from '../findings.ts';

/** Final dextrose % on a peripheral bag against the age group's limit (`dextrose-peripheral`). */
export const dextrosePeripheral: Check = (bag, policy) => {
  if (bag.order.route !== 'peripheral') return [];
  const rule = ruleFor(policy, 'dextrose-peripheral', bag.order.patient.ageGroup);
  if (!rule?.max) return [];
  const pct = bag.percent.dextrose;
  if (!pct.gt(rule.max)) return [];
  return [fromRule('dextrose-peripheral', rule, {
    value: pct, limit: rule.max, decimals: 2,
    message: `Final dextrose ${fmt(pct, 2)}% is over the peripheral limit of ${fmt(rule.max, 1)}% for this age group: a central line is needed, or less dextrose.`,
    lines: bag.lines.filter((l) => l.product.role === 'dextrose').map((l) => l.line.index),
    fields: ['route'],
  })];
};
