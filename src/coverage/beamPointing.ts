import type { Direction, Quantity, SphereGrid } from '../types.js';
import { betterSign } from '../quantity.js';
import { unitVectors, type UnitVectors } from '../sphere/direction.js';

/** Unit vectors of the grid points (src/sphere/direction.ts), computed once per grid and shared by all its beams. */
export type GridVectors = UnitVectors;

/** The grid's unit vectors (unitVectors of its θ and φ). Cost O(n). */
export function gridVectors(grid: Pick<SphereGrid, 'thetaDeg' | 'phiDeg'>): GridVectors {
  return unitVectors(grid.thetaDeg, grid.phiDeg);
}

/**
 * Pointing direction of a beam, finer than the grid step: the solid-angle- and power-weighted
 * mean direction of its main lobe, taken as the points within `windowDb` of the peak value and
 * within `radiusDeg` of the peak sample (so that a second lobe elsewhere does not pull it),
 *   u = Σ wᵢ (pᵢ − p₀) uᵢ / |Σ wᵢ (pᵢ − p₀) uᵢ|,  pᵢ = 10^((vᵢ − v_peak)/10) (eis: 10^((v_peak − vᵢ)/10)),
 *   p₀ = 10^(−windowDb/10).                                                              Eq. (1)
 * Subtracting p₀ makes a point's weight go to zero as it reaches the window's edge, so the
 * estimate does not jump when a sample crosses the edge. For a symmetric lobe this is its axis;
 * on a coarse grid it moves smoothly with the beam
 * where the peak sample jumps a whole step, which is what a pointing-drift comparison across
 * frequencies needs. Common practice (centroid of the −3 dB region); no single standard source.
 * Cost O(n), no allocation; on a grid in canonical order (θ ascending) only the points whose θ
 * lies within radiusDeg of the peak's are visited (thetaBand).
 * @example beamPointing(values, grid, gridVectors(grid), 'eirp', peakIndex) // { thetaDeg, phiDeg }
 */
export function beamPointing(
  values: ArrayLike<number>,
  grid: Pick<SphereGrid, 'weightSr' | 'thetaDeg'>,
  vec: GridVectors,
  quantity: Quantity,
  peakIndex: number,
  windowDb = 3,
  radiusDeg = 45,
): Direction {
  const sign = betterSign(quantity);
  const peak = values[peakIndex];
  const cosR = Math.cos((radiusDeg * Math.PI) / 180);
  const floor = 10 ** (-windowDb / 10);
  const px = vec.x[peakIndex];
  const py = vec.y[peakIndex];
  const pz = vec.z[peakIndex];
  let sx = 0;
  let sy = 0;
  let sz = 0;
  const [from, to] = thetaBand(grid.thetaDeg, values.length, peakIndex, radiusDeg);
  for (let i = from; i < to; i++) {
    const below = sign * (peak - values[i]);
    if (below > windowDb) continue;
    if (vec.x[i] * px + vec.y[i] * py + vec.z[i] * pz < cosR) continue;
    const w = grid.weightSr[i] * (10 ** (-below / 10) - floor); // Eq. (1)
    sx += w * vec.x[i];
    sy += w * vec.y[i];
    sz += w * vec.z[i];
  }
  const r = Math.hypot(sx, sy, sz);
  const thetaDeg = (Math.acos(Math.max(-1, Math.min(1, sz / r))) * 180) / Math.PI;
  const phiDeg = ((Math.atan2(sy, sx) * 180) / Math.PI + 360) % 360;
  return { thetaDeg, phiDeg: thetaDeg < 1e-9 || thetaDeg > 180 - 1e-9 ? 0 : phiDeg };
}

/** Grids whose θ was checked to ascend (canonical order), by their θ array. */
const ascendingTheta = new WeakMap<ArrayLike<number>, boolean>();

/**
 * Index range [from, to) that holds every point within radiusDeg of the peak, when θ ascends:
 * a point farther than radiusDeg in θ alone is farther on the sphere, so its unit-vector test
 * fails; the range's edge is widened by 1e-6° so that no point the test would keep is left out
 * by rounding (its cosine is then ~1e-8 below the limit, rounding ~1e-16). Otherwise [0, n).
 */
function thetaBand(thetaDeg: ArrayLike<number>, n: number, peakIndex: number, radiusDeg: number): [number, number] {
  if (thetaDeg.length !== n || !(radiusDeg < 180)) return [0, n];
  let up = ascendingTheta.get(thetaDeg);
  if (up === undefined) {
    up = true;
    for (let i = 1; i < n && up; i++) if (!(thetaDeg[i] >= thetaDeg[i - 1])) up = false;
    ascendingTheta.set(thetaDeg, up);
  }
  if (!up) return [0, n];
  const t = thetaDeg[peakIndex];
  const reach = radiusDeg + 1e-6;
  return [firstAbove(thetaDeg, n, t - reach, false), firstAbove(thetaDeg, n, t + reach, true)];
}

/** First index of an ascending array whose value is > bound (strict) or ≥ bound (not strict); n when none. */
function firstAbove(a: ArrayLike<number>, n: number, bound: number, strict: boolean): number {
  let lo = 0, hi = n;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (strict ? a[mid] <= bound : a[mid] < bound) lo = mid + 1; else hi = mid;
  }
  return lo;
}
