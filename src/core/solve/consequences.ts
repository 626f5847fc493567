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

/** Whether two findings are the same warning or hold: same code, screen, nutrient and severity. */
function sameKind(a: Finding, b: Finding): boolean {
  return a.code === b.code && a.severity === b.severity && (a.screen ?? '') === (b.screen ?? '') && (a.nutrient ?? '') === (b.nutrient ?? '');
}

/** The warnings and holds among findings (information left out). */
function serious(findings: readonly Finding[]): Finding[] {
  const out: Finding[] = [];
  for (const f of findings) if (f.severity !== 'info') out.push(f);
  return out;
}

/** Whether a list holds a finding of the same kind as `f`. */
function hasKind(list: readonly Finding[], f: Finding): boolean {
  for (const g of list) if (sameKind(f, g)) return true;
  return false;
}

/** The findings of `from` with no finding of the same kind in `among`. */
function notIn(from: readonly Finding[], among: readonly Finding[]): Finding[] {
  const out: Finding[] = [];
  for (const f of from) if (!hasKind(among, f)) out.push(f);
  return out;
}

/** Warnings and holds present after but not before (appear), and before but not after (disappear). */
export function findingChanges(before: readonly Finding[], after: readonly Finding[]): { appears: Finding[]; disappears: Finding[] } {
  const b = serious(before);
  const a = serious(after);
  return { appears: notIn(a, b), disappears: notIn(b, a) };
}

/** Whether any finding is the peripheral osmolarity screen's. */
export function failsOsmolarity(findings: readonly Finding[]): boolean {
  for (const f of findings) if (f.code === 'osmolarity-peripheral') return true;
  return false;
}

/** A proposal from the current evaluation and the re-checked modified order. */
export function propose(kind: SuggestionKind, message: string, change: Change, current: Checked, next: Checked, policy: Policy, notes: string[] = []): Proposal {
  const changes = findingChanges(current.findings, next.findings);
  return {
    kind, status: 'proposal', message, change, order: next.order,
    before: snapshot(current, policy),
    after: snapshot(next, policy),
    passesOsmolarity: !failsOsmolarity(next.findings),
    appears: changes.appears,
    disappears: changes.disappears,
    notes,
  };
}

/** One line naming the warnings and holds a change brings, for a proposal's message ('' when none). */
export function appearsText(appears: readonly Finding[]): string {
  if (appears.length === 0) return '';
  const names = appears.map((f) => `${f.code}${f.nutrient ? ` (${f.nutrient})` : f.screen ? ` (${f.screen})` : ''}`);
  return ` It would bring: ${names.join(', ')}.`;
}
