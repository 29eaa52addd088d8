import type { LimitSet } from './limitSet.js';
import { coverageLevelPct, snap } from './evaluateCheck.js';
import { worsenedBy } from '../quantity.js';

/**
 * What the batch must compute so every check can be judged: the CDF levels of percentile checks
 * and the coverage thresholds of min-coverage checks, both as written and relaxed by the test
 * tolerance (Eq. L3 of evaluateCheck: t − tol for eirp/gain, t + tol for eis), and the CDF level
 * each coverage check is equivalent to (Eq. L4, for its margin in dB), sorted, unique.
 *
 * Cost O(checks log checks).
 * @example metricNeeds(ls) // { percentilesPct: [50], thresholds: [9, 10] }
 */
export function metricNeeds(ls: LimitSet): { percentilesPct: number[]; thresholds: number[] } {
  const levels = new Set<number>();
  const thresholds = new Set<number>();
  for (const c of ls.checks) {
    if (c.kind === 'percentile') levels.add(c.levelPct);
    if (c.kind === 'min-coverage') {
      thresholds.add(c.threshold);
      levels.add(coverageLevelPct(c.minEfficiency, ls.quantity)); // for the check's margin in dB (Eq. L4)
      thresholds.add(snap(worsenedBy(ls.quantity, c.threshold, c.toleranceDb))); // Eq. L3
    }
  }
  const asc = (a: number, b: number): number => a - b;
  return { percentilesPct: [...levels].sort(asc), thresholds: [...thresholds].sort(asc) };
}
