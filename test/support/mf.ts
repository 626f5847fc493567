import { MF } from 'mf-parser';

/** Average molar mass (g/mol) from a reference chemistry library. Hydrates as `A . nB`. */
export function molarMass(formula: string): number {
  if (formula.trim() === '') throw new Error('empty formula');
  return new MF(formula).getInfo().mass;
}
