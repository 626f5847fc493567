import { Readable } from 'node:stream';
import type { CliIo, PathKind } from '../../src/cli/io.ts';

/** Options of the in-memory CLI world. */
export interface MemoryIoOptions {
  /** Bytes per chunk when a file is streamed: small chunks split lines, and UTF-8 characters, mid-way. */
  chunkBytes?: number;
  /** When set, the run sees a terminal on stderr (and on stdout too with `stdoutIsTerminal`) and this clock (ms). */
  clock?: () => number;
  stdoutIsTerminal?: boolean;
  /** File names whose whole-file reading fails, to prove they are streamed. */
  streamOnly?: RegExp;
}

function enoent(path: string): Error {
  return Object.assign(new Error(`no such file: ${path}`), { code: 'ENOENT' });
}

/**
 * A CLI world in memory: `files` maps paths to contents; a directory is any prefix ending in `/`.
 * Returns the io and what the run wrote to stdout, stderr and the progress line, and all three in order in `log`.
 */
export function memoryIo(files: Record<string, string | Buffer>, options: MemoryIoOptions = {}) {
  const out: string[] = [];
  const err: string[] = [];
  const progress: string[] = [];
  const log: { to: 'out' | 'err' | 'progress'; text: string }[] = [];
  const bytes = (path: string) => {
    const content = files[path];
    if (content === undefined) throw enoent(path);
    return typeof content === 'string' ? Buffer.from(content, 'utf8') : content;
  };
  const isDir = (path: string) => {
    const prefix = path.endsWith('/') ? path : `${path}/`;
    return Object.keys(files).some((f) => f.startsWith(prefix));
  };
  const io: CliIo = {
    readFile: async (path) => {
      if (options.streamOnly?.test(path)) throw new Error(`${path} must be streamed, not read whole`);
      return bytes(path).toString('utf8');
    },
    openRead: (path) => {
      // Counts what it has handed out, as a file stream's bytesRead does.
      const stream = Object.assign(Readable.from(chunks(), { objectMode: false }), { bytesRead: 0 });
      async function* chunks() {
        const all = bytes(path);
        const size = options.chunkBytes ?? 64 * 1024;
        for (let i = 0; i < all.length; i += size) {
          stream.bytesRead = Math.min(all.length, i + size);
          yield all.subarray(i, i + size);
        }
      }
      return stream;
    },
    stat: async (path) => {
      if (files[path] !== undefined) return { kind: 'file', size: bytes(path).length };
      if (isDir(path)) return { kind: 'directory', size: 0 };
      throw enoent(path);
    },
    readDir: async (path) => {
      const prefix = path.endsWith('/') ? path : `${path}/`;
      const entries = new Map<string, PathKind>();
      for (const f of Object.keys(files)) {
        if (!f.startsWith(prefix)) continue;
        const [name, ...rest] = f.slice(prefix.length).split('/');
        if (name) entries.set(name, rest.length > 0 ? 'directory' : 'file');
      }
      return [...entries].map(([name, kind]) => ({ name, kind }));
    },
    stdout: (text) => { out.push(text); log.push({ to: 'out', text }); },
    stderr: (text) => { err.push(text); log.push({ to: 'err', text }); },
  };
  if (options.clock) {
    io.now = options.clock;
    io.progress = (text) => { progress.push(text); log.push({ to: 'progress', text }); };
    io.stdoutIsTerminal = options.stdoutIsTerminal ?? false;
  }
  return { io, out, err, progress, log };
}
