import type { Report } from '../../core/report.ts';
import type { SpeciesId } from '../../core/species.ts';
import { AGE_GROUP_TEXT, SEVERITY_TEXT, VERDICT_TEXT } from '../show.ts';
import { FILTER, beyondUseRows, beyondUseSources, filterText, routeWording, volumeFields } from './bagFacts.ts';
import { amount, dateTime, figure, trimmed } from './format.ts';
import type { Cell, Field, FindingRow, SheetModel, Table } from './model.ts';
import type { PrintOptions } from './options.ts';

type Line = Report['lines'][number];

function orderedText(l: Line): Cell {
  if (l.fill) return 'to volume';
  if (!l.perDay) return '—';
  const figure = amount(l.perDay.amount, `${l.perDay.unit}/day`);
  return l.species && (l.perDay.unit === 'mEq' || l.perDay.unit === 'mmol') ? [figure, l.species] : figure;
}

function perKgText(l: Line): string {
  if (!l.perKgPerDay) return l.fill ? '' : '—';
  return amount(l.perKgPerDay.amount, `${l.perKgPerDay.unit}/day`);
}

function linesTable(report: Report, kids: boolean): Table {
  const columns = ['#', 'Stock', 'Stock strength', 'Ordered per day', ...(kids ? ['Per kg per day'] : []), 'Volume to add', 'mOsm', 'Checked'];
  const numeric = [false, false, false, true, ...(kids ? [true] : []), true, true, false];
  const rows = report.lines.map((l) => ({
    muted: l.fill,
    cells: [String(l.index + 1), l.name, l.strength ?? '—', orderedText(l), ...(kids ? [perKgText(l)] : []), figure(l.volumeMl, 2, 'mL'), figure(l.mOsm, 1, 'mOsm'), ''],
  }));
  const foot = ['', 'Bag', '', '', ...(kids ? [''] : []), figure(report.volumeMl, 2, 'mL'), figure(report.osmolarity.totalMOsm, 1, 'mOsm'), ''];
  return { columns, numeric, rows, foot };
}

const METHOD_TEXT = { particle: 'particle count', labelSum: 'label sum' } as const;

function osmolarity(report: Report): SheetModel['osmolarity'] {
  const o = report.osmolarity;
  const over = o.peripheralLimit !== null && o.reported > o.peripheralLimit;
  const fields: Field[] = [
    { label: 'Particle count (ideal, USP <785>)', value: figure(o.particle, 1, 'mOsm/L') },
    { label: 'Label sum (labelled stock osmolarities)', value: figure(o.labelSum, 1, 'mOsm/L') },
    { label: `Reported (${METHOD_TEXT[o.method]}, by policy)`, value: figure(o.reported, 1, 'mOsm/L') },
    { label: `Peripheral limit (${AGE_GROUP_TEXT[report.patient.ageGroup].toLowerCase()})`, value: o.peripheralLimit === null ? 'none in the policy' : figure(o.peripheralLimit, 0, 'mOsm/L') },
  ];
  const reported = `Reported ${figure(o.reported, 1, 'mOsm/L')}`;
  let statement: string;
  if (o.peripheralLimit === null) statement = `${reported}; the policy sets no peripheral limit for this age group.`;
  else if (over) statement = `${reported} is over the peripheral limit of ${figure(o.peripheralLimit, 0, 'mOsm/L')}: central line only.`;
  else statement = `${reported} is within the peripheral limit of ${figure(o.peripheralLimit, 0, 'mOsm/L')}.`;
  return { fields, statement, overPeripheralLimit: over };
}

