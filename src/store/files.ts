// The catalog and policy kept in the browser: saved edits and imports, export, reset to the shipped
// defaults, and a library of every version an order was checked against (by content hash).
import type { Problem, Result } from '../core/problems.ts';
import { DEFAULT_FILES } from '../defaults.ts';
import { contentHash } from './canonical.ts';
import type { CheckEnv, Provenance } from './check.ts';
import { read, write, type Store } from './db.ts';
import type { ActiveFile, FileOrigin, FileRef, JsonObject, LibraryEntry } from './types.ts';
import { validCatalogFile, validPolicyFile, type Valid } from './validate.ts';

/** The two reference files the browser keeps. */
export type RefKind = 'catalog' | 'policy';

function validate(kind: RefKind, input: unknown) {
  return kind === 'catalog' ? validCatalogFile(input) : validPolicyFile(input);
}

function idOf(kind: RefKind, file: JsonObject): string {
  const id = file.id;
  return typeof id === 'string' && id !== '' ? id : kind;
}

/** The shipped default file of a kind and its identity. */
export async function shippedFile(kind: RefKind): Promise<{ file: JsonObject; ref: FileRef }> {
  const file = DEFAULT_FILES[kind] as JsonObject;
  return { file, ref: { id: idOf(kind, file), hash: await contentHash(file) } };
}

/** The catalog and policy in force, and what went wrong reading a stored one (it is then the default). */
export interface LoadedEnv {
  env: CheckEnv;
  /** The catalog and policy files in force, as v1 JSON (for editors and export). */
  files: { catalog: JsonObject; policy: JsonObject };
  problems: Problem[];
}

async function loadOne<T>(store: Store, kind: RefKind, check: (input: unknown) => Result<Valid<T>>, problems: Problem[]) {
  const stored = await read(() => store.db.get('active', kind));
  if (!stored.ok) problems.push(...stored.problems);
  const active = stored.ok ? stored.value : undefined;
  if (active) {
    const valid = check(active.file);
    if (valid.ok) return { value: valid.value.value, file: valid.value.file, ref: active.ref, from: active.origin as Provenance };
    // A stored file that no longer validates (e.g. written by another build) is kept in storage,
    // never deleted, and the shipped default is used until the user imports a good one.
    problems.push(...valid.problems.map((p) => ({ path: `stored ${kind}: ${p.path}`, message: p.message })));
  }
  const shipped = await shippedFile(kind);
  const valid = check(shipped.file);
  if (!valid.ok) throw new Error(`shipped ${kind} is invalid`); // a build defect: the test suite checks the shipped files
  return { value: valid.value.value, file: shipped.file, ref: shipped.ref, from: 'shipped' as Provenance };
}

/** Load the catalog and policy in force (stored ones, else the shipped defaults), each with its hash. */
export async function loadEnv(store: Store): Promise<LoadedEnv> {
  const problems: Problem[] = [];
  const catalog = await loadOne(store, 'catalog', validCatalogFile, problems);
  const policy = await loadOne(store, 'policy', validPolicyFile, problems);
  return {
    env: {
      catalog: catalog.value, policy: policy.value,
      catalogRef: catalog.ref, policyRef: policy.ref,
      catalogFrom: catalog.from, policyFrom: policy.from,
    },
    files: { catalog: catalog.file, policy: policy.file },
    problems,
  };
}

/**
 * Save an edited or imported catalog/policy as the one in force. It goes through restore and its zod
 * schema first; an invalid file is rejected with every problem and nothing stored changes.
 */
export async function saveRefFile(store: Store, kind: RefKind, input: unknown, origin: FileOrigin): Promise<Result<ActiveFile>> {
  const valid = validate(kind, input);
  if (!valid.ok) return valid;
  const file = valid.value.file;
  const ref: FileRef = { id: idOf(kind, file), hash: await contentHash(file) };
  const at = store.now();
  const active: ActiveFile = { kind, file, ref, savedAt: at, origin };
  return write(store, ['active', 'library'], async (tx) => {
    await tx.objectStore('active').put(active);
    const library = tx.objectStore('library');
    if (!(await library.get(ref.hash))) await library.put({ hash: ref.hash, kind, id: ref.id, file, firstUsed: at });
    return { ok: true, value: active };
  });
}

/** Go back to the shipped default (the edited file stays in the library, for old orders' comparisons). */
export async function resetRefFile(store: Store, kind: RefKind): Promise<Result<void>> {
  return write(store, ['active'], async (tx) => {
    await tx.objectStore('active').delete(kind);
    return { ok: true, value: undefined };
  });
}

/** The file in force as the v1 JSON text to export. */
export async function exportRefFile(store: Store, kind: RefKind): Promise<Result<string>> {
  const stored = await read(() => store.db.get('active', kind));
  if (!stored.ok) return stored;
  const file = stored.value?.file ?? (DEFAULT_FILES[kind] as JsonObject);
  return { ok: true, value: `${JSON.stringify(file, null, 2)}\n` };
}

/** Record a file in the library (the shipped defaults go in when an order is first checked against them). */
export async function remember(store: Store, kind: RefKind, file: JsonObject, ref: FileRef): Promise<Result<void>> {
  return write(store, ['library'], async (tx) => {
    if (!(await tx.objectStore('library').get(ref.hash))) await tx.objectStore('library').put({ hash: ref.hash, kind, id: ref.id, file, firstUsed: store.now() });
    return { ok: true, value: undefined };
  });
}

/** The catalog or policy with this hash, from the library or the shipped defaults; null when unknown. */
export async function fileByHash(store: Store, kind: RefKind, hash: string): Promise<JsonObject | null> {
  const entry: Result<LibraryEntry | undefined> = await read(() => store.db.get('library', hash));
  if (entry.ok && entry.value && entry.value.kind === kind) return entry.value.file;
  const shipped = await shippedFile(kind);
  return shipped.ref.hash === hash ? shipped.file : null;
}
