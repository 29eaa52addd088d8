import type { SphereGrid } from '../../types.js';
import { buildSphereGrid } from '../../sphere/buildGrid.js';

/** One sub-grid of a grid: its own grid (weights rebuilt) and, per sub-grid point, the parent point. */
export interface SubGrid {
  grid: SphereGrid;
  parentIndex: Int32Array;
}

/**
 * The four coarser grids a grid contains, for re-reading a unit on them.
 * - Regular grid: the four 2Δ grids of even/odd θ rows × even/odd φ columns (a pole row, one
 *   merged point, belongs to the row parity only). Each is a constant-step grid at twice the
 *   step; its cell weights are rebuilt (regularWeights: the outer rows extend half a step, so
 *   the odd-row grid of a full sphere still covers 4π).
 * - Scattered set (stated thinning): points in canonical order (θ, then φ), point i to set
 *   i mod 4; each quarter set is a scattered grid with its own spherical Voronoi weights, at
 *   about twice the mean spacing.
 * A sub-grid whose cells cover within 1 % of the parent's solid angle is rescaled to it (the
 * Voronoi clipping of a thinned set can read a thin rim near a pole as unmeasured): a sub-grid
 * of a full sphere is read as a full sphere.
 * Sub-grids that cannot be built (fewer than 4 points, or all on one row) are left out.
 * Cost: four grid builds, O(n log n) (Voronoi for scattered grids).
 * @example subGrids(grid5deg).length // 4, each a 10° grid
 */
export function subGrids(grid: SphereGrid): SubGrid[] {
  const n = grid.thetaDeg.length;
  const reg = grid.regular;
  // Members of the four sets, each list in canonical order (so each sub-grid's build needs no
  // sort): for a regular grid row by row (its rows hold consecutive points), a pole point in
  // both column parities of its row parity.
  const members = [new Int32Array(n), new Int32Array(n), new Int32Array(n), new Int32Array(n)];
  const size = [0, 0, 0, 0];
  for (let k = 0; k < 4; k++) {
    const list = members[k];
    let count = 0;
    if (!reg) {
      for (let i = k; i < n; i += 4) list[count++] = i;
    } else {
      const a = k >> 1, b = k & 1;
      for (let r = a; r < reg.thetaRowsDeg.length; r += 2) {
        const start = reg.rowStart[r], len = reg.rowLength[r];
        if (len === 1 && (reg.thetaRowsDeg[r] === 0 || reg.thetaRowsDeg[r] === 180)) list[count++] = start;
        else for (let c = b; c < len; c += 2) list[count++] = start + c;
      }
    }
    size[k] = count;
  }
  const out: SubGrid[] = [];
  for (let k = 0; k < 4; k++) {
    const count = size[k];
    if (count < 4) continue;
    const list = members[k];
    try {
      // Plain loops: Float64Array.from with a mapping function takes V8's slow iterator path
      // (a third of this function's time on a 64,442-point grid).
      const theta = new Float64Array(count);
      const phi = new Float64Array(count);
      for (let j = 0; j < count; j++) {
        theta[j] = grid.thetaDeg[list[j]];
        phi[j] = grid.phiDeg[list[j]];
      }
      const built = buildSphereGrid(theta, phi);
      const parentIndex = new Int32Array(built.grid.thetaDeg.length);
      for (let j = 0; j < count; j++) parentIndex[built.pointOf[j]] = list[j];
      out.push({ grid: sameSolidAngle(built.grid, grid.solidAngleSr), parentIndex });
    } catch {
      // a degenerate sub-grid (too few distinct rows) is simply not used
    }
  }
  return out;
}

function sameSolidAngle(g: SphereGrid, parentSr: number): SphereGrid {
  const r = parentSr / g.solidAngleSr;
  if (r === 1 || Math.abs(r - 1) > 0.01) return g;
  return { ...g, weightSr: g.weightSr.map((w) => w * r), solidAngleSr: parentSr };
}
