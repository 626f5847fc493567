import { D, ZERO, round } from '../decimal.ts';
import { isCharged, type SpeciesId } from '../species.ts';
import { as, mmolToMEq } from '../units.ts';
import type { Product } from '../catalog.ts';
import type { IonOrder } from '../order.ts';
import type { AnionsInput, PhosphateSalt } from './compoundingPolicy.ts';

export const ION_KEYS = ['Na', 'K', 'Ca', 'Mg', 'phosphate', 'Cl', 'acetate'] as const;
/** An ion of the delivered-vs-ordered table; phosphate counts inorganic and organic phosphate. */
export type IonKey = (typeof ION_KEYS)[number];
/** Per-bag amounts of each ion: mEq, except phosphate in mmol of P. */
export type IonTable = Record<IonKey, D>;

/** The cations the allocator splits between chloride and acetate salts. */
export type Monovalent = 'Na' | 'K';

export const ION_INFO: Readonly<Record<IonKey, { label: string; unit: 'mEq' | 'mmol' }>> = {
  Na: { label: 'sodium', unit: 'mEq' },
  K: { label: 'potassium', unit: 'mEq' },
  Ca: { label: 'calcium', unit: 'mEq' },
  Mg: { label: 'magnesium', unit: 'mEq' },
  phosphate: { label: 'phosphate', unit: 'mmol' },
  Cl: { label: 'chloride', unit: 'mEq' },
  acetate: { label: 'acetate', unit: 'mEq' },
};

export function emptyIons(): IonTable {
  return { Na: ZERO, K: ZERO, Ca: ZERO, Mg: ZERO, phosphate: ZERO, Cl: ZERO, acetate: ZERO };
}

export function addIons(a: IonTable, b: IonTable): IonTable {
  const out = emptyIons();
  for (const k of ION_KEYS) out[k] = a[k].plus(b[k]);
  return out;
}

/** The ion a species counts toward in the table (null for species the table does not list). */
export function ionOfSpecies(s: SpeciesId): IonKey | null {
  switch (s) {
    case 'Na': case 'K': case 'Ca': case 'Mg': case 'Cl': case 'acetate': case 'phosphate':
      return s;
    case 'glycerophosphate':
      return 'phosphate';
    case 'gluconate': case 'lactate': case 'sulfate': case 'glycerol':
      return null;
  }
}

/** A species amount in the table's unit: mEq for ions with a charge, mmol for the phosphate species. */
export function tableAmount(s: SpeciesId, mmol: D): D {
  return isCharged(s) ? mmolToMEq(s, as(mmol, 'mmol')) : mmol;
}

/**
 * The ion table of mmol per bag of every species (as computeBag returns them).
 * Example: 5 mmol Ca → 10 mEq; 2 mmol phosphate + 1 mmol glycerophosphate → 3 mmol phosphate.
 */
export function ionsFromSpecies(speciesMmol: Readonly<Record<SpeciesId, D>>): IonTable {
  const out = emptyIons();
  for (const s of Object.keys(speciesMmol) as SpeciesId[]) {
    const ion = ionOfSpecies(s);
    const mmol = speciesMmol[s];
    if (ion && mmol) out[ion] = out[ion].plus(tableAmount(s, mmol));
  }
  return out;
}

/** The ions a volume of one stock brings. */
export function ionsOfProduct(product: Product, volumeMl: D): IonTable {
  const out = emptyIons();
  for (const s of Object.keys(product.perMl) as SpeciesId[]) {
    const ion = ionOfSpecies(s);
    const perMl = product.perMl[s];
    if (ion && perMl) out[ion] = out[ion].plus(tableAmount(s, perMl.times(volumeMl)));
  }
  return out;
}

/** The anion preference in engine form; `balanced` is the 1:1 ratio. */
export type AnionPreference =
  | { kind: 'chloride' }
  | { kind: 'acetate' }
  | { kind: 'ratio'; chlorideToAcetate: D; balanced: boolean }
  | { kind: 'acetate-amount'; mEq: D }
  | { kind: 'chloride-amount'; mEq: D };

/** The ions an order can ask for by amount (chloride and acetate follow the anion preference). */
export type OrderedIon = 'Na' | 'K' | 'Ca' | 'Mg' | 'phosphate';
export const ORDERED_IONS: readonly OrderedIon[] = ['Na', 'K', 'Ca', 'Mg', 'phosphate'];

