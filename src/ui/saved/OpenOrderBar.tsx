import { useState } from 'react';
import type { Verdict } from '../../core/findings.ts';
import { formatProblem, type Problem } from '../../core/problems.ts';
import type { JsonObject } from '../../store/types.ts';
import { ChangedSinceNotice } from './ChangedSinceNotice.tsx';
import { SignOff } from './SignOff.tsx';
import { showTime } from './time.ts';
import type { AutosaveState, SavedOrderApi } from './useSavedOrder.ts';
import './saved.css';

interface Props {
  api: SavedOrderApi;
  /** The order file on screen (committed edits). */
  file: JsonObject;
  verdict: Verdict | null;
  initials: string;
  onInitials(text: string): void;
}

function autosaveText(a: AutosaveState): string {
  switch (a.kind) {
    case 'idle': return 'Every edit is kept in this browser as you go.';
    case 'saving': return 'Keeping your edit…';
    case 'kept': return `Draft kept in this browser · ${showTime(a.at)}`;
    case 'failed': return 'Your last edit could not be kept in this browser (see the storage message). It is still on screen.';
  }
}

/** The open order's saved state: version, unsaved changes, autosave, save, sign-off, and what changed since. */
export function OpenOrderBar({ api, file, verdict, initials, onInitials }: Props) {
  const [problems, setProblems] = useState<Problem[]>([]);
  const latest = api.latest;
  const state = !latest ? 'Not saved as an order yet' : api.unsaved ? `Version ${latest.n} · unsaved changes` : `Version ${latest.n}${latest.signOff ? ' · verified' : ''}`;
  const save = async () => {
    const r = await api.save(file, initials.trim() === '' ? null : initials.trim().toUpperCase());
    setProblems(r.ok ? [] : r.problems);
  };
  return (
    <div className="saved">
      <div className="saved-bar" aria-label="Saved order">
        <span className={`state${api.unsaved ? ' unsaved' : latest?.signOff ? ' locked' : ''}`} data-testid="saved-state">{state}</span>
        <span className={`autosave${api.autosave.kind === 'failed' ? ' failed' : ''}`} data-testid="autosave-state">{autosaveText(api.autosave)}</span>
        <label>
          Your initials
          <input type="text" className="initials" value={initials} maxLength={5} size={5} autoComplete="off" onChange={(e) => onInitials(e.target.value)} />
        </label>
        <button type="button" disabled={!api.ready || (!api.unsaved && latest !== null)} onClick={() => void save()}>
          {!latest ? 'Save order' : api.unsaved ? `Save as version ${latest.n + 1}` : `Saved as version ${latest.n}`}
        </button>
        <SignOff latest={latest} unsaved={api.unsaved} verdict={verdict} initials={initials} onSign={() => api.sign(file, initials)} />
      </div>
      {problems.length > 0 ? <ul className="form-problems" role="alert">{problems.map((p, i) => <li key={i}>{formatProblem(p)}</li>)}</ul> : null}
      {latest ? <ChangedSinceNotice changes={api.changes} version={latest.n} /> : null}
    </div>
  );
}
