import { z } from 'zod';
import { D } from './decimal.ts';
import { isSpeciesId, isPhosphateSpecies, isCharged, SPECIES, SPECIES_IDS, type SpeciesId } from './species.ts';
import { decimal, decimalReader, optionalDecimal, parseWith } from './schema.ts';
import { NUTRIENT_ROLES, type Catalog, type Product } from './catalog.ts';
import type { Problem, Result } from './problems.ts';

export const AGE_GROUPS = ['adult', 'child', 'term-neonate', 'preterm-neonate'] as const;
/** The patient's age group: it selects the policy's limits. */
export type AgeGroup = (typeof AGE_GROUPS)[number];

export const ROUTES = ['peripheral', 'central'] as const;
/** The vein the bag runs into. */
export type Route = (typeof ROUTES)[number];

export const LINE_UNITS = ['mL', 'g', 'mEq', 'mmol', 'mL/kg', 'g/kg', 'mEq/kg', 'mmol/kg'] as const;
/** How an order line's amount is written; the `/kg` forms are multiplied by the dosing weight. */
export type LineUnit = (typeof LINE_UNITS)[number];
export type BaseUnit = 'mL' | 'g' | 'mEq' | 'mmol';

// Written as switches, not a lookup table: a record keyed by these texts is read through a slow generic
// keyed load, and every line of every bag asks both.
/** The unit without its `/kg`: "mEq/kg" → "mEq". */
export function baseUnit(unit: LineUnit): BaseUnit {
  switch (unit) {
    case 'mL/kg': return 'mL';
    case 'g/kg': return 'g';
    case 'mEq/kg': return 'mEq';
    case 'mmol/kg': return 'mmol';
    default: return unit;
  }
}
export function isPerKg(unit: LineUnit): boolean {
  return baseUnit(unit) !== unit;
}

/**
 * Plausibility bounds of an order's numbers (common practice: the smallest live-born infants weigh
 * about 0.25 kg; no PN bag holds 20 L or runs for more than 72 h). They keep every figure finite.
 */
export const LIMITS = {
  weightKg: { min: 0.1, max: 700 },
  volumeMl: { gt: 0, max: 20000 },
  hours: { min: 1, max: 72 },
  amount: { min: 0, max: 100000 },
} as const;

const lineSchema = z.object({
  product: z.string().min(1, 'must name a catalog product'),
  amount: optionalDecimal(LIMITS.amount),
  unit: z.enum(LINE_UNITS).optional(),
  species: z.string().optional(),
  fill: z.boolean().optional(),
  note: z.string().optional(),
});

const anionsSchema = z.union([
  z.enum(['chloride', 'acetate', 'balanced']),
  z.strictObject({ acetate: decimal({ min: 0 }) }),
  z.strictObject({ chloride: decimal({ min: 0 }) }),
  z.strictObject({ chlorideToAcetate: decimal({ min: 0 }) }),
]);

/** The optional ion order (prescriber orders ions; the allocator turns them into salts). */
export const ionsSchema = z.strictObject({
  per: z.enum(['day', 'kg']),
  Na: optionalDecimal({ min: 0 }),
  K: optionalDecimal({ min: 0 }),
  Ca: optionalDecimal({ min: 0 }),
  Mg: optionalDecimal({ min: 0 }),
  phosphate: optionalDecimal({ min: 0 }),
  phosphateSalt: z.enum(['sodium', 'potassium', 'organic', 'auto']).optional(),
  anions: anionsSchema.optional(),
});
export type IonOrder = z.output<typeof ionsSchema>;

export const orderFileSchema = z.object({
  format: z.literal('osmocount-order').optional(),
  version: z.literal(1).optional(),
  id: z.string().trim().min(1, 'must not be empty'),
  patient: z.object({
    id: z.string().trim().min(1, 'must not be empty'),
    name: z.string().optional(),
    location: z.string().optional(),
    weightKg: decimal(LIMITS.weightKg),
    ageGroup: z.enum(AGE_GROUPS),
  }),
  route: z.enum(ROUTES),
  volumeMl: optionalDecimal(LIMITS.volumeMl),
  hours: optionalDecimal(LIMITS.hours),
  lines: z.array(lineSchema),
  ions: ionsSchema.optional(),
  note: z.string().optional(),
});
export type OrderInput = z.input<typeof orderFileSchema>;
type OrderFile = z.output<typeof orderFileSchema>;

