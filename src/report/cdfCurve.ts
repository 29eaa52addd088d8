import type { Quantity } from '../types.js';
import { weightedCdf } from '../coverage/weightedCdf.js';
import { worstValue } from '../quantity.js';

/** A CDF as plain data (sendable between worker threads), at most a few hundred points. */
export interface CdfCurve {
  /** Values ascending, in the value's unit. */
  values: Float64Array;
  /** F(values[k]) over 4π: fraction of the whole sphere at or below values[k]. */
  fractions: Float64Array;
  /** F just below values[0]: the unmeasured share for eirp/gain (counted as worst), else 0. */
  startFraction: number;
}

const FOUR_PI = 4 * Math.PI;

/**
 * Solid-angle-weighted CDF of a pattern, for plotting: F(v) = (U + Σ w_i [x_i ≤ v]) / 4π, with
 * U = 4π − Σ w_i the unmeasured solid angle counted as worst (at the bottom for eirp/gain, never
 * reached for eis, where worst is large). Non-finite values and zero weights count as unmeasured.
 * The steps come from the core's weightedCdf (one step per distinct value, compensated sums);
 * downsampled to ≤ maxPoints by keeping the first step reaching each of maxPoints evenly spaced
 * fraction levels (so the curve keeps its vertical resolution), plus both end points.
 * Cost: O(n) for values with two decimals, else O(n log n) (weightedCdf's routes; the plot
 * needs this view only, the judged percentiles come from src/coverage).
 * @example cdfCurve(Float64Array.of(1, 2), Float64Array.of(2 * Math.PI, 2 * Math.PI)).fractions // → [0.5, 1]
 */
export function cdfCurve(values: ArrayLike<number>, weightSr: ArrayLike<number>, quantity: Quantity = 'eirp', maxPoints = 400): CdfCurve {
  const { values: steps, cumulativeSr: cum, measuredSr: measured } = weightedCdf(...measuredOnly(values, weightSr));
  const n = steps.length;
  const start = worstValue(quantity) === -Infinity ? Math.max(0, FOUR_PI - measured) / FOUR_PI : 0; // the unmeasured share sits at the worst value
  const keep: number[] = [];
  if (n <= maxPoints) for (let k = 0; k < n; k++) keep.push(k);
  else {
    const levels = maxPoints - 1;
    let k = 0;
    for (let m = 1; m <= levels; m++) {
      const target = (m / levels) * measured;
      while (k < n - 1 && cum[k] < target) k++;
      if (keep[keep.length - 1] !== k) keep.push(k);
    }
    if (keep[0] !== 0) keep.unshift(0);
    if (keep.length > maxPoints) keep.splice(1, keep.length - maxPoints);
  }
  return {
    values: Float64Array.from(keep, (k) => steps[k]),
    fractions: Float64Array.from(keep, (k) => start + cum[k] / FOUR_PI),
    startFraction: start,
  };
}

/** The finite-valued, positive-weight points (all of them, uncopied, in the usual case). */
function measuredOnly(values: ArrayLike<number>, weightSr: ArrayLike<number>): [ArrayLike<number>, ArrayLike<number>] {
  let all = true;
  for (let i = 0; i < values.length && all; i++) all = Number.isFinite(values[i]) && weightSr[i] > 0;
  if (all) return [values, weightSr];
  const v: number[] = [];
  const w: number[] = [];
  for (let i = 0; i < values.length; i++) {
    if (Number.isFinite(values[i]) && weightSr[i] > 0) {
      v.push(values[i]);
      w.push(weightSr[i]);
    }
  }
  return [v, w];
}
