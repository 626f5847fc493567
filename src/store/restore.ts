// The one door for every file that enters the store (imported, restored from IndexedDB, pasted):
// recognise what it is, bring older layouts up to the current format version, and only then let the
// core's zod schemas judge it. Migrations never throw and never touch the caller's object.
import type { Problem, Result } from '../core/problems.ts';

/** What a file holds. */
export type FileKind = 'order' | 'catalog' | 'policy';

/** The format version this build writes and reads natively. */
export const CURRENT_VERSION = 1;

export const FORMAT_NAMES: Record<FileKind, string> = {
  order: 'osmocount-order',
  catalog: 'osmocount-catalog',
  policy: 'osmocount-policy',
};

/** The layout a file was read from. */
export type Layout = 'v1' | 'v0' | 'unversioned';

/** A file brought to the current layout, with what was done to it. */
export interface Restored {
  kind: FileKind;
  /** The file in the current (v1) layout; a fresh object, never the input. */
  file: Record<string, unknown>;
  from: Layout;
  /** Human-readable notes on what the migration changed (empty for a v1 file). */
  notes: string[];
}

type Json = Record<string, unknown>;

function isRecord(value: unknown): value is Json {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function kindOfFormat(format: unknown): FileKind | null {
  for (const kind of ['order', 'catalog', 'policy'] as const) if (format === FORMAT_NAMES[kind]) return kind;
  return null;
}

/** Guess an unlabelled file's kind from the fields only that kind has. */
function inferKind(file: Json): FileKind | null {
  if ('products' in file) return 'catalog';
  if ('rules' in file) return 'policy';
  if ('lines' in file || 'items' in file || 'patient' in file) return 'order';
  return null;
}

/**
 * The pre-release order layout (format "osmocount-order", version 0), read for files written by
 * development builds before the v1 exchange format was fixed:
 *
 * | v0 field          | v1 field           |
 * |-------------------|--------------------|
 * | `patient.weight`  | `patient.weightKg` |
 * | `bagMl`           | `volumeMl`         |
 * | `items`           | `lines`            |
 * | `items[].qs`      | `lines[].fill`     |
 *
 * Everything else is the same. When both spellings are present the v1 one wins and a note says so.
 */
function orderFromV0(file: Json, notes: string[]): Json {
  const out: Json = { ...file };
  const rename = (target: Json, from: string, to: string, where: string) => {
    if (!(from in target)) return;
    if (to in target) notes.push(`${where}${from} ignored: ${where}${to} is also present`);
    else { target[to] = target[from]; notes.push(`${where}${from} read as ${where}${to}`); }
    delete target[from];
  };
  if (isRecord(out.patient)) {
    out.patient = { ...out.patient };
    rename(out.patient as Json, 'weight', 'weightKg', 'patient.');
  }
  rename(out, 'bagMl', 'volumeMl', '');
  rename(out, 'items', 'lines', '');
  if (Array.isArray(out.lines)) {
    out.lines = out.lines.map((line: unknown) => {
      if (!isRecord(line) || !('qs' in line)) return line;
      const { qs, ...rest } = line;
      return 'fill' in rest ? rest : { ...rest, fill: qs };
    });
  }
  return out;
}

/**
 * Bring a file to the current layout. `expected` names the kind the caller wants (an order import
 * refuses a catalog). A v1 file passes unchanged; a file without `format`/`version` (written before
 * the header existed) gets them; an order in the v0 pre-release layout is migrated field by field; a
 * newer version is refused with a clear message. Problems carry a path; nothing throws.
 * The result still has to pass the core's schema (parseOrder, parseCatalog, parsePolicy).
 */
export function restoreFile(input: unknown, expected?: FileKind): Result<Restored> {
  if (!isRecord(input)) {
    const what = Array.isArray(input) ? 'an array' : input === null ? 'null' : `a ${typeof input}`;
    return fail('(file)', `must be a JSON object (${expected ? `an ${expected} file` : 'an order, catalog or policy file'}), not ${what}`);
  }
  const hasFormat = input.format !== undefined;
  const kind = hasFormat ? kindOfFormat(input.format) : inferKind(input) ?? expected ?? null;
  if (kind === null) {
    if (hasFormat) return fail('format', `must be one of ${Object.values(FORMAT_NAMES).map((f) => JSON.stringify(f)).join(', ')}`);
    return fail('(file)', 'is not an Osmocount file: it has no "format" and none of the fields of an order, catalog or policy');
  }
  if (expected && kind !== expected) {
    return fail('format', `is ${article(kind)} ${kind} file ("${FORMAT_NAMES[kind]}"); expected ${article(expected)} ${expected} file`);
  }
  const copy = cloneJson(input);
  if (copy === null) return fail('(file)', 'holds values that are not JSON (functions, cycles or big integers)');
  const version = input.version;
  if (version === undefined) {
    const notes = [hasFormat ? 'version 1 assumed (the file has no "version")' : `read as ${article(kind)} ${kind} file (the file has no "format" or "version")`];
    return { ok: true, value: { kind, file: { ...copy, format: FORMAT_NAMES[kind], version: CURRENT_VERSION }, from: 'unversioned', notes } };
  }
  if (version === CURRENT_VERSION) {
    return { ok: true, value: { kind, file: { ...copy, format: FORMAT_NAMES[kind] }, from: 'v1', notes: [] } };
  }
  if (version === 0 && kind === 'order') {
    const notes: string[] = ['migrated from the pre-release layout (version 0)'];
    const file = orderFromV0(copy, notes);
    return { ok: true, value: { kind, file: { ...file, format: FORMAT_NAMES.order, version: CURRENT_VERSION }, from: 'v0', notes } };
  }
  if (typeof version === 'number' && Number.isInteger(version) && version > CURRENT_VERSION) {
    return fail('version', `is ${version}: the file was written by a newer Osmocount; this one reads version ${CURRENT_VERSION}`);
  }
  return fail('version', `must be ${CURRENT_VERSION}${kind === 'order' ? ' (or 0, the pre-release order layout)' : ''}`);
}

/** A deep copy through JSON (what every file is); null when the value is not JSON. */
function cloneJson(value: Json): Json | null {
  try {
    const copy: unknown = JSON.parse(JSON.stringify(value));
    return isRecord(copy) ? copy : null;
  } catch {
    return null;
  }
}

function fail(path: string, message: string): Result<never> {
  const problem: Problem = { path, message };
  return { ok: false, problems: [problem] };
}

function article(word: string): string {
  return /^[aeiou]/.test(word) ? 'an' : 'a';
}
