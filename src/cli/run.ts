import { parseArgs } from 'node:util';
import { parseCatalog, type Catalog } from '../core/catalog.ts';
import { parsePolicy, type Policy } from '../core/policy.ts';
import { checkOrder } from '../core/evaluate.ts';
import type { Report } from '../core/report.ts';
import { DEFAULT_CATALOG, DEFAULT_POLICY } from '../defaults.ts';
import { ordersFromText, formatFileProblem, type FileProblem } from './inputs.ts';
import { reportTable, CAUTION } from './table.ts';
import { compound } from './compound.ts';
import { print } from './print.ts';

/** What the CLI may touch: injected so tests run it in memory. */
export interface CliIo {
  readFile(path: string): Promise<string>;
  stdout(text: string): void;
  stderr(text: string): void;
  /** Write a text file, creating its folder; absent where nothing may be written. */
  writeFile?(path: string, text: string): Promise<void>;
  /** The clock (the printing time and the default compounding time); the system clock when absent. */
  now?(): Date;
}

export const EXIT = { ok: 0, block: 1, invalid: 2 } as const;

export const USAGE = `Usage:
  osmocount check FILE... [--catalog FILE] [--policy FILE] [--json]
      Check PN orders (one order, a JSON array of orders, or NDJSON per file).
      Exit 0: every order pass or warn; 1: any order held (block); 2: any input invalid.
      An order with an "ions" block is allocated first (salts added), then checked.
  osmocount compound FILE... [--catalog FILE] [--policy FILE] [--json]
      Allocate each order's ion block: the electrolyte lines it adds (volumes rounded to
      measurable increments), delivered vs ordered for every ion, problems with proposals,
      and the suggested mixing sequence. Exit 0: every order met; 1: any order cannot be
      met as written; 2: any input invalid or without an ion block.
  osmocount print FILE... --sheet|--label --out DIR [--catalog FILE] [--policy FILE]
        [--institution NAME] [--paper a4|letter] [--label-size 4x6|4x4|WxHin|WxHmm]
        [--compounded ISO-TIME] [--time-zone ZONE]
      Write each order's verification sheet (ORDER.sheet.html) and/or bag label (ORDER.label.html)
      into DIR as self-contained HTML (styles and barcode inline) for printing. --compounded is
      the compounding time the beyond-use dates count from (default now), read in --time-zone
      (default the system's) unless it carries an offset. Exit codes as for check.

Options:
  --catalog FILE   stock catalog (default: the shipped data/catalog.json)
  --policy FILE    institution policy (default: the shipped data/policy.json)
  --json           print reports as JSON (an array when there are several)
  -h, --help       this text`;

async function readJson(io: CliIo, file: string, problems: FileProblem[]): Promise<unknown> {
  let text: string;
  try {
    text = await io.readFile(file);
  } catch (e) {
    problems.push({ file, where: '', problem: { path: '(file)', message: `cannot be read (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})` } });
    return undefined;
  }
  try {
    return JSON.parse(text.replace(/^\uFEFF/, ''));
  } catch (e) {
    problems.push({ file, where: '', problem: { path: '(file)', message: `is not valid JSON (${(e as Error).message})` } });
    return undefined;
  }
}

/** Load --catalog and --policy (or the shipped defaults); null when either is invalid (problems printed). */
export async function loadSetup(io: CliIo, catalogPath: string | undefined, policyPath: string | undefined): Promise<{ catalog: Catalog; policy: Policy } | null> {
  const problems: FileProblem[] = [];
  let catalog = DEFAULT_CATALOG;
  let policy = DEFAULT_POLICY;
  if (catalogPath) {
    const json = await readJson(io, catalogPath, problems);
    if (json !== undefined) {
      const r = parseCatalog(json);
      if (r.ok) catalog = r.value;
      else problems.push(...r.problems.map((problem) => ({ file: catalogPath, where: '', problem })));
    }
  }
  if (policyPath) {
    const json = await readJson(io, policyPath, problems);
    if (json !== undefined) {
      const r = parsePolicy(json);
      if (r.ok) policy = r.value;
      else problems.push(...r.problems.map((problem) => ({ file: policyPath, where: '', problem })));
    }
  }
  if (problems.length > 0) {
    for (const p of problems) io.stderr(formatFileProblem(p));
    io.stderr('The catalog or policy is invalid: no order was checked.');
    return null;
  }
  return { catalog, policy };
}

async function check(args: string[], io: CliIo): Promise<number> {
  let parsed;
  try {
    parsed = parseArgs({ args, allowPositionals: true, options: { catalog: { type: 'string' }, policy: { type: 'string' }, json: { type: 'boolean' }, help: { type: 'boolean', short: 'h' } } });
  } catch (e) {
    io.stderr(`osmocount check: ${(e as Error).message}\n\n${USAGE}`);
    return EXIT.invalid;
  }
  if (parsed.values.help) { io.stdout(USAGE); return EXIT.ok; }
  const files = parsed.positionals;
  if (files.length === 0) { io.stderr(`osmocount check: name at least one order file\n\n${USAGE}`); return EXIT.invalid; }
  const setup = await loadSetup(io, parsed.values.catalog, parsed.values.policy);
  if (!setup) return EXIT.invalid;

  const reports: Report[] = [];
  const problems: FileProblem[] = [];
  for (const file of files) {
    let text: string;
    try {
      text = await io.readFile(file);
    } catch (e) {
      problems.push({ file, where: '', problem: { path: '(file)', message: `cannot be read (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})` } });
      continue;
    }
    const found = ordersFromText(file, text);
    problems.push(...found.problems);
    for (const o of found.orders) {
      const r = checkOrder(o.value, setup.catalog, setup.policy);
      if (r.ok) reports.push(r.value.report);
      else problems.push(...r.problems.map((problem) => ({ file: o.file, where: o.where, problem })));
    }
  }
  for (const p of problems) io.stderr(formatFileProblem(p));
  if (parsed.values.json) {
    io.stdout(JSON.stringify(reports.length === 1 ? reports[0] : reports, null, 2));
  } else {
    io.stdout(reports.map(reportTable).join('\n\n'));
    if (reports.length > 0) io.stdout(`\n${CAUTION}`);
  }
  if (problems.length > 0) return EXIT.invalid;
  return reports.some((r) => r.verdict === 'block') ? EXIT.block : EXIT.ok;
}

/** Run one CLI invocation; returns the exit code. Never throws on user input. */
export async function runCli(argv: string[], io: CliIo): Promise<number> {
  const [command, ...rest] = argv;
  switch (command) {
    case 'check':
      return check(rest, io);
    case 'compound':
      return compound(rest, io);
    case 'print':
      return print(rest, io);
    case undefined:
    case '-h':
    case '--help':
    case 'help':
      io.stdout(USAGE);
      return command === undefined ? EXIT.invalid : EXIT.ok;
    default:
      io.stderr(`osmocount: unknown command "${command}"\n\n${USAGE}`);
      return EXIT.invalid;
  }
}
