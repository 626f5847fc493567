import { cellText, type Field, type LabelModel, type SheetModel, type Table } from './model.ts';
import { labelSizeText, PAPER_TEXT } from './options.ts';

// Printouts as plain text, one fact per line: what the tests read, and what a screen reader or a
// plain-text export would need.

function fields(list: readonly Field[]): string[] {
  return list.map((f) => `${f.label}: ${f.value}`);
}

function table(t: Table): string[] {
  return [t.columns.join(' | '), ...t.rows.map((r) => r.cells.map(cellText).join(' | ')), ...(t.foot ? [t.foot.join(' | ')] : [])];
}

/** The verification sheet as text. */
export function sheetText(m: SheetModel): string {
  return [
    `${m.institution} — ${m.title} (${PAPER_TEXT[m.paper]})`,
    `Order ${m.orderId} — printed ${m.printedAt}`,
    `Verdict: ${m.verdict.word} — ${m.verdict.detail}`,
    ...fields(m.order),
    'Lines',
    ...table(m.lines),
    'Osmolarity',
    ...fields(m.osmolarity.fields),
    m.osmolarity.statement,
    ...m.totals.flatMap((g) => [g.title, ...fields(g.fields)]),
    'Electrolytes',
    ...table(m.electrolytes),
    'Findings',
    ...(m.findings.length === 0 ? ['No findings.'] : m.findings.map((f) => `${f.severityText} ${f.code}: ${f.message} | value ${f.value} | limit ${f.limit} | source: ${f.source}`)),
    `Verdict: ${m.verdict.word} — ${m.verdict.detail}`,
    'Label and storage',
    ...fields(m.label),
    ...(m.sequence ? ['Suggested mixing sequence', ...m.sequence.map((s) => `${s.step}. ${s.lines}. ${s.mix} ${s.reason} (source: ${s.source})`.replace(/\s+/g, ' '))] : []),
    ...m.signOff.map((who) => `${who}: ____ Date and time: ____`),
    ...m.cautions,
    m.footnote,
  ].join('\n');
}

/** The bag label as text. */
export function labelText(m: LabelModel): string {
  return [
    `${m.institution} — ${m.title} (${labelSizeText(m.size)})`,
    ...(m.fitWarning ? [`Warning: ${m.fitWarning}`] : []),
    ...(m.hold ? [m.hold] : []),
    `Patient: ${m.patient.name}`,
    `ID: ${m.patient.identifier}`,
    `Location: ${m.patient.location}`,
    `Dosing weight: ${m.patient.weight} (${m.patient.ageGroup})`,
    `Route: ${m.route.text} — ${m.route.detail}`,
    ...m.ingredients.map((i) => [i.name, i.perKg, i.perDay, i.note].filter((x) => x !== null).join(' | ')),
    ...fields(m.volume),
    `Compounded: ${m.compounded}`,
    ...(m.beyondUseProblem ? [`Beyond use: ${m.beyondUseProblem}`] : m.beyondUse.map((b) => `Use by ${b.until} if ${b.condition} (${b.duration})${b.after ? `, ${b.after}` : ''}`)),
    m.storage,
    m.filter,
    ...m.cautions,
    `Barcode: ${m.barcode ? `${m.barcode.symbology} ${m.barcode.text}` : m.barcodeProblem ?? ''}`,
    `Order ${m.orderId}`,
    `${m.verification}: ____`,
  ].join('\n');
}
