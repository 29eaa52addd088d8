import type { SphereGrid } from '../types.js';
import { nearestPointFinder } from './nearestPoint.js';
import { seamGap } from './regularLayout.js';

const DEG = 180 / Math.PI;

export interface ResampledBeam {
  values: Float64Array;
  method: 'bilinear' | 'nearest';
  /** Largest angle from a target point to the nearest source point used, degrees. */
  maxDistanceDeg: number;
}

/**
 * Moves a beam measured on grid `from` onto grid `to` (the caller reports 'beam-resampled').
 *
 * Regular `from` grids: bilinear interpolation in (θ, φ) of the dB values (Eq. 1:
 * v = (1−a)(1−b)v₀₀ + a(1−b)v₁₀ + (1−a)b v₀₁ + ab v₁₁ with a, b the fractional θ and φ
 * positions), across the φ seam when it wraps; a pole row is one value for every φ. Targets
 * outside the measured θ rows or inside the unmeasured φ gap take the nearest source value.
 * Interpolating dB rather than linear power is common practice for smooth patterns; near deep
 * nulls it overestimates the null depth's width. Scattered `from` grids: the nearest source
 * point (great-circle distance).
 * maxDistanceDeg tells how far any target is from real data (0 when the grids coincide).
 * Cost O(m log n) bilinear; about O(m √n) nearest.
 * @throws RangeError when values does not match `from`.
 * @example resampleBeam(grid5deg, values, grid1deg).method // 'bilinear'
 */
export function resampleBeam(from: SphereGrid, values: Float64Array, to: SphereGrid): ResampledBeam {
  if (values.length !== from.thetaDeg.length) {
    throw new RangeError(`resampleBeam: ${values.length} values for ${from.thetaDeg.length} grid points`);
  }
  const m = to.thetaDeg.length;
  const out = new Float64Array(m);
  const finder = nearestPointFinder(from.thetaDeg, from.phiDeg);
  let maxDistanceRad = 0;
  const lay = from.regular;
  if (!lay) {
    for (let i = 0; i < m; i++) {
      out[i] = values[finder.nearest(to.thetaDeg[i], to.phiDeg[i])];
      if (finder.distanceRad > maxDistanceRad) maxDistanceRad = finder.distanceRad;
    }
    return { values: out, method: 'nearest', maxDistanceDeg: maxDistanceRad * DEG };
  }
  const rows = lay.thetaRowsDeg, cols = lay.phiColsDeg;
  const nr = rows.length, nc = cols.length;
  const seam = lay.phiWraps ? -1 : seamGap(cols);
  const rowValue = (r: number, c0: number, c1: number, b: number): number => {
    const s = lay.rowStart[r];
    if (lay.rowLength[r] === 1) return values[s];
    return (1 - b) * values[s + c0] + b * values[s + c1];
  };
  for (let i = 0; i < m; i++) {
    const t = to.thetaDeg[i], p = to.phiDeg[i];
    let r0 = -1;
    let lo = 0, hi = nr;
    while (lo < hi) { const mid = (lo + hi) >> 1; if (rows[mid] <= t) lo = mid + 1; else hi = mid; }
    r0 = lo - 1;
    let c0 = -1;
    lo = 0; hi = nc;
    while (lo < hi) { const mid = (lo + hi) >> 1; if (cols[mid] <= p) lo = mid + 1; else hi = mid; }
    c0 = lo - 1 < 0 ? nc - 1 : lo - 1;
    const c1 = (c0 + 1) % nc;
    const span = c1 > c0 ? cols[c1] - cols[c0] : 360 - cols[c0] + cols[c1];
    const inTheta = r0 >= 0 && (r0 < nr - 1 || rows[r0] === t);
    const inPhi = c0 !== seam || t === 0 || t === 180;
    const nearestIndex = finder.nearest(t, p);
    if (finder.distanceRad > maxDistanceRad) maxDistanceRad = finder.distanceRad;
    if (!inTheta || !inPhi) { out[i] = values[nearestIndex]; continue; }
    const b = (((p - cols[c0]) % 360) + 360) % 360 / span;
    const r1 = r0 < nr - 1 ? r0 + 1 : r0;
    const a = r1 === r0 ? 0 : (t - rows[r0]) / (rows[r1] - rows[r0]);
    out[i] = (1 - a) * rowValue(r0, c0, c1, b) + a * rowValue(r1, c0, c1, b); // Eq. 1
  }
  return { values: out, method: 'bilinear', maxDistanceDeg: maxDistanceRad * DEG };
}
