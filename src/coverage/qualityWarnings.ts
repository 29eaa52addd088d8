/**
 * Warnings about how far a unit's numbers can be trusted, raised from its grid and metrics:
 * `few-points`, `beam-never-best` and `scattered-grid` (src/warnings.ts has their texts).
 */
import type { BeamMetrics, Measurement, Warning } from '../types.js';
import { warning } from '../warnings.js';

/**
 * Below this many grid points a unit gets `few-points`. With n points each one stands on average
 * for 4π/n of the sphere, and the solid-angle-weighted CDF steps by about 100/n % per point: below
 * 100 points a step exceeds 1 % of the sphere, coarser than the percentile levels (5 %, 10 %, …)
 * and coverage shares a requirement is read at with any confidence. Our choice; for scale, a 15°
 * constant-step grid has 266 points and a 30° grid 62.
 */
export const FEW_POINTS = 100;

/**
 * The quality warnings of one measured unit: `few-points` when the grid has fewer than
 * FEW_POINTS points; `beam-never-best` for each beam whose best share is 0 (it adds nothing to
 * the total scan pattern: it is never the best beam in any measured direction); `scattered-grid`
 * when the points are not a regular θ/φ grid and are weighted by spherical Voronoi cell areas.
 * Cost O(beams).
 * @example qualityWarnings(m, beams).map((w) => w.code) // ['beam-never-best'] for one beam with bestShare 0
 */
export function qualityWarnings(m: Pick<Measurement, 'grid'>, beams: Pick<BeamMetrics, 'id' | 'bestShare'>[]): Warning[] {
  const out: Warning[] = [];
  const n = m.grid.thetaDeg.length;
  if (n < FEW_POINTS) {
    out.push(warning('few-points', `${n} grid points (fewer than ${FEW_POINTS}): each stands for about ${(100 / n).toFixed(1)} % of 4π, so CDF levels and coverage shares move in steps of that size`));
  }
  if (m.grid.kind === 'scattered') {
    out.push(warning('scattered-grid', `the ${n} points are not a regular θ/φ grid; each is weighted by its spherical Voronoi cell area`));
  }
  for (const b of beams) {
    if (b.bestShare === 0) out.push(warning('beam-never-best', `beam '${b.id}' is never the best beam in any measured direction (best share 0)`));
  }
  return out;
}
