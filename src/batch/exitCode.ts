import type { ResultsFile } from '../types.js';

/**
 * The process exit code as a pure function of the results (CONTRACT.md "Exit"):
 * 2 when any input could not be read (the rest was still analyzed), else 1 when any unit failed
 * a limit, else 0. An unreadable input wins over a failed unit: the verdict of an incomplete
 * build is itself incomplete.
 * @example exitCode({ ...results, errors: [], units: [{ verdict: 'fail' }] }) === 1
 */
export function exitCode(results: Pick<ResultsFile, 'units' | 'errors'>): 0 | 1 | 2 {
  if (results.errors.length > 0) return 2;
  return results.units.some((u) => u.verdict === 'fail') ? 1 : 0;
}

/** Exit codes beyond the contract's three. */
export const EXIT_INTERNAL = 3;
export const EXIT_INTERRUPTED = 130;
