import type { CoveragePoint, Quantity } from '../types.js';
import { coverageEfficiency } from './coverageEfficiency.js';
import type { WeightedCdf } from './weightedCdf.js';

/** Most points a curve may have; wider value ranges get a coarser (multiple of stepDb) step. */
export const MAX_CURVE_POINTS = 2001;

/**
 * The whole coverage-efficiency curve: efficiency (coverageEfficiency) on a regular threshold
 * grid t_k = k·s from ⌊min/s⌋·s to ⌈max/s⌉·s, ascending (Eq. 1), s = stepDb (default 0.1 dB),
 * widened to a whole multiple of stepDb when that would exceed MAX_CURVE_POINTS. A regular
 * grid keeps the size bounded (independent of the number of distinct TSP values) and makes
 * curves of different units comparable point by point. Thresholds are rounded to 1e-9.
 * Cost O(k log n) for k curve points.
 * @throws RangeError when stepDb is not positive.
 * @example coverageCurve(cdf, 'eirp')[0].efficiency // 1 (the lowest threshold is ≤ every value)
 */
export function coverageCurve(cdf: WeightedCdf, quantity: Quantity, stepDb = 0.1): CoveragePoint[] {
  if (!(stepDb > 0)) throw new RangeError(`coverageCurve: step ${stepDb} dB is not positive`);
  const m = cdf.values.length;
  if (m === 0) return [];
  let step = stepDb;
  const span = cdf.values[m - 1] - cdf.values[0];
  if (span / step + 2 > MAX_CURVE_POINTS) step = stepDb * Math.ceil(span / stepDb / (MAX_CURVE_POINTS - 2));
  const k0 = Math.floor(cdf.values[0] / step + 1e-9);
  const k1 = Math.ceil(cdf.values[m - 1] / step - 1e-9);
  const curve: CoveragePoint[] = [];
  for (let k = k0; k <= k1; k++) {
    const threshold = Math.round(k * step * 1e9) / 1e9; // Eq. 1
    curve.push({ threshold, efficiency: coverageEfficiency(cdf, threshold, quantity) });
  }
  return curve;
}
