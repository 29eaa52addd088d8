import type { SphereGrid } from '../types.js';

/** Relative tolerance on 4π for calling a grid a full sphere. */
export const FULL_SPHERE_REL_TOL = 1e-6;

/**
 * Whether the grid's measured solid angle is the whole sphere: |Σw − 4π| ≤ 1e-6·4π (Eq. 1).
 * Regular full grids hit 4π to ~1e-15 and Voronoi weights to ~1e-12, so 1e-6 separates
 * rounding from a real gap such as a blocked cap (an equatorial cell of a 1° grid alone is
 * 2.4e-5 of 4π).
 * Cost O(1).
 * @throws never.
 * @example isFullSphere(buildSphereGrid(theta5deg, phi5deg).grid) // true
 */
export function isFullSphere(grid: Pick<SphereGrid, 'solidAngleSr'>): boolean {
  return Math.abs(grid.solidAngleSr - 4 * Math.PI) <= FULL_SPHERE_REL_TOL * 4 * Math.PI; // Eq. 1
}
