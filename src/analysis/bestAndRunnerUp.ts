import type { Quantity, TotalScanPattern } from '../types.js';
import { isLowerBetter, worstValue } from '../quantity.js';

/**
 * Per grid point the best beam's value and index (the total scan pattern) and the runner-up's
 * value, in one pass over the beams.
 *
 * Best: TSP(i) = max_b v_b(i) (min for eis), ties to the lowest beam index (Eq. 1) — the same
 * values and indices as `totalScanPattern`, bit for bit (beam 0 first, a strictly better value
 * takes the lead, so NaN in beam 0 stays and NaN elsewhere never leads). Runner-up: the best of
 * the other beams, where a value equal to or better than the current runner-up takes its place
 * (so of two identical beams the second is the runner-up wherever the first leads); the worst
 * value (`worstValue`) when there is one beam.
 * Units: the values' own (dBm/dBi). Cost O(B·n), beams outer (each pass streams one array).
 * @throws RangeError for no beams or beams of unequal length.
 * @example bestAndRunnerUp([new Float64Array([1, 5]), new Float64Array([3, 2])], 'eirp').runnerUp // [1, 2]
 */
export function bestAndRunnerUp(beams: Float64Array[], quantity: Quantity): { tsp: TotalScanPattern; runnerUp: Float64Array } {
  if (beams.length === 0) throw new RangeError('bestAndRunnerUp: no beams');
  const n = beams[0].length;
  const lowerIsBetter = isLowerBetter(quantity);
  const bestBeam = new Int32Array(n), values = Float64Array.from(beams[0]), runnerUp = new Float64Array(n).fill(worstValue(quantity));
  for (let k = 1; k < beams.length; k++) {
    const b = beams[k];
    if (b.length !== n) throw new RangeError(`bestAndRunnerUp: beam ${k} has ${b.length} values, beam 0 has ${n}`);
    for (let i = 0; i < n; i++) {
      const v = b[i], bv = values[i];
      if (lowerIsBetter ? v < bv : v > bv) { runnerUp[i] = bv; values[i] = v; bestBeam[i] = k; } // Eq. 1
      else if (!(lowerIsBetter ? runnerUp[i] < v : runnerUp[i] > v)) runnerUp[i] = v; // ≥ (eis: ≤): an equal runner-up is kept
    }
  }
  return { tsp: { values, bestBeam }, runnerUp };
}
