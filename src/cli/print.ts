import { parseArgs } from 'node:util';
import { join } from 'node:path';
import { checkOrder } from '../core/evaluate.ts';
import { formatProblem, type Problem } from '../core/problems.ts';
import type { Report } from '../core/report.ts';
import { renderLabelHtml, renderSheetHtml } from '../ui/print/html.tsx';
import { labelModel } from '../ui/print/labelModel.ts';
import { sheetModel } from '../ui/print/sheetModel.ts';
import { parseDateTime } from '../ui/print/localTime.ts';
import { sheetSequence } from '../ui/print/mixing.ts';
import { PAPERS, checkTimeZone, parseLabelSize, type Paper, type PrintOptions, type PrintSequenceStep } from '../ui/print/options.ts';
import { ordersInFiles, formatFileProblem, type FileProblem } from './inputs.ts';
import { EXIT, type CliIo } from './io.ts';
import { loadSetup } from './setup.ts';
import { USAGE } from './usage.ts';

/** The institution printed when neither --institution nor the policy names one. */
export const NO_INSTITUTION = '(institution not set)';

/** A file name made from an order id: letters, digits, dot, dash and underscore only; never empty or hidden. */
export function fileNameFor(orderId: string): string {
  const safe = orderId.normalize('NFKD').replace(/\p{M}+/gu, '').replace(/[^A-Za-z0-9._-]+/g, '_').replace(/^[._]+/, '').slice(0, 100);
  return safe === '' ? 'order' : safe;
}

/** Unique names for a batch: a repeated (sanitised) id gets -2, -3… */
function uniqueNames(ids: readonly string[]): string[] {
  const seen = new Map<string, number>();
  return ids.map((id) => {
    const base = fileNameFor(id);
    const n = (seen.get(base) ?? 0) + 1;
    seen.set(base, n);
    return n === 1 ? base : `${base}-${n}`;
  });
}

interface PrintArgs {
  files: string[];
  sheet: boolean;
  label: boolean;
  out: string;
  catalog: string | undefined;
  policy: string | undefined;
  options: Omit<PrintOptions, 'catalog' | 'policy' | 'institution'> & { institution: string | null };
}

function readArgs(args: string[], now: Date): { ok: true; value: PrintArgs } | { ok: false; problems: Problem[] } | 'help' {
  const parsed = parseArgs({
    args, allowPositionals: true,
    options: {
      sheet: { type: 'boolean' }, label: { type: 'boolean' }, out: { type: 'string' },
      catalog: { type: 'string' }, policy: { type: 'string' }, institution: { type: 'string' },
      paper: { type: 'string' }, 'label-size': { type: 'string' }, compounded: { type: 'string' }, 'time-zone': { type: 'string' },
      help: { type: 'boolean', short: 'h' },
    },
  });
  const v = parsed.values;
  if (v.help) return 'help';
  const problems: Problem[] = [];
  if (parsed.positionals.length === 0) problems.push({ path: 'FILE', message: 'name at least one order file' });
  if (!v.sheet && !v.label) problems.push({ path: '--sheet/--label', message: 'choose what to print: --sheet, --label, or both' });
  if (!v.out) problems.push({ path: '--out', message: 'is required: the folder the HTML files are written to' });
  if (v.institution !== undefined && v.institution.trim() === '') problems.push({ path: '--institution', message: 'must not be empty' });
  const paper = v.paper ?? 'a4';
  if (!(PAPERS as readonly string[]).includes(paper)) problems.push({ path: '--paper', message: `must be one of ${PAPERS.join(', ')} (got "${paper}")` });
  const size = parseLabelSize(v['label-size'] ?? '4x6', '--label-size');
  if (!size.ok) problems.push(...size.problems);
  const zone = checkTimeZone(v['time-zone'] ?? Intl.DateTimeFormat().resolvedOptions().timeZone, '--time-zone');
  if (!zone.ok) problems.push(...zone.problems);
  let compoundedAt = now;
  if (v.compounded !== undefined && zone.ok) {
    const t = parseDateTime(v.compounded, zone.value, '--compounded');
    if (t.ok) compoundedAt = t.value;
    else problems.push(...t.problems);
  }
  if (problems.length > 0 || !size.ok || !zone.ok) return { ok: false, problems };
  return {
    ok: true,
    value: {
      files: parsed.positionals, sheet: v.sheet ?? false, label: v.label ?? false, out: v.out ?? '',
      catalog: v.catalog, policy: v.policy,
      options: {
        institution: v.institution?.trim() ?? null, paper: paper as Paper, labelSize: size.value,
        compoundedAt, printedAt: now, timeZone: zone.value,
      },
    },
  };
}

