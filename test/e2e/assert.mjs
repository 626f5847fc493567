// Plain assertions for the end-to-end tests (no test framework runs there).
export function ok(cond, message) { if (!cond) throw new Error(message); }
export function equal(actual, expected, message) {
  if (actual !== expected) throw new Error(`${message}: expected ${JSON.stringify(expected)}, got ${JSON.stringify(actual)}`);
}
/** Fail when the page logged a console error, threw, or asked for anything off this machine. */
export function clean(problems) { if (problems.length > 0) throw new Error(problems.join('\n')); }
