import { beyondUse } from '../../core/beyondUse.ts';
import { formatProblem } from '../../core/problems.ts';
import type { Report } from '../../core/report.ts';
import type { BeyondUseRow } from './model.ts';
import type { PrintOptions } from './options.ts';
import { amount, dateTime, fixed } from './format.ts';

// Facts that both printouts state the same way: route wording, filter, beyond-use dates, cautions.

/** In-line filter per bag type (field guide §8.1): ASPEN 2014 (Boullata et al., JPEN 38:334). */
export const FILTER = {
  threeInOne: '1.2 µm',
  twoInOne: '0.22 µm',
  source: 'ASPEN 2014 (Boullata et al.): 1.2 µm filter for 3-in-1, 0.22 µm for 2-in-1',
} as const;

/** Auxiliary statements for the bag (field guide §8.1 item 9: common practice and ASPEN). */
export const LABEL_CAUTIONS = {
  precipitate: 'Do not use if precipitate or separation is seen.',
  emulsion: 'Do not use if precipitate or separation is seen (cracked emulsion: yellow oily streaks).',
  highAlert: 'High-alert medication: check patient, route and rate.',
} as const;

/** True when the bag holds lipid emulsion (a 3-in-1 admixture). */
export function isThreeInOne(report: Report): boolean {
  return report.lines.some((l) => l.role === 'lipid' && l.volumeMl > 0);
}

/** The in-line filter the bag needs, in words. */
export function filterText(report: Report): string {
  return isThreeInOne(report)
    ? `Use a ${FILTER.threeInOne} in-line filter (3-in-1: contains lipid).`
    : `Use a ${FILTER.twoInOne} in-line filter (2-in-1: no lipid).`;
}

/** True when the reported osmolarity is over the policy's peripheral limit for the age group. */
export function overPeripheralLimit(report: Report): boolean {
  const limit = report.osmolarity.peripheralLimit;
  return limit !== null && report.osmolarity.reported > limit;
}

/** The route in plain words; a bag over the peripheral limit is "CENTRAL LINE ONLY" whatever was ordered. */
export function routeWording(report: Report): { text: string; emphatic: boolean; detail: string } {
  const o = report.osmolarity;
  const osm = `Osmolarity ${fixed(o.reported, 1)} mOsm/L`;
  const limit = o.peripheralLimit === null ? null : `${fixed(o.peripheralLimit, 0)} mOsm/L`;
  if (overPeripheralLimit(report)) {
    return { text: 'CENTRAL LINE ONLY', emphatic: true, detail: `${osm}: over the peripheral limit of ${limit}.` };
  }
  if (report.route === 'central') return { text: 'Central line', emphatic: false, detail: `${osm} (ordered for a central line).` };
  return {
    text: 'Peripheral vein or central line',
    emphatic: false,
    detail: limit ? `${osm}: within the peripheral limit of ${limit}.` : `${osm}; the policy sets no peripheral limit for this age group.`,
  };
}

function durationText(d: { amount: { toString(): string }; unit: 'h' | 'days' }): string {
  const n = d.amount.toString();
  return d.unit === 'h' ? `${n} h` : `${n} ${n === '1' ? 'day' : 'days'}`;
}

/** Beyond-use rows for the bag, from the compounding time and the policy; or the problem that prevents them. */
export function beyondUseRows(options: PrintOptions): { rows: BeyondUseRow[]; problem: string | null } {
  const r = beyondUse(options.compoundedAt, options.policy);
  if (!r.ok) return { rows: [], problem: r.problems.map(formatProblem).join('; ') };
  if (r.value.length === 0) return { rows: [], problem: 'the policy sets no beyond-use time: the pharmacist writes it by hand' };
  return {
    problem: null,
    rows: r.value.map(({ condition: c, until }) => ({
      condition: `kept ${c.label} ${c.temperature}`,
      until: dateTime(until, options.timeZone),
      duration: durationText(c.duration),
      after: c.afterRemoval ? `then up to ${durationText(c.afterRemoval.duration)} ${c.afterRemoval.label} ${c.afterRemoval.temperature}` : null,
    })),
  };
}

/** The sources behind the beyond-use rows, for the verification sheet. */
export function beyondUseSources(options: PrintOptions): string[] {
  return (options.policy.beyondUse?.conditions ?? []).flatMap((c) => [c.source, ...(c.afterRemoval ? [c.afterRemoval.source] : [])]);
}

/** Total volume, rate and duration as the label and the sheet state them. */
export function volumeFields(report: Report): { label: string; value: string }[] {
  return [
    { label: 'Total volume', value: amount(report.volumeMl, 'mL') },
    { label: 'Rate', value: amount(report.rateMlPerHour, 'mL/h') },
    { label: 'Infuse over', value: amount(report.hours, 'h') },
  ];
}
