import type { SphereGrid } from '../types.js';

/** Relative tolerance on 4π for calling a grid a full sphere (rounding of the weight sums). */
export const FULL_SPHERE_REL_TOL = 1e-6;

/**
 * Whether the grid covers the whole sphere: no unmeasured region was found
 * (unmeasuredRule.ts for scattered sets, the cut θ range or φ wedge of a regular grid, a
 * missing block of a lattice) and |Σw − 4π| ≤ 1e-6·4π (Eq. 1). Without a region list (a
 * hand-built grid) Eq. 1 alone decides. Full grids sum to 4π to ~1e-13 (exact cells,
 * absorbed missing samples and unclipped Voronoi cells all tile the sphere), so Eq. 1 only
 * guards rounding.
 * Cost O(1).
 * @throws never.
 * @example isFullSphere(buildSphereGrid(theta5deg, phi5deg).grid) // true
 */
export function isFullSphere(grid: Pick<SphereGrid, 'solidAngleSr' | 'unmeasured'>): boolean {
  if (grid.unmeasured && grid.unmeasured.length > 0) return false;
  return Math.abs(grid.solidAngleSr - 4 * Math.PI) <= FULL_SPHERE_REL_TOL * 4 * Math.PI; // Eq. 1
}