// The plain reader (readPlainOrder) and the full path (orderFileSchema, bindLine) must agree: order.test.ts
// holds the reader to give the full path's order whenever it reads a file. Change both together.
const readWeight = decimalReader(LIMITS.weightKg);
const readVolume = decimalReader(LIMITS.volumeMl);
const readHours = decimalReader(LIMITS.hours);
const readAmount = decimalReader(LIMITS.amount);

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}
const isOptionalString = (value: unknown): value is string | undefined => value === undefined || typeof value === 'string';
const isOneOf = <T extends string>(values: readonly T[], value: unknown): value is T => (values as readonly unknown[]).includes(value);

/** The trimmed text of a string field that must not be empty; null otherwise. */
function nonEmptyTrimmed(value: unknown): string | null {
  if (typeof value !== 'string') return null;
  const text = value.trim();
  return text.length > 0 ? text : null;
}

/** One line of a validated order: a product, and how much of it (or the fill). */
export type OrderLine =
  | { kind: 'amount'; index: number; product: Product; amount: D; unit: LineUnit; species: SpeciesId | null; note: string | null }
  | { kind: 'fill'; index: number; product: Product; note: string | null };

/** A validated order, bound to the catalog it was checked against. */
export interface Order {
  id: string;
  patient: { id: string; name: string | null; location: string | null; weightKg: D; ageGroup: AgeGroup };
  route: Route;
  volumeMl: D | null;
  hours: D;
  lines: OrderLine[];
  ions: IonOrder | null;
  note: string | null;
}

type LineInput = z.output<typeof lineSchema>;

/** The path of a line's field in a problem ("lines[3].unit"), written only when a problem names it. */
function linePath(index: number, field = ''): string {
  return `lines[${index}]${field}`;
}

function bindLine(line: LineInput, index: number, catalog: Catalog, problems: Problem[]): OrderLine | null {
  const product = catalog.byId.get(line.product);
  if (!product) {
    problems.push({ path: linePath(index, '.product'), message: `unknown product "${line.product}" (not in the catalog)` });
    return null;
  }
  const note = line.note ?? null;
  if (line.fill) {
    if (line.amount !== undefined || line.unit !== undefined) problems.push({ path: linePath(index), message: 'a fill line takes no amount or unit: it makes up the bag volume' });
    return { kind: 'fill', index, product, note };
  }
  if (line.amount === undefined) problems.push({ path: linePath(index, '.amount'), message: 'is required (a number ≥ 0) unless the line is the fill' });
  if (line.unit === undefined) problems.push({ path: linePath(index, '.unit'), message: `is required unless the line is the fill (one of ${LINE_UNITS.join(', ')})` });
  if (line.amount === undefined || line.unit === undefined) return null;
  const base = baseUnit(line.unit);
  let species: SpeciesId | null = null;
  if (base === 'g' && !NUTRIENT_ROLES.includes(product.role)) {
    problems.push({ path: linePath(index, '.unit'), message: `"g" counts grams of nutrient; ${product.name} is not a dextrose, amino-acid or lipid stock — use mL, mEq or mmol` });
    return null;
  }
  if (base === 'mEq' || base === 'mmol') {
    const named = line.species ?? product.orderSpecies;
    if (named === null) {
      problems.push({ path: linePath(index, '.unit'), message: `${product.name} delivers no ion to count in ${base}; use mL` });
      return null;
    }
    if (!isSpeciesId(named)) {
      problems.push({ path: linePath(index, '.species'), message: `unknown species "${named}"` });
      return null;
    }
    if (!product.perMl[named]?.gt(0)) {
      problems.push({ path: linePath(index, '.species'), message: `${product.name} contains no ${SPECIES[named].label}` });
      return null;
    }
    if (base === 'mEq' && isPhosphateSpecies(named)) {
      problems.push({ path: linePath(index, '.unit'), message: 'phosphate is ordered in mmol, never mEq (its charge depends on pH)' });
      return null;
    }
    if (base === 'mEq' && !isCharged(named)) {
      problems.push({ path: linePath(index, '.unit'), message: `${SPECIES[named].label} has no charge; use mmol` });
      return null;
    }
    species = named;
  } else if (line.species !== undefined) {
    problems.push({ path: linePath(index, '.species'), message: `only mEq and mmol lines name a species` });
  }
  return { kind: 'amount', index, product, amount: line.amount, unit: line.unit, species, note };
}

