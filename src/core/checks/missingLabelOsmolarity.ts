import { ruleFor } from '../policy.ts';
import { fromRule, type Check, type Finding } from '../findings.ts';

/** A stock without a labelled osmolarity was counted by its particles in the label sum (`missing-label-osmolarity`). */
export const missingLabelOsmolarity: Check = (bag, policy) => {
  const rule = ruleFor(policy, 'missing-label-osmolarity', bag.order.patient.ageGroup);
  if (!rule) return [];
  const out: Finding[] = [];
  for (const l of bag.lines) {
    if (!l.labelMissing || !l.inBag) continue;
    out.push(fromRule('missing-label-osmolarity', rule, {
      value: null, limit: null, decimals: 0,
      message: `${l.product.name} has no labelled osmolarity in the catalog: the label sum counts its ideal particles instead. Add the label value to the catalog.`,
      lines: [l.line.index],
    }));
  }
  return out;
};
