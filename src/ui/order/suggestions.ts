// The solver's proposals (the report's optional `suggestions`) as the workspace shows them: a title,
// what the change does to the bag, and the order edits that apply it.
import type { Report } from '../../core/report.ts';
import { SEVERITY_TEXT, show, VERDICT_TEXT } from '../show.ts';
import type { Change } from './edits.ts';

type ReportSuggestion = NonNullable<Report['suggestions']>[number];
type Proposal = Extract<ReportSuggestion, { status: 'proposal' }>;
type Snapshot = Proposal['before'];

/** A proposal that would change the order, with what it does to the bag; applied only on the user's click. */
export interface Suggestion {
  id: string;
  /** Short: what the change is ("Final volume 2560 mL"). */
  title: string;
  /** The engine's own sentence about the proposal. */
  detail: string;
  consequences: string[];
  changes: Change[];
  /** The verdict the engine found after the change. */
  verdictAfter: 'pass' | 'warn' | 'block' | null;
}

/** A kind of proposal the solver looked for but cannot make, and why. */
export interface Unavailable {
  id: string;
  message: string;
  notes: string[];
}

const ROUTE_WORD = { peripheral: 'Peripheral line', central: 'Central line' } as const;

function titleOf(change: Proposal['change'], report: Report): string {
  switch (change.field) {
    case 'volumeMl': return `Final volume ${show(change.to, 0)} mL`;
    case 'amount': {
      const name = report.lines.find((l) => l.index === change.line)?.name ?? change.product;
      return `${name}: ${change.to} ${change.unit}`;
    }
    case 'route': return `${ROUTE_WORD[change.to]} instead of ${ROUTE_WORD[change.from].toLowerCase()}`;
  }
}

/** The order edits that apply a proposal's change. */
export function changesOf(change: Proposal['change']): Change[] {
  switch (change.field) {
    case 'volumeMl': {
      const out: Change[] = [{ path: 'volumeMl', value: String(change.to) }];
      if (change.addsFillLine) out.push({ path: 'lines[+].fill', value: change.addsFillLine });
      return out;
    }
    case 'amount':
      return [{ path: `lines[${change.line}].unit`, value: change.unit }, { path: `lines[${change.line}].amount`, value: String(change.to) }];
    case 'route':
      return [{ path: 'route', value: change.to }];
  }
}

/** "from → to unit" for the figures a proposal changes (unchanged figures are left out). */
function effects(before: Snapshot, after: Snapshot): string[] {
  const out: string[] = [];
  const limit = after.osmolarityLimit === null ? '' : ` (limit ${show(after.osmolarityLimit, 0)})`;
  out.push(`Osmolarity ${show(before.osmolarity, 1)} → ${show(after.osmolarity, 1)} mOsm/L${limit}`);
  if (before.volumeMl !== after.volumeMl) out.push(`Volume ${show(before.volumeMl, 0)} → ${show(after.volumeMl, 0)} mL; fluid ${show(before.fluidMlPerKgPerDay, 1)} → ${show(after.fluidMlPerKgPerDay, 1)} mL/kg/day`);
  if (before.dextroseG !== after.dextroseG) out.push(`Dextrose ${show(before.dextroseG, 1)} → ${show(after.dextroseG, 1)} g; GIR ${show(before.girMgPerKgPerMin, 2)} → ${show(after.girMgPerKgPerMin, 2)} mg/kg/min`);
  if (before.kcal !== after.kcal) out.push(`Energy ${show(before.kcal, 0)} → ${show(after.kcal, 0)} kcal (${show(after.kcalPerKgPerDay, 1)} kcal/kg/day)`);
  return out;
}

function findingText(f: Proposal['findingsAppear'][number]): string {
  return `${SEVERITY_TEXT[f.severity]} ${f.code}${f.nutrient ? ` (${f.nutrient})` : f.screen ? ` (${f.screen})` : ''}`;
}

/** The report's proposals in the panel's shape, and the kinds the solver could not propose. */
export function readSuggestions(report: Report, suggestions: Report['suggestions'] = report.suggestions): { proposals: Suggestion[]; unavailable: Unavailable[] } {
  const proposals: Suggestion[] = [];
  const unavailable: Unavailable[] = [];
  for (const s of suggestions ?? []) {
    if (s.status === 'unavailable') {
      unavailable.push({ id: s.kind, message: s.message, notes: s.notes });
      continue;
    }
    const consequences = effects(s.before, s.after);
    if (s.findingsAppear.length > 0) consequences.push(`Brings: ${s.findingsAppear.map(findingText).join(', ')}`);
    if (s.findingsDisappear.length > 0) consequences.push(`Clears: ${s.findingsDisappear.map(findingText).join(', ')}`);
    consequences.push(`Verdict ${VERDICT_TEXT[s.before.verdict].word} → ${VERDICT_TEXT[s.after.verdict].word}`);
    consequences.push(...s.notes);
    proposals.push({
      id: s.kind,
      title: titleOf(s.change, report),
      detail: s.message,
      consequences,
      changes: changesOf(s.change),
      verdictAfter: s.after.verdict,
    });
  }
  return { proposals, unavailable };
}
