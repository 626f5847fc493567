import { ruleFor } from '../policy.ts';
import { fmt } from '../format.ts';
import { fromRule, type Check } from '../findings.ts';

/** The lines need more volume than the ordered bag holds (`volume-overflow`). */
export const volumeOverflow: Check = (bag, policy) => {
  const ordered = bag.order.volumeMl;
  const rule = ruleFor(policy, 'volume-overflow', bag.order.patient.ageGroup);
  if (!ordered || !rule || !bag.addedVolumeMl.gt(ordered)) return [];
  const over = bag.addedVolumeMl.minus(ordered);
  return [fromRule('volume-overflow', rule, {
    value: bag.addedVolumeMl, limit: ordered, decimals: 1,
    message: `The lines need ${fmt(bag.addedVolumeMl, 1)} mL but the bag is ${fmt(ordered, 1)} mL (${fmt(over, 1)} mL over): raise the final volume or lower the amounts. Figures below use the ${fmt(bag.finalVolumeMl, 1)} mL the lines really make.`,
    lines: bag.lines.filter((l) => l.line.kind === 'amount').map((l) => l.line.index),
    fields: ['volumeMl'],
  })];
};

/** No line fills the bag and the lines add up to less than the ordered volume (`volume-shortfall`). */
export const volumeShortfall: Check = (bag, policy) => {
  const ordered = bag.order.volumeMl;
  if (!ordered || !bag.addedVolumeMl.lt(ordered)) return [];
  const rule = ruleFor(policy, 'volume-shortfall', bag.order.patient.ageGroup);
  if (!rule || bag.order.lines.some((l) => l.kind === 'fill')) return [];
  return [fromRule('volume-shortfall', rule, {
    value: bag.addedVolumeMl, limit: ordered, decimals: 1,
    message: `The lines add up to ${fmt(bag.addedVolumeMl, 1)} mL, less than the ordered ${fmt(ordered, 1)} mL, and no line fills the bag: add a fill line or correct the volume. Figures use ${fmt(bag.finalVolumeMl, 1)} mL.`,
    fields: ['volumeMl'],
  })];
};

/** The bag holds nothing (`empty-bag`): every figure would be undefined. */
export const emptyBag: Check = (bag) => {
  if (!bag.finalVolumeMl.isZero()) return [];
  return [{
    code: 'empty-bag', severity: 'block', value: null, limit: null, unit: null, decimals: 0,
    message: 'The bag holds no volume: enter amounts (or a final volume with a fill line).',
    source: 'arithmetic: concentrations need a volume', lines: [], fields: ['volumeMl'],
  }];
};
