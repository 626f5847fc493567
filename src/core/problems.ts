/** A problem found in an input file or cell: where it is and what is wrong. Errors are data. */
export interface Problem {
  /** Path inside the input, e.g. `products[3].perMl.Na` or `lines[2].unit`. */
  path: string;
  message: string;
}

/** Success with a value, or failure with every problem found. */
export type Result<T> = { ok: true; value: T } | { ok: false; problems: Problem[] };

export function formatPath(path: readonly PropertyKey[]): string {
  let out = '';
  for (const part of path) {
    if (typeof part === 'number') out += `[${part}]`;
    else out += out === '' ? String(part) : `.${String(part)}`;
  }
  return out === '' ? '(file)' : out;
}

/** `path: message`, the one way problems are printed everywhere. */
export function formatProblem(p: Problem): string {
  return `${p.path}: ${p.message}`;
}

export function assertNever(value: never): never {
  throw new Error(`unexpected value ${JSON.stringify(value)}`);
}
