import { parseArgs } from 'node:util';
import type { Readable } from 'node:stream';
import { checkOrder } from '../core/evaluate.ts';
import type { Verdict } from '../core/findings.ts';
import { foreignFormat, formatFileProblem, invalid, type FoundOrder, type InvalidItem } from './inputs.ts';
import { EXIT, type CliIo } from './io.ts';
import { jsonWriter, ndjsonWriter, tableWriter } from './output.ts';
import { progressLine } from './progress.ts';
import { loadSetup } from './setup.ts';
import { listInputs, readInput } from './sources.ts';
import { addReport, newSummary, summaryText } from './summary.ts';
import { CAUTION } from './table.ts';

export { CHECK_USAGE } from './usage.ts';

const VERDICT_NAMES: Readonly<Record<string, Verdict>> = { pass: 'pass', warn: 'warn', block: 'block', hold: 'block' };
const RANK: Readonly<Record<Verdict, number>> = { pass: 0, warn: 1, block: 2 };

/** `--only warn,block` → the set of verdicts; null when a name is unknown. */
function verdictSet(values: readonly string[]): Set<Verdict> | null {
  const out = new Set<Verdict>();
  for (const name of values.flatMap((v) => v.split(','))) {
    const v = VERDICT_NAMES[name.trim().toLowerCase()];
    if (!v) return null;
    out.add(v);
  }
  return out;
}

function place(o: FoundOrder): string {
  return o.where === '' ? o.file : `${o.file} ${o.where}`;
}

/** The options of one `check` run. */
interface CheckOptions {
  paths: string[];
  catalog: string | undefined;
  policy: string | undefined;
  output: 'table' | 'json' | 'ndjson';
  only: Set<Verdict>;
  failOn: Verdict;
}

/** Read the command line; a message when it makes no sense, 'help' for -h. */
function checkOptions(args: string[]): CheckOptions | 'help' | { message: string } {
  let parsed;
  try {
    parsed = parseArgs({
      args, allowPositionals: true,
      options: {
        catalog: { type: 'string' }, policy: { type: 'string' },
        json: { type: 'boolean' }, ndjson: { type: 'boolean' },
        only: { type: 'string', multiple: true }, 'fail-on': { type: 'string' },
        help: { type: 'boolean', short: 'h' },
      },
    });
  } catch (e) {
    return { message: (e as Error).message };
  }
  const v = parsed.values;
  if (v.help) return 'help';
  if (parsed.positionals.length === 0) return { message: 'name at least one order file or directory' };
  if (v.json && v.ndjson) return { message: 'choose one of --json and --ndjson' };
  const only = v.only ? verdictSet(v.only) : new Set<Verdict>(['pass', 'warn', 'block']);
  if (!only) return { message: `--only takes pass, warn or block (got "${v.only?.join(',')}")` };
  const failOn = VERDICT_NAMES[(v['fail-on'] ?? 'block').toLowerCase()];
  if (!failOn || failOn === 'pass') return { message: `--fail-on takes warn or block (got "${v['fail-on']}")` };
  return { paths: parsed.positionals, catalog: v.catalog, policy: v.policy, output: v.json ? 'json' : v.ndjson ? 'ndjson' : 'table', only, failOn };
}

/** `osmocount check`: every order of every input through the engine, reports as they come, a summary at the end. */
export async function checkCommand(args: string[], io: CliIo, usage: string): Promise<number> {
  const options = checkOptions(args);
  if (options === 'help') { io.stdout(usage); return EXIT.ok; }
  if ('message' in options) { io.stderr(`osmocount check: ${options.message}\n\n${usage}`); return EXIT.invalid; }
  const setup = await loadSetup(io, options.catalog, options.policy);
  if (!setup) return EXIT.invalid;
  const { files, problems } = await listInputs(io, options.paths);

  const now = io.now ? io.now.bind(io) : () => Date.now();
  const started = now();
  const progress = progressLine(io.progress?.bind(io), now, files.reduce((n, f) => n + f.size, 0));
  const say = io.stdoutIsTerminal ? (text: string) => { progress.clear(); io.stdout(text); } : (text: string) => io.stdout(text);
  const complain = (text: string) => { progress.clear(); io.stderr(text); };
  const writer = { table: tableWriter, json: jsonWriter, ndjson: ndjsonWriter }[options.output](say);
  const summary = newSummary();
  const reject = (item: InvalidItem) => {
    summary.invalid += 1;
    for (const p of item.problems) complain(formatFileProblem(p));
  };

  // The stream being read, so the progress line can tell how far into the inputs the run is.
  const reading: { stream: Readable | null } = { stream: null };
  const tracked: CliIo = io.openRead ? { ...io, openRead: (path) => (reading.stream = io.openRead!(path)) } : io;
  let bytesDone = 0;
  let checked = 0;

  problems.forEach(reject);
  for (const file of files) {
    reading.stream = null;
    for await (const item of readInput(tracked, file)) {
      if (item.kind === 'invalid') { reject(item); continue; }
      const o = item.order;
      const foreign = foreignFormat(o.value);
      if (foreign) {
        reject(invalid(o.file, o.where, 'format', `is "${foreign}", not an order (a catalog is given with --catalog, a policy with --policy)`));
        continue;
      }
      const r = checkOrder(o.value, setup.catalog, setup.policy);
      if (!r.ok) {
        reject({ kind: 'invalid', problems: r.problems.map((problem) => ({ file: o.file, where: o.whereOf?.(problem.path) ?? o.where, problem })) });
        continue;
      }
      const report = r.value.report;
      addReport(summary, report, place(o));
      if (options.only.has(report.verdict)) writer.write(report);
      checked += 1;
      progress.update(checked, bytesDone + ((reading.stream as { bytesRead?: number } | null)?.bytesRead ?? 0));
      if (checked % 64 === 0 && io.flush) await io.flush();
    }
    bytesDone += file.size;
  }
  writer.end();
  progress.clear();
  const text = summaryText(summary, io.now ? (now() - started) / 1000 : null);
  if (options.output === 'table') io.stdout(`\n${text}\n\n${CAUTION}`);
  else io.stderr(`${summary.invalid > 0 ? '\n' : ''}${text}\n${CAUTION}`);

  if (summary.invalid > 0) return EXIT.invalid;
  const failing = (['pass', 'warn', 'block'] as const).some((verdict) => RANK[verdict] >= RANK[options.failOn] && summary.byVerdict[verdict] > 0);
  return failing ? EXIT.block : EXIT.ok;
}
