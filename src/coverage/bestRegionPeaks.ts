import type { Quantity } from '../types.js';
import { isBetter } from '../quantity.js';

/**
 * Where each beam is strongest within the directions where it is the best beam: for beam b, the
 * grid index i with bestBeam[i] = b and the best values[b][i] among those (max for eirp/gain, min
 * for eis, src/quantity.ts), or −1 when b is best nowhere. The best-beam map labels each beam's
 * region there, so a label sits inside its own region at that beam's peak within it.
 * Ties go to the lower grid index. bestBeam entries < 0 (no beam: unmeasured) are skipped.
 * Units: values in dB (dBm, dBi), as the total scan pattern's beams. Cost O(n) for n grid points.
 * @throws RangeError when a bestBeam entry names no beam of `values`.
 * @example bestRegionPeaks([Float64Array.of(1, 3, 0), Float64Array.of(0, 0, 2)], Int32Array.of(0, 0, 1), 'eirp') // Int32Array [1, 2]
 */
export function bestRegionPeaks(values: ArrayLike<number>[], bestBeam: ArrayLike<number>, quantity: Quantity): Int32Array {
  const at = new Int32Array(values.length).fill(-1);
  for (let i = 0; i < bestBeam.length; i++) {
    const b = bestBeam[i];
    if (b < 0) continue;
    if (b >= values.length) throw new RangeError(`bestRegionPeaks: point ${i} names beam ${b} of ${values.length}`);
    const j = at[b];
    if (j < 0 || isBetter(quantity, values[b][i], values[b][j])) at[b] = i;
  }
  return at;
}
