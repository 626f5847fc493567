import { ruleFor } from '../policy.ts';
import type { Product } from '../catalog.ts';
import { fromRule, type Check, type Finding } from '../findings.ts';
import { kept } from './limits.ts';

// Each stock's message, written once (a product is an immutable value).
const messages = new WeakMap<Product, string>();

function messageOf(product: Product): string {
  return `${product.name} has no labelled osmolarity in the catalog: the label sum counts its ideal particles instead. Add the label value to the catalog.`;
}

/** A stock without a labelled osmolarity was counted by its particles in the label sum (`missing-label-osmolarity`). */
export const missingLabelOsmolarity: Check = (bag, policy) => {
  const rule = ruleFor(policy, 'missing-label-osmolarity', bag.order.patient.ageGroup);
  if (!rule) return [];
  const out: Finding[] = [];
  for (const l of bag.lines) {
    if (!l.labelMissing || !l.inBag) continue;
    out.push(fromRule('missing-label-osmolarity', rule, {
      value: null, limit: null, decimals: 0,
      message: kept(messages, l.product, messageOf),
      lines: [l.line.index],
    }));
  }
  return out;
};
