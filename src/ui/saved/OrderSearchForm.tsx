import type { OrderQuery } from '../../store/search.ts';
import './saved.css';

/** Search saved orders by id or patient, date range, verdict and sign-off. */
export function OrderSearchForm({ query, onChange }: { query: OrderQuery; onChange(q: OrderQuery): void }) {
  const set = (patch: Record<string, string>) => {
    const next: OrderQuery = { ...query };
    for (const [k, v] of Object.entries(patch)) {
      if (v === '') delete next[k as keyof OrderQuery];
      else (next as Record<string, string>)[k] = v;
    }
    onChange(next);
  };
  return (
    <form className="row search" role="search" onSubmit={(e) => e.preventDefault()}>
      <label>
        Order id, patient id or name
        <input type="search" value={query.text ?? ''} onChange={(e) => set({ text: e.target.value })} />
      </label>
      <label>
        Saved from
        <input type="date" value={query.from ?? ''} onChange={(e) => set({ from: e.target.value })} />
      </label>
      <label>
        to
        <input type="date" value={query.to ?? ''} onChange={(e) => set({ to: e.target.value })} />
      </label>
      <label>
        Verdict
        <select value={query.verdict ?? ''} onChange={(e) => set({ verdict: e.target.value })}>
          <option value="">Any</option>
          <option value="pass">Pass</option>
          <option value="warn">Review</option>
          <option value="block">Hold</option>
          <option value="unchecked">Not checked</option>
        </select>
      </label>
      <label>
        Sign-off
        <select value={query.signed ?? ''} onChange={(e) => set({ signed: e.target.value })}>
          <option value="">Any</option>
          <option value="signed">Verified</option>
          <option value="unsigned">Not verified</option>
        </select>
      </label>
    </form>
  );
}
