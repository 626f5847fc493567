import { ZERO, type D } from '../decimal.ts';
import { fmt } from '../format.ts';
import type { SpeciesId } from '../species.ts';
import type { Catalog } from '../catalog.ts';
import type { IonOrder, Order, OrderLine } from '../order.ts';
import type { Policy } from '../policy.ts';
import { computeBag } from '../compute/bag.ts';
import { allocate, allocationVolumeMl, type Allocation } from './allocate.ts';
import { measurableVolume } from './measure.ts';
import { mixingSequence, type SequenceStep } from './sequence.ts';
import { CONFIRM, type IonProblem } from './ionProblems.ts';
import {
  ION_KEYS, addIons, emptyIons, ionOfSpecies, ionsFromSpecies, ionsOfProduct, orderedTable,
  resolveIonOrder, tableAmount, targetsToJson, type IonKey, type IonTable, type IonTargets, type IonsJson,
} from './ions.ts';

/** An allocated line as it goes in the bag: exact and measured volume, and what each delivers. */
export interface CompoundedLine extends Allocation {
  /** Index of the line in the compounded order (after the order's own lines). */
  index: number;
  exactVolumeMl: D;
  /** The volume rounded to the policy's measuring increment: what is drawn up. */
  volumeMl: D;
  /** `amount` at the measured volume, in the same unit. */
  measuredAmount: D;
  ionsExact: IonTable;
  ionsMeasured: IonTable;
  /** The exact volume is below the policy's smallest measurable volume. */
  belowMeasurable: boolean;
}

/** What the allocator made of an ion order, ready for the CLI, the check and the verification sheet. */
export interface CompoundResult {
  order: Order;
  /** The order with the allocated lines added (its `ions` cleared: it cannot be allocated twice). */
  compounded: Order;
  /** Per-bag targets as ordered; null when the policy has no compounding section. */
  targets: IonTargets | null;
  /** The targets the lines meet: `targets` when feasible, else the nearest feasible ones. */
  amended: IonTargets | null;
  /** What the order asks, per bag; `unordered` ions have no ordered amount (shown as 0). */
  ordered: IonTable;
  unordered: IonKey[];
  /** What the order's own lines deliver before any salt is added. */
  otherLines: IonTable;
  /** Every line of the bag at exact volumes, then at measured volumes. */
  deliveredExact: IonTable;
  delivered: IonTable;
  lines: CompoundedLine[];
  problems: IonProblem[];
  /** The nearest feasible ion order (in the order's own terms) when the order had to change; else null. */
  proposal: IonsJson | null;
  sequence: SequenceStep[];
  /** No problem blocks: every ordered amount is met within the rounding of volumes. */
  feasible: boolean;
}

/** True when a validated order carries an ion order to allocate. */
export function hasIons(order: Order): order is Order & { ions: IonOrder } {
  return order.ions !== null;
}

function otherLineIons(order: Order, policy: Policy): { ions: IonTable; sources: Record<IonKey, string[]> } {
  const bag = computeBag(order, policy);
  const sources = {} as Record<IonKey, string[]>;
  for (const k of ION_KEYS) sources[k] = [];
  for (const l of bag.lines) {
    for (const s of Object.keys(l.product.perMl) as SpeciesId[]) {
      const ion = ionOfSpecies(s);
      if (ion && l.product.perMl[s]?.gt(0) && l.volumeMl.gt(0) && !sources[ion].includes(l.product.name)) sources[ion].push(l.product.name);
    }
  }
  return { ions: ionsFromSpecies(bag.speciesMmol), sources };
}

function measured(a: Allocation, index: number, policy: NonNullable<Policy['compounding']>): CompoundedLine {
  const exactVolumeMl = allocationVolumeMl(a);
  const volumeMl = measurableVolume(exactVolumeMl, policy.volumeIncrements);
  const perMl = a.product.perMl[a.species] ?? ZERO;
  return {
    ...a, index, exactVolumeMl, volumeMl,
    measuredAmount: tableAmount(a.species, perMl.times(volumeMl)),
    ionsExact: ionsOfProduct(a.product, exactVolumeMl),
    ionsMeasured: ionsOfProduct(a.product, volumeMl),
    belowMeasurable: exactVolumeMl.lt(policy.smallestMeasurableMl.value),
  };
}

