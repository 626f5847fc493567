import { D, ZERO, round } from '../decimal.ts';
import { fmt } from '../format.ts';
import type { SpeciesId } from '../species.ts';
import { as, mEqToMmol } from '../units.ts';
import type { Catalog, Product } from '../catalog.ts';
import type { AgeGroup } from '../order.ts';
import { PHOSPHATE_SALTS, autoPhosphateOrder, type CompoundingPolicy, type PhosphateSalt } from './compoundingPolicy.ts';
import { ION_INFO, ORDERED_IONS, addIons, emptyIons, ionsOfProduct, tableAmount, type AnionPreference, type IonKey, type IonTable, type IonTargets, type IonsJson, type Monovalent, type OrderedIon } from './ions.ts';
import { pickStock, stocksOf } from './stocks.ts';
import { CONFIRM, amountText, inOrderTerms, proposedText, type IonProblem } from './ionProblems.ts';

/** Which part of the ion order a line meets. */
export type AllocationPurpose = 'phosphate' | 'calcium' | 'magnesium' | 'sodium-potassium';

/** One electrolyte line the allocator adds, at its exact amount (volumes are rounded later). */
export interface Allocation {
  product: Product;
  /** The species the amount counts: a phosphate species (mmol of P) or a cation (mEq). */
  species: SpeciesId;
  unit: 'mEq' | 'mmol';
  amount: D;
  purpose: AllocationPurpose;
}

/** What the allocator works with besides the ion order. */
export interface AllocationContext {
  catalog: Catalog;
  compounding: CompoundingPolicy;
  ageGroup: AgeGroup;
  /** What the order's own lines already deliver, per bag (the amino-acid product's ions included). */
  baseline: IonTable;
  /** Names of the order's products that bring each ion, for messages. */
  baselineSources: Record<IonKey, string[]>;
}

/** The lines that meet the ion order, the problems met on the way, and the order they really meet. */
export interface AllocationResult {
  allocations: Allocation[];
  problems: IonProblem[];
  /** The ion order the allocations meet: the order itself when feasible, else the nearest feasible one. */
  amended: IonTargets;
}

/** Exact stock volume of an allocation, mL. Example: 20 mmol P of a 3 mmol/mL stock → 6.667 mL. */
export function allocationVolumeMl(a: Allocation): D {
  const perMl = a.product.perMl[a.species] ?? ZERO;
  if (perMl.isZero()) return ZERO;
  const mmol = a.unit === 'mEq' ? mEqToMmol(a.species, as(a.amount, 'mEq')) : a.amount;
  return mmol.div(perMl);
}

/** The ions an allocation brings at its exact volume. */
export function allocationIons(a: Allocation): IonTable {
  return ionsOfProduct(a.product, allocationVolumeMl(a));
}

interface State {
  t: IonTargets;
  problems: IonProblem[];
  allocations: Allocation[];
  added: IonTable;
}

const ARITHMETIC = 'arithmetic: stock compositions from the catalog (label values)';

// Differences below this many mEq (or mmol) are decimal rounding at 15 significant digits (about
// 1e-12 on a bag's amounts), not a shortfall: without it a proposal computed as "at most X" could fail by
// that much when checked again. A millionth of the 0.001 mEq a pharmacist could measure.
const EPS = new D('1e-9');
const over = (a: D, b: D): boolean => a.minus(b).gt(EPS);
const under = (a: D, b: D): boolean => b.minus(a).gt(EPS);
const clamp = (x: D, hi: D): D => D.min(D.max(x, ZERO), hi);

