import type { Product } from '../catalog.ts';
import { stockFigures } from '../compute/stock.ts';

/**
 * The groups of lines a finding names, one bit each: a line belongs to a group when its stock holds
 * the species (`Ca` … `glycerophosphate`), plays the role (`aminoAcids`, `dextrose`, `lipid`), brings
 * energy (kcal per mL above zero, so every line of it in the bag brings kcal) or has no aluminum value.
 */
export const GROUP = {
  Na: 1 << 0,
  K: 1 << 1,
  Ca: 1 << 2,
  Mg: 1 << 3,
  Cl: 1 << 4,
  phosphate: 1 << 5,
  glycerophosphate: 1 << 6,
  aminoAcids: 1 << 7,
  dextrose: 1 << 8,
  lipid: 1 << 9,
  energy: 1 << 10,
  noAluminum: 1 << 11,
} as const;

function groupsOfProduct(product: Product): number {
  const stock = stockFigures(product);
  let groups = 0;
  for (const s of ['Na', 'K', 'Ca', 'Mg', 'Cl', 'phosphate', 'glycerophosphate'] as const) if (stock.holds.has(s)) groups |= GROUP[s];
  if (product.role === 'amino-acids') groups |= GROUP.aminoAcids;
  if (product.role === 'dextrose') groups |= GROUP.dextrose;
  if (product.role === 'lipid') groups |= GROUP.lipid;
  if (stock.kcalPerMl?.gt(0)) groups |= GROUP.energy;
  if (product.aluminumMcgPerL === null) groups |= GROUP.noAluminum;
  return groups;
}

// Each product's groups, worked out on its first use: a product is an immutable value (an edited catalog
// holds new product objects), and the checks ask of every line which groups it is in, for every bag.
const groupsByProduct = new WeakMap<Product, number>();

/** The groups (GROUP bits) a product's lines belong to. Example: potassium phosphates → K | phosphate. */
export function groupsOf(product: Product): number {
  let groups = groupsByProduct.get(product);
  if (groups === undefined) {
    groups = groupsOfProduct(product);
    groupsByProduct.set(product, groups);
  }
  return groups;
}
