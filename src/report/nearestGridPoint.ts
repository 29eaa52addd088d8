import type { SphereGrid } from '../types.js';
import { nearestPointFinder } from '../sphere/nearestPoint.js';

/** Returns the index of the grid point whose cell holds (θ, φ), or −1 if it is not measured. */
export type NearestLookup = (thetaDeg: number, phiDeg: number) => number;


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
 * Scattered grids: nearest point by angular distance (src/sphere/nearestPoint.ts, the one
 * finder); a direction farther than 0.8·√(median cell solid angle) from every point is
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
  const sortedW = Float64Array.from(grid.weightSr).sort();
  const maxAngleRad = 0.8 * Math.sqrt(sortedW[grid.weightSr.length >> 1] || 4 * Math.PI);
  const finder = nearestPointFinder(grid.thetaDeg, grid.phiDeg, { maxAngleRad });
  return (thetaDeg, phiDeg) => finder.nearest(thetaDeg, phiDeg);
}