const LINE_UNIT_SET: ReadonlySet<unknown> = new Set(LINE_UNITS);

/** Whether a value is one of LINE_UNITS (a set: an array search compares the text with each unit). */
function isLineUnit(value: unknown): value is LineUnit {
  return LINE_UNIT_SET.has(value);
}

/**
 * What plainLine asks of a product, answered once per catalog: whether g lines may name it, and the
 * species an mmol or an mEq line may count in it (bindLine's tests, in the same order of precedence).
 */
interface PlainProduct {
  product: Product;
  /** A dextrose, amino-acid or lipid stock: a g line may name it. */
  grams: boolean;
  /** The species it holds (perMl above zero): an mmol line may count these. */
  mmol: ReadonlySet<string>;
  /** The held species that have a charge and are not phosphate: an mEq line may count these. */
  mEq: ReadonlySet<string>;
}

// Keyed by the catalog's product map: a catalog is never edited in place (an edited one is a new catalog),
// so the answers last as long as the map.
const plainProducts = new WeakMap<ReadonlyMap<string, Product>, ReadonlyMap<string, PlainProduct>>();

function plainProductsOf(catalog: Catalog): ReadonlyMap<string, PlainProduct> {
  let index = plainProducts.get(catalog.byId);
  if (index === undefined) {
    const entries = new Map<string, PlainProduct>();
    for (const [id, product] of catalog.byId) {
      const held = SPECIES_IDS.filter((s) => product.perMl[s]?.gt(0));
      entries.set(id, {
        product,
        grams: NUTRIENT_ROLES.includes(product.role),
        mmol: new Set(held),
        mEq: new Set(held.filter((s) => !isPhosphateSpecies(s) && isCharged(s))),
      });
    }
    index = entries;
    plainProducts.set(catalog.byId, index);
  }
  return index;
}

/**
 * A well-formed order line read and bound to its product in one step, as bindLine binds the schema's
 * output; null for anything bindLine or the schema would report (parseOrder then takes the full path).
 */
function plainLine(input: unknown, index: number, products: ReadonlyMap<string, PlainProduct>): OrderLine | null {
  if (!isRecord(input)) return null;
  const { product: id, amount, unit, species: named, fill, note } = input;
  if (typeof id !== 'string' || id.length === 0) return null;
  if (!isOptionalString(named) || !isOptionalString(note) || (fill !== undefined && typeof fill !== 'boolean')) return null;
  if (unit !== undefined && !isLineUnit(unit)) return null;
  const value = amount === undefined ? undefined : readAmount(amount);
  if (value === null) return null;
  const entry = products.get(id);
  if (entry === undefined) return null;
  const product = entry.product;
  if (fill) return value === undefined && unit === undefined ? { kind: 'fill', index, product, note: note ?? null } : null;
  if (value === undefined || unit === undefined) return null;
  const base = baseUnit(unit);
  if (base === 'g' && !entry.grams) return null;
  let species: SpeciesId | null = null;
  if (base === 'mEq' || base === 'mmol') {
    const s = named ?? product.orderSpecies;
    // Both sets hold species ids only: a name in one is a species the product holds.
    if (s === null || !(base === 'mEq' ? entry.mEq : entry.mmol).has(s)) return null;
    species = s as SpeciesId;
  } else if (named !== undefined) return null;
  return { kind: 'amount', index, product, amount: value, unit, species, note: note ?? null };
}

/** Hours of an order that names none: one day. */
const DAY_HOURS = new D(24);

