// Pure edits of the order document. Each returns a new document, or the same one when nothing changes
// (so the history records only real edits).
import type { Catalog } from '../../core/catalog.ts';
import { LINE_UNITS, type LineUnit } from '../../core/order.ts';
import type { DraftLine, DraftOrder, HeaderField, OrderDoc } from './draft.ts';
import { defaultUnit, fittingSpecies, unitChoices, FILL, type UnitChoice } from './lineUnits.ts';

function withOrder(doc: OrderDoc, order: DraftOrder): OrderDoc {
  return { ...doc, order };
}

function withLine(doc: OrderDoc, index: number, line: DraftLine): OrderDoc {
  const old = doc.order.lines[index];
  if (!old || JSON.stringify(old) === JSON.stringify(line)) return doc;
  const lines = doc.order.lines.slice();
  lines[index] = line;
  return withOrder(doc, { ...doc.order, lines });
}

/** Set a header field to the text typed (or the option chosen). */
export function setHeader(doc: OrderDoc, field: HeaderField, text: string): OrderDoc {
  const o = doc.order;
  const [head, sub] = field.split('.') as [string, string | undefined];
  if (sub !== undefined) {
    const patient = o.patient as Record<string, string>;
    if (patient[sub] === text) return doc;
    return withOrder(doc, { ...o, patient: { ...o.patient, [sub]: text } });
  }
  if ((o as unknown as Record<string, string>)[head] === text) return doc;
  return withOrder(doc, { ...o, [head]: text });
}

/** Set a line's amount to the text typed. */
export function setAmount(doc: OrderDoc, index: number, text: string): OrderDoc {
  const line = doc.order.lines[index];
  if (!line) return doc;
  return withLine(doc, index, { ...line, amount: text });
}

function isLineUnit(text: string | undefined): text is LineUnit {
  return (LINE_UNITS as readonly string[]).includes(text ?? '');
}

/**
 * Pick a line's stock. The unit is kept when the new stock takes it; otherwise the stock's own unit is
 * chosen (per kg if the line was per kg). A species the new stock lacks is dropped.
 */
export function setProduct(doc: OrderDoc, index: number, productId: string, catalog: Catalog): OrderDoc {
  const line = doc.order.lines[index];
  const product = catalog.byId.get(productId);
  if (!line || !product) return doc;
  if (line.fill) return withLine(doc, index, { ...line, product: productId });
  const unit = isLineUnit(line.unit) && unitChoices(product).includes(line.unit) ? line.unit : defaultUnit(product, line.unit?.endsWith('/kg') ?? false);
  const next: DraftLine = { ...line, product: productId, unit, amount: line.amount ?? '' };
  const species = fittingSpecies(product, unit, line.species);
  if (species === undefined) delete next.species;
  else next.species = species;
  return withLine(doc, index, next);
}

/** Choose a line's unit, or make it the fill line (`fill`), which takes no amount or unit. */
export function setUnit(doc: OrderDoc, index: number, unit: UnitChoice, catalog: Catalog): OrderDoc {
  const line = doc.order.lines[index];
  if (!line) return doc;
  if (unit === FILL) {
    const next: DraftLine = { product: line.product, fill: true };
    if (line.note !== undefined) next.note = line.note;
    return withLine(doc, index, next);
  }
  const next: DraftLine = { ...line, unit, amount: line.amount ?? '' };
  delete next.fill;
  const product = catalog.byId.get(line.product);
  const species = product ? fittingSpecies(product, unit, line.species) : line.species;
  if (species === undefined) delete next.species;
  else next.species = species;
  return withLine(doc, index, next);
}

/** Choose which species an mEq/mmol line counts. */
export function setSpecies(doc: OrderDoc, index: number, species: string): OrderDoc {
  const line = doc.order.lines[index];
  if (!line) return doc;
  return withLine(doc, index, { ...line, species });
}

/** Add an empty line just before the fill line (or at the end); returns the document and the new line's key. */
export function addLine(doc: OrderDoc): { doc: OrderDoc; key: string } {
  const key = `l${doc.nextKey}`;
  const fillAt = doc.order.lines.findIndex((l) => l.fill);
  const at = fillAt === -1 ? doc.order.lines.length : fillAt;
  const lines = doc.order.lines.slice();
  lines.splice(at, 0, { product: '', amount: '', unit: '' });
  const keys = doc.keys.slice();
  keys.splice(at, 0, key);
  return { doc: { ...doc, order: { ...doc.order, lines }, keys, nextKey: doc.nextKey + 1 }, key };
}

/** Append a fill line of a stock (the solver's larger volume needs one when the order has none). */
export function addFillLine(doc: OrderDoc, productId: string): OrderDoc {
  return {
    ...doc,
    order: { ...doc.order, lines: [...doc.order.lines, { product: productId, fill: true }] },
    keys: [...doc.keys, `l${doc.nextKey}`],
    nextKey: doc.nextKey + 1,
  };
}

/** Remove a line. */
export function removeLine(doc: OrderDoc, index: number): OrderDoc {
  if (index < 0 || index >= doc.order.lines.length) return doc;
  return {
    ...doc,
    order: { ...doc.order, lines: doc.order.lines.filter((_, i) => i !== index) },
    keys: doc.keys.filter((_, i) => i !== index),
  };
}

/** Move a line up (−1) or down (+1). */
export function moveLine(doc: OrderDoc, index: number, delta: -1 | 1): OrderDoc {
  const to = index + delta;
  const n = doc.order.lines.length;
  if (index < 0 || index >= n || to < 0 || to >= n) return doc;
  const swap = <T>(xs: T[]): T[] => {
    const out = xs.slice();
    const a = out[index] as T;
    out[index] = out[to] as T;
    out[to] = a;
    return out;
  };
  return { ...doc, order: { ...doc.order, lines: swap(doc.order.lines) }, keys: swap(doc.keys) };
}

/** One change a suggestion makes, addressed like a problem path: `volumeMl`, `lines[1].amount`. */
export interface Change {
  path: string;
  value: string;
}

const LINE_PATH = /^lines\[(\d+)\]\.(amount|unit|species)$/;

/** Apply path/value changes (a suggestion) to the document; `lines[+].fill` adds a fill line of that stock; unknown paths are ignored. */
export function applyChanges(doc: OrderDoc, changes: readonly Change[], catalog: Catalog): OrderDoc {
  let out = doc;
  for (const c of changes) {
    const m = LINE_PATH.exec(c.path);
    if (c.path === 'lines[+].fill') {
      out = addFillLine(out, c.value);
    } else if (m) {
      const i = Number(m[1]);
      if (m[2] === 'amount') out = setAmount(out, i, c.value);
      else if (m[2] === 'unit' && (isLineUnit(c.value) || c.value === FILL)) out = setUnit(out, i, c.value, catalog);
      else if (m[2] === 'species') out = setSpecies(out, i, c.value);
    } else if (['id', 'route', 'volumeMl', 'hours', 'patient.weightKg', 'patient.ageGroup'].includes(c.path)) {
      out = setHeader(out, c.path as HeaderField, c.value);
    }
  }
  return out;
}
