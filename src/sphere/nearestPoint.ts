import { unitVector, unitVectors } from './direction.js';

const RAD = Math.PI / 180;

/**
 * Finds the grid point nearest to a direction (−1 when a `maxAngleRad` was given and no point is
 * closer than it); `distanceRad` holds the last answer's angle (Infinity for −1).
 */
export interface NearestFinder {
  nearest(thetaDeg: number, phiDeg: number): number;
  distanceRad: number;
}

/**
 * Nearest-direction search over a fixed point set (great-circle distance), the one finder of
 * the code base: resampling a beam onto another grid and painting maps of scattered grids.
 *
 * Without `maxAngleRad` (exact nearest, resampling): points are kept sorted by θ; a query scans
 * outward in θ from its own θ and stops once the θ difference alone exceeds the best distance
 * found (|Δθ| is a lower bound of the angle), so only a band of about one spacing around the
 * query is examined. Cost O(n log n) to build; per query about O(√n) on well-spread grids.
 * With `maxAngleRad` (map painting: a direction farther than that from every point is
 * unmeasured, −1): points go into θ/φ buckets about maxAngleRad wide, and a query looks at its
 * own and the neighbouring buckets (wider in φ near the poles). Cost O(n) to build, about O(1) a
 * query — 4× faster than the θ band on a 20,000-point scattered grid (measured, issue 15).
 * No per-query allocation either way.
 * @throws RangeError for an empty point set.
 * @example nearestPointFinder(theta, phi).nearest(90, 0) // index of the point at the horizon, φ = 0
 */
export function nearestPointFinder(thetaDeg: Float64Array, phiDeg: Float64Array, opts: { maxAngleRad?: number } = {}): NearestFinder {
  if (thetaDeg.length === 0) throw new RangeError('nearestPointFinder: no points');
  return opts.maxAngleRad === undefined ? thetaBandFinder(thetaDeg, phiDeg) : bucketFinder(thetaDeg, phiDeg, opts.maxAngleRad);
}

function thetaBandFinder(thetaDeg: Float64Array, phiDeg: Float64Array): NearestFinder {
  const n = thetaDeg.length;
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

function bucketFinder(thetaDeg: Float64Array, phiDeg: Float64Array, maxAngleRad: number): NearestFinder {
  const n = thetaDeg.length;
  const { x: ux, y: uy, z: uz } = unitVectors(thetaDeg, phiDeg);
  const cosMax = Math.cos(Math.min(Math.PI, maxAngleRad));
  const cellDeg = Math.min(30, Math.max(0.5, maxAngleRad / RAD));
  const nT = Math.ceil(180 / cellDeg);
  const nP = Math.ceil(360 / cellDeg);
  const buckets: number[][] = Array.from({ length: nT * nP }, () => []);
  const bt = (t: number) => Math.min(nT - 1, Math.floor(t / cellDeg));
  const bp = (p: number) => ((Math.floor(p / cellDeg) % nP) + nP) % nP;
  for (let i = 0; i < n; i++) buckets[bt(thetaDeg[i]) * nP + bp(phiDeg[i])].push(i);
  const finder: NearestFinder = {
    distanceRad: 0,
    nearest(qThetaDeg: number, qPhiDeg: number): number {
      const [qx, qy, qz] = unitVector(qThetaDeg, qPhiDeg);
      let best = -1;
      let bestDot = cosMax;
      const r0 = bt(qThetaDeg);
      for (let r = Math.max(0, r0 - 1); r <= Math.min(nT - 1, r0 + 1); r++) {
        // Near the poles a bucket row spans little arc length: widen the φ search there.
        const sinRow = Math.max(1e-3, Math.min(Math.sin(r * cellDeg * RAD), Math.sin(Math.min(180, (r + 1) * cellDeg) * RAD)));
        const span = Math.min(nP, Math.ceil(1 / sinRow) + 1);
        const c0 = bp(qPhiDeg);
        for (let dc = -span; dc <= span; dc++) {
          if (2 * span + 1 > nP && (dc < 0 || dc >= nP)) continue;
          for (const i of buckets[r * nP + (((c0 + dc) % nP) + nP) % nP]) {
            const dot = qx * ux[i] + qy * uy[i] + qz * uz[i];
            if (dot > bestDot) {
              bestDot = dot;
              best = i;
            }
          }
        }
      }
      finder.distanceRad = best < 0 ? Infinity : Math.acos(Math.min(1, bestDot));
      return best;
    },
  };
  return finder;
}