/** An ion order resolved to per-bag amounts (per-kg amounts multiplied by the dosing weight). */
export interface IonTargets {
  per: 'day' | 'kg';
  weightKg: D;
  /**
   * Which ions the order names. An absent ion is none ordered: no salt of it is added and no
   * phosphate salt may bring it; what the order's own lines bring of it is shown, not refused.
   * An ion ordered as 0 is held to 0.
   */
  given: Readonly<Record<OrderedIon, boolean>>;
  Na: D;
  K: D;
  Ca: D;
  Mg: D;
  /** mmol of P. */
  phosphate: D;
  phosphateSalt: PhosphateSalt | 'auto';
  anions: AnionPreference;
  /** True when the order named no anion preference and the policy's default was used. */
  anionsFromPolicy: boolean;
}

function anionPreference(input: AnionsInput, factor: D): AnionPreference {
  if (input === 'chloride' || input === 'acetate') return { kind: input };
  if (input === 'balanced') return { kind: 'ratio', chlorideToAcetate: new D(1), balanced: true };
  if ('acetate' in input) return { kind: 'acetate-amount', mEq: input.acetate.times(factor) };
  if ('chloride' in input) return { kind: 'chloride-amount', mEq: input.chloride.times(factor) };
  return { kind: 'ratio', chlorideToAcetate: input.chlorideToAcetate, balanced: false };
}

/**
 * Resolve an ion order to per-bag targets. Absent ions are none ordered (zero); an absent
 * phosphate salt is `auto`; an absent anion preference takes the policy default.
 * Example: `{ per: "kg", Na: 3 }` for 1.5 kg → Na 4.5 mEq per bag.
 */
export function resolveIonOrder(ions: IonOrder, weightKg: D, defaultAnions: AnionsInput): IonTargets {
  const factor = ions.per === 'kg' ? weightKg : new D(1);
  const amount = (v: D | undefined): D => (v ?? ZERO).times(factor);
  return {
    per: ions.per,
    weightKg,
    given: { Na: ions.Na !== undefined, K: ions.K !== undefined, Ca: ions.Ca !== undefined, Mg: ions.Mg !== undefined, phosphate: ions.phosphate !== undefined },
    Na: amount(ions.Na),
    K: amount(ions.K),
    Ca: amount(ions.Ca),
    Mg: amount(ions.Mg),
    phosphate: amount(ions.phosphate),
    phosphateSalt: ions.phosphateSalt ?? 'auto',
    anions: anionPreference(ions.anions ?? defaultAnions, factor),
    anionsFromPolicy: ions.anions === undefined,
  };
}

/** What the order asks of each ion, per bag; `unordered` lists the ions it names no amount of (shown as 0). */
export function orderedTable(t: IonTargets): { ordered: IonTable; unordered: IonKey[] } {
  const ordered: IonTable = { ...emptyIons(), Na: t.Na, K: t.K, Ca: t.Ca, Mg: t.Mg, phosphate: t.phosphate };
  const unordered: IonKey[] = ORDERED_IONS.filter((k) => !t.given[k]);
  if (t.anions.kind === 'chloride-amount') ordered.Cl = t.anions.mEq; else unordered.push('Cl');
  if (t.anions.kind === 'acetate-amount') ordered.acetate = t.anions.mEq; else unordered.push('acetate');
  return { ordered, unordered };
}

/** An ion order as JSON, in the order's own terms (per day or per kg), for proposals. */
export interface IonsJson {
  per: 'day' | 'kg';
  Na?: number;
  K?: number;
  Ca?: number;
  Mg?: number;
  phosphate?: number;
  phosphateSalt: PhosphateSalt | 'auto';
  anions: 'chloride' | 'acetate' | 'balanced' | { acetate: number } | { chloride: number } | { chlorideToAcetate: number };
}

/** Targets back to an ion order block (per-kg orders divided by the weight; 2 decimals per day, 3 per kg); absent ions stay absent. */
export function targetsToJson(t: IonTargets): IonsJson {
  const perKg = t.per === 'kg';
  const show = (v: D): number => (perKg ? round(v.div(t.weightKg), 3) : round(v, 2));
  const a = t.anions;
  let anions: IonsJson['anions'];
  switch (a.kind) {
    case 'chloride': case 'acetate': anions = a.kind; break;
    case 'ratio': anions = a.balanced ? 'balanced' : { chlorideToAcetate: round(a.chlorideToAcetate, 3) }; break;
    case 'acetate-amount': anions = { acetate: show(a.mEq) }; break;
    case 'chloride-amount': anions = { chloride: show(a.mEq) }; break;
  }
  const out: Partial<IonsJson> = { per: t.per };
  for (const k of ORDERED_IONS) if (t.given[k]) out[k] = show(t[k]);
  return { ...out, per: t.per, phosphateSalt: t.phosphateSalt, anions };
}

/** Display name of an ion with its unit, e.g. "sodium (mEq)". */
export function ionLabel(ion: IonKey): string {
  return `${ION_INFO[ion].label} (${ION_INFO[ion].unit})`;
}