function totals(report: Report): SheetModel['totals'] {
  const t = report.totals;
  const k = t.kcal;
  return [
    { title: 'Final concentrations', fields: [
      { label: 'Dextrose', value: figure(t.dextrosePercent, 2, '% w/v') },
      { label: 'Amino acids', value: figure(t.aminoAcidPercent, 2, '% w/v') },
      { label: 'Lipid', value: figure(t.lipidPercent, 2, '% w/v') },
    ] },
    { title: 'Doses', fields: [
      { label: 'Dextrose', value: `${amount(t.grams.dextrose, 'g/day')} · ${amount(t.gramsPerKg.dextrose, 'g/kg/day')}` },
      { label: 'Amino acids', value: `${amount(t.grams.aminoAcids, 'g/day')} · ${amount(t.gramsPerKg.aminoAcids, 'g/kg/day')}` },
      { label: 'Lipid', value: `${amount(t.grams.lipid, 'g/day')} · ${amount(t.gramsPerKg.lipid, 'g/kg/day')}` },
      { label: 'Nitrogen', value: amount(t.nitrogenG, 'g/day') },
      { label: 'Fluid', value: figure(t.fluidMlPerKg, 1, 'mL/kg/day') },
      { label: 'Glucose infusion rate (GIR)', value: figure(t.girMgPerKgPerMin, 2, 'mg/kg/min') },
      { label: 'Aluminum', value: figure(t.aluminumMcgPerKgPerDay, 2, 'µg/kg/day') },
    ] },
    { title: 'Energy', fields: [
      { label: 'Total', value: figure(k.total, 1, 'kcal/day') },
      { label: 'Total per kg', value: figure(t.kcalPerKg, 1, 'kcal/kg/day') },
      { label: 'From dextrose', value: figure(k.dextrose, 1, 'kcal/day') },
      { label: 'From amino acids', value: figure(k.aminoAcids, 1, 'kcal/day') },
      { label: 'From lipid', value: figure(k.lipid, 1, 'kcal/day') },
      ...(k.other > 0 ? [{ label: 'From other stocks', value: figure(k.other, 1, 'kcal/day') }] : []),
      { label: 'Non-protein', value: figure(k.nonProtein, 1, 'kcal/day') },
      { label: 'Non-protein kcal per g nitrogen', value: t.npcToN === null ? '— (no amino acids)' : figure(t.npcToN, 0, 'kcal/g N') },
    ] },
  ];
}

const IONS: readonly { id: SpeciesId; text: string }[] = [
  { id: 'Na', text: 'Sodium' }, { id: 'K', text: 'Potassium' }, { id: 'Ca', text: 'Calcium' }, { id: 'Mg', text: 'Magnesium' },
  { id: 'phosphate', text: 'Phosphate (inorganic)' }, { id: 'glycerophosphate', text: 'Phosphate (organic)' },
  { id: 'Cl', text: 'Chloride' }, { id: 'acetate', text: 'Acetate' },
];

function electrolytes(report: Report): Table {
  const t = report.totals;
  const rows = IONS.filter((s) => t.mmolPerDay[s.id] > 0).map((s) => ({
    muted: false,
    cells: [
      s.text,
      amount(t.mmolPerDay[s.id], 'mmol/day'),
      amount(t.mmolPerKgPerDay[s.id], 'mmol/kg/day'),
      t.mEqPerL[s.id] > 0 && t.mEqPerL[s.id] !== t.mmolPerL[s.id]
        ? `${figure(t.mmolPerL[s.id], 2, 'mmol/L')} = ${figure(t.mEqPerL[s.id], 2, 'mEq/L')}`
        : figure(t.mmolPerL[s.id], 2, 'mmol/L'),
    ],
  }));
  return { columns: ['Ion', 'Per day', 'Per kg per day', 'Per litre'], numeric: [false, true, true, true], rows, foot: null };
}

function findingRows(report: Report): FindingRow[] {
  return report.findings.map((f) => {
    const unit = f.unit ? ` ${f.unit}` : '';
    return {
      severity: f.severity,
      severityText: SEVERITY_TEXT[f.severity],
      code: f.nutrient ? `${f.code} (${f.nutrient})` : f.code,
      message: f.message,
      value: f.value === null ? '—' : `${trimmed(f.value, 4)}${unit}`,
      limit: f.limit === null ? '—' : `${trimmed(f.limit, 4)}${unit}`,
      source: f.source,
    };
  });
}

