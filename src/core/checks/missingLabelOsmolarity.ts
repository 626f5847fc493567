import { ruleFor } from '../policy.ts';
import { fromRule, type Check } from '../findings.ts';

/** A stock without a labelled osmolarity was counted by its particles in the label sum (`missing-label-osmolarity`). */
export const missingLabelOsmolarity: Check = (bag, policy) => {
  const rule = ruleFor(policy, 'missing-label-osmolarity', bag.order.patient.ageGroup);
  if (!rule) return [];
  return bag.lines
    .filter((l) => l.labelMissing && l.inBag)
    .map((l) => fromRule('missing-label-osmolarity', rule, {
      value: null, limit: null, decimals: 0,
      message: `${l.product.name} has no labelled osmolarity in the catalog: the label sum counts its ideal particles instead. Add the label value to the catalog.`,
      lines: [l.line.index],
    }));
};
