import { useState } from 'react';
import type { Verdict } from '../../core/findings.ts';
import { formatProblem, type Problem, type Result } from '../../core/problems.ts';
import type { OrderVersion } from '../../store/types.ts';
import { showTime } from './time.ts';
import './saved.css';

interface Props {
  latest: OrderVersion | null;
  /** The order on screen differs from the latest saved version. */
  unsaved: boolean;
  /** The verdict of the order on screen; null when it does not validate. */
  verdict: Verdict | null;
  initials: string;
  onSign(): Promise<Result<OrderVersion>>;
}

/**
 * "Verified by": signs the order on screen (saving it as a new version first when needed). A signed
 * version is locked; the control then says who signed and that any change makes a new version. A bag
 * the checks hold asks for an explicit confirmation that the findings were reviewed.
 */
export function SignOff({ latest, unsaved, verdict, initials, onSign }: Props) {
  const [problems, setProblems] = useState<Problem[]>([]);
  const [confirmHold, setConfirmHold] = useState(false);
  const [busy, setBusy] = useState(false);
  if (latest?.signOff && !unsaved) {
    return (
      <div className="sign-off" aria-label="Sign-off">
        <span className="verified">Verified by {latest.signOff.by} · {showTime(latest.signOff.at)}</span>
        <span className="count">Version {latest.n} is locked: any change makes version {latest.n + 1}.</span>
      </div>
    );
  }
  const next = unsaved || !latest ? (latest?.n ?? 0) + 1 : latest.n;
  const blocked = verdict === 'block' && !confirmHold;
  const sign = async () => {
    setBusy(true);
    const r = await onSign();
    setBusy(false);
    setProblems(r.ok ? [] : r.problems);
    if (r.ok) setConfirmHold(false);
  };
  return (
    <div className="sign-off" aria-label="Sign-off">
      {verdict === 'block' ? (
        <label className="confirm">
          <input type="checkbox" checked={confirmHold} onChange={(e) => setConfirmHold(e.target.checked)} />
          <span>The checks hold this bag. I reviewed every finding and sign under local policy.</span>
        </label>
      ) : null}
      <button type="button" className="primary" disabled={busy || verdict === null || initials.trim() === '' || blocked} onClick={() => void sign()}>
        {unsaved || !latest ? `Save and sign off as version ${next}` : `Sign off version ${next}`}
      </button>
      {verdict === null ? <span className="count">The order must check before it can be signed.</span> : initials.trim() === '' ? <span className="count">Enter your initials to sign.</span> : null}
      {problems.length > 0 ? <ul className="form-problems" role="alert">{problems.map((p, i) => <li key={i}>{formatProblem(p)}</li>)}</ul> : null}
    </div>
  );
}
