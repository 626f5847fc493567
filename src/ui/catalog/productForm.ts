// A catalog product as an edit form: every value as text, flat keys. The form turns back into the
// catalog file's own product shape, and parseCatalog validates it exactly as it validates a file.
import { parseCatalog, type Catalog } from '../../core/catalog.ts';
import type { Problem } from '../../core/problems.ts';
import { SPECIES_IDS } from '../../core/species.ts';
import { toText } from '../order/draft.ts';

export const NUTRIENT_KEYS = ['gramsPerMl', 'mOsmPerGram', 'basis', 'kcalPerGram'] as const;
const TOP_KEYS = ['id', 'name', 'role', 'strength', 'mOsmPerMl', 'kcalPerMl', 'aluminumMcgPerL', 'orderSpecies'] as const;
const HANDLED = new Set<string>([...TOP_KEYS, 'nutrient', 'perMl', 'sources']);

/** Flat text fields: `name`, `nutrient.gramsPerMl`, `perMl.Na`, `sources` (one `field: source` per line). */
export type ProductForm = Record<string, string>;

function isRecord(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/** The catalog file's products array (empty when the file has none). */
export function fileProducts(file: unknown): unknown[] {
  return isRecord(file) && Array.isArray(file.products) ? file.products : [];
}

/** A product of the file as form text. */
export function formFromProduct(raw: unknown): ProductForm {
  const p = isRecord(raw) ? raw : {};
  const form: ProductForm = {};
  for (const k of TOP_KEYS) form[k] = toText(p[k]);
  const nutrient = isRecord(p.nutrient) ? p.nutrient : {};
  for (const k of NUTRIENT_KEYS) form[`nutrient.${k}`] = toText(nutrient[k]);
  const perMl = isRecord(p.perMl) ? p.perMl : {};
  for (const s of SPECIES_IDS) form[`perMl.${s}`] = toText(perMl[s]);
  const sources = isRecord(p.sources) ? p.sources : {};
  form.sources = Object.entries(sources).map(([k, v]) => `${k}: ${toText(v)}`).join('\n');
  return form;
}

/** A new, empty electrolyte product. */
export function emptyForm(): ProductForm {
  return { ...formFromProduct({}), role: 'electrolyte' };
}

/**
 * The form as a product of the file: text kept as typed, empty fields left out, fields the form does not
 * show (salts, unknown keys of the original) carried over.
 */
export function productFromForm(form: ProductForm, original: unknown): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  if (isRecord(original)) for (const [k, v] of Object.entries(original)) if (!HANDLED.has(k)) out[k] = v;
  const val = (k: string) => (form[k] ?? '').trim();
  for (const k of TOP_KEYS) if (val(k) !== '') out[k] = val(k);
  const nutrient: Record<string, string> = {};
  for (const k of NUTRIENT_KEYS) if (val(`nutrient.${k}`) !== '') nutrient[k] = val(`nutrient.${k}`);
  if (Object.keys(nutrient).length > 0) out.nutrient = nutrient;
  const perMl: Record<string, string> = {};
  for (const s of SPECIES_IDS) if (val(`perMl.${s}`) !== '') perMl[s] = val(`perMl.${s}`);
  if (Object.keys(perMl).length > 0) out.perMl = perMl;
  const sources: Record<string, string> = {};
  for (const line of (form.sources ?? '').split('\n')) {
    const at = line.indexOf(':');
    if (at > 0 && line.slice(at + 1).trim() !== '') sources[line.slice(0, at).trim()] = line.slice(at + 1).trim();
  }
  if (Object.keys(sources).length > 0) out.sources = sources;
  return out;
}

/**
 * The catalog file with one product replaced (at `index`) or added (index = products.length), validated
 * by parseCatalog: the new catalog, or every problem as `path: message`.
 */
export function withProduct(file: unknown, index: number, product: Record<string, unknown>): { file: unknown; result: { ok: true; value: Catalog } | { ok: false; problems: Problem[] } } {
  const products = fileProducts(file).slice();
  products[index] = product;
  const next = { ...(isRecord(file) ? file : {}), products };
  return { file: next, result: parseCatalog(next) };
}

/** The form field a problem path points at (`products[3].nutrient.basis` → `nutrient.basis`), if it is this product's. */
export function formFieldOf(path: string, index: number): string | null {
  const prefix = `products[${index}]`;
  if (!path.startsWith(prefix)) return null;
  const rest = path.slice(prefix.length).replace(/^\./, '');
  return rest === '' ? '' : rest;
}
