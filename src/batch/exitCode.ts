import type { ResultsFile } from '../types.js';

/** Conditions that `--fail-on` turns into exit code 1 besides a failed limit (a CI gate). */
export const FAIL_ON_CONDITIONS = ['not-judged', 'partial-sphere', 'warnings'] as const;
export type FailOnCondition = (typeof FAIL_ON_CONDITIONS)[number];

/**
 * The process exit code as a pure function of the results (CONTRACT.md "Exit"):
 * 2 when any input could not be read (the rest was still analyzed), else 1 when any unit failed
 * a limit — or, with `failOn`, was not judged, was measured on a partial sphere, or carries
 * warnings — else 0. An unreadable input wins over a failed unit: the verdict of an incomplete
 * build is itself incomplete.
 * @example exitCode({ ...results, errors: [], units: [{ verdict: 'fail' }] }) === 1
 * @example exitCode({ ...results, errors: [], units: [{ verdict: 'none' }] }, ['not-judged']) === 1
 */
export function exitCode(results: Pick<ResultsFile, 'units' | 'errors'>, failOn: readonly FailOnCondition[] = []): 0 | 1 | 2 {
  if (results.errors.length > 0) return 2;
  const gate = new Set(failOn);
  const fails = results.units.some((u) =>
    u.verdict === 'fail' ||
    (gate.has('not-judged') && u.verdict === 'none') ||
    (gate.has('partial-sphere') && u.grid?.fullSphere === false) ||
    (gate.has('warnings') && u.warnings.length > 0));
  return fails ? 1 : 0;
}

/** Exit codes beyond the contract's three. */
export const EXIT_INTERNAL = 3;
export const EXIT_INTERRUPTED = 130;
