import type { GridAdequacy, Quantity, SphereGrid } from '../../types.js';
import { rankedCdf, subsetCdf, type RankedCdf, type WeightedCdf } from '../../coverage/weightedCdf.js';
import { percentile } from '../../coverage/percentile.js';
import { coverageEfficiency } from '../../coverage/coverageEfficiency.js';
import { subGrids } from './subGrids.js';

/**
 * Calibration of the sub-grid estimator (factors on the sub-grid spread s), measured on known
 * patterns by test/analysis/gridAdequacy/calibration.ts: truth = the pattern on a 0.5° grid;
 * the unit = the same pattern sampled at 5°, 7.5°, 10° and 15°; the factor is the 90th
 * percentile of |true error| / s over the patterns, steps and levels, so "±x" holds in about
 * 9 cases out of 10 on those patterns. `at1p5`/`at2`: the same for the error of a grid 1.5× and
 * 2× coarser than the unit's. Values and the table behind them: README, "How sure is the verdict".
 */
export const GRID_ADEQUACY_CALIBRATION = { atStep: 0.7, at1p5: 1.6, at2: 1.8 };

/**
 * Grid adequacy of a unit from its own data: re-read each percentile and coverage value on the
 * four sub-grids of the grid (subGrids: 2Δ grids of a regular grid, quarter thinnings of a
 * scattered one), take the root-mean-square deviation s = √(mean_k d_k²), d_k = metric on
 * sub-grid k − metric on the full grid (Eq. G1), and report ±K·s (Eq. G2) with the calibrated
 * factors K of GRID_ADEQUACY_CALIBRATION — the estimated grid error at the unit's step, at 1.5×
 * and at 2× the step — beside the share of points a 1.5× and 2× grid saves: 1 − n(fΔ)/n(Δ),
 * n(Δ) = (180/Δ − 1)·360/Δ + 2 for a full constant-step grid (3GPP TS 38.521-2 Annex M.2.1
 * counts), else 1 − 1/f² (Eq. G3).
 * Boundary rule: a value is estimated from the sub-grids where it is evaluable; fewer than two
 * gives null. The total scan pattern of a sub-grid is the parent's at its points (it is
 * pointwise), so no beam is re-combined.
 * `tspCdf` is the TSP's ranked CDF when the caller has it (computeMetrics returns it; it must be
 * rankedCdf(tspValues, grid.weightSr)); the sub-grids' CDFs are read from it (subsetCdf, the
 * same bits as sorting each sub-grid's values), so the pattern is sorted once.
 * Cost: four sub-grid builds (no sort: a sub-grid keeps canonical order) and CDFs, O(n) with
 * `tspCdf`, else one O(n log n) sort.
 * @example gridAdequacy(grid, tsp.values, 'eirp', [50], []).percentiles[0].adequacyDb // ±x dB
 */
export function gridAdequacy(grid: SphereGrid, tspValues: Float64Array, quantity: Quantity, levelsPct: number[],
  thresholds: number[], cal = GRID_ADEQUACY_CALIBRATION, tspCdf: RankedCdf = rankedCdf(tspValues, grid.weightSr)): GridAdequacy {
  const subs = subGrids(grid);
  const full = tspCdf;
  const cdfs = subs.map((s) => subsetCdf(full, s.parentIndex, s.grid.weightSr));
  const spread = (read: (c: WeightedCdf) => number | null): number | null => {
    const v = read(full);
    if (v === null) return null;
    let ss = 0, k = 0;
    for (const c of cdfs) {
      const x = read(c);
      if (x === null) continue;
      ss += (x - v) * (x - v); // Eq. (G1)
      k++;
    }
    return k >= 2 ? Math.sqrt(ss / k) : null;
  };
  const times = (s: number | null, f: number): number | null => (s === null ? null : s * f); // Eq. (G2)
  return {
    method: subs.length < 2 ? 'none (grid too small for sub-grids)' : grid.regular ? 'four 2Δ sub-grids (even/odd rows × columns)' : 'four quarter thinnings (canonical order, i mod 4)',
    calibrationFactor: cal.atStep,
    percentiles: levelsPct.map((levelPct) => {
      const s = spread((c) => percentile(c, levelPct, quantity));
      return { levelPct, adequacyDb: times(s, cal.atStep), subGridSpreadDb: s, at1p5StepDb: times(s, cal.at1p5), at2StepDb: times(s, cal.at2) };
    }),
    coverage: thresholds.map((threshold) => {
      const s = spread((c) => coverageEfficiency(c, threshold, quantity));
      return { threshold, adequacy: times(s, cal.atStep), subGridSpread: s };
    }),
    coarser: [1.5, 2].map((f) => ({ stepFactor: f, pointsSavedShare: pointsSaved(grid, f) })),
  };
}

function pointsSaved(grid: SphereGrid, f: number): number {
  const reg = grid.regular;
  const rows = reg?.thetaRowsDeg;
  const cols = reg?.phiColsDeg;
  if (rows && cols && rows.length > 2 && cols.length > 1 && rows[0] === 0 && rows[rows.length - 1] === 180) {
    const dt = 180 / (rows.length - 1), dp = 360 / cols.length;
    const count = (a: number, b: number): number => (180 / a - 1) * (360 / b) + 2;
    return 1 - count(f * dt, f * dp) / count(dt, dp); // Eq. (G3)
  }
  return 1 - 1 / (f * f); // Eq. (G3)
}
