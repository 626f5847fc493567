import type { Report } from '../core/report.ts';

/** Left- or right-aligned columns of plain text. */
export function columns(rows: string[][], right: boolean[]): string[] {
  const widths = rows[0]?.map((_, c) => Math.max(...rows.map((r) => (r[c] ?? '').length))) ?? [];
  return rows.map((r) => r.map((cell, c) => (right[c] ? cell.padStart(widths[c] ?? 0) : cell.padEnd(widths[c] ?? 0))).join('  ').trimEnd());
}

const SEVERITY_TAG = { block: 'HOLD', warn: 'WARN', info: 'INFO' } as const;
const VERDICT_TEXT = { pass: 'PASS - no finding holds this bag', warn: 'WARN - release only after a pharmacist has reviewed the warnings', block: 'HOLD - do not compound as ordered' } as const;

function amountText(l: Report['lines'][number]): string {
  if (l.fill) return 'to volume';
  if (l.amount === null || l.unit === null) return '';
  const species = l.species && (l.unit.startsWith('mEq') || l.unit.startsWith('mmol')) ? ` ${l.species}` : '';
  return `${l.amount} ${l.unit}${species}`;
}

/** The readable per-order table the CLI prints without --json. */
export function reportTable(r: Report): string {
  const out: string[] = [];
  out.push(`Order ${r.order}  patient ${r.patient.id}  ${r.patient.ageGroup}  ${r.patient.weightKg} kg  ${r.route} line`);
  out.push(`  ${r.volumeMl} mL over ${r.hours} h = ${r.rateMlPerHour} mL/h`);
  const rows = [['  line', 'ordered', 'volume mL', 'mOsm', 'share']];
  for (const l of r.lines) rows.push([`  ${l.name}`, amountText(l), l.volumeMl.toFixed(2), l.mOsm.toFixed(1), `${l.sharePercent.toFixed(1)}%`]);
  out.push(...columns(rows, [false, false, true, true, true]));
  const o = r.osmolarity;
  const limit = o.peripheralLimit === null ? '' : ` (peripheral limit ${o.peripheralLimit})`;
  out.push(`  Osmolarity: particle ${o.particle.toFixed(1)}, label sum ${o.labelSum.toFixed(1)}, reported ${o.reported.toFixed(1)} mOsm/L${limit}`);
  const t = r.totals;
  out.push(`  Dextrose ${t.dextrosePercent.toFixed(2)}%, amino acids ${t.aminoAcidPercent.toFixed(2)}%, lipid ${t.lipidPercent.toFixed(2)}%; GIR ${t.girMgPerKgPerMin.toFixed(2)} mg/kg/min; ${t.kcal.total.toFixed(0)} kcal (${t.kcalPerKg.toFixed(1)} kcal/kg)`);
  if (r.findings.length === 0) out.push('  Findings: none');
  for (const f of r.findings) {
    const vs = f.value !== null && f.limit !== null ? ` [${f.value} vs ${f.limit} ${f.unit ?? ''}]` : '';
    const which = f.nutrient ?? f.screen;
    out.push(`  ${SEVERITY_TAG[f.severity]} ${f.code}${which ? ` (${which})` : ''}: ${f.message}${vs}`);
    out.push(`       source: ${f.source}`);
  }
  const predicted = r.information.predictedOsmolality;
  if (predicted) out.push(`  Predicted osmolality (estimates only): ${predicted.estimates.map((e) => `${e.label} ${e.value.toFixed(1)} ${e.unit}`).join('; ')}`);
  for (const s of r.suggestions ?? []) out.push(`  ${s.status === 'proposal' ? 'PROPOSAL' : 'NO PROPOSAL'} ${s.kind}: ${s.message}`);
  out.push(`  Verdict: ${VERDICT_TEXT[r.verdict]}`);
  return out.join('\n');
}

export const CAUTION = 'Osmocount is a checking aid. Local policy and the verifying pharmacist decide; PN is a high-alert medication.';
