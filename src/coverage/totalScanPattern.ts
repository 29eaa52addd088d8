import type { Quantity, TotalScanPattern } from '../types.js';
import { isLowerBetter } from '../quantity.js';

/**
 * Total scan pattern: per grid point the best beam's value and that beam's index —
 * the maximum over beams for eirp/gain, the minimum (most sensitive) for eis (Eq. 1:
 * TSP(i) = max_b v_b(i), or min_b for EIS). Ties go to the lowest beam index.
 * Source: 3GPP TS 38.101-2 spherical coverage (best beam per direction); DESIGN.md "TSP".
 * Cost O(points·beams), beams outer so each pass streams one array; two output arrays.
 * @throws RangeError for no beams or beams of unequal length.
 * @example totalScanPattern([new Float64Array([1, 5]), new Float64Array([3, 2])], 'eirp') // values [3, 5], bestBeam [1, 0]
 */
export function totalScanPattern(beams: Float64Array[], quantity: Quantity): TotalScanPattern {
  if (beams.length === 0) throw new RangeError('totalScanPattern: no beams');
  const n = beams[0].length;
  const values = Float64Array.from(beams[0]);
  const bestBeam = new Int32Array(n);
  const lowerIsBetter = isLowerBetter(quantity);
  for (let b = 1; b < beams.length; b++) {
    const v = beams[b];
    if (v.length !== n) throw new RangeError(`totalScanPattern: beam ${b} has ${v.length} values, beam 0 has ${n}`);
    if (lowerIsBetter) {
      for (let i = 0; i < n; i++) if (v[i] < values[i]) { values[i] = v[i]; bestBeam[i] = b; } // Eq. 1
    } else {
      for (let i = 0; i < n; i++) if (v[i] > values[i]) { values[i] = v[i]; bestBeam[i] = b; } // Eq. 1
    }
  }
  return { values, bestBeam };
}
