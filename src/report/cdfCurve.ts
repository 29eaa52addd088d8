import type { Quantity } from '../types.js';

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
 * reached for eis, where worst is large). Non-finite values count as unmeasured.
 * Downsampled to ≤ maxPoints by keeping the first point reaching each of maxPoints evenly spaced
 * fraction levels (so the curve keeps its vertical resolution), plus both end points.
 * Cost: O(n log n) (one sort; the plot needs this view only, the judged percentiles come from
 * src/coverage).
 * @example cdfCurve(Float64Array.of(1, 2), Float64Array.of(2 * Math.PI, 2 * Math.PI)).fractions // → [0.5, 1]
 */
export function cdfCurve(values: ArrayLike<number>, weightSr: ArrayLike<number>, quantity: Quantity = 'eirp', maxPoints = 400): CdfCurve {
  const idx: number[] = [];
  for (let i = 0; i < values.length; i++) if (Number.isFinite(values[i]) && weightSr[i] > 0) idx.push(i);
  idx.sort((a, b) => values[a] - values[b] || a - b);
  const n = idx.length;
  const cum = new Float64Array(n);
  let s = 0;
  let c = 0;
  for (let k = 0; k < n; k++) {
    // Neumaier compensated sum of the cell solid angles.
    const w = weightSr[idx[k]];
    const t = s + w;
    c += Math.abs(s) >= Math.abs(w) ? s - t + w : w - t + s;
    s = t;
    cum[k] = s + c;
  }
  const measured = n > 0 ? cum[n - 1] : 0;
  const start = quantity === 'eis' ? 0 : Math.max(0, FOUR_PI - measured) / FOUR_PI;
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
    values: Float64Array.from(keep, (k) => values[idx[k]]),
    fractions: Float64Array.from(keep, (k) => start + cum[k] / FOUR_PI),
    startFraction: start,
  };
}
