import { Readable } from 'node:stream';

/** What kind of thing a path names. */
export type PathKind = 'file' | 'directory' | 'other';

/**
 * What the CLI may touch: injected so tests run it in memory. `readFile`, `stdout` and `stderr`
 * are enough to run every command (files are then read whole); the optional members add
 * streaming, directories, back-pressure and a progress line, and the real entry provides them all.
 */
export interface CliIo {
  readFile(path: string): Promise<string>;
  stdout(text: string): void;
  stderr(text: string): void;
  /** A file's bytes as a stream: NDJSON and CSV are read through it, never whole. */
  openRead?(path: string): Readable;
  /** Whether a path is a file or a directory, and its size in bytes (for the progress line). */
  stat?(path: string): Promise<{ kind: PathKind; size: number }>;
  /** The entries of a directory. */
  readDir?(path: string): Promise<{ name: string; kind: PathKind }[]>;
  /** Resolves when stdout can take more text (so a fast engine never piles up output in memory). */
  flush?(): Promise<void>;
  /** A monotonic clock in milliseconds. */
  now?(): number;
  /** The wall clock (the printing time and the default compounding time); the system clock when absent. */
  wallClock?(): Date;
  /** Write a text file, creating its folder; absent where nothing may be written. */
  writeFile?(path: string, text: string): Promise<void>;
  /** Present only when stderr is a terminal: draws the progress line (the text carries its own `\r`). */
  progress?(text: string): void;
  /** True when stdout is that same terminal, so the progress line is wiped before each report too. */
  stdoutIsTerminal?: boolean;
}

/** The exit codes every command uses. */
export const EXIT = { ok: 0, block: 1, invalid: 2 } as const;

/** The reason a read failed, as a short code (`ENOENT`) or message. */
export function readError(e: unknown): string {
  return (e as NodeJS.ErrnoException).code ?? (e as Error).message;
}

/** Open a file as a byte stream; without `openRead`, the whole file becomes one chunk. */
export function openStream(io: CliIo, path: string): Readable {
  if (io.openRead) return io.openRead(path);
  async function* whole() {
    yield Buffer.from(await io.readFile(path), 'utf8');
  }
  return Readable.from(whole());
}