function measurabilityProblem(l: CompoundedLine, t: IonTargets, policy: NonNullable<Policy['compounding']>): IonProblem {
  const ion = ionOfSpecies(l.species);
  const unit = l.unit;
  const lost = l.volumeMl.isZero() ? ` It rounds to 0 mL: none of the ${fmt(l.amount, 2)} ${unit} would be added.` : ` It is drawn up as ${fmt(l.volumeMl, 2)} mL (${fmt(l.measuredAmount, 2)} ${unit}).`;
  return {
    code: 'below-measurable-volume', severity: 'warn', ion, path: ion ? `ions.${ion}` : 'ions',
    message: `${l.product.name}: ${fmt(l.amount, 2)} ${unit} needs ${fmt(l.exactVolumeMl, 3)} mL, below the smallest measurable volume of ${fmt(policy.smallestMeasurableMl.value, 2)} mL.${lost}`,
    source: policy.smallestMeasurableMl.source,
    proposal: { text: `Use a more dilute stock or a measured dilution as local policy allows${t.per === 'kg' ? '' : ', or review the amount ordered'}. ${CONFIRM}`, change: {} },
  };
}

function noPolicy(order: Order, otherLines: IonTable): CompoundResult {
  // Without a compounding section nothing is allocated; the ordered table needs no anion default.
  const { ordered, unordered } = order.ions ? orderedTable(resolveIonOrder(order.ions, order.patient.weightKg, 'chloride')) : { ordered: emptyIons(), unordered: [] };
  return {
    order, compounded: { ...order, ions: null }, targets: null, amended: null, ordered, unordered, otherLines,
    deliveredExact: otherLines, delivered: otherLines, lines: [], sequence: [], proposal: null, feasible: false,
    problems: [{
      code: 'no-compounding-policy', severity: 'block', ion: null, path: 'ions',
      message: 'The policy has no compounding section (measuring increments, salt choices, mixing sequence): the ion order cannot be allocated.',
      source: 'policy: compounding section missing', proposal: null,
    }],
  };
}

/**
 * Allocate a validated order's ion block: electrolyte lines from the catalog's salts, each volume
 * rounded to what can be measured, delivered against ordered for every ion (the order's own lines
 * included), problems with proposals, and the mixing sequence. Pure.
 */
export function compoundOrder(order: Order & { ions: IonOrder }, catalog: Catalog, policy: Policy): CompoundResult {
  const compounding = policy.compounding;
  if (!compounding) return noPolicy(order, otherLineIons(order, policy).ions);
  return compoundTargets(order, resolveIonOrder(order.ions, order.patient.weightKg, compounding.defaultAnions.value), catalog, policy);
}

/** compoundOrder for targets already resolved (e.g. a proposal's `amended` targets, checked again). */
export function compoundTargets(order: Order, targets: IonTargets, catalog: Catalog, policy: Policy): CompoundResult {
  const other = otherLineIons(order, policy);
  const compounding = policy.compounding;
  if (!compounding) return noPolicy(order, other.ions);
  const { ordered, unordered } = orderedTable(targets);
  const result = allocate(targets, { catalog, compounding, ageGroup: order.patient.ageGroup, baseline: other.ions, baselineSources: other.sources });

  const firstIndex = order.lines.reduce((max, l) => Math.max(max, l.index + 1), 0);
  const lines = result.allocations.map((a, i) => measured(a, firstIndex + i, compounding));
  const problems = [...result.problems, ...lines.filter((l) => l.belowMeasurable).map((l) => measurabilityProblem(l, targets, compounding))];
  const added: OrderLine[] = lines.filter((l) => l.volumeMl.gt(0)).map((l) => ({
    kind: 'amount', index: l.index, product: l.product, amount: l.measuredAmount, unit: l.unit, species: l.species,
    note: `allocated from the ion order (${fmt(l.volumeMl, 2)} mL measured)`,
  }));
  const compounded: Order = { ...order, lines: [...order.lines, ...added], ions: null };
  const deliveredExact = lines.reduce((sum, l) => addIons(sum, l.ionsExact), other.ions);
  const delivered = ionsFromSpecies(computeBag(compounded, policy).speciesMmol);
  const changes = problems.flatMap((p) => (p.proposal && Object.keys(p.proposal.change).length > 0 ? [p.proposal.change] : []));
  return {
    order, compounded, targets, amended: result.amended, ordered, unordered, otherLines: other.ions, deliveredExact, delivered, lines, problems,
    proposal: changes.length > 0 ? Object.assign(targetsToJson(targets), ...changes) as IonsJson : null,
    sequence: mixingSequence(compounded.lines, compounding.mixingSequence),
    feasible: !problems.some((p) => p.severity === 'block'),
  };
}

/**
 * The order with its ion block turned into electrolyte lines (the lines `osmocount check` then
 * checks). An order without an ion block is returned as it is.
 */
export function withAllocatedLines(order: Order, catalog: Catalog, policy: Policy): Order {
  return hasIons(order) ? compoundOrder(order, catalog, policy).compounded : order;
}

/** The change rounding made to each delivered ion (measured − exact), per bag. */
export function roundingEffect(r: CompoundResult): IonTable {
  const out = emptyIons();
  for (const k of ION_KEYS) out[k] = r.delivered[k].minus(r.deliveredExact[k]);
  return out;
}
