import { join } from 'node:path';
import { csvItems } from './csv.ts';
import { jsonItems, invalid, type InputItem, type InvalidItem } from './inputs.ts';
import { ndjsonItems } from './ndjson.ts';
import { openStream, readError, type CliIo } from './io.ts';

/** How a file holds its orders, from its name: `.ndjson`/`.jsonl` and `.csv` are streamed, anything else is JSON. */
export type InputFormat = 'json' | 'ndjson' | 'csv';

/** A file to read orders from. */
export interface InputFile {
  path: string;
  format: InputFormat;
  /** Bytes, for the progress line (0 when unknown). */
  size: number;
}

/** The file names a directory search picks up. */
export const ORDER_FILE = /\.(json|ndjson|jsonl|csv)$/i;

export function formatOf(path: string): InputFormat {
  if (/\.(ndjson|jsonl)$/i.test(path)) return 'ndjson';
  if (/\.csv$/i.test(path)) return 'csv';
  return 'json';
}

async function walk(io: CliIo, dir: string, out: InputFile[]): Promise<void> {
  const entries = io.readDir ? await io.readDir(dir) : [];
  entries.sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
  for (const e of entries) {
    if (e.name.startsWith('.')) continue;
    const path = join(dir, e.name);
    if (e.kind === 'directory') await walk(io, path, out);
    else if (e.kind === 'file' && ORDER_FILE.test(e.name)) {
      const size = io.stat ? (await io.stat(path)).size : 0;
      out.push({ path, format: formatOf(path), size });
    }
  }
}

/**
 * The files named on the command line, directories searched recursively (sorted by name;
 * hidden entries skipped) for *.json, *.ndjson, *.jsonl and *.csv. A path that cannot be read,
 * or a directory without order files, is an invalid item.
 */
export async function listInputs(io: CliIo, paths: readonly string[]): Promise<{ files: InputFile[]; problems: InvalidItem[] }> {
  const files: InputFile[] = [];
  const problems: InvalidItem[] = [];
  for (const path of paths) {
    try {
      const st = io.stat ? await io.stat(path) : { kind: 'file' as const, size: 0 };
      if (st.kind === 'directory') {
        const found: InputFile[] = [];
        await walk(io, path, found);
        if (found.length === 0) problems.push(invalid(path, '', '(directory)', 'holds no order files (*.json, *.ndjson, *.jsonl, *.csv)'));
        files.push(...found);
      } else {
        files.push({ path, format: formatOf(path), size: st.size });
      }
    } catch (e) {
      problems.push(invalid(path, '', '(file)', `cannot be read (${readError(e)})`));
    }
  }
  const named = new Set<string>();
  const unique = files.filter((f) => !named.has(f.path) && named.add(f.path));
  return { files: unique, problems };
}

/** The orders (and invalid units) of one input file, in file order; NDJSON and CSV are streamed. */
export async function* readInput(io: CliIo, file: InputFile): AsyncGenerator<InputItem> {
  switch (file.format) {
    case 'ndjson':
      yield* ndjsonItems(file.path, openStream(io, file.path));
      return;
    case 'csv':
      yield* csvItems(file.path, openStream(io, file.path));
      return;
    case 'json': {
      let text: string;
      try {
        text = await io.readFile(file.path);
      } catch (e) {
        yield invalid(file.path, '', '(file)', `cannot be read (${readError(e)})`);
        return;
      }
      yield* jsonItems(file.path, text);
      return;
    }
  }
}
