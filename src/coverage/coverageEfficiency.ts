import type { CoveragePoint, Quantity, RelativeCoveragePoint } from '../types.js';
import type { WeightedCdf } from './weightedCdf.js';
import { isLowerBetter, worsenedBy } from '../quantity.js';

/**
 * Coverage efficiency at threshold t: the fraction of the sphere where the total scan pattern
 * is at or better than t — Σ w[x ≥ t] / 4π for eirp/gain, Σ w[x ≤ t] / 4π for eis (Eq. 1;
 * DESIGN.md, CONTRACT.md). Unmeasured directions count as not covered (divisor 4π; Σw on a
 * full sphere, see sphereNormSr). Values exactly at t count as covered.
 * Cost O(log n).
 * @throws never; NaN threshold gives NaN.
 * @example coverageEfficiency(weightedCdf([1, 2, 3, 4], [π, π, π, π]), 3, 'eirp') // 0.5
 */
export function coverageEfficiency(cdf: WeightedCdf, threshold: number, quantity: Quantity): number {
  if (Number.isNaN(threshold)) return NaN;
  const { values, cumulativeSr } = cdf;
  const m = values.length;
  const lowerIsBetter = isLowerBetter(quantity);
  const strict = !lowerIsBetter; // eirp: count x < t as not covered; eis: count x ≤ t as covered
  let lo = 0, hi = m; // first index whose value is ≥ t (eirp) or > t (eis)
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (strict ? values[mid] < threshold : values[mid] <= threshold) lo = mid + 1; else hi = mid;
  }
  const atOrBelowSr = lo > 0 ? cumulativeSr[lo - 1] : 0;
  const coveredSr = lowerIsBetter ? atOrBelowSr : cdf.measuredSr - atOrBelowSr; // Eq. 1
  return coveredSr / cdf.sphereSr;
}

/** Coverage efficiency at each absolute threshold (value unit), in the given order. */
export function coverageAt(cdf: WeightedCdf, thresholds: number[], quantity: Quantity): CoveragePoint[] {
  return thresholds.map((threshold) => ({ threshold, efficiency: coverageEfficiency(cdf, threshold, quantity) }));
}

/**
 * Coverage efficiency at thresholds relative to the TSP peak: t = peak − d for eirp/gain
 * (d dB below the peak), t = best + d for eis (d dB above the most sensitive EIS) (Eq. 2).
 */
export function relativeCoverage(cdf: WeightedCdf, dbBelowPeak: number[], quantity: Quantity): RelativeCoveragePoint[] {
  const m = cdf.values.length;
  if (m === 0) return [];
  const best = isLowerBetter(quantity) ? cdf.values[0] : cdf.values[m - 1];
  return dbBelowPeak.map((d) => {
    const threshold = worsenedBy(quantity, best, d); // Eq. 2
    return { threshold, efficiency: coverageEfficiency(cdf, threshold, quantity), dbBelowPeak: d };
  });
}
