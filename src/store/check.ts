// Checking a stored order file against a catalog and policy, and stamping the result on its version.
import { evaluateOrder, type Evaluation } from '../core/evaluate.ts';
import type { Catalog } from '../core/catalog.ts';
import type { Policy } from '../core/policy.ts';
import type { Problem, Result } from '../core/problems.ts';
import type { CheckStamp, FileRef } from './types.ts';
import { validOrderFile } from './validate.ts';

/** Where a catalog or policy in force came from. */
export type Provenance = 'shipped' | 'edited' | 'imported';

/** The catalog and policy orders are checked against, with their identities. */
export interface CheckEnv {
  catalog: Catalog;
  policy: Policy;
  catalogRef: FileRef;
  policyRef: FileRef;
  catalogFrom: Provenance;
  policyFrom: Provenance;
}

/** Validate (through restore) and evaluate an order file; its problems when it does not validate. */
export function evaluateFile(file: unknown, env: Pick<CheckEnv, 'catalog' | 'policy'>): Result<Evaluation> {
  const valid = validOrderFile(file, env.catalog);
  if (!valid.ok) return valid;
  return { ok: true, value: evaluateOrder(valid.value.value, env.catalog, env.policy) };
}

/** The stamp a version carries: verdict (or how many problems stopped the check) and against what. */
export function stampOf(result: Result<Evaluation>, env: Pick<CheckEnv, 'catalogRef' | 'policyRef'>, at: string): CheckStamp {
  return {
    verdict: result.ok ? result.value.verdict : null,
    problems: result.ok ? 0 : result.problems.length,
    catalog: env.catalogRef,
    policy: env.policyRef,
    checkedAt: at,
  };
}

/** Evaluate and stamp in one step. */
export function checkAndStamp(file: unknown, env: CheckEnv, at: string): { stamp: CheckStamp; problems: Problem[] } {
  const result = evaluateFile(file, env);
  return { stamp: stampOf(result, env, at), problems: result.ok ? [] : result.problems };
}
