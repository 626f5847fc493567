import type { RefChange } from '../../store/changes.ts';
import { shortHash } from '../../store/canonical.ts';
import './saved.css';

const MAX_DETAILS = 8;

/** "Checked against an earlier catalog/policy": which, and what changed since, when known. */
export function ChangedSinceNotice({ changes, version }: { changes: readonly RefChange[]; version: number }) {
  if (changes.length === 0) return null;
  return (
    <section className="changed-notice" aria-label="Changed since checked">
      {changes.map((c) => (
        <div key={c.kind}>
          <strong>
            Version {version} was checked against an earlier {c.kind} ({c.then.id}, #{shortHash(c.then.hash)}); the {c.kind} in
            force is now {c.now.id} (#{shortHash(c.now.hash)}).
          </strong>{' '}
          The figures on screen use the {c.kind} in force now.
          {c.details === null ? (
            <p>The earlier {c.kind} is not kept in this browser, so what changed cannot be listed.</p>
          ) : c.details.length > 0 ? (
            <ul>
              {c.details.slice(0, MAX_DETAILS).map((d) => <li key={d}>{d}</li>)}
              {c.details.length > MAX_DETAILS ? <li>and {c.details.length - MAX_DETAILS} more</li> : null}
            </ul>
          ) : null}
        </div>
      ))}
    </section>
  );
}
