// Every file that enters the store passes here: restoreFile (layout and version), then the core's zod
// schema for its kind. The result is the v1 file to store and the engine's parsed value.
import { parseCatalog, type Catalog } from '../core/catalog.ts';
import { parseOrder, type Order } from '../core/order.ts';
import { parsePolicy, type Policy } from '../core/policy.ts';
import type { Result } from '../core/problems.ts';
import { restoreFile, type Layout } from './restore.ts';

/** A file that passed restore and its schema: the v1 JSON to keep, and what the engine made of it. */
export interface Valid<T> {
  file: Record<string, unknown>;
  value: T;
  from: Layout;
  notes: string[];
}

function wrap<T>(restored: ReturnType<typeof restoreFile>, parse: (file: Record<string, unknown>) => Result<T>): Result<Valid<T>> {
  if (!restored.ok) return restored;
  const { file, from, notes } = restored.value;
  const parsed = parse(file);
  if (!parsed.ok) return parsed;
  return { ok: true, value: { file, value: parsed.value, from, notes } };
}

/** An order file, migrated and validated against the catalog it will be checked with. */
export function validOrderFile(input: unknown, catalog: Catalog): Result<Valid<Order>> {
  return wrap(restoreFile(input, 'order'), (file) => parseOrder(file, catalog));
}

/** A catalog file, migrated and validated. */
export function validCatalogFile(input: unknown): Result<Valid<Catalog>> {
  return wrap(restoreFile(input, 'catalog'), parseCatalog);
}

/** A policy file, migrated and validated. */
export function validPolicyFile(input: unknown): Result<Valid<Policy>> {
  return wrap(restoreFile(input, 'policy'), parsePolicy);
}
