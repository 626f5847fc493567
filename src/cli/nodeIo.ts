import { createReadStream } from 'node:fs';
import { mkdir, readFile, readdir, stat, writeFile } from 'node:fs/promises';
import { once } from 'node:events';
import { dirname, join } from 'node:path';
import { performance } from 'node:perf_hooks';
import type { CliIo, PathKind } from './io.ts';

function kindOf(s: { isFile(): boolean; isDirectory(): boolean }): PathKind {
  return s.isDirectory() ? 'directory' : s.isFile() ? 'file' : 'other';
}

/** The real file system and the process's streams; the progress line only when stderr is a terminal. */
export function nodeIo(): CliIo {
  const io: CliIo = {
    readFile: (path) => readFile(path, 'utf8'),
    openRead: (path) => createReadStream(path),
    stat: async (path) => {
      const s = await stat(path);
      return { kind: kindOf(s), size: s.size };
    },
    readDir: async (path) => {
      const entries = await readdir(path, { withFileTypes: true });
      return Promise.all(entries.map(async (e) => ({
        name: e.name,
        // A link counts when it leads to a file; linked directories are not followed (no loops).
        kind: e.isSymbolicLink() ? await stat(join(path, e.name)).then((s) => (s.isFile() ? 'file' as const : 'other' as const), () => 'other' as const) : kindOf(e),
      })));
    },
    stdout: (text) => { process.stdout.write(`${text}\n`); },
    stderr: (text) => { process.stderr.write(`${text}\n`); },
    flush: async () => {
      if (process.stdout.writableNeedDrain) await once(process.stdout, 'drain');
    },
    now: () => performance.now(),
    wallClock: () => new Date(),
    writeFile: async (path, text) => {
      await mkdir(dirname(path), { recursive: true });
      await writeFile(path, text, 'utf8');
    },
  };
  if (process.stderr.isTTY) {
    io.progress = (text) => { process.stderr.write(text); };
    io.stdoutIsTerminal = process.stdout.isTTY;
  }
  return io;
}
