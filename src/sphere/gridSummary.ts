import type { GridSummary, Measurement } from '../types.js';
import { isFullSphere } from './isFullSphere.js';

/** Uniform step of ascending values, or null when the steps differ by more than 1e-6°. */
function uniformStep(values: ArrayLike<number>): number | null {
  if (values.length < 2) return null;
  const step = values[1] - values[0];
  for (let i = 2; i < values.length; i++) if (Math.abs(values[i] - values[i - 1] - step) > 1e-6) return null;
  return +step.toFixed(9);
}

function range(values: Float64Array): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (const v of values) {
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  return values.length ? [lo, hi] : [0, 0];
}

/**
 * The facts about a grid that a reader of results needs to trust them (inspect, results.json,
 * the report's data-quality section): kind, points, θ/φ ranges, steps (regular grids with
 * uniform steps; null otherwise), measured solid angle, full sphere or not, the unmeasured
 * regions and the absorbed missing samples, the samples merged
 * into coincident points and the beams resampled from another grid (one 'beam-resampled'
 * warning each). Cost O(n).
 * @example gridSummary(measurement).thetaStepDeg // 5 on a 5° grid
 */
export function gridSummary(m: Pick<Measurement, 'grid' | 'mergedSamples' | 'warnings'>): GridSummary {
  const grid = m.grid;
  const reg = grid.regular;
  return {
    kind: grid.kind,
    points: grid.thetaDeg.length,
    thetaRangeDeg: range(grid.thetaDeg),
    phiRangeDeg: range(grid.phiDeg),
    thetaStepDeg: reg ? uniformStep(reg.thetaRowsDeg) : null,
    phiStepDeg: reg ? uniformStep(reg.phiColsDeg) : null,
    fullSphere: isFullSphere(grid),
    solidAngleSr: grid.solidAngleSr,
    unmeasured: grid.unmeasured ?? [],
    missing: grid.missing ?? [],
    duplicatesMerged: m.mergedSamples ?? 0,
    beamsResampled: m.warnings.filter((w) => w.code === 'beam-resampled').length,
  };
}