function capital(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

function changeOf(ion: OrderedIon, value: number): Partial<IonsJson> {
  const change: Partial<IonsJson> = {};
  change[ion] = value;
  return change;
}

function add(s: State, a: Allocation): void {
  if (!over(a.amount, ZERO)) return;
  s.allocations.push(a);
  s.added = addIons(s.added, allocationIons(a));
}

/** "Sodium ordered 20.00 mEq is below what" / "No sodium is ordered, yet" — the start of a phosphate-cation message. */
function orderedPhrase(t: IonTargets, ion: Monovalent): string {
  const label = ION_INFO[ion].label;
  return t.given[ion] ? `${capital(label)} ordered ${amountText(t, ion, t[ion])} is below what` : `No ${label} is ordered, yet`;
}

function sourcesText(names: readonly string[]): string {
  return names.length > 0 ? names.join(', ') : 'the order\'s other lines';
}

/** Step 0: an ion the order's own lines already bring in excess of the order. */
function checkOtherLines(s: State, ctx: AllocationContext): void {
  for (const ion of ORDERED_IONS) {
    const have = ctx.baseline[ion];
    if (!s.t.given[ion] || !over(have, s.t[ion])) continue;
    const label = ION_INFO[ion].label;
    s.problems.push({
      code: 'ordered-below-other-lines', severity: 'block', ion, path: `ions.${ion}`,
      message: `${capital(label)} ordered ${amountText(s.t, ion, s.t[ion])} is below the ${amountText(s.t, ion, have)} that the order's other lines already deliver (${sourcesText(ctx.baselineSources[ion])}).`,
      source: ARITHMETIC,
      proposal: { text: `${capital(label)} ${proposedText(s.t, ion, have, 'up')} with no ${label} salt added, or a product with less ${label}. ${CONFIRM}`, change: changeOf(ion, inOrderTerms(s.t, have, 'up')) },
    });
    s.t[ion] = have;
  }
}

interface PhosphateOption {
  kind: PhosphateSalt;
  product: Product;
  phosphate: SpeciesId;
  cation: Monovalent;
  /** mEq of the cation per mmol of P (label ratio, e.g. 4.4/3 for potassium phosphates). */
  cationPerP: D;
}

function phosphateOption(kind: PhosphateSalt, mmol: D, ctx: AllocationContext): PhosphateOption | null {
  const groups: [Monovalent, SpeciesId][] =
    kind === 'potassium' ? [['K', 'phosphate']] : kind === 'sodium' ? [['Na', 'phosphate']] : [['Na', 'glycerophosphate'], ['K', 'glycerophosphate']];
  for (const [cation, phosphate] of groups) {
    const product = pickStock(stocksOf(ctx.catalog, [cation, phosphate]), phosphate, mmol, ctx.compounding.smallestMeasurableMl.value);
    const p = product?.perMl[phosphate];
    const c = product?.perMl[cation];
    if (product && p && c) return { kind, product, phosphate, cation, cationPerP: tableAmount(cation, c).div(p) };
  }
  return null;
}

const SALT_WORDS: Readonly<Record<PhosphateSalt, string>> = {
  potassium: 'potassium phosphate', sodium: 'sodium phosphate', organic: 'organic phosphate (glycerophosphate)',
};

/** Step 1: phosphate first; its cation counts toward the sodium or potassium ordered. */
function allocatePhosphate(s: State, ctx: AllocationContext): void {
  const base = ctx.baseline;
  const need = s.t.phosphate.minus(base.phosphate);
  if (!over(need, ZERO)) return;
  const auto = autoPhosphateOrder(ctx.compounding, ctx.ageGroup);
  const requested = s.t.phosphateSalt;
  const kinds = requested === 'auto' ? auto.order : [...new Set<PhosphateSalt>([requested, ...auto.order, ...PHOSPHATE_SALTS])];
  const options = kinds.flatMap((k) => phosphateOption(k, need, ctx) ?? []);
  const room = (o: PhosphateOption): D => D.max(s.t[o.cation].minus(base[o.cation]).minus(s.added[o.cation]), ZERO);
  const cationFor = (o: PhosphateOption, mmol: D): D => mmol.times(o.cationPerP);
  const fits = (o: PhosphateOption): boolean => !over(cationFor(o, need), room(o));
  const maxP = (o: PhosphateOption): D => room(o).div(o.cationPerP);
  const pText = (v: D): string => amountText(s.t, 'phosphate', v);
  const cText = (o: PhosphateOption, v: D): string => amountText(s.t, o.cation, v);
  const source = requested === 'auto' ? `${ARITHMETIC}; salt order: ${auto.source}` : ARITHMETIC;

  if (options.length === 0) {
    s.problems.push({
      code: 'no-stock', severity: 'block', ion: 'phosphate', path: 'ions.phosphate',
      message: `The catalog holds no ${kinds.map((k) => SALT_WORDS[k]).join(' or ')} stock: the ${pText(need)} of phosphate cannot be added.`,
      source,
      proposal: { text: `Phosphate ${proposedText(s.t, 'phosphate', base.phosphate, 'up')} (nothing added) until a phosphate stock is in the catalog. ${CONFIRM}`, change: changeOf('phosphate', inOrderTerms(s.t, base.phosphate, 'up')) },
    });
    s.t.phosphate = base.phosphate;
    return;
  }

  const chosen = options.find(fits);
  if (chosen) {
    if (requested !== 'auto' && chosen.kind !== requested) {
      const asked = options.find((o) => o.kind === requested);
      const proposal = {
        text: `${chosen.product.name}: its ${cText(chosen, cationFor(chosen, need))} of ${ION_INFO[chosen.cation].label} fits within the ${ION_INFO[chosen.cation].label} ordered. ${CONFIRM}`,
        change: { phosphateSalt: chosen.kind },
      };
      if (asked) {
        s.problems.push({
          code: 'phosphate-cation-exceeds-order', severity: 'block', ion: asked.cation, path: `ions.${asked.cation}`,
          message: `${orderedPhrase(s.t, asked.cation)} ${asked.product.name} alone delivers with ${pText(need)} of phosphate: ${cText(asked, cationFor(asked, need))} (${fmt(asked.cationPerP, 3)} mEq per mmol P)${base[asked.cation].gt(0) ? `, on top of the ${cText(asked, base[asked.cation])} the other lines bring` : ''}.`,
          source, proposal,
        });
      } else {
        s.problems.push({
          code: 'no-stock', severity: 'block', ion: 'phosphate', path: 'ions.phosphateSalt',
          message: `The catalog holds no ${SALT_WORDS[requested]} stock for the ${pText(need)} of phosphate ordered.`,
          source, proposal,
        });
      }
      s.t.phosphateSalt = chosen.kind;
    }
    add(s, { product: chosen.product, species: chosen.phosphate, unit: 'mmol', amount: need, purpose: 'phosphate' });
    return;
  }

  // No salt fits: the most phosphate any salt allows within the cations ordered.
  const best = options.reduce((b, o) => (maxP(o).gt(maxP(b)) ? o : b));
  const spoken = (requested === 'auto' ? null : options.find((o) => o.kind === requested)) ?? options[0] ?? best;
  const label = ION_INFO[spoken.cation].label;
  const allowed = base.phosphate.plus(maxP(best));
  const raiseTo = s.t[spoken.cation].plus(cationFor(spoken, need)).minus(room(spoken));
  const change: Partial<IonsJson> = changeOf('phosphate', inOrderTerms(s.t, allowed, 'down'));
  if (requested !== 'auto' && best.kind !== requested) change.phosphateSalt = best.kind;
  s.problems.push({
    code: 'phosphate-cation-exceeds-order', severity: 'block', ion: spoken.cation, path: `ions.${spoken.cation}`,
    message: `${orderedPhrase(s.t, spoken.cation)} ${spoken.product.name} alone delivers with ${pText(need)} of phosphate: ${cText(spoken, cationFor(spoken, need))} (${fmt(spoken.cationPerP, 3)} mEq per mmol P). No phosphate salt in the catalog fits the sodium and potassium ordered: ${options.map((o) => `${o.product.name} needs ${cText(o, cationFor(o, need))} ${ION_INFO[o.cation].label}, ${cText(o, room(o))} is left`).join('; ')}.`,
    source,
    proposal: {
      text: `Phosphate ${proposedText(s.t, 'phosphate', allowed, 'down')} as ${best.product.name} (the most the ${ION_INFO[best.cation].label} ordered allows), or raise ${label} to ${cText(spoken, raiseTo)}. ${CONFIRM}`,
      change,
    },
  });
  s.t.phosphate = allowed;
  if (requested !== 'auto') s.t.phosphateSalt = best.kind;
  add(s, { product: best.product, species: best.phosphate, unit: 'mmol', amount: maxP(best), purpose: 'phosphate' });
}

/** Step 2: calcium, as gluconate unless the policy allows (and prefers) chloride. */
function allocateCalcium(s: State, ctx: AllocationContext): void {
  const need = s.t.Ca.minus(ctx.baseline.Ca);
  if (!over(need, ZERO)) return;
  const mmol = mEqToMmol('Ca', as(need, 'mEq'));
  const allowed = ctx.compounding.calciumSalts;
  for (const salt of allowed.order) {
    const product = pickStock(stocksOf(ctx.catalog, ['Ca', salt === 'gluconate' ? 'gluconate' : 'Cl']), 'Ca', mmol, ctx.compounding.smallestMeasurableMl.value);
    if (product) { add(s, { product, species: 'Ca', unit: 'mEq', amount: need, purpose: 'calcium' }); return; }
  }
  const chlorideHeld = !allowed.order.includes('chloride') && stocksOf(ctx.catalog, ['Ca', 'Cl']).length > 0;
  s.problems.push({
    code: 'no-stock', severity: 'block', ion: 'Ca', path: 'ions.Ca',
    message: `The catalog holds no calcium ${allowed.order.join(' or ')} stock${chlorideHeld ? ' (it holds calcium chloride, which the policy does not allow)' : ''}: the ${amountText(s.t, 'Ca', need)} of calcium cannot be added.`,
    source: allowed.source,
    proposal: {
      text: `Calcium ${proposedText(s.t, 'Ca', ctx.baseline.Ca, 'up')} (nothing added) until a calcium stock the policy allows is in the catalog${chlorideHeld ? ', or a policy that lists "chloride" in compounding.calciumSalts' : ''}. ${CONFIRM}`,
      change: changeOf('Ca', inOrderTerms(s.t, ctx.baseline.Ca, 'up')),
    },
  });
  s.t.Ca = ctx.baseline.Ca;
}

/** Step 3: magnesium as sulfate. */
function allocateMagnesium(s: State, ctx: AllocationContext): void {
  const need = s.t.Mg.minus(ctx.baseline.Mg);
  if (!over(need, ZERO)) return;
  const product = pickStock(stocksOf(ctx.catalog, ['Mg', 'sulfate']), 'Mg', mEqToMmol('Mg', as(need, 'mEq')), ctx.compounding.smallestMeasurableMl.value);
  if (product) { add(s, { product, species: 'Mg', unit: 'mEq', amount: need, purpose: 'magnesium' }); return; }
  s.problems.push({
    code: 'no-stock', severity: 'block', ion: 'Mg', path: 'ions.Mg',
    message: `The catalog holds no magnesium sulfate stock: the ${amountText(s.t, 'Mg', need)} of magnesium cannot be added.`,
    source: ARITHMETIC,
    proposal: { text: `Magnesium ${proposedText(s.t, 'Mg', ctx.baseline.Mg, 'up')} (nothing added) until a magnesium sulfate stock is in the catalog. ${CONFIRM}`, change: changeOf('Mg', inOrderTerms(s.t, ctx.baseline.Mg, 'up')) },
  });
  s.t.Mg = ctx.baseline.Mg;
}

/** The chloride-salt share (mEq) a preference asks for, before stock availability; with any problem. */
interface AnionPlan {
  x: D;
  problem: Omit<IonProblem, 'source'> | null;
  amended: AnionPreference;
}

function ratioText(cl: D, ac: D): string {
  return ac.isZero() ? 'all chloride' : `${fmt(cl.div(ac), 2)} : 1`;
}

/**
 * Where the preference puts the chloride share x of the sodium and potassium salts (0 ≤ x ≤ S).
 * Ratios and amounts are over the whole bag: chloride = Cl0 + x, acetate = Ac0 + S − x.
 */
function planAnions(t: IonTargets, S: D, Cl0: D, Ac0: D, sources: { Cl: string; acetate: string }): AnionPlan {
  const a = t.anions;
  const at = (ion: 'Cl' | 'acetate', v: D): string => amountText(t, ion, v);
  switch (a.kind) {
    case 'chloride': return { x: S, problem: null, amended: a };
    case 'acetate': return { x: ZERO, problem: null, amended: a };
    case 'ratio': {
      if (S.isZero()) return { x: ZERO, problem: null, amended: a };
      const R = a.chlorideToAcetate;
      const x = R.times(Ac0.plus(S)).minus(Cl0).div(R.plus(1));
      if (!under(x, ZERO) && !over(x, S)) return { x: clamp(x, S), problem: null, amended: a };
      const allAcetate = x.lt(0);
      const xNear = allAcetate ? ZERO : S;
      const asked = a.balanced ? 'balanced chloride and acetate (1 : 1)' : `a chloride : acetate ratio of ${fmt(R, 2)} : 1`;
      return {
        x: xNear,
        amended: { kind: allAcetate ? 'acetate' : 'chloride' },
        problem: {
          code: 'anion-ratio-unreachable', severity: 'warn', ion: allAcetate ? 'Cl' : 'acetate', path: 'ions.anions',
          message: `${capital(asked)} cannot be reached: the other lines bring chloride ${at('Cl', Cl0)} and acetate ${at('acetate', Ac0)}, and the sodium and potassium salts carry only ${fmt(S, 2)} mEq of anion. Nearest: every sodium and potassium salt as ${allAcetate ? 'acetate' : 'chloride'}, giving chloride : acetate ${ratioText(Cl0.plus(xNear), Ac0.plus(S).minus(xNear))}.`,
          proposal: { text: `Anions "${allAcetate ? 'acetate' : 'chloride'}" (the nearest the bag allows). ${CONFIRM}`, change: { anions: allAcetate ? 'acetate' : 'chloride' } },
        },
      };
    }
    case 'acetate-amount':
      return planAnionAmount(t, 'acetate', a.mEq, S, Ac0, sources.acetate);
    case 'chloride-amount':
      return planAnionAmount(t, 'Cl', a.mEq, S, Cl0, sources.Cl);
  }
}

/**
 * An anion ordered as an amount (mEq over the whole bag): the sodium and potassium salts carry
 * `ordered − own0` of it, between 0 and S. Returns the chloride share x of those salts.
 */
function planAnionAmount(t: IonTargets, ion: 'Cl' | 'acetate', ordered: D, S: D, own0: D, otherSources: string): AnionPlan {
  const name = ion === 'Cl' ? 'Chloride' : 'Acetate';
  const key = ion === 'Cl' ? 'chloride' : 'acetate';
  const other = ion === 'Cl' ? 'acetate' : 'chloride';
  const kind = ion === 'Cl' ? 'chloride-amount' as const : 'acetate-amount' as const;
  const at = (v: D): string => amountText(t, ion, v);
  const amountChange = (v: ReturnType<typeof inOrderTerms>): Partial<IonsJson> => ({ anions: ion === 'Cl' ? { chloride: v } : { acetate: v } });
  // The chloride share of the salts when they carry y mEq of this anion.
  const chlorideShare = (y: D): D => (ion === 'Cl' ? y : S.minus(y));
  const fromSalts = ordered.minus(own0);
  if (under(fromSalts, ZERO)) {
    return {
      x: chlorideShare(ZERO), amended: { kind, mEq: own0 },
      problem: {
        code: `${key}-below-other-lines`, severity: 'block', ion, path: `ions.anions.${key}`,
        message: `${name} ordered ${at(ordered)} is below the ${at(own0)} the other lines already deliver (${otherSources}).`,
        proposal: { text: `${name} ${proposedText(t, ion, own0, 'up')}: every sodium and potassium salt as ${other}. ${CONFIRM}`, change: amountChange(inOrderTerms(t, own0, 'up')) },
      },
    };
  }
  if (over(fromSalts, S)) {
    const most = own0.plus(S);
    return {
      x: chlorideShare(S), amended: { kind, mEq: most },
      problem: {
        code: `${key}-above-cations`, severity: 'block', ion, path: `ions.anions.${key}`,
        message: `${name} ordered ${at(ordered)} is more than the cations allow: the other lines bring ${at(own0)} and the sodium and potassium left for chloride or acetate salts carry at most ${fmt(S, 2)} mEq, so at most ${at(most)}.`,
        proposal: { text: `${name} ${proposedText(t, ion, most, 'down')}: every sodium and potassium salt as ${key}; or more sodium or potassium. ${CONFIRM}`, change: amountChange(inOrderTerms(t, most, 'down')) },
      },
    };
  }
  return { x: clamp(chlorideShare(fromSalts), S), problem: null, amended: { kind, mEq: ordered } };
}

/** The preference actually met when stock shortages move the chloride share to x. */
function achieved(t: IonTargets, x: D, wanted: D, S: D, Cl0: D, Ac0: D): { pref: AnionPreference; json: IonsJson['anions'] } {
  const a = t.anions;
  // Stock forced more chloride (x > wanted): acetate is at its most and chloride at its least.
  const moreChloride = x.gt(wanted);
  if (a.kind === 'acetate-amount') { const v = Ac0.plus(S).minus(x); return { pref: { kind: 'acetate-amount', mEq: v }, json: { acetate: inOrderTerms(t, v, moreChloride ? 'down' : 'up') } }; }
  if (a.kind === 'chloride-amount') { const v = Cl0.plus(x); return { pref: { kind: 'chloride-amount', mEq: v }, json: { chloride: inOrderTerms(t, v, moreChloride ? 'up' : 'down') } }; }
  if (x.eq(S)) return { pref: { kind: 'chloride' }, json: 'chloride' };
  if (x.isZero()) return { pref: { kind: 'acetate' }, json: 'acetate' };
  const r = Cl0.plus(x).div(Ac0.plus(S).minus(x));
  return { pref: { kind: 'ratio', chlorideToAcetate: r, balanced: false }, json: { chlorideToAcetate: round(r, 3) } };
}

/** Step 4: what is left of sodium and potassium, split between chloride and acetate salts. */
function allocateMonovalent(s: State, ctx: AllocationContext): void {
  const base = ctx.baseline;
  const smallest = ctx.compounding.smallestMeasurableMl.value;
  const rem = { Na: ZERO, K: ZERO };
  const stock = { Na: { Cl: [] as Product[], acetate: [] as Product[] }, K: { Cl: [] as Product[], acetate: [] as Product[] } };
  for (const c of ['Na', 'K'] as const) {
    rem[c] = D.max(s.t[c].minus(base[c]).minus(s.added[c]), ZERO);
    stock[c] = { Cl: stocksOf(ctx.catalog, [c, 'Cl']), acetate: stocksOf(ctx.catalog, [c, 'acetate']) };
    if (over(rem[c], ZERO) && stock[c].Cl.length === 0 && stock[c].acetate.length === 0) {
      const label = ION_INFO[c].label;
      const without = s.t[c].minus(rem[c]);
      s.problems.push({
        code: 'no-stock', severity: 'block', ion: c, path: `ions.${c}`,
        message: `The catalog holds no ${label} chloride or ${label} acetate stock: ${amountText(s.t, c, rem[c])} of ${label} cannot be added.`,
        source: ARITHMETIC,
        proposal: { text: `${capital(label)} ${proposedText(s.t, c, without, 'up')} (what the other lines and the phosphate salt bring). ${CONFIRM}`, change: changeOf(c, inOrderTerms(s.t, without, 'up')) },
      });
      s.t[c] = without;
      rem[c] = ZERO;
    }
  }
  const S = rem.Na.plus(rem.K);
  const Cl0 = base.Cl.plus(s.added.Cl);
  const Ac0 = base.acetate.plus(s.added.acetate);
  const withAdded = (ion: 'Cl' | 'acetate'): string =>
    sourcesText([...ctx.baselineSources[ion], ...s.allocations.filter((a) => allocationIons(a)[ion].gt(0)).map((a) => a.product.name)]);
  const plan = planAnions(s.t, S, Cl0, Ac0, { Cl: withAdded('Cl'), acetate: withAdded('acetate') });
  if (plan.problem) s.problems.push({ ...plan.problem, source: ARITHMETIC });
  s.t.anions = plan.amended;

  // Stock availability: a cation with only one of its two salts forces that anion.
  const onlyCl = (c: Monovalent): boolean => stock[c].acetate.length === 0;
  const onlyAc = (c: Monovalent): boolean => stock[c].Cl.length === 0;
  const forcedCl = (['Na', 'K'] as const).reduce((sum, c) => (onlyCl(c) ? sum.plus(rem[c]) : sum), ZERO);
  const forcedAc = (['Na', 'K'] as const).reduce((sum, c) => (onlyAc(c) && !onlyCl(c) ? sum.plus(rem[c]) : sum), ZERO);
  const x = D.min(D.max(plan.x, forcedCl), S.minus(forcedAc));
  if (over(x.minus(plan.x).abs(), ZERO)) {
    const missing = (['Na', 'K'] as const).filter((c) => rem[c].gt(0) && (onlyCl(c) || onlyAc(c)))
      .map((c) => `${ION_INFO[c].label} ${onlyCl(c) ? 'acetate' : 'chloride'}`);
    const got = achieved(s.t, x, plan.x, S, Cl0, Ac0);
    const amounts = s.t.anions.kind === 'acetate-amount' || s.t.anions.kind === 'chloride-amount';
    s.problems.push({
      code: 'no-stock', severity: amounts ? 'block' : 'warn', ion: x.gt(plan.x) ? 'Cl' : 'acetate', path: 'ions.anions',
      message: `The catalog holds no ${missing.join(' or ')} stock, so the anions cannot follow the order: chloride ${amountText(s.t, 'Cl', Cl0.plus(x))} and acetate ${amountText(s.t, 'acetate', Ac0.plus(S).minus(x))} instead of chloride ${amountText(s.t, 'Cl', Cl0.plus(plan.x))} and acetate ${amountText(s.t, 'acetate', Ac0.plus(S).minus(plan.x))}.`,
      source: ARITHMETIC,
      proposal: { text: `Anions as the catalog allows (${ratioText(Cl0.plus(x), Ac0.plus(S).minus(x))} chloride : acetate), or add the missing stock to the catalog. ${CONFIRM}`, change: { anions: got.json } },
    });
    s.t.anions = got.pref;
  }

  // Forced cations take their only salt; the others share the rest of the chloride in proportion.
  const flexible = (['Na', 'K'] as const).filter((c) => !onlyCl(c) && !onlyAc(c));
  const flexTotal = flexible.reduce((sum, c) => sum.plus(rem[c]), ZERO);
  const share = flexTotal.isZero() ? ZERO : x.minus(forcedCl).div(flexTotal);
  for (const c of ['Na', 'K'] as const) {
    if (!over(rem[c], ZERO)) continue;
    const chloride = onlyCl(c) ? rem[c] : onlyAc(c) ? ZERO : rem[c].times(share);
    const acetate = rem[c].minus(chloride);
    const clStock = pickStock(stock[c].Cl, c, chloride, smallest);
    const acStock = pickStock(stock[c].acetate, c, acetate, smallest);
    if (clStock) add(s, { product: clStock, species: c, unit: 'mEq', amount: chloride, purpose: 'sodium-potassium' });
    if (acStock) add(s, { product: acStock, species: c, unit: 'mEq', amount: acetate, purpose: 'sodium-potassium' });
  }
}

/**
 * Turn an ion order into electrolyte lines: phosphate first (its cation counted), calcium,
 * magnesium, then sodium and potassium split between chloride and acetate salts, after what the
 * order's own lines already deliver. When the order cannot be met as written, each reason is a
 * problem with its proposal, and the allocations meet the nearest feasible order (`amended`).
 *
 * Example: Na 100, K 80 mEq, phosphate 20 mmol as potassium phosphates (4.4 mEq K per 3 mmol P)
 * → 6.667 mL bringing 29.33 mEq K; 50.67 mEq K and 100 mEq Na are left for chloride/acetate.
 */
export function allocate(targets: IonTargets, ctx: AllocationContext): AllocationResult {
  const s: State = { t: { ...targets }, problems: [], allocations: [], added: emptyIons() };
  checkOtherLines(s, ctx);
  allocatePhosphate(s, ctx);
  allocateCalcium(s, ctx);
  allocateMagnesium(s, ctx);
  allocateMonovalent(s, ctx);
  return { allocations: s.allocations, problems: s.problems, amended: s.t };
}
