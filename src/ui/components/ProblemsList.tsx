import type { Problem } from '../../core/problems.ts';
import { formatProblem } from '../../core/problems.ts';

/** Problems no single field shows (e.g. an unknown field in an opened file), listed as `path: message`. */
export function ProblemsList({ problems, title }: { problems: readonly Problem[]; title: string }) {
  if (problems.length === 0) return null;
  return (
    <section className="panel problems" role="alert" aria-label={title}>
      <h2>{title}</h2>
      <ul>{problems.map((p, i) => <li key={i}>{formatProblem(p)}</li>)}</ul>
    </section>
  );
}
