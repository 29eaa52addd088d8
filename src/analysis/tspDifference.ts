import { resampleBeam } from '../sphere/resample.js';
import type { SphereGrid, TotalScanPattern } from '../types.js';

/**
 * Per-direction difference of two total scan patterns, on grid A: Δᵢ = TSP_A(uᵢ) − TSP_B(uᵢ) (Eq. 1)
 * in dB (unit A minus reference B; raw sign, so for eis a positive Δ is worse).
 * Same grid (equal point count and identical θ/φ arrays, which the canonical point order
 * guarantees for equal scans): direct difference. Different grids: B is moved onto A by the
 * core's `resampleBeam` (bilinear in (θ, φ) from a regular grid, nearest point from a
 * scattered one; A's directions outside B's measured region take B's nearest value).
 * Cost O(n) on one grid; O(n log m) bilinear, about O(n √m) nearest otherwise.
 * @throws RangeError when a TSP does not match its grid.
 * @example tspDifference(g, golden.tsp, g, golden.tsp) // all zeros
 */
export function tspDifference(gridA: SphereGrid, tspA: TotalScanPattern, gridB: SphereGrid, tspB: TotalScanPattern): Float64Array {
  const n = gridA.thetaDeg.length;
  if (tspA.values.length !== n) throw new RangeError(`tspDifference: ${tspA.values.length} values for ${n} points of grid A`);
  if (tspB.values.length !== gridB.thetaDeg.length) {
    throw new RangeError(`tspDifference: ${tspB.values.length} values for ${gridB.thetaDeg.length} points of grid B`);
  }
  const b = sameGrid(gridA, gridB) ? tspB.values : resampleBeam(gridB, tspB.values, gridA).values;
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = tspA.values[i] - b[i]; // Eq. 1
  return out;
}

function sameGrid(a: SphereGrid, b: SphereGrid): boolean {
  if (a === b) return true;
  if (a.thetaDeg.length !== b.thetaDeg.length) return false;
  for (let i = 0; i < a.thetaDeg.length; i++) if (a.thetaDeg[i] !== b.thetaDeg[i] || a.phiDeg[i] !== b.phiDeg[i]) return false;
  return true;
}
