import type { Suggestion, Unavailable } from '../order/suggestions.ts';
import { VERDICT_TEXT } from '../show.ts';

interface Props {
  suggestions: Suggestion[];
  unavailable: Unavailable[];
  onApply(s: Suggestion): void;
  disabled: boolean;
}

/** The solver's proposals with their consequences; each is applied only on the user's click, and can be undone. */
export function SuggestionsPanel({ suggestions, unavailable, onApply, disabled }: Props) {
  if (suggestions.length === 0 && unavailable.length === 0) return null;
  return (
    <section className="panel suggestions" aria-labelledby="suggestions-title">
      <h2 id="suggestions-title">Ways to make it fit</h2>
      <p className="info">Proposals from the engine, each re-checked through every check. Nothing changes until you apply one; Undo takes it back.</p>
      <ul>
        {suggestions.map((s) => (
          <li key={s.id} className="suggestion">
            <p className="suggestion-title">{s.title}</p>
            {s.consequences.length > 0 ? <ul className="consequences">{s.consequences.map((c, i) => <li key={i}>{c}</li>)}</ul> : null}
            {s.detail ? <details className="detail"><summary>The engine’s note</summary><p>{s.detail}</p></details> : null}
            <button type="button" className="small" disabled={disabled} onClick={() => onApply(s)}
              aria-label={`Apply: ${s.title}${s.verdictAfter ? ` (verdict after: ${VERDICT_TEXT[s.verdictAfter].word})` : ''}`}>Apply</button>
          </li>
        ))}
        {unavailable.map((u) => (
          <li key={u.id} className="suggestion unavailable">
            <p>{u.message}</p>
            {u.notes.length > 0 ? <ul className="consequences">{u.notes.map((n, i) => <li key={i}>{n}</li>)}</ul> : null}
          </li>
        ))}
      </ul>
    </section>
  );
}
