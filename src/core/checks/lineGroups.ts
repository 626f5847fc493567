import type { Product } from '../catalog.ts';
import { stockFigures } from '../compute/stock.ts';
import type { Bag, BagLine } from '../compute/bag.ts';
import { NO_LINES } from '../findings.ts';

/**
 * The groups of lines a finding names, one bit each: a line belongs to a group when its stock holds
 * the species (`Ca` … `glycerophosphate`), plays the role (`aminoAcids`, `dextrose`, `lipid`), brings
 * energy (kcal per mL above zero, so every line of it in the bag brings kcal), has no aluminum value, or
 * holds both calcium and chloride.
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
  /** Calcium with chloride (calcium chloride): holds both. */
  calciumChloride: 1 << 12,
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
  if ((groups & GROUP.Ca) !== 0 && (groups & GROUP.Cl) !== 0) groups |= GROUP.calciumChloride;
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

/** How many GROUP bits there are. */
const GROUP_BITS = Object.keys(GROUP).length;

/**
 * The lines of one bag that are in the bag, with their groups: `index[i]` is the order line's index,
 * `groups[i]` its GROUP bits and `product[i]` its product, for i below `count`; `byGroup[b]` holds the
 * indexes of the lines in the group of bit b (its first `inGroup[b]` entries), in line order. See inBagGroups.
 */
export interface InBagGroups {
  count: number;
  readonly index: number[];
  readonly groups: number[];
  /** The line's product. */
  readonly product: Product[];
  readonly byGroup: readonly number[][];
  readonly inGroup: number[];
}

// One set of lists, for the last bag asked about: the checks that name lines by group (dose ranges,
// calcium–phosphate, 3-in-1 stability) run one after another on the same bag, so the lines are looked up
// once per bag, and no lists are made per bag. `of` is the bag's lines array the lists were filled from.
const scratch: InBagGroups & { of: readonly BagLine[] | null } = {
  count: 0, index: [], groups: [], product: [],
  byGroup: Array.from({ length: GROUP_BITS }, (): number[] => []), inGroup: new Array<number>(GROUP_BITS).fill(0),
  of: null,
};

/**
 * The lines of a bag that are in the bag, with their groups, in line order. The lists are shared and
 * filled again when another bag is asked about: read them (with linesIn) before that.
 */
export function inBagGroups(bag: Bag): InBagGroups {
  // A bag's lines are never changed once it is computed (a changed order makes a new bag).
  if (scratch.of === bag.lines) return scratch;
  let n = 0;
  const { index, groups, product, byGroup, inGroup } = scratch;
  inGroup.fill(0);
  for (const l of bag.lines) {
    if (!l.inBag) continue;
    const g = groupsOf(l.product);
    index[n] = l.line.index;
    groups[n] = g;
    product[n] = l.product;
    n++;
    // Each group bit of the line, lowest first.
    for (let rest = g; rest !== 0; rest &= rest - 1) {
      const b = 31 - Math.clz32(rest & -rest);
      byGroup[b]![inGroup[b]!++] = l.line.index;
    }
  }
  scratch.count = n;
  scratch.of = bag.lines;
  return scratch;
}

/** Whether any line is in any of the `mask` groups. */
export function anyIn(lines: InBagGroups, mask: number): boolean {
  for (let i = 0; i < lines.count; i++) if ((lines.groups[i]! & mask) !== 0) return true;
  return false;
}

// A mask of one group reads that group's list; a mask of several goes over the lines (a line in two of
// them is named once).

function countIn(lines: InBagGroups, mask: number): number {
  if (mask === 0) return 0;
  if ((mask & (mask - 1)) === 0) return lines.inGroup[31 - Math.clz32(mask)]!;
  let found = 0;
  for (let i = 0; i < lines.count; i++) if ((lines.groups[i]! & mask) !== 0) found++;
  return found;
}

function putIn(lines: InBagGroups, mask: number, out: number[], at: number): number {
  if (mask === 0) return at;
  if ((mask & (mask - 1)) === 0) {
    const b = 31 - Math.clz32(mask);
    const list = lines.byGroup[b]!;
    const n = lines.inGroup[b]!;
    for (let i = 0; i < n; i++) out[at++] = list[i]!;
    return at;
  }
  for (let i = 0; i < lines.count; i++) if ((lines.groups[i]! & mask) !== 0) out[at++] = lines.index[i]!;
  return at;
}

/**
 * The indexes of the lines in any of the `first` groups, in line order, then those in any of the `second`,
 * then the `third` (one list after the other, as a finding names them: a line in two is named twice).
 * A new array of just that length, or the shared empty NO_LINES when there are none.
 */
export function linesIn(lines: InBagGroups, first: number, second = 0, third = 0): number[] {
  const found = countIn(lines, first) + countIn(lines, second) + countIn(lines, third);
  if (found === 0) return NO_LINES;
  const out: number[] = new Array<number>(found);
  putIn(lines, third, out, putIn(lines, second, out, putIn(lines, first, out, 0)));
  return out;
}
