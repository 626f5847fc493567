// Generators of damaged files for the import fuzz tests: a valid file with a few random edits at
// random places (a field deleted, retyped, set to an edge value, an array emptied or duplicated, an
// unknown field added), or arbitrary JSON.
import fc from 'fast-check';

type Json = unknown;

/** Every path inside a JSON value (the root is []). */
export function pathsOf(value: Json, prefix: (string | number)[] = [], out: (string | number)[][] = []): (string | number)[][] {
  out.push(prefix);
  if (Array.isArray(value)) value.forEach((v, i) => pathsOf(v, [...prefix, i], out));
  else if (value !== null && typeof value === 'object') for (const [k, v] of Object.entries(value)) pathsOf(v, [...prefix, k], out);
  return out;
}

/** Values that break careless parsers: edge numbers, numeric text, wrong types. */
export const EDGE_VALUES: readonly Json[] = [
  null, true, false, 0, -0, -1, 1e308, -1e308, 5e-324, 0.1, 1e21, 2 ** 53 + 1, '', ' ', '0', '-1', '1e999', '1e-999', 'NaN',
  'Infinity', '-Infinity', '0x10', '1,5', '١٢', '\u0000', '💉', 'a'.repeat(300), [], {}, [[]], { '': null }, { __proto__: 1 },
  { constructor: 'x' }, 'mEq', 'mmol', 'fill', 'adult', 'central',
];

/** One edit of a file. */
export interface Mutation {
  at: number;
  op: 'delete' | 'replace' | 'edge' | 'stringify' | 'empty' | 'duplicate' | 'add-field';
  value: Json;
  edge: number;
}

export const mutation: fc.Arbitrary<Mutation> = fc.record({
  at: fc.nat(),
  op: fc.constantFrom('delete', 'replace', 'edge', 'stringify', 'empty', 'duplicate', 'add-field'),
  value: fc.jsonValue({ maxDepth: 2 }),
  edge: fc.nat(),
});

function parentAndKey(root: Json, path: (string | number)[]): [Record<string | number, Json>, string | number] | null {
  if (path.length === 0) return null;
  let node = root as Record<string | number, Json>;
  for (const p of path.slice(0, -1)) node = node[p] as Record<string | number, Json>;
  return [node, path[path.length - 1]!];
}

/** Apply edits to a deep copy of `file` (the root itself can be replaced). */
export function mutate(file: Json, edits: readonly Mutation[]): Json {
  let root: Json = structuredClone(file);
  for (const m of edits) {
    const paths = pathsOf(root);
    const path = paths[m.at % paths.length]!;
    const target = parentAndKey(root, path);
    const current = target ? target[0][target[1]] : root;
    let next: Json;
    switch (m.op) {
      case 'delete':
        if (target && Array.isArray(target[0])) target[0].splice(Number(target[1]), 1);
        else if (target) delete target[0][target[1]];
        else root = undefined;
        continue;
      case 'replace': next = structuredClone(m.value); break;
      case 'edge': next = structuredClone(EDGE_VALUES[m.edge % EDGE_VALUES.length]); break;
      case 'stringify': next = typeof current === 'string' ? Number(current) : JSON.stringify(current ?? null); break;
      case 'empty': next = Array.isArray(current) ? [] : typeof current === 'object' && current !== null ? {} : ''; break;
      case 'duplicate': next = Array.isArray(current) && current.length > 0 ? [...current, structuredClone(current[m.edge % current.length])] : current; break;
      case 'add-field': next = typeof current === 'object' && current !== null && !Array.isArray(current) ? { ...current, [`extra${m.edge % 3}`]: m.value } : current; break;
    }
    if (target) target[0][target[1]] = next;
    else root = next;
  }
  return root;
}

/** A valid file with 1–4 random edits. */
export function mutated(file: Json): fc.Arbitrary<Json> {
  return fc.array(mutation, { minLength: 1, maxLength: 4 }).map((edits) => mutate(file, edits));
}
