// Run the built CLI as a user would, and measure its wall time and peak resident memory.
import { spawnSync } from 'node:child_process';
import { closeSync, existsSync, openSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { pathToFileURL } from 'node:url';

/** What one CLI run cost. */
export interface CliRun {
  code: number | null;
  ms: number;
  /** Peak resident set size of the CLI process, kB. */
  maxRssKb: number | null;
  stderr: string;
}

const TIME = '/usr/bin/time';

/**
 * Run `node <bundle> ...args` with stdout to `stdoutPath` (e.g. /dev/null). Peak memory comes from
 * GNU time's "Maximum resident set size" when /usr/bin/time exists, else from the process itself
 * (process.resourceUsage().maxRSS, reported on exit by a small wrapper written to `scratch`).
 */
export function runBuiltCli(bundle: string, args: string[], stdoutPath: string, scratch: string): CliRun {
  const out = openSync(stdoutPath, 'w');
  try {
    let command: string;
    let argv: string[];
    const viaTime = existsSync(TIME);
    if (viaTime) {
      command = TIME;
      argv = ['-v', process.execPath, bundle, ...args];
    } else {
      const wrapper = join(scratch, 'measure.mjs');
      writeFileSync(wrapper, `process.on('exit', () => process.stderr.write('\\nbench-max-rss-kb ' + process.resourceUsage().maxRSS + '\\n'));\nawait import(${JSON.stringify(pathToFileURL(bundle).href)});\n`);
      command = process.execPath;
      argv = [wrapper, ...args];
    }
    const t0 = performance.now();
    const r = spawnSync(command, argv, { stdio: ['ignore', out, 'pipe'], encoding: 'utf8', maxBuffer: 256 * 1024 * 1024 });
    const ms = performance.now() - t0;
    const stderr = r.stderr ?? '';
    const rss = viaTime ? /Maximum resident set size \(kbytes\): (\d+)/.exec(stderr) : /bench-max-rss-kb (\d+)/.exec(stderr);
    return { code: r.status, ms, maxRssKb: rss ? Number(rss[1]) : null, stderr };
  } finally {
    closeSync(out);
  }
}

/** Wall times, sorted, of `runs` spawns of `node <script> ...args` (cold starts: a new process each time; exit 0 or 1). */
export function coldStartMs(script: string, args: string[], runs: number): number[] {
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    const r = spawnSync(process.execPath, [script, ...args], { stdio: 'ignore' });
    times.push(performance.now() - t0);
    if (r.status !== 0 && r.status !== 1) throw new Error(`${script} ${args.join(' ')} exited ${r.status}`);
  }
  return times.sort((a, b) => a - b);
}
