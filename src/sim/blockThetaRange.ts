import type { SampleGrid } from './types.js';

/**
 * A partial-sphere scan: the grid without the directions the positioner cannot reach
 * (a blocked θ band, e.g. behind the DUT mount).
 * Formula: keep sample i unless fromDeg ≤ θᵢ ≤ toDeg.
 * Units: degrees. Boundary rule: the band is closed, both edges are removed.
 * Cost: O(points).
 * @example
 * blockThetaRange(regularGrid({ thetaStepDeg: 5, phiStepDeg: 5 }), 160, 180); // θ ≤ 155 kept
 */
export function blockThetaRange(grid: SampleGrid, fromDeg: number, toDeg: number): SampleGrid {
  const keep: number[] = [];
  for (let i = 0; i < grid.thetaDeg.length; i++) {
    const t = grid.thetaDeg[i];
    if (t < fromDeg || t > toDeg) keep.push(i);
  }
  return {
    thetaDeg: Float64Array.from(keep, (i) => grid.thetaDeg[i]),
    phiDeg: Float64Array.from(keep, (i) => grid.phiDeg[i]),
  };
}
