import type { MissingSample, SphereGrid, UnmeasuredRegion } from '../types.js';
import { latticeWeights } from './latticeWeights.js';
import { neumaierSum } from './neumaierSum.js';
import { detectRegularLayout } from './regularLayout.js';
import { regularUnmeasured } from './regularUnmeasured.js';
import { regularWeights } from './regularWeights.js';
import { voronoiWeights } from './voronoiWeights.js';

export interface GridBuild {
  grid: SphereGrid;
  /** Raw sample index → grid point index. */
  pointOf: Int32Array;
  /** Raw samples that were merged into another sample's point (duplicates, seam, poles). */
  merged: number;
  /** Voronoi cells limited because they border an unmeasured region; 0 for regular grids. */
  clippedCells: number;
}

/** Angles are compared after rounding to 1e-5° (0.17 µrad): far below any positioner step. */
const STEPS_PER_DEG = 1e5;
const PHI_STEPS = 360 * STEPS_PER_DEG;
const POLE_S = 180 * STEPS_PER_DEG;

/**
 * Builds the sphere grid from raw sample directions (degrees).
 *
 * 1. φ is normalized to [0, 360) (so −180..180 and 0..360 inputs agree) and both angles are
 *    rounded to 1e-5°; samples with equal rounded (θ, φ) are one point, and every sample at
 *    θ = 0 (or 180) is one pole point at φ = 0 — so φ = 0/360 seams and pole rows are never
 *    double-counted.
 * 2. Canonical order: θ ascending, then φ ascending.
 * 3. Regular detection (detectRegularLayout): exact cell weights (regularWeights), the cut θ
 *    range and φ wedge unmeasured (regularUnmeasured). Else a lattice with a few samples
 *    missing (latticeWeights): exact cells, small missing groups absorbed by their neighbours
 *    and listed, larger ones unmeasured; the grid is then 'scattered' for lookups (its layout
 *    has holes). Anything else is scattered: unclipped spherical Voronoi weights, limited only
 *    beside unmeasured regions found by the local rule (voronoiWeights, unmeasuredRule).
 * 4. solidAngleSr = Σ weights (Neumaier); `unmeasured` lists the regions (Σ = 4π − Σw).
 * `forceScattered` skips step 3's regular path (for tests and comparisons).
 * Cost O(n) for samples already in canonical order, else O(n log n) (one sort of the keys);
 * Voronoi for scattered grids.
 * @throws RangeError when the arrays differ in length, an angle is not finite, θ lies outside
 *   [0, 180], or a scattered set has fewer than 4 distinct directions.
 * @example buildSphereGrid(theta, phi).grid.solidAngleSr // 4π for a full 5° grid
 */
export function buildSphereGrid(
  thetaDeg: Float64Array,
  phiDeg: Float64Array,
  opts: { forceScattered?: boolean } = {},
): GridBuild {
  const n = thetaDeg.length;
  if (phiDeg.length !== n) throw new RangeError(`buildSphereGrid: ${n} θ values but ${phiDeg.length} φ values`);
  if (n === 0) throw new RangeError('buildSphereGrid: no directions');
  // Point p is the p-th distinct key in ascending order. Exports written θ-major then φ (and the
  // sub-grids of a canonical grid) arrive with their keys already in order: the pass that makes
  // the keys numbers them too. Otherwise the distinct keys are sorted natively and each sample
  // finds its rank by binary search (an index sort with a comparator was most of this
  // function's time).
  const key = new Float64Array(n);
  const pointOf = new Int32Array(n);
  let sorted = true;
  let m = 0;
  let prev = -1;
  for (let i = 0; i < n; i++) {
    const t = thetaDeg[i];
    const p = phiDeg[i];
    if (!Number.isFinite(t) || !Number.isFinite(p) || t < -1e-9 || t > 180 + 1e-9) {
      throw new RangeError(`buildSphereGrid: direction ${i} (θ ${t}, φ ${p}) is outside θ ∈ [0, 180]`);
    }
    const ts = Math.round(Math.min(180, Math.max(0, t)) * STEPS_PER_DEG);
    // φ in [0, 360) skips both remainders: (p + 360) − 360 is the second remainder's exact value
    // there (Sterbenz), and a sum that rounds to 720 becomes ps = PHI_STEPS, wrapped to 0 below
    // as the remainder's 0 would be.
    let ps = Math.round((p >= 0 && p < 360 ? p + 360 - 360 : (((p % 360) + 360) % 360)) * STEPS_PER_DEG);
    if (ps >= PHI_STEPS) ps -= PHI_STEPS;
    if (ts === 0 || ts === POLE_S) ps = 0;
    const k = ts * PHI_STEPS + ps; // < 2^53: exact
    key[i] = k;
    if (k < prev) sorted = false;
    else if (k > prev && i > 0) m++;
    pointOf[i] = m;
    prev = k;
  }
  let uniq: Float64Array;
  if (sorted) {
    m++;
    uniq = new Float64Array(m);
    for (let i = 0; i < n; i++) uniq[pointOf[i]] = key[i];
  } else {
    uniq = Float64Array.from(key).sort();
    m = 0;
    for (let k = 0; k < n; k++) if (k === 0 || uniq[k] !== uniq[m - 1]) uniq[m++] = uniq[k];
    for (let i = 0; i < n; i++) {
      const v = key[i];
      let lo = 0, hi = m - 1;
      while (lo < hi) { const mid = (lo + hi) >> 1; if (uniq[mid] < v) lo = mid + 1; else hi = mid; }
      pointOf[i] = lo;
    }
  }
  const thetaU = new Float64Array(m);
  const phiU = new Float64Array(m);
  for (let p = 0; p < m; p++) {
    const kk = uniq[p];
    const ts = Math.floor(kk / PHI_STEPS);
    thetaU[p] = ts / STEPS_PER_DEG;
    phiU[p] = (kk - ts * PHI_STEPS) / STEPS_PER_DEG;
  }

  const regular = opts.forceScattered ? null : detectRegularLayout(thetaU, phiU);
  let weightSr: Float64Array;
  let clippedCells = 0;
  let unmeasured: UnmeasuredRegion[];
  let missing: MissingSample[] = [];
  const lattice = regular || opts.forceScattered ? null : latticeWeights(thetaU, phiU);
  if (regular) {
    weightSr = regularWeights(regular, m);
    unmeasured = regularUnmeasured(regular);
  } else if (lattice) {
    ({ weightSr, unmeasured, missing } = lattice);
  } else {
    const v = voronoiWeights(thetaU, phiU);
    weightSr = v.weightSr;
    clippedCells = v.clipped;
    unmeasured = v.unmeasured;
  }
  const grid: SphereGrid = {
    kind: regular ? 'regular' : 'scattered',
    thetaDeg: thetaU,
    phiDeg: phiU,
    weightSr,
    solidAngleSr: neumaierSum(weightSr),
    regular,
    unmeasured,
    missing,
  };
  return { grid, pointOf, merged: n - m, clippedCells };
}
