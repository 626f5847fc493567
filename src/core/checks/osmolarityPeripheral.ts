import { ruleFor } from '../policy.ts';
import { fmt } from '../format.ts';
import { fromRule, type Check } from '../findings.ts';

/**
 * Reported osmolarity against the peripheral limit on a peripheral bag (`osmolarity-peripheral`).
 * The limit, its severity and source come from the policy (default 900 mOsm/L, ASPEN 2014).
 */
export const osmolarityPeripheral: Check = (bag, policy) => {
  if (bag.order.route !== 'peripheral') return [];
  const rule = ruleFor(policy, 'osmolarity-peripheral', bag.order.patient.ageGroup);
  if (!rule?.max) return [];
  const osm = bag.osmolarity.reported;
  if (!osm.gt(rule.max)) return [];
  const by = osm.minus(rule.max);
  const method = bag.osmolarity.method === 'particle' ? 'particle count' : 'label sum';
  const top = [...bag.lines].sort((a, b) => b.particleMOsm.cmp(a.particleMOsm)).slice(0, 3).filter((l) => l.particleMOsm.gt(0));
  return [fromRule('osmolarity-peripheral', rule, {
    value: osm, limit: rule.max, decimals: 1,
    message: `Osmolarity ${fmt(osm, 1)} mOsm/L (${method}) is over the peripheral limit of ${fmt(rule.max, 0)} mOsm/L by ${fmt(by, 1)}: give it through a central line, or raise the volume or lower the dextrose or amino acids.`,
    lines: top.map((l) => l.line.index),
    fields: ['route', 'volumeMl'],
  })];
};