/**
 * A well-formed order file without an ion block, read and bound without the schema machinery: the
 * order parseOrder's full path gives, or null for anything else (a missing or wrong field, an unknown
 * product, an ion block), which the full path then reads and reports. Most files in a batch are well
 * formed, and this is the cheap way through them. order.test.ts holds the two paths to the same result.
 */
export function readPlainOrder(input: unknown, catalog: Catalog): Order | null {
  if (!isRecord(input) || !isRecord(input.patient) || !Array.isArray(input.lines)) return null;
  const { format, version, patient, route, volumeMl, hours, ions, note } = input;
  if ((format !== undefined && format !== 'osmocount-order') || (version !== undefined && version !== 1)) return null;
  if (ions !== undefined || !isOptionalString(note) || !isOneOf(ROUTES, route)) return null;
  const id = nonEmptyTrimmed(input.id);
  const patientId = nonEmptyTrimmed(patient.id);
  const weightKg = readWeight(patient.weightKg);
  const { name, location, ageGroup } = patient;
  if (id === null || patientId === null || weightKg === null || !isOneOf(AGE_GROUPS, ageGroup)) return null;
  if (!isOptionalString(name) || !isOptionalString(location)) return null;
  const volume = volumeMl === undefined ? null : readVolume(volumeMl);
  if (volumeMl !== undefined && volume === null) return null;
  const h = hours === undefined ? DAY_HOURS : readHours(hours);
  if (h === null) return null;
  const fileLines = input.lines as unknown[];
  if (fileLines.length === 0) return null;
  const products = plainProductsOf(catalog);
  const lines: OrderLine[] = [];
  let filled = false;
  for (let i = 0; i < fileLines.length; i++) {
    const line = plainLine(fileLines[i], i, products);
    if (line === null) return null;
    if (line.kind === 'fill') {
      if (filled || volume === null) return null;
      filled = true;
    }
    lines.push(line);
  }
  return {
    id,
    patient: { id: patientId, name: name ?? null, location: location ?? null, weightKg, ageGroup },
    route, volumeMl: volume, hours: h, lines, ions: null, note: note ?? null,
  };
}

/**
 * Validate an order file against a catalog. Every problem is listed with its path; nothing throws.
 * Unknown products and species, mEq of phosphate and two fill lines are errors.
 */
export function parseOrder(input: unknown, catalog: Catalog): Result<Order> {
  const plain = readPlainOrder(input, catalog);
  return plain ? { ok: true, value: plain } : parseOrderFile(input, catalog);
}

/** parseOrder's full path: the schema, then each line bound to the catalog, every problem listed. */
export function parseOrderFile(input: unknown, catalog: Catalog): Result<Order> {
  const parsed: Result<OrderFile> = parseWith(orderFileSchema, input);
  if (!parsed.ok) return parsed;
  const o = parsed.value;
  const problems: Problem[] = [];
  const lines: OrderLine[] = [];
  let firstFill = -1;
  let secondFill = -1;
  for (let i = 0; i < o.lines.length; i++) {
    const line = o.lines[i]!;
    const bound = bindLine(line, i, catalog, problems);
    if (bound) lines.push(bound);
    if (line.fill) {
      if (firstFill === -1) firstFill = i;
      else if (secondFill === -1) secondFill = i;
    }
  }
  if (secondFill !== -1) problems.push({ path: `lines[${secondFill}].fill`, message: `only one line may fill the bag (line ${firstFill} already does)` });
  if (firstFill !== -1 && o.volumeMl === undefined) problems.push({ path: 'volumeMl', message: 'is required when a line fills the bag' });
  if (o.lines.length === 0 && !o.ions) problems.push({ path: 'lines', message: 'must hold at least one line' });
  if (problems.length > 0) return { ok: false, problems };
  return {
    ok: true,
    value: {
      id: o.id,
      patient: { id: o.patient.id, name: o.patient.name ?? null, location: o.patient.location ?? null, weightKg: o.patient.weightKg, ageGroup: o.patient.ageGroup },
      route: o.route,
      volumeMl: o.volumeMl ?? null,
      hours: o.hours ?? DAY_HOURS,
      lines,
      ions: o.ions ?? null,
      note: o.note ?? null,
    },
  };
}
