import { z } from 'zod';
import { D } from './decimal.ts';
import { isSpeciesId, isPhosphateSpecies, isCharged, SPECIES, type SpeciesId } from './species.ts';
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

const BASE_UNIT: Readonly<Record<LineUnit, BaseUnit>> = {
  mL: 'mL', g: 'g', mEq: 'mEq', mmol: 'mmol', 'mL/kg': 'mL', 'g/kg': 'g', 'mEq/kg': 'mEq', 'mmol/kg': 'mmol',
};
/** The unit without its `/kg`: "mEq/kg" → "mEq". */
export function baseUnit(unit: LineUnit): BaseUnit {
  return BASE_UNIT[unit];
}
export function isPerKg(unit: LineUnit): boolean {
  return BASE_UNIT[unit] !== unit;
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

// The plain reader below and orderFileSchema must agree: order.test.ts holds the reader to give the
// schema's output whenever it reads a file. Change both together.
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

function readLine(input: unknown): LineInput | null {
  if (!isRecord(input)) return null;
  const { product, amount, unit, species, fill, note } = input;
  if (typeof product !== 'string' || product.length === 0) return null;
  if (!isOptionalString(species) || !isOptionalString(note) || (fill !== undefined && typeof fill !== 'boolean')) return null;
  if (unit !== undefined && !isOneOf(LINE_UNITS, unit)) return null;
  const line: LineInput = { product };
  if (amount !== undefined) {
    const d = readAmount(amount);
    if (d === null) return null;
    line.amount = d;
  }
  if (unit !== undefined) line.unit = unit;
  if (species !== undefined) line.species = species;
  if (fill !== undefined) line.fill = fill;
  if (note !== undefined) line.note = note;
  return line;
}

/**
 * A well-formed order file read without the schema machinery: the same output as orderFileSchema, or
 * null for anything else (an ion block, a missing or wrong field), which the schema then reads and
 * reports. Most files in a batch are well formed, and this is the cheap way through them.
 */
export function readPlainOrderFile(input: unknown): OrderFile | null {
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
  const lines: LineInput[] = [];
  for (const l of input.lines as unknown[]) {
    const line = readLine(l);
    if (line === null) return null;
    lines.push(line);
  }
  const out: OrderFile = { id, patient: { id: patientId, weightKg, ageGroup }, route, lines };
  if (name !== undefined) out.patient.name = name;
  if (location !== undefined) out.patient.location = location;
  if (format !== undefined) out.format = format;
  if (version !== undefined) out.version = version;
  if (note !== undefined) out.note = note;
  if (volumeMl !== undefined) {
    const d = readVolume(volumeMl);
    if (d === null) return null;
    out.volumeMl = d;
  }
  if (hours !== undefined) {
    const d = readHours(hours);
    if (d === null) return null;
    out.hours = d;
  }
  return out;
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

function bindLine(line: LineInput, index: number, catalog: Catalog, problems: Problem[]): OrderLine | null {
  const at = `lines[${index}]`;
  const product = catalog.byId.get(line.product);
  if (!product) {
    problems.push({ path: `${at}.product`, message: `unknown product "${line.product}" (not in the catalog)` });
    return null;
  }
  const note = line.note ?? null;
  if (line.fill) {
    if (line.amount !== undefined || line.unit !== undefined) problems.push({ path: at, message: 'a fill line takes no amount or unit: it makes up the bag volume' });
    return { kind: 'fill', index, product, note };
  }
  if (line.amount === undefined) problems.push({ path: `${at}.amount`, message: 'is required (a number ≥ 0) unless the line is the fill' });
  if (line.unit === undefined) problems.push({ path: `${at}.unit`, message: `is required unless the line is the fill (one of ${LINE_UNITS.join(', ')})` });
  if (line.amount === undefined || line.unit === undefined) return null;
  const base = baseUnit(line.unit);
  let species: SpeciesId | null = null;
  if (base === 'g' && !NUTRIENT_ROLES.includes(product.role)) {
    problems.push({ path: `${at}.unit`, message: `"g" counts grams of nutrient; ${product.name} is not a dextrose, amino-acid or lipid stock — use mL, mEq or mmol` });
    return null;
  }
  if (base === 'mEq' || base === 'mmol') {
    const named = line.species ?? product.orderSpecies;
    if (named === null) {
      problems.push({ path: `${at}.unit`, message: `${product.name} delivers no ion to count in ${base}; use mL` });
      return null;
    }
    if (!isSpeciesId(named)) {
      problems.push({ path: `${at}.species`, message: `unknown species "${named}"` });
      return null;
    }
    if (!product.perMl[named]?.gt(0)) {
      problems.push({ path: `${at}.species`, message: `${product.name} contains no ${SPECIES[named].label}` });
      return null;
    }
    if (base === 'mEq' && isPhosphateSpecies(named)) {
      problems.push({ path: `${at}.unit`, message: 'phosphate is ordered in mmol, never mEq (its charge depends on pH)' });
      return null;
    }
    if (base === 'mEq' && !isCharged(named)) {
      problems.push({ path: `${at}.unit`, message: `${SPECIES[named].label} has no charge; use mmol` });
      return null;
    }
    species = named;
  } else if (line.species !== undefined) {
    problems.push({ path: `${at}.species`, message: `only mEq and mmol lines name a species` });
  }
  return { kind: 'amount', index, product, amount: line.amount, unit: line.unit, species, note };
}

/**
 * Validate an order file against a catalog. Every problem is listed with its path; nothing throws.
 * Unknown products and species, mEq of phosphate and two fill lines are errors.
 */
export function parseOrder(input: unknown, catalog: Catalog): Result<Order> {
  const plain = readPlainOrderFile(input);
  const parsed: Result<OrderFile> = plain ? { ok: true, value: plain } : parseWith(orderFileSchema, input);
  if (!parsed.ok) return parsed;
  const o = parsed.value;
  const problems: Problem[] = [];
  const lines: OrderLine[] = [];
  o.lines.forEach((line, i) => {
    const bound = bindLine(line, i, catalog, problems);
    if (bound) lines.push(bound);
  });
  const fills = o.lines.flatMap((l, i) => (l.fill ? [i] : []));
  if (fills.length > 1) problems.push({ path: `lines[${fills[1]}].fill`, message: `only one line may fill the bag (line ${fills[0]} already does)` });
  if (fills.length > 0 && o.volumeMl === undefined) problems.push({ path: 'volumeMl', message: 'is required when a line fills the bag' });
  if (o.lines.length === 0 && !o.ions) problems.push({ path: 'lines', message: 'must hold at least one line' });
  if (problems.length > 0) return { ok: false, problems };
  return {
    ok: true,
    value: {
      id: o.id,
      patient: { id: o.patient.id, name: o.patient.name ?? null, location: o.patient.location ?? null, weightKg: o.patient.weightKg, ageGroup: o.patient.ageGroup },
      route: o.route,
      volumeMl: o.volumeMl ?? null,
      hours: o.hours ?? new D(24),
      lines,
      ions: o.ions ?? null,
      note: o.note ?? null,
    },
  };
}
