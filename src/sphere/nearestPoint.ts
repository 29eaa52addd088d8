import { unitVector, unitVectors } from './direction.js';

const RAD = Math.PI / 180;

/** Finds the grid point nearest to a direction; `distanceRad` holds the last answer's angle. */
export interface NearestFinder {
  nearest(thetaDeg: number, phiDeg: number): number;
  distanceRad: number;
}

/**
 * Nearest-direction search over a fixed point set (great-circle distance).
 *
 * Points are kept sorted by θ; a query scans outward in θ from its own θ and stops once the
 * θ difference alone exceeds the best distance found (|Δθ| is a lower bound of the angle), so
 * only a band of about one spacing around the query is examined.
 * Cost O(n log n) to build; per query about O(√n) on well-spread grids; no per-query
 * allocation.
 * @throws RangeError for an empty point set.
 * @example nearestPointFinder(theta, phi).nearest(90, 0) // index of the point at the horizon, φ = 0
 */
export function nearestPointFinder(thetaDeg: Float64Array, phiDeg: Float64Array): NearestFinder {
  const n = thetaDeg.length;
  if (n === 0) throw new RangeError('nearestPointFinder: no points');
  const order = new Uint32Array(n);
  for (let i = 0; i < n; i++) order[i] = i;
  order.sort((a, b) => thetaDeg[a] - thetaDeg[b]);
  const tRad = new Float64Array(n);
  const xyz = new Float64Array(3 * n); // in θ order, interleaved: one cache line a candidate
  const u = unitVectors(thetaDeg, phiDeg);
  for (let k = 0; k < n; k++) {
    const i = order[k];
    tRad[k] = thetaDeg[i] * RAD;
    xyz[3 * k] = u.x[i]; xyz[3 * k + 1] = u.y[i]; xyz[3 * k + 2] = u.z[i];
  }
  const finder: NearestFinder = {
    distanceRad: 0,
    nearest(qThetaDeg: number, qPhiDeg: number): number {
      const t = qThetaDeg * RAD;
      const [qx, qy, qz] = unitVector(qThetaDeg, qPhiDeg);
      let lo = 0, hi = n;
      while (lo < hi) { const mid = (lo + hi) >> 1; if (tRad[mid] < t) lo = mid + 1; else hi = mid; }
      let best = -1, bestAngle = Infinity;
      const consider = (k: number): void => {
        const dx = xyz[3 * k] - qx, dy = xyz[3 * k + 1] - qy, dz = xyz[3 * k + 2] - qz;
        const ang = 2 * Math.asin(Math.min(1, Math.sqrt(dx * dx + dy * dy + dz * dz) / 2));
        if (ang < bestAngle) { bestAngle = ang; best = k; }
      };
      for (let k = lo; k < n && tRad[k] - t <= bestAngle; k++) consider(k);
      for (let k = lo - 1; k >= 0 && t - tRad[k] <= bestAngle; k--) consider(k);
      finder.distanceRad = bestAngle;
      return order[best];
    },
  };
  return finder;
}
