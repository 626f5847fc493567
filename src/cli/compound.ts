import { parseArgs } from 'node:util';
import { parseOrder } from '../core/order.ts';
import { compoundOrder, hasIons } from '../core/compound/compoundOrder.ts';
import { toCompoundReport, type CompoundReport } from '../core/compound/compoundReport.ts';
import { ION_INFO, ION_KEYS } from '../core/compound/ions.ts';
import { SPECIES, isSpeciesId } from '../core/species.ts';
import { ordersInFiles, formatFileProblem, type FileProblem } from './inputs.ts';
import { CAUTION, columns } from './table.ts';
import { EXIT, type CliIo } from './io.ts';
import { loadSetup } from './setup.ts';
import { USAGE } from './usage.ts';

const f2 = (n: number): string => n.toFixed(2);
const signed = (n: number): string => (n > 0 ? `+${f2(n)}` : f2(n));
const TAG = { block: 'HOLD', warn: 'WARN' } as const;

function speciesWord(species: string): string {
  return isSpeciesId(species) ? SPECIES[species].label : species;
}

/** The readable text `osmocount compound` prints for one order. */
export function compoundTable(r: CompoundReport): string {
  const out: string[] = [];
  out.push(`Order ${r.order}  patient ${r.patient.id}  ${r.patient.ageGroup}  ${r.patient.weightKg} kg  ions ordered per ${r.per === 'kg' ? 'kg per day' : 'day'}`);
  if (!r.feasible) out.push('  HOLD - the ion order cannot be met as written: the lines below meet the proposal, not the order.');
  out.push(r.lines.length === 0 ? '  Lines added: none' : '  Lines added (volumes rounded to measurable increments):');
  if (r.lines.length > 0) {
    const rows = [['    stock', 'amount', 'exact mL', 'measure mL', 'delivers']];
    for (const l of r.lines) {
      rows.push([`    ${l.name}${l.belowMeasurable ? ' (!)' : ''}`, `${f2(l.amount)} ${l.unit} ${speciesWord(l.species)}`, l.exactVolumeMl.toFixed(3), f2(l.volumeMl), `${f2(l.measuredAmount)} ${l.unit}`]);
    }
    out.push(...columns(rows, [false, false, true, true, true]));
  }
  out.push('  Delivered vs ordered, per bag (every line of the bag, after rounding):');
  const rows = [['    ion', 'ordered', 'delivered', 'difference', 'before rounding', 'rounding']];
  for (const k of ION_KEYS) {
    const unordered = r.unordered.includes(k);
    rows.push([
      `    ${ION_INFO[k].label} (${ION_INFO[k].unit})`,
      unordered ? '-' : f2(r.ordered[k]),
      f2(r.delivered[k]),
      unordered ? '' : signed(r.delivered[k] - r.ordered[k]),
      f2(r.deliveredBeforeRounding[k]),
      signed(r.delivered[k] - r.deliveredBeforeRounding[k]),
    ]);
  }
  out.push(...columns(rows, [false, true, true, true, true, true]));
  if (r.deliveredPerKg) out.push(`    delivered per kg: ${ION_KEYS.map((k) => `${ION_INFO[k].label} ${(r.deliveredPerKg?.[k] ?? 0).toFixed(3)}`).join(', ')}`);
  if (r.unordered.length > 0) out.push(`    (-: no amount ordered: ${r.unordered.map((k) => ION_INFO[k].label).join(', ')})`);
  if (r.problems.length === 0) out.push('  Problems: none');
  for (const p of r.problems) {
    out.push(`  ${TAG[p.severity]} ${p.code}${p.ion ? ` (${ION_INFO[p.ion].label})` : ''}: ${p.message}`);
    if (p.proposal) out.push(`       proposal: ${p.proposal.text}`);
    out.push(`       source: ${p.source}`);
  }
  if (r.proposal) out.push(`  Proposed ion order: ${JSON.stringify(r.proposal)}`);
  out.push('  Mixing sequence (suggested; follow your compounding procedure):');
  for (const s of r.sequence) {
    out.push(`    ${s.step}. ${s.lines.map((l) => l.name).join('; ')}`);
    out.push(`       ${s.reason}${s.mixAfter ? ' -> mix' : ''}`);
    out.push(`       source: ${s.source}`);
  }
  return out.join('\n');
}

/** `osmocount compound FILE…`: allocate each order's ion block and print lines, delivered vs ordered, sequence. */
export async function compound(args: string[], io: CliIo): Promise<number> {
  let parsed;
  try {
    parsed = parseArgs({ args, allowPositionals: true, options: { catalog: { type: 'string' }, policy: { type: 'string' }, json: { type: 'boolean' }, help: { type: 'boolean', short: 'h' } } });
  } catch (e) {
    io.stderr(`osmocount compound: ${(e as Error).message}\n\n${USAGE}`);
    return EXIT.invalid;
  }
  if (parsed.values.help) { io.stdout(USAGE); return EXIT.ok; }
  const files = parsed.positionals;
  if (files.length === 0) { io.stderr(`osmocount compound: name an order file\n\n${USAGE}`); return EXIT.invalid; }
  const setup = await loadSetup(io, parsed.values.catalog, parsed.values.policy);
  if (!setup) return EXIT.invalid;

  const reports: CompoundReport[] = [];
  const problems: FileProblem[] = [];
  for await (const o of ordersInFiles(io, files, problems)) {
    const r = parseOrder(o.value, setup.catalog);
    if (!r.ok) { problems.push(...r.problems.map((problem) => ({ file: o.file, where: o.where, problem }))); continue; }
    if (!hasIons(r.value)) { problems.push({ file: o.file, where: o.where, problem: { path: 'ions', message: 'is required: osmocount compound allocates an order\'s ion block (use osmocount check for orders written as salts)' } }); continue; }
    reports.push(toCompoundReport(compoundOrder(r.value, setup.catalog, setup.policy)));
  }
  for (const p of problems) io.stderr(formatFileProblem(p));
  if (parsed.values.json) {
    io.stdout(JSON.stringify(reports.length === 1 ? reports[0] : reports, null, 2));
  } else if (reports.length > 0) {
    io.stdout(reports.map(compoundTable).join('\n\n'));
    io.stdout(`\n${CAUTION}`);
  }
  if (problems.length > 0) return EXIT.invalid;
  return reports.some((r) => !r.feasible) ? EXIT.block : EXIT.ok;
}
