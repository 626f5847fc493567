import type { Suggestion } from '../order/suggestions.ts';
import { VERDICT_TEXT } from '../show.ts';

/** The solver's proposals with their consequences; each is applied only on the user's click, and can be undone. */
export function SuggestionsPanel({ suggestions, onApply, disabled }: { suggestions: Suggestion[]; onApply(s: Suggestion): void; disabled: boolean }) {
  if (suggestions.length === 0) return null;
  return (
    <section className="panel suggestions" aria-labelledby="suggestions-title">
      <h2 id="suggestions-title">Ways to make it fit</h2>
      <p className="info">Proposals from the engine, re-checked through every check. Nothing changes until you apply one; Undo takes it back.</p>
      <ul>
        {suggestions.map((s) => (
          <li key={s.id} className="suggestion">
            <p className="suggestion-title">{s.title}</p>
            {s.consequences.length > 0 ? <ul className="consequences">{s.consequences.map((c, i) => <li key={i}>{c}</li>)}</ul> : null}
            {s.verdictAfter ? <p className="after">Verdict after the change: {VERDICT_TEXT[s.verdictAfter].word}</p> : null}
            <button type="button" className="small" disabled={disabled} onClick={() => onApply(s)} aria-label={`Apply: ${s.title}`}>Apply</button>
          </li>
        ))}
      </ul>
    </section>
  );
}
