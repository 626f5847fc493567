// The order being edited, held as the order file's own shape with every value as typed (strings).
// Nothing here parses numbers: the engine (parseOrder) reads the text when the order is checked.
import type { Problem, Result } from '../../core/problems.ts';

/** One order line as the file holds it; amounts are the text the user typed. */
export interface DraftLine {
  product: string;
  amount?: string;
  unit?: string;
  species?: string;
  fill?: boolean;
  note?: string;
}

/** The order file's shape (format v1) with text values; `ions` and unknown fields pass through untouched. */
export interface DraftOrder {
  id: string;
  patient: { id: string; name: string; location: string; weightKg: string; ageGroup: string };
  route: string;
  volumeMl: string;
  hours: string;
  lines: DraftLine[];
  note: string;
  /** Fields of the file the workspace does not edit (e.g. the `ions` block), kept as they were. */
  rest: Record<string, unknown>;
}

/** The edited document: the order plus a stable key per line (for focus and highlighting across edits). */
export interface OrderDoc {
  /** Which opened document this is (a new order or an opened file gets a new one; edits keep it). */
  docId: number;
  order: DraftOrder;
  keys: string[];
  nextKey: number;
}

/** Header fields the workspace edits as text, by their path in the order file. */
export const HEADER_TEXT_FIELDS = ['id', 'patient.id', 'patient.name', 'patient.location', 'patient.weightKg', 'volumeMl', 'hours'] as const;
export type HeaderTextField = (typeof HEADER_TEXT_FIELDS)[number];
export type HeaderField = HeaderTextField | 'patient.ageGroup' | 'route';

/** Editable fields of a line; `fill` is switched through the unit. */
export type LineTextField = 'amount';

const KNOWN = new Set(['format', 'version', 'id', 'patient', 'route', 'volumeMl', 'hours', 'lines', 'note']);

/** A JSON value as the text a user would have typed: numbers keep their JSON spelling, absent is empty. */
export function toText(value: unknown): string {
  if (value === undefined || value === null) return '';
  if (typeof value === 'string') return value;
  if (typeof value === 'number' || typeof value === 'boolean') return String(value);
  return JSON.stringify(value);
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function lineFromFile(value: unknown): DraftLine {
  if (!isRecord(value)) return { product: toText(value) };
  const line: DraftLine = { product: toText(value.product) };
  if (value.fill === true) line.fill = true;
  if (value.amount !== undefined) line.amount = toText(value.amount);
  if (value.unit !== undefined) line.unit = toText(value.unit);
  if (value.species !== undefined) line.species = toText(value.species);
  if (value.note !== undefined) line.note = toText(value.note);
  return line;
}

let lastDocId = 0;

function withKeys(order: DraftOrder): OrderDoc {
  lastDocId += 1;
  return { docId: lastDocId, order, keys: order.lines.map((_, i) => `l${i}`), nextKey: order.lines.length };
}

/**
 * Open an order file (parsed JSON) for editing. Every value becomes its text; only a file that is not an
 * order object at all is refused (the engine reports everything else, field by field).
 */
export function docFromFile(input: unknown): Result<OrderDoc> {
  if (Array.isArray(input)) {
    return { ok: false, problems: [{ path: '(file)', message: `holds ${input.length} orders; open one order at a time (the command line checks batches)` }] };
  }
  if (!isRecord(input)) return { ok: false, problems: [{ path: '(file)', message: 'must be an order object' }] };
  const problems: Problem[] = [];
  if (input.format !== undefined && input.format !== 'osmocount-order') problems.push({ path: 'format', message: 'must be "osmocount-order"' });
  if (input.lines !== undefined && !Array.isArray(input.lines)) problems.push({ path: 'lines', message: 'must be an array of lines' });
  if (problems.length > 0) return { ok: false, problems };
  const patient = isRecord(input.patient) ? input.patient : {};
  const rest: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(input)) if (!KNOWN.has(k)) rest[k] = v;
  const order: DraftOrder = {
    id: toText(input.id),
    patient: {
      id: toText(patient.id), name: toText(patient.name), location: toText(patient.location),
      weightKg: toText(patient.weightKg), ageGroup: toText(patient.ageGroup),
    },
    route: toText(input.route),
    volumeMl: toText(input.volumeMl),
    hours: toText(input.hours),
    lines: Array.isArray(input.lines) ? input.lines.map(lineFromFile) : [],
    note: toText(input.note),
    rest,
  };
  return { ok: true, value: withKeys(order) };
}

/** A blank adult order with one empty line and a water fill line, ready to type into. */
export function newOrderDoc(): OrderDoc {
  return withKeys({
    id: '', patient: { id: '', name: '', location: '', weightKg: '', ageGroup: 'adult' },
    route: 'peripheral', volumeMl: '', hours: '24',
    lines: [{ product: '', amount: '', unit: '' }, { product: 'sterile-water', fill: true }],
    note: '', rest: {},
  });
}

function put(target: Record<string, unknown>, key: string, text: string | undefined): void {
  if (text !== undefined && text.trim() !== '') target[key] = text;
}

/**
 * The order file the engine checks: empty text is left out (so a missing value reads "is required"),
 * every other value is passed as typed. Fields the workspace does not edit come back as they were.
 */
export function toOrderFile(order: DraftOrder): Record<string, unknown> {
  const patient: Record<string, unknown> = {};
  put(patient, 'id', order.patient.id);
  put(patient, 'name', order.patient.name);
  put(patient, 'location', order.patient.location);
  put(patient, 'weightKg', order.patient.weightKg);
  put(patient, 'ageGroup', order.patient.ageGroup);
  const file: Record<string, unknown> = { format: 'osmocount-order', version: 1, ...order.rest };
  file.id = order.id;
  file.patient = patient;
  put(file, 'route', order.route);
  put(file, 'volumeMl', order.volumeMl);
  put(file, 'hours', order.hours);
  file.lines = order.lines.map((l) => {
    const line: Record<string, unknown> = { product: l.product };
    if (l.fill) line.fill = true;
    put(line, 'amount', l.amount);
    put(line, 'unit', l.unit);
    put(line, 'species', l.species);
    put(line, 'note', l.note);
    return line;
  });
  put(file, 'note', order.note);
  return file;
}

/** Read a header field's text. */
export function headerValue(order: DraftOrder, field: HeaderField): string {
  switch (field) {
    case 'id': return order.id;
    case 'route': return order.route;
    case 'volumeMl': return order.volumeMl;
    case 'hours': return order.hours;
    case 'patient.id': return order.patient.id;
    case 'patient.name': return order.patient.name;
    case 'patient.location': return order.patient.location;
    case 'patient.weightKg': return order.patient.weightKg;
    case 'patient.ageGroup': return order.patient.ageGroup;
  }
}
