// The plain order files that make up nearly every batch — the fields of the order format, each of the
// right type and within its bounds, and no ion block — read straight into what the order schema would
// produce, without the schema machinery (a batch spends most of its validation time there). Anything else
// returns null and goes to the schema, which reports every problem. A law test holds the two readers to
// the same result on generated and mutated files.
import { toDecimal, type D } from './decimal.ts';
import { AGE_GROUPS, LIMITS, LINE_UNITS, ROUTES, type OrderFile } from './order.ts';

type Bound = { min?: number; gt?: number; max?: number };

const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);
// order.ts imports this module: its constants are read when a file is read, never while modules load.
const oneOf = (list: readonly string[], v: unknown): boolean => typeof v === 'string' && list.includes(v);

/** A decimal within its bound, or null (as the schema's decimal fields decide). */
function bounded(value: unknown, bound: Bound): D | null {
  const d = toDecimal(value);
  if (d === null) return null;
  if (bound.gt !== undefined && d.lte(bound.gt)) return null;
  if (bound.min !== undefined && d.lt(bound.min)) return null;
  if (bound.max !== undefined && d.gt(bound.max)) return null;
  return d;
}

/** A present, non-empty string after trimming (the schema trims ids), or null. */
function trimmedId(value: unknown): string | null {
  if (typeof value !== 'string') return null;
  const t = value.trim();
  return t === '' ? null : t;
}

const optionalString = (v: unknown): boolean => v === undefined || typeof v === 'string';

type LineFile = OrderFile['lines'][number];

function plainLine(value: unknown): LineFile | null {
  if (!isRecord(value)) return null;
  const { product, amount, unit, species, fill, note } = value;
  if (typeof product !== 'string' || product === '') return null;
  if ((unit !== undefined && !oneOf(LINE_UNITS, unit)) || !optionalString(species) || !optionalString(note)) return null;
  if (fill !== undefined && typeof fill !== 'boolean') return null;
  const line: LineFile = { product };
  if (amount !== undefined) {
    const d = bounded(amount, LIMITS.amount);
    if (d === null) return null;
    line.amount = d;
  }
  if (unit !== undefined) line.unit = unit as LineFile['unit'] & string;
  if (species !== undefined) line.species = species as string;
  if (fill !== undefined) line.fill = fill;
  if (note !== undefined) line.note = note as string;
  return line;
}

/**
 * The order schema's result for a plain, valid order file without an ion block; null for anything else
 * (then the schema reads the file and reports its problems).
 */
export function readPlainOrder(input: unknown): OrderFile | null {
  if (!isRecord(input)) return null;
  const { format, version, id, patient, route, volumeMl, hours, lines, ions, note } = input;
  if (ions !== undefined || (format !== undefined && format !== 'osmocount-order') || (version !== undefined && version !== 1)) return null;
  const orderId = trimmedId(id);
  if (orderId === null || !oneOf(ROUTES, route) || !Array.isArray(lines) || !optionalString(note) || !isRecord(patient)) return null;
  const patientId = trimmedId(patient.id);
  const weightKg = bounded(patient.weightKg, LIMITS.weightKg);
  if (patientId === null || weightKg === null || !oneOf(AGE_GROUPS, patient.ageGroup) || !optionalString(patient.name) || !optionalString(patient.location)) return null;
  const out: OrderFile = {
    id: orderId,
    patient: { id: patientId, weightKg, ageGroup: patient.ageGroup as OrderFile['patient']['ageGroup'] },
    route: route as OrderFile['route'],
    lines: [],
  };
  if (format !== undefined) out.format = 'osmocount-order';
  if (version !== undefined) out.version = 1;
  if (patient.name !== undefined) out.patient.name = patient.name as string;
  if (patient.location !== undefined) out.patient.location = patient.location as string;
  if (volumeMl !== undefined) {
    const d = bounded(volumeMl, LIMITS.volumeMl);
    if (d === null) return null;
    out.volumeMl = d;
  }
  if (hours !== undefined) {
    const d = bounded(hours, LIMITS.hours);
    if (d === null) return null;
    out.hours = d;
  }
  for (const l of lines as unknown[]) {
    const line = plainLine(l);
    if (line === null) return null;
    out.lines.push(line);
  }
  if (note !== undefined) out.note = note as string;
  return out;
}