/**
 * `osmocount print`: check each order, then write its verification sheet and/or bag label as one
 * self-contained HTML file per order into --out (named by order id). Invalid input is reported like
 * `check` (exit 2; valid orders are still printed); a held order is printed with its hold banner (exit 1).
 */
export async function print(args: string[], io: CliIo): Promise<number> {
  let read;
  try {
    read = readArgs(args, io.wallClock?.() ?? new Date());
  } catch (e) {
    io.stderr(`osmocount print: ${(e as Error).message}\n\n${USAGE}`);
    return EXIT.invalid;
  }
  if (read === 'help') { io.stdout(USAGE); return EXIT.ok; }
  if (!read.ok) {
    for (const p of read.problems) io.stderr(`osmocount print: ${formatProblem(p)}`);
    io.stderr(`\n${USAGE}`);
    return EXIT.invalid;
  }
  const a = read.value;
  const writeFile = io.writeFile;
  if (!writeFile) { io.stderr('osmocount print: this environment cannot write files'); return EXIT.invalid; }
  const setup = await loadSetup(io, a.catalog, a.policy);
  if (!setup) return EXIT.invalid;
  const options: PrintOptions = { ...a.options, institution: a.options.institution ?? setup.policy.institution ?? NO_INSTITUTION, catalog: setup.catalog, policy: setup.policy };

  const reports: Report[] = [];
  const sequences: (PrintSequenceStep[] | undefined)[] = [];
  const problems: FileProblem[] = [];
  for await (const o of ordersInFiles(io, a.files, problems)) {
    const r = checkOrder(o.value, setup.catalog, setup.policy);
    if (r.ok) {
      reports.push(r.value.report);
      sequences.push(sheetSequence(r.value.order.lines, setup.policy));
    } else problems.push(...r.problems.map((problem) => ({ file: o.file, where: o.where, problem })));
  }
  for (const p of problems) io.stderr(formatFileProblem(p));

  const names = uniqueNames(reports.map((r) => r.order));
  let writeFailed = false;
  for (const [i, report] of reports.entries()) {
    const outputs: [string, string][] = [];
    const sequence = sequences[i];
    if (a.sheet) outputs.push([`${names[i]}.sheet.html`, renderSheetHtml(sheetModel(report, sequence ? { ...options, sequence } : options))]);
    if (a.label) {
      const label = labelModel(report, options);
      if (label.fitWarning) io.stderr(`warning: ${report.order}: ${label.fitWarning}`);
      outputs.push([`${names[i]}.label.html`, renderLabelHtml(label)]);
    }
    for (const [name, html] of outputs) {
      const path = join(a.out, name);
      try {
        await writeFile(path, html);
        io.stdout(`wrote ${path}${report.verdict === 'block' ? '  (order on HOLD: printed with its hold banner)' : ''}`);
      } catch (e) {
        writeFailed = true;
        io.stderr(`${path}: (file): cannot be written (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})`);
      }
    }
  }
  if (problems.length > 0 || writeFailed) return EXIT.invalid;
  return reports.some((r) => r.verdict === 'block') ? EXIT.block : EXIT.ok;
}
