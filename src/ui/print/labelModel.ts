import type { Report } from '../../core/report.ts';
import type { LabelQuantity } from '../../core/labelAmount.ts';
import { formatProblem } from '../../core/problems.ts';
import { SPECIES } from '../../core/species.ts';
import { AGE_GROUP_TEXT } from '../show.ts';
import { orderBarcode } from './barcode.ts';
import { LABEL_CAUTIONS, beyondUseRows, filterText, isThreeInOne, routeWording, volumeFields } from './bagFacts.ts';
import { amount, dateTime } from './format.ts';
import { GROUP_TEXT, labelIngredients, type Ingredient } from './ingredients.ts';
import type { IngredientRow, LabelModel } from './model.ts';
import { labelSizeText, type PrintOptions } from './options.ts';
import { labelFit } from './labelFit.ts';

const SPECIES_SHORT: Partial<Record<string, string>> = { Na: 'Na', K: 'K', Ca: 'Ca', Mg: 'Mg' };

function perDay(q: LabelQuantity): string {
  return amount(q.perDay, `${q.unit}/day`);
}
function perKg(q: LabelQuantity): string {
  return amount(q.perKgPerDay, `${q.unit}/kg/day`);
}

function note(i: Ingredient, kids: boolean): string | null {
  const parts: string[] = [];
  const a = i.amount;
  if (a.amount.species === 'phosphate' || a.amount.species === 'glycerophosphate') parts.push(a.amount.species === 'phosphate' ? 'as phosphate' : 'as organic phosphate');
  if (a.includes?.species) parts.push(`with ${kids ? perKg(a.includes) : perDay(a.includes)} ${SPECIES_SHORT[a.includes.species] ?? SPECIES[a.includes.species].label}`);
  if (a.ordered) parts.push(`ordered as ${kids ? perKg(a.ordered) : perDay(a.ordered)}`);
  return parts.length > 0 ? parts.join(', ') : null;
}

function ingredientRows(report: Report, options: PrintOptions, kids: boolean): IngredientRow[] {
  return labelIngredients(report, options.catalog).map((i) => ({
    group: i.group,
    groupText: GROUP_TEXT[i.group],
    name: i.name,
    perKg: kids ? perKg(i.amount.amount) : null,
    perDay: perDay(i.amount.amount),
    note: note(i, kids),
  }));
}

/**
 * The bag label of a report: patient, route in plain words, ingredients in the label sequence with
 * amounts per day (and per kg per day for children and neonates), volume and rate, compounding and
 * beyond-use date/times with storage, in-line filter, cautions, the order id as a barcode, and the
 * pharmacist's initials. Pure: the same report and options always give the same label.
 */
export function labelModel(report: Report, options: PrintOptions): LabelModel {
  const p = report.patient;
  const kids = p.ageGroup !== 'adult';
  const bud = beyondUseRows(options);
  const barcode = orderBarcode(report.order);
  const threeInOne = isThreeInOne(report);
  const cautions = [threeInOne ? LABEL_CAUTIONS.emulsion : LABEL_CAUTIONS.precipitate, LABEL_CAUTIONS.highAlert];
  const route = routeWording(report);
  const ingredients = ingredientRows(report, options, kids);
  const patientName = p.name ?? '(no name in the order)';
  const hold = report.verdict === 'block' ? 'ON HOLD: not released. Do not hang.' : null;
  const fit = labelFit({ patientName, emphaticRoute: route.emphatic, threeInOne, hold: hold !== null, ingredients }, options.labelSize);
  return {
    kind: 'label',
    size: options.labelSize,
    compact: fit.compact,
    fitWarning: fit.fits ? null : `This label may not fit on one ${labelSizeText(options.labelSize)} label (${ingredients.length} ingredients): print it on a larger label.`,
    institution: options.institution,
    title: 'Parenteral nutrition',
    orderId: report.order,
    patient: {
      name: patientName,
      identifier: p.id,
      location: p.location ?? '(no location in the order)',
      weight: amount(p.weightKg, 'kg'),
      ageGroup: AGE_GROUP_TEXT[p.ageGroup],
    },
    route,
    hold,
    perKg: kids,
    ingredients,
    volume: volumeFields(report),
    compounded: dateTime(options.compoundedAt, options.timeZone),
    beyondUse: bud.rows,
    beyondUseProblem: bud.problem,
    storage: options.policy.beyondUse?.storage.text ?? 'Storage: see local policy.',
    filter: filterText(report),
    cautions,
    barcode: barcode.ok ? barcode.value : null,
    barcodeProblem: barcode.ok ? null : barcode.problems.map(formatProblem).join('; '),
    verification: 'Pharmacist verified (initials)',
  };
}
