import { ruleFor, type Policy } from '../policy.ts';
import type { Finding } from '../findings.ts';
import { perKgOf } from '../compute/bag.ts';
import type { Change, Checked, Proposal, Snapshot, SuggestionKind } from './suggestion.ts';

/** The figures of a checked bag that a proposal changes. */
export function snapshot(c: Checked, policy: Policy): Snapshot {
  const { bag } = c;
  return {
    osmolarity: bag.osmolarity.reported,
    osmolarityLimit: ruleFor(policy, 'osmolarity-peripheral', bag.order.patient.ageGroup)?.max ?? null,
    verdict: c.verdict,
    volumeMl: bag.finalVolumeMl,
    fluidMlPerKgPerDay: perKgOf(bag, bag.finalVolumeMl),
    kcal: bag.kcal.total,
    kcalPerKgPerDay: perKgOf(bag, bag.kcal.total),
    girMgPerKgPerMin: bag.girMgPerKgPerMin,
    dextroseG: bag.grams.dextrose,
  };
}

function key(f: Finding): string {
  return [f.code, f.screen ?? '', f.nutrient ?? '', f.severity].join('|');
}

/** Warnings and holds present after but not before (appear), and before but not after (disappear). */
export function findingChanges(before: readonly Finding[], after: readonly Finding[]): { appears: Finding[]; disappears: Finding[] } {
  const serious = (f: Finding) => f.severity !== 'info';
  const beforeKeys = new Set(before.filter(serious).map(key));
  const afterKeys = new Set(after.filter(serious).map(key));
  return {
    appears: after.filter((f) => serious(f) && !beforeKeys.has(key(f))),
    disappears: before.filter((f) => serious(f) && !afterKeys.has(key(f))),
  };
}

/** A proposal from the current evaluation and the re-checked modified order. */
export function propose(kind: SuggestionKind, message: string, change: Change, current: Checked, next: Checked, policy: Policy, notes: string[] = []): Proposal {
  return {
    kind, status: 'proposal', message, change, order: next.order,
    before: snapshot(current, policy),
    after: snapshot(next, policy),
    passesOsmolarity: !next.findings.some((f) => f.code === 'osmolarity-peripheral'),
    ...findingChanges(current.findings, next.findings),
    notes,
  };
}

/** One line naming the warnings and holds a change brings, for a proposal's message ('' when none). */
export function appearsText(appears: readonly Finding[]): string {
  if (appears.length === 0) return '';
  const names = appears.map((f) => `${f.code}${f.nutrient ? ` (${f.nutrient})` : f.screen ? ` (${f.screen})` : ''}`);
  return ` It would bring: ${names.join(', ')}.`;
}
