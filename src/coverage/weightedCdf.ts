import { NeumaierAccumulator, neumaierAddAt } from '../sphere/neumaierSum.js';
import { sphereNormSr } from './sphereNormSr.js';

/** The solid-angle-weighted distribution of a pattern as a step function over distinct values. */
export interface WeightedCdf {
  /** Distinct values, ascending. */
  values: Float64Array;
  /** cumulativeSr[k] = Σ w[x ≤ values[k]], sr (compensated). */
  cumulativeSr: Float64Array;
  /** Σ w over all points, sr. */
  measuredSr: number;
  /** Divisor of every fraction (sphereNormSr): 4π, or measuredSr on a full sphere. */
  sphereSr: number;
}

/**
 * Solid-angle-weighted CDF: F(v) = Σ w_i [x_i ≤ v] / 4π (Eq. 1; DESIGN.md "CDF").
 *
 * One sort of a Float64Array copy of the values (native numeric sort, the only sort of the
 * measure stage); ties collapse into one step; each point's weight is added to its value's
 * step found by binary search, and the steps are accumulated with a Neumaier running sum.
 * Zero weights are allowed (they add nothing).
 * Cost O(n log n), four typed arrays.
 * @throws RangeError when the lengths differ or a value is NaN.
 * @example weightedCdf([3, 1, 3], [1, 2, 1]) // values [1, 3], cumulativeSr [2, 4]
 */
export function weightedCdf(values: ArrayLike<number>, weightSr: ArrayLike<number>): WeightedCdf {
  const n = values.length;
  if (weightSr.length !== n) throw new RangeError(`weightedCdf: ${n} values but ${weightSr.length} weights`);
  const sorted = Float64Array.from(values).sort();
  if (n > 0 && Number.isNaN(sorted[n - 1])) throw new RangeError('weightedCdf: NaN value');
  let m = 0;
  for (let i = 0; i < n; i++) if (i === 0 || sorted[i] !== sorted[m - 1]) sorted[m++] = sorted[i];
  const distinct = sorted.slice(0, m);
  const stepSr = new Float64Array(m);
  const stepComp = new Float64Array(m);
  for (let i = 0; i < n; i++) {
    const v = values[i];
    let lo = 0, hi = m - 1;
    while (lo < hi) { const mid = (lo + hi) >> 1; if (distinct[mid] < v) lo = mid + 1; else hi = mid; }
    neumaierAddAt(stepSr, stepComp, lo, weightSr[i]);
  }
  const cumulativeSr = new Float64Array(m);
  const running = new NeumaierAccumulator();
  for (let k = 0; k < m; k++) {
    running.add(stepSr[k] + stepComp[k]);
    cumulativeSr[k] = running.total(); // Eq. 1 (numerator)
  }
  const measuredSr = m > 0 ? cumulativeSr[m - 1] : 0;
  return { values: distinct, cumulativeSr, measuredSr, sphereSr: sphereNormSr(measuredSr) };
}
