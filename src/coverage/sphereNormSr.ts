import { FULL_SPHERE_REL_TOL } from '../sphere/isFullSphere.js';

/**
 * The solid angle every fraction of the sphere is divided by: 4π, except that a grid whose
 * measured solid angle is within 1e-6 relative of 4π (a full sphere) divides by its own Σw,
 * so that rounding or Voronoi drift cannot leave 100 % unreachable or an efficiency of
 * 1 − 1e-12 (Eq. 1). Partial spheres divide by 4π: the unmeasured part counts as not covered.
 * Cost O(1).
 * @throws never.
 * @example sphereNormSr(4 * Math.PI * (1 - 1e-12)) // the argument; sphereNormSr(6) // 4π
 */
export function sphereNormSr(measuredSr: number): number {
  const full = 4 * Math.PI;
  return Math.abs(measuredSr - full) <= FULL_SPHERE_REL_TOL * full ? measuredSr : full; // Eq. 1
}