function labelFields(report: Report, options: PrintOptions): Field[] {
  const bud = beyondUseRows(options);
  const route = routeWording(report);
  return [
    { label: 'Route on the label', value: route.text },
    { label: 'Compounded', value: dateTime(options.compoundedAt, options.timeZone) },
    ...(bud.problem ? [{ label: 'Beyond use', value: bud.problem }] : bud.rows.map((b) => ({
      label: `Use by, if ${b.condition}`,
      value: `${b.until} (${b.duration})${b.after ? `, ${b.after}` : ''}`,
    }))),
    { label: 'Storage', value: options.policy.beyondUse?.storage.text ?? 'see local policy' },
    { label: 'In-line filter', value: filterText(report) },
    { label: 'Sources', value: [...beyondUseSources(options), FILTER.source].join('; ') },
  ];
}

export const SHEET_CAUTIONS = [
  'Osmocount is a checking aid, not a prescriber: local policy and the verifying pharmacist decide.',
  'Figures are calculated estimates from the catalog’s stock compositions; the measured osmolality of concentrated PN runs higher.',
  'PN is a high-alert medication (ASPEN 2014; ISMP): check every line against the prescriber’s order, independently.',
] as const;

/**
 * The verification sheet of a report: identity and infusion plan, every line with its stock, amount,
 * volume to add and mOsm, osmolarities against the limit, totals, findings with their sources, the
 * verdict, the mixing sequence when one is given, sign-off lines and cautions. Pure.
 */
export function sheetModel(report: Report, options: PrintOptions): SheetModel {
  const p = report.patient;
  const kids = p.ageGroup !== 'adult';
  const verdict = VERDICT_TEXT[report.verdict];
  const [volume, rate, hours] = volumeFields(report);
  const sequence = options.sequence && options.sequence.length > 0
    ? options.sequence.map((s) => ({
        step: String(s.step),
        lines: s.lines.map((l) => `${l.name} (line ${l.index + 1})`).join('; '),
        mix: s.mixAfter ? 'Mix well before the next step.' : '',
        reason: s.reason,
        source: s.source,
      }))
    : null;
  return {
    kind: 'sheet',
    paper: options.paper,
    institution: options.institution,
    title: 'PN verification sheet',
    orderId: report.order,
    printedAt: dateTime(options.printedAt, options.timeZone),
    verdict: { verdict: report.verdict, word: verdict.word, detail: verdict.detail },
    order: [
      { label: 'Order', value: report.order },
      { label: 'Patient', value: p.name ?? '—' },
      { label: 'Patient ID', value: p.id },
      { label: 'Location', value: p.location ?? '—' },
      { label: 'Dosing weight', value: amount(p.weightKg, 'kg') },
      { label: 'Age group', value: AGE_GROUP_TEXT[p.ageGroup] },
      { label: 'Route ordered', value: report.route === 'central' ? 'Central line' : 'Peripheral vein' },
      { label: 'Final volume', value: volume?.value ?? '' },
      { label: 'Infusion time', value: hours?.value ?? '' },
      { label: 'Rate', value: rate?.value ?? '' },
    ],
    lines: linesTable(report, kids),
    osmolarity: osmolarity(report),
    totals: totals(report),
    electrolytes: electrolytes(report),
    findings: findingRows(report),
    label: labelFields(report, options),
    sequence,
    signOff: ['Prepared by', 'Checked by'],
    cautions: [...SHEET_CAUTIONS, ...(sequence ? ['The mixing sequence is a suggestion: follow the local compounding procedure.'] : [])],
    footnote: `Times in ${options.timeZone}. Checked against catalog "${report.catalog}" and policy "${report.policy}". Printed ${dateTime(options.printedAt, options.timeZone)}.`,
  };
}
