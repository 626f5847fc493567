import { formatProblem } from '../../core/problems.ts';
import { useSavedWork } from './SavedWorkProvider.tsx';
import './saved.css';

/** Storage problems (a full disk, a stored file that no longer validates), plainly, with a dismiss. */
export function StorageNotice() {
  const { problems, dismiss, status } = useSavedWork();
  if (problems.length === 0) return null;
  return (
    <section className="storage-notice" role="alert" aria-label="Storage problem">
      <h2>{status === 'unavailable' ? 'Saving in this browser is not available' : 'Saving needs your attention'}</h2>
      <ul>{problems.map((p, i) => <li key={i}>{formatProblem(p)}</li>)}</ul>
      <button type="button" onClick={dismiss}>Dismiss</button>
    </section>
  );
}
