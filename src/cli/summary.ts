import type { Report } from '../core/report.ts';
import type { Verdict } from '../core/findings.ts';

/** One peripheral bag among the highest osmolarities: which order, where it was read, its figure. */
export interface PeripheralBag {
  order: string;
  place: string;
  reported: number;
  limit: number | null;
  verdict: Verdict;
}

/** What a batch run counts: every checked order by verdict, warn/hold findings by code, the top peripheral bags. */
export interface Summary {
  byVerdict: Record<Verdict, number>;
  /** Inputs that could not be checked: invalid orders, unreadable lines, rows or files. */
  invalid: number;
  /** Findings that warn or hold, counted by code (`dose-range (K)` when the finding names a nutrient). */
  findings: Map<string, Record<'block' | 'warn', number>>;
  /** At most TOP peripheral bags, highest reported osmolarity first (the earlier of equal figures first). */
  highestPeripheral: PeripheralBag[];
}

/** How many of the highest peripheral osmolarities the summary keeps. */
export const TOP = 10;

export function newSummary(): Summary {
  return { byVerdict: { pass: 0, warn: 0, block: 0 }, invalid: 0, findings: new Map(), highestPeripheral: [] };
}

/** Count one checked order; `place` says where it was read (`day.csv rows 2-9`). */
export function addReport(s: Summary, r: Report, place: string): void {
  s.byVerdict[r.verdict] += 1;
  for (const f of r.findings) {
    if (f.severity === 'info') continue;
    const key = f.nutrient ? `${f.code} (${f.nutrient})` : f.code;
    const counts = s.findings.get(key) ?? { block: 0, warn: 0 };
    counts[f.severity] += 1;
    s.findings.set(key, counts);
  }
  if (r.route !== 'peripheral') return;
  const top = s.highestPeripheral;
  const value = r.osmolarity.reported;
  if (top.length === TOP && value <= (top[TOP - 1]?.reported ?? -Infinity)) return;
  const at = top.findIndex((b) => value > b.reported);
  top.splice(at === -1 ? top.length : at, 0, { order: r.order, place, reported: value, limit: r.osmolarity.peripheralLimit, verdict: r.verdict });
  if (top.length > TOP) top.pop();
}

export function checkedCount(s: Summary): number {
  return s.byVerdict.pass + s.byVerdict.warn + s.byVerdict.block;
}

const TAG = { pass: 'PASS', warn: 'WARN', block: 'HOLD' } as const;
const count = new Intl.NumberFormat('en-US');

/** The summary as the person running the batch reads it. */
export function summaryText(s: Summary, seconds: number | null = null): string {
  const out: string[] = [];
  const checked = checkedCount(s);
  const time = seconds === null ? '' : ` in ${seconds.toFixed(1)} s`;
  out.push(`Summary: ${count.format(checked)} order${checked === 1 ? '' : 's'} checked${time}${s.invalid > 0 ? `, ${count.format(s.invalid)} not checked` : ''}`);
  const width = count.format(Math.max(checked, s.invalid)).length;
  for (const v of ['pass', 'warn', 'block'] as const) out.push(`  ${TAG[v].padEnd(7)}  ${count.format(s.byVerdict[v]).padStart(width)}`);
  if (s.invalid > 0) out.push(`  ${'INVALID'.padEnd(7)}  ${count.format(s.invalid).padStart(width)}  (not checked: each problem is listed as file: where: path: message)`);

  const rows = [...s.findings].flatMap(([code, n]) => (['block', 'warn'] as const).filter((sev) => n[sev] > 0).map((sev) => ({ code, sev, n: n[sev] })));
  rows.sort((a, b) => (a.sev === b.sev ? b.n - a.n || (a.code < b.code ? -1 : 1) : a.sev === 'block' ? -1 : 1));
  if (rows.length === 0) out.push('Findings that warn or hold: none');
  else {
    out.push('Findings that warn or hold, by code');
    const codeWidth = Math.max(...rows.map((r) => r.code.length));
    const nWidth = Math.max(...rows.map((r) => count.format(r.n).length));
    for (const r of rows) out.push(`  ${TAG[r.sev]}  ${r.code.padEnd(codeWidth)}  ${count.format(r.n).padStart(nWidth)}`);
  }

  const top = s.highestPeripheral;
  if (top.length === 0) out.push('Highest osmolarity on peripheral bags: no peripheral bag checked');
  else {
    out.push(`Highest reported osmolarity on peripheral bags (top ${TOP})`);
    const figures = top.map((b) => b.reported.toFixed(1));
    const limits = top.map((b) => (b.limit === null ? 'no limit' : `limit ${b.limit}`));
    const orders = top.map((b) => b.order);
    const fw = Math.max(...figures.map((f) => f.length));
    const lw = Math.max(...limits.map((l) => l.length));
    const ow = Math.max(...orders.map((o) => o.length));
    top.forEach((b, i) => out.push(`  ${(figures[i] ?? '').padStart(fw)} mOsm/L  ${(limits[i] ?? '').padEnd(lw)}  ${TAG[b.verdict]}  ${(orders[i] ?? '').padEnd(ow)}  ${b.place}`));
  }
  return out.join('\n');
}
