// Storage failures as problems the user can act on. IndexedDB transactions are all-or-nothing, so a
// failed write leaves what was stored before exactly as it was; the message says so.
import type { Problem, Result } from '../core/problems.ts';

/** What was being attempted, for the message. */
export type StorageAction = 'open' | 'read' | 'save';

function errorName(error: unknown): string {
  if (error && typeof error === 'object' && 'name' in error && typeof error.name === 'string') return error.name;
  return 'Error';
}

function errorText(error: unknown): string {
  if (error && typeof error === 'object' && 'message' in error && typeof error.message === 'string' && error.message !== '') return error.message;
  return String(error);
}

/** The browser refused: the site's storage is full. */
export function isQuotaError(error: unknown): boolean {
  const name = errorName(error);
  // Firefox used NS_ERROR_DOM_QUOTA_REACHED before the standard name (MDN, "QuotaExceededError").
  return name === 'QuotaExceededError' || name === 'NS_ERROR_DOM_QUOTA_REACHED';
}

/** A storage error as a `(storage): message` problem that says what happened and what is safe. */
export function storageProblem(error: unknown, action: StorageAction): Problem {
  if (isQuotaError(error)) {
    return {
      path: '(storage)',
      message: 'the browser’s storage for this site is full, so nothing was saved; what was saved before is unchanged and your edit is still on screen. Export your work, or delete old orders or QA entries, then save again.',
    };
  }
  const what = action === 'open' ? 'could not open its storage' : action === 'read' ? 'could not read its storage' : 'could not save';
  return { path: '(storage)', message: `the browser ${what} (${errorName(error)}: ${errorText(error)}); nothing stored was changed.` };
}

/** Run a storage step; a thrown storage error becomes a problem. */
export async function guard<T>(action: StorageAction, step: () => Promise<T>): Promise<Result<T>> {
  try {
    return { ok: true, value: await step() };
  } catch (error) {
    return { ok: false, problems: [storageProblem(error, action)] };
  }
}
