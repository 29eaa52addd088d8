import type { SphereGrid } from '../types.js';
import { unitVector, unitVectors } from '../sphere/direction.js';

/** Returns the index of the grid point whose cell holds (θ, φ), or −1 if it is not measured. */
export type NearestLookup = (thetaDeg: number, phiDeg: number) => number;

const RAD = Math.PI / 180;

/** Index of the value in a sorted array nearest to x (ties to the lower index). */
function nearestSorted(arr: ArrayLike<number>, lo: number, hi: number, x: number): number {
  let a = lo;
  let b = hi - 1;
  while (b - a > 1) {
    const mid = (a + b) >> 1;
    if (arr[mid] <= x) a = mid;
    else b = mid;
  }
  return Math.abs(arr[b] - x) < Math.abs(arr[a] - x) ? b : a;
}

/**
 * Map a direction to the grid point whose cell contains it, for painting maps.
 *
 * Regular grids: the cell of a point spans halfway to its neighbours in θ and φ (the same rule as
 * the solid-angle weights, DESIGN.md), so the nearest θ row, then the nearest φ in that row, is
 * the cell; outside the outermost half-steps the direction is unmeasured. The φ seam wraps when
 * the layout says so. Cost: O(log rows + log cols) a query.
 *
 * Scattered grids: nearest point by angular distance, found in θ/φ buckets about one point
 * spacing wide; a direction farther than 0.8·√(median cell solid angle) from every point is
 * unmeasured (a square cell's half-diagonal is 0.71·√A, a hexagon's circumradius 0.62·√A).
 * Cost: O(points) to build, about O(1) a query.
 */
export function nearestGridPoint(grid: SphereGrid): NearestLookup {
  return grid.regular ? regularLookup(grid) : scatteredLookup(grid);
}

function regularLookup(grid: SphereGrid): NearestLookup {
  const lay = grid.regular!;
  const rows = lay.thetaRowsDeg;
  const cols = lay.phiColsDeg;
  const nr = rows.length;
  const edgeStep = (a: number, b: number) => (nr > 1 ? Math.abs(b - a) / 2 : 2.5);
  const thetaLo = rows[0] <= 1e-9 ? -1 : rows[0] - edgeStep(rows[0], rows[Math.min(1, nr - 1)]);
  const thetaHi = rows[nr - 1] >= 180 - 1e-9 ? 181 : rows[nr - 1] + edgeStep(rows[nr - 2] ?? 0, rows[nr - 1]);
  const nc = cols.length;
  const phiStep = nc > 1 ? (cols[nc - 1] - cols[0]) / (nc - 1) : 360;
  const phiLo = cols[0] - phiStep / 2;
  const phiHi = cols[nc - 1] + phiStep / 2;
  return (thetaDeg, phiDeg) => {
    if (thetaDeg < thetaLo || thetaDeg > thetaHi) return -1;
    const r = nearestSorted(rows, 0, nr, thetaDeg);
    const start = lay.rowStart[r];
    const len = lay.rowLength[r];
    if (len === 1) return start;
    let phi = phiDeg;
    if (!lay.phiWraps) {
      if (phi > phiHi && phi - 360 >= phiLo) phi -= 360;
      if (phi < phiLo || phi > phiHi) return -1;
    }
    let k = nearestSorted(grid.phiDeg, start, start + len, phi);
    if (lay.phiWraps) {
      // Across the seam the first and last column are neighbours.
      const first = grid.phiDeg[start] + 360;
      const last = grid.phiDeg[start + len - 1] - 360;
      const d = Math.abs(grid.phiDeg[k] - phi);
      if (Math.abs(first - phi) < d) k = start;
      else if (Math.abs(last - phi) < d) k = start + len - 1;
    }
    return k;
  };
}

function scatteredLookup(grid: SphereGrid): NearestLookup {
  const n = grid.thetaDeg.length;
  const { x: ux, y: uy, z: uz } = unitVectors(grid.thetaDeg, grid.phiDeg);
  const sortedW = Float64Array.from(grid.weightSr).sort();
  const maxGapRad = 0.8 * Math.sqrt(sortedW[n >> 1] || 4 * Math.PI);
  const cosMax = Math.cos(Math.min(Math.PI, maxGapRad));
  const cellDeg = Math.min(30, Math.max(0.5, maxGapRad / RAD));
  const nT = Math.ceil(180 / cellDeg);
  const nP = Math.ceil(360 / cellDeg);
  const buckets: number[][] = Array.from({ length: nT * nP }, () => []);
  const bt = (t: number) => Math.min(nT - 1, Math.floor(t / cellDeg));
  const bp = (p: number) => ((Math.floor(p / cellDeg) % nP) + nP) % nP;
  for (let i = 0; i < n; i++) buckets[bt(grid.thetaDeg[i]) * nP + bp(grid.phiDeg[i])].push(i);
  return (thetaDeg, phiDeg) => {
    const [qx, qy, qz] = unitVector(thetaDeg, phiDeg);
    let best = -1;
    let bestDot = cosMax;
    const r0 = bt(thetaDeg);
    for (let r = Math.max(0, r0 - 1); r <= Math.min(nT - 1, r0 + 1); r++) {
      // Near the poles a bucket row spans little arc length: widen the φ search there.
      const sinRow = Math.max(1e-3, Math.min(Math.sin(r * cellDeg * RAD), Math.sin(Math.min(180, (r + 1) * cellDeg) * RAD)));
      const span = Math.min(nP, Math.ceil(1 / sinRow) + 1);
      const c0 = bp(phiDeg);
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
    return best;
  };
}
