import type { PeakValue, Quantity, SphereGrid } from '../types.js';
import { isLowerBetter } from '../quantity.js';

/**
 * Peak of a pattern and its direction: the maximum for eirp/gain, the minimum (most
 * sensitive) for eis (CONTRACT.md "peak is the best value"). Ties go to the first point in
 * canonical order (smallest θ, then φ). The peak is a grid sample, not an interpolated
 * maximum: between grid points it can read up to the pattern's curvature × (step/2)² low.
 * Cost O(n).
 * @throws RangeError for an empty pattern or a length that does not match the grid.
 * @example beamPeak(Float64Array.of(1, 7, 3), grid, 'eirp') // { value: 7, thetaDeg: grid.thetaDeg[1], ... }
 */
export function beamPeak(values: ArrayLike<number>, grid: Pick<SphereGrid, 'thetaDeg' | 'phiDeg'>, quantity: Quantity): PeakValue {
  const n = values.length;
  if (n === 0 || n !== grid.thetaDeg.length) throw new RangeError(`beamPeak: ${n} values for ${grid.thetaDeg.length} grid points`);
  const best = peakIndex(values, quantity);
  return { value: values[best], thetaDeg: grid.thetaDeg[best], phiDeg: grid.phiDeg[best] };
}

/**
 * Index of the peak (beamPeak's rule: the best value, the first in canonical order among ties);
 * 0 for an empty pattern. For callers that need the peak's point too (beamPointing). Cost O(n).
 */
export function peakIndex(values: ArrayLike<number>, quantity: Quantity): number {
  const n = values.length;
  if (n === 0) return 0;
  let best = 0;
  let bestValue = values[0];
  if (isLowerBetter(quantity)) {
    for (let i = 1; i < n; i++) if (values[i] < bestValue) { best = i; bestValue = values[i]; }
  } else {
    for (let i = 1; i < n; i++) if (values[i] > bestValue) { best = i; bestValue = values[i]; }
  }
  return best;
}
