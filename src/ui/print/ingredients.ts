import { labelAmount, type LabelAmount } from '../../core/labelAmount.ts';
import type { Catalog, Product } from '../../core/catalog.ts';
import type { Report } from '../../core/report.ts';
import type { SpeciesId } from '../../core/species.ts';

// The label lists ingredients in the sequence of the standard order form (field guide §8.1; ASPEN
// 2004 label templates and ASPEN 2014 consensus): macronutrients (amino acids, dextrose, lipid),
// then electrolytes as complete salts (sodium, potassium, magnesium, calcium; within each, chloride,
// acetate, phosphate), then vitamins, trace elements and other additives. The fill water is left out.

export const INGREDIENT_GROUPS = ['macronutrients', 'electrolytes', 'vitamins', 'trace-elements', 'other-additives'] as const;
/** Where an ingredient sits in the label sequence. */
export type IngredientGroup = (typeof INGREDIENT_GROUPS)[number];

export const GROUP_TEXT: Readonly<Record<IngredientGroup, string>> = {
  macronutrients: 'Macronutrients',
  electrolytes: 'Electrolytes',
  vitamins: 'Vitamins',
  'trace-elements': 'Trace elements',
  'other-additives': 'Other additives',
};

/** One ingredient of the bag as the label lists it. */
export interface Ingredient {
  /** The order line it comes from. */
  index: number;
  group: IngredientGroup;
  name: string;
  amount: LabelAmount;
}

const NUTRIENT_ORDER: Readonly<Record<string, number>> = { 'amino-acids': 0, dextrose: 1, lipid: 2 };
const CATION_ORDER: readonly SpeciesId[] = ['Na', 'K', 'Mg', 'Ca'];
const ANION_ORDER: readonly SpeciesId[][] = [['Cl'], ['acetate'], ['phosphate', 'glycerophosphate']];

// Additives are told apart by their generic names (catalog roles do not separate them).
const VITAMINS = /vitamin|thiamine|pyridoxine|ascorbic|phytonadione|folic acid|cyanocobalamin/i;
const TRACE = /trace element|zinc|selen|copper|cupric|manganese|chromium|iodide|molybd/i;

function additiveGroup(name: string): IngredientGroup {
  if (VITAMINS.test(name)) return 'vitamins';
  if (TRACE.test(name)) return 'trace-elements';
  return 'other-additives';
}

function groupOf(role: string, name: string): IngredientGroup {
  if (role in NUTRIENT_ORDER) return 'macronutrients';
  if (role === 'electrolyte') return 'electrolytes';
  return additiveGroup(name);
}

function rank(list: readonly (readonly SpeciesId[])[], p: Product | undefined): number {
  if (!p) return list.length;
  const i = list.findIndex((ids) => ids.some((s) => p.perMl[s]?.gt(0)));
  return i === -1 ? list.length : i;
}

/** Sort key inside a group: nutrient kind, or cation then anion for salts; then the order line. */
function keyOf(role: string, p: Product | undefined): number[] {
  if (role in NUTRIENT_ORDER) return [NUTRIENT_ORDER[role] ?? 9];
  if (role === 'electrolyte') return [rank(CATION_ORDER.map((c) => [c]), p), rank(ANION_ORDER, p)];
  return [0];
}

function compareKeys(a: number[], b: number[]): number {
  for (let i = 0; i < Math.max(a.length, b.length); i += 1) {
    const d = (a[i] ?? 0) - (b[i] ?? 0);
    if (d !== 0) return d;
  }
  return 0;
}

/**
 * The name an ingredient goes by on the label: the stock's generic name without its strength,
 * dosage form and parenthesised details ("Sodium chloride 23.4% injection (4 mEq/mL)" → "Sodium
 * chloride"), keeping an age qualifier ("Multiple vitamins injection, adult" → "Multiple vitamins,
 * adult"); a lipid keeps its oil ("Lipid emulsion (soybean oil)").
 */
export function labelName(name: string, role: string): string {
  const paren = /\(([^)]*)\)/.exec(name)?.[1]?.trim();
  const plain = name.replace(/\s*\([^)]*\)/g, '').trim();
  const [head = plain, tail = ''] = plain.split(/\s+(?:injection|injectable)\b/i);
  const base = head.replace(/\s+\d+(?:\.\d+)?\s*%$/, '').trim() || plain;
  if (role === 'lipid') return `Lipid emulsion${paren ? ` (${paren})` : ''}`;
  const qualifier = /^\s*(?:concentrate\s*)?,\s*(adult|pediatric|paediatric|neonatal|infant)\b/i.exec(tail)?.[1];
  return qualifier ? `${base}, ${qualifier}` : base;
}

/** The bag's ingredients in label sequence, each with its label amount; the fill water left out. */
export function labelIngredients(report: Report, catalog: Catalog): Ingredient[] {
  const out: { ingredient: Ingredient; key: number[] }[] = [];
  for (const line of report.lines) {
    const product = catalog.byId.get(line.product);
    const amount = labelAmount(line, product, report.patient.weightKg);
    if (!amount) continue;
    const group = groupOf(line.role, line.name);
    out.push({ ingredient: { index: line.index, group, name: labelName(line.name, line.role), amount }, key: [INGREDIENT_GROUPS.indexOf(group), ...keyOf(line.role, product), line.index] });
  }
  return out.sort((a, b) => compareKeys(a.key, b.key)).map((x) => x.ingredient);
}
