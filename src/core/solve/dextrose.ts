import { D, ZERO } from '../decimal.ts';
import { fmt, fmtTrim } from '../format.ts';
import type { Policy } from '../policy.ts';
import { computeBag } from '../compute/bag.ts';
import type { Order, OrderLine } from '../order.ts';
import { propose, appearsText } from './consequences.ts';
import { crossings, floorToStep } from './threshold.ts';
import type { Checked, Evaluate, Suggestion } from './suggestion.ts';

type AmountLine = Extract<OrderLine, { kind: 'amount' }>;

/** How many extra steps the solver tries when rounding meets the limit at full precision. */
const GUARD_STEPS = 5;

/** A line's amount, in its own unit, that delivers `grams` of dextrose a day. */
function amountFor(line: AmountLine, grams: D, weightKg: D): D {
  const gramsPerMl = line.product.nutrient?.gramsPerMl ?? null;
  switch (line.unit) {
    case 'g': return grams;
    case 'g/kg': return grams.div(weightKg);
    case 'mL': return gramsPerMl ? grams.div(gramsPerMl) : grams;
    case 'mL/kg': return gramsPerMl ? grams.div(gramsPerMl).div(weightKg) : grams;
    default: return grams;
  }
}

/** Grams of dextrose a day from a line's amount in its own unit. */
function gramsFor(line: AmountLine, amount: D, weightKg: D): D {
  const gramsPerMl = line.product.nutrient?.gramsPerMl ?? ZERO;
  switch (line.unit) {
    case 'g': return amount;
    case 'g/kg': return amount.times(weightKg);
    case 'mL': return amount.times(gramsPerMl);
    case 'mL/kg': return amount.times(gramsPerMl).times(weightKg);
    default: return amount;
  }
}

function unavailable(message: string): Suggestion {
  return { kind: 'dextrose', status: 'unavailable', message, notes: [] };
}

/**
 * The largest dextrose (rounded DOWN to the policy's step for the line's unit) that brings a
 * failing peripheral bag's reported osmolarity to the limit at its current volume (the fill
 * grows as dextrose shrinks; without a fill the bag shrinks with it, and a note says so).
 * Only for an order with one dextrose line. Re-checked through every check; never applied.
 * Example: 250 g of dextrose 70% in 2000 mL at 1149.3 mOsm/L, limit 900, step 5 g → 150 g.
 */
export function dextroseSuggestion(current: Checked, policy: Policy, limit: D, evaluate: Evaluate): Suggestion | null {
  const { order, bag } = current;
  const dextroseLines = order.lines.filter((l): l is AmountLine => l.kind === 'amount' && l.product.role === 'dextrose' && l.product.nutrient !== null);
  const fill = order.lines.find((l) => l.kind === 'fill');
  if (fill?.product.role === 'dextrose') return unavailable('Dextrose fills this bag: change the fill stock to water before lowering dextrose.');
  const line = dextroseLines[0];
  if (!line) return null;
  if (dextroseLines.length > 1) return unavailable('The order has several dextrose lines: lower them by hand.');
  if (order.volumeMl && bag.addedVolumeMl.gt(order.volumeMl)) return unavailable('The lines overflow the bag: correct the volume first.');
  const w = order.patient.weightKg;
  const withAmount = (amount: D): Order => ({ ...order, lines: order.lines.map((l) => (l.index === line.index ? { ...line, amount } : l)) });
  const x0 = gramsFor(line, line.amount, w);
  if (!x0.gt(0)) return unavailable(`The dextrose line is already at zero: lower the amino acids or electrolytes, raise the volume, or use a central line.`);
  const found = crossings(policy, limit, x0, bag, ZERO, computeBag(withAmount(ZERO), policy, bag));
  if (!found || found.some((c) => c.falling)) return unavailable('Lowering dextrose does not lower this bag\'s osmolarity.');
  const exact = D.min(...found.map((c) => c.x));
  if (!exact.gt(0)) return unavailable(`Even with no dextrose this bag stays over ${limit.toString()} mOsm/L: lower the amino acids or electrolytes, raise the volume, or use a central line.`);
  const step = policy.solver.dextroseStep[line.unit as keyof Policy['solver']['dextroseStep']] ?? null;
  if (!step) return unavailable(`The policy has no dextrose step for a line in ${line.unit}.`);
  let amount = floorToStep(amountFor(line, exact, w), step);
  let proposed = amount.gt(0) ? computeBag(withAmount(amount), policy, bag) : null;
  for (let i = 0; i < GUARD_STEPS && proposed && proposed.osmolarity.reported.gt(limit); i++) {
    amount = amount.minus(step);
    proposed = amount.gt(0) ? computeBag(withAmount(amount), policy, bag) : null;
  }
  if (!proposed) return unavailable(`Rounded down to ${step.toString()} ${line.unit}, no dextrose is left: lower other lines, raise the volume or use a central line.`);
  const next = evaluate(proposed);
  const notes: string[] = [];
  if (!fill) notes.push('The order has no fill line: the bag shrinks by the dextrose volume removed.');
  const gramsTo = gramsFor(line, amount, w);
  const p = propose('dextrose', '', { field: 'amount', line: line.index, product: line.product.id, from: line.amount, to: amount, unit: line.unit, gramsPerDayFrom: x0, gramsPerDayTo: gramsTo }, current, next, policy, notes);
  const at = fill ? `at ${fmtTrim(bag.finalVolumeMl, 1)} mL (the fill makes up the difference)` : `(the bag becomes ${fmtTrim(next.bag.finalVolumeMl, 1)} mL)`;
  p.message = `Dextrose ${fmtTrim(amount, 3)} ${line.unit} (from ${fmtTrim(line.amount, 3)} ${line.unit}; ${fmtTrim(gramsTo, 2)} g a day, rounded down to ${step.toString()} ${line.unit}) ${at}: reported osmolarity ${fmt(p.after.osmolarity, 1)} mOsm/L against ${limit.toString()}. GIR ${fmt(p.before.girMgPerKgPerMin, 2)} → ${fmt(p.after.girMgPerKgPerMin, 2)} mg/kg/min; energy ${fmt(p.before.kcal, 0)} → ${fmt(p.after.kcal, 0)} kcal (${fmt(p.after.kcalPerKgPerDay, 1)} kcal/kg/day).${appearsText(p.appears)} A proposal only: the pharmacist decides.`;
  return p;
}
