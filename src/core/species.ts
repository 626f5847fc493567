import { D } from './decimal.ts';

/** The dissolved particles that stocks deliver, each counted once (exchange format v1). */
export const SPECIES_IDS = [
  'Na', 'K', 'Ca', 'Mg', 'Cl', 'acetate', 'gluconate', 'lactate', 'sulfate',
  'phosphate', 'glycerophosphate', 'glycerol',
] as const;
export type SpeciesId = (typeof SPECIES_IDS)[number];

/**
 * A record of one value per species, in SPECIES_IDS order, from values listed in that order. Written as
 * one literal so every record has the same shape, built in one step (a record grown key by key is slower
 * to build and to read).
 */
export function speciesRecord<T>(v: readonly T[]): Record<SpeciesId, T> {
  return {
    Na: v[0]!, K: v[1]!, Ca: v[2]!, Mg: v[3]!, Cl: v[4]!, acetate: v[5]!, gluconate: v[6]!, lactate: v[7]!, sulfate: v[8]!,
    phosphate: v[9]!, glycerophosphate: v[10]!, glycerol: v[11]!,
  };
}

/**
 * A record's values in SPECIES_IDS order (speciesRecord's inverse). Read by name: every record has one
 * shape, so each read is a load at a fixed place, where a loop reading `record[s]` by a changing key
 * looks each one up.
 */
export function speciesRow<T>(r: Readonly<Record<SpeciesId, T>>): T[] {
  return [r.Na, r.K, r.Ca, r.Mg, r.Cl, r.acetate, r.gluconate, r.lactate, r.sulfate, r.phosphate, r.glycerophosphate, r.glycerol];
}

/** One row of the species table. */
export interface SpeciesInfo {
  id: SpeciesId;
  label: string;
  /** Ionic charge; null where mEq is not defined (phosphate species: charge depends on pH). */
  charge: number | null;
  /** Formula of the particle whose molar mass is given (checked against a reference library in the tests). */
  formula: string;
  /** g/mol of that formula; for the phosphate species it is the mass of phosphorus (mmol of P). */
  molarMass: D;
  molarMassSource: string;
}

const IUPAC = 'IUPAC 2021 standard atomic weights (abridged), summed by formula';

export const SPECIES: Readonly<Record<SpeciesId, SpeciesInfo>> = {
  Na: { id: 'Na', label: 'sodium', charge: 1, formula: 'Na', molarMass: new D('22.990'), molarMassSource: IUPAC },
  K: { id: 'K', label: 'potassium', charge: 1, formula: 'K', molarMass: new D('39.098'), molarMassSource: IUPAC },
  Ca: { id: 'Ca', label: 'calcium', charge: 2, formula: 'Ca', molarMass: new D('40.078'), molarMassSource: IUPAC },
  Mg: { id: 'Mg', label: 'magnesium', charge: 2, formula: 'Mg', molarMass: new D('24.305'), molarMassSource: IUPAC },
  Cl: { id: 'Cl', label: 'chloride', charge: -1, formula: 'Cl', molarMass: new D('35.45'), molarMassSource: IUPAC },
  acetate: { id: 'acetate', label: 'acetate', charge: -1, formula: 'C2H3O2', molarMass: new D('59.044'), molarMassSource: IUPAC },
  gluconate: { id: 'gluconate', label: 'gluconate', charge: -1, formula: 'C6H11O7', molarMass: new D('195.15'), molarMassSource: IUPAC },
  lactate: { id: 'lactate', label: 'lactate', charge: -1, formula: 'C3H5O3', molarMass: new D('89.07'), molarMassSource: IUPAC },
  sulfate: { id: 'sulfate', label: 'sulfate', charge: -2, formula: 'SO4', molarMass: new D('96.06'), molarMassSource: IUPAC },
  phosphate: { id: 'phosphate', label: 'phosphate (inorganic)', charge: null, formula: 'P', molarMass: new D('30.974'), molarMassSource: `${IUPAC}; counted as mmol of phosphorus` },
  glycerophosphate: { id: 'glycerophosphate', label: 'glycerophosphate (organic phosphate)', charge: null, formula: 'P', molarMass: new D('30.974'), molarMassSource: `${IUPAC}; counted as mmol of phosphorus` },
  glycerol: { id: 'glycerol', label: 'glycerol', charge: 0, formula: 'C3H8O3', molarMass: new D('92.094'), molarMassSource: IUPAC },
};

export function isSpeciesId(value: string): value is SpeciesId {
  return (SPECIES_IDS as readonly string[]).includes(value);
}

/** True for the two phosphate species, which are ordered and labelled in mmol only. */
export function isPhosphateSpecies(id: SpeciesId): boolean {
  return id === 'phosphate' || id === 'glycerophosphate';
}

/** True for the ions that have a charge (mEq is defined for them). */
export function isCharged(id: SpeciesId): boolean {
  const c = SPECIES[id].charge;
  return c !== null && c !== 0;
}
