import type { CoverageMetrics, LevelLimit, Measurement, TotalScanPattern } from '../types.js';
import { isFullSphere } from '../sphere/isFullSphere.js';
import { beamPeak, peakIndex } from './beamPeak.js';
import { beamPointing, gridVectors } from './beamPointing.js';
import { bestShares } from './bestShares.js';
import { coverageAt, coverageEfficiency, relativeCoverage } from './coverageEfficiency.js';
import { coverageCurve } from './coverageCurve.js';
import { percentile } from './percentile.js';
import { totalScanPattern } from './totalScanPattern.js';
import { beamTrpDbm } from './trp.js';
import { rankedCdf, type RankedCdf } from './weightedCdf.js';
import { hasTrp } from '../quantity.js';

export interface MetricOptions {
  /** CDF levels, % in [0, 100]. */
  percentilesPct: number[];
  /** Absolute coverage thresholds in the value's unit. */
  thresholds: number[];
  /** Coverage thresholds in dB below the TSP peak (above the best EIS for eis). */
  relativeDb: number[];
  /** Step of the coverage-efficiency curve, dB (default 0.1). */
  curveStepDb?: number;
  /** The limit set's percentile requirement (limits/impliedChoices.ts percentileLimit), for coverageAtLevelLimit. */
  levelLimit?: LevelLimit | null;
}

/**
 * Every coverage metric of one measurement: combine (total scan pattern), then measure
 * (weighted CDF, percentiles, coverage efficiency absolute/relative/curve, peak, per-beam
 * peak, TRP on a full sphere for eirp/gain, best share; with `levelLimit`, the coverage
 * efficiency at the limit set's percentile limit). Definitions in the called functions.
 * Cost O(points·beams + points·log points); the CDF sort is the only sort. The TSP's CDF is
 * returned (`cdf`, ranked) for the later readers of the same pattern (gridAdequacy), so it is
 * sorted once per unit.
 * @throws RangeError for a level outside [0, 100] (from percentile).
 * @example computeMetrics(m, { percentilesPct: [50], thresholds: [10], relativeDb: [3] }).metrics.peak
 */
export function computeMetrics(m: Measurement, opts: MetricOptions): { tsp: TotalScanPattern; metrics: CoverageMetrics; cdf: RankedCdf } {
  const { grid, quantity } = m;
  const tsp = totalScanPattern(m.beams.map((b) => b.values), quantity);
  const cdf = rankedCdf(tsp.values, grid.weightSr);
  const full = isFullSphere(grid);
  const shares = bestShares(tsp.bestBeam, grid.weightSr, m.beams.length, grid.solidAngleSr);
  let vec: ReturnType<typeof gridVectors> | null = null;
  const vectors = () => (vec ??= gridVectors(grid));
  const metrics: CoverageMetrics = {
    peak: beamPeak(tsp.values, grid, quantity),
    percentiles: opts.percentilesPct.map((levelPct) => ({ levelPct, value: percentile(cdf, levelPct, quantity) })),
    coverage: coverageAt(cdf, opts.thresholds, quantity),
    relativeCoverage: relativeCoverage(cdf, opts.relativeDb, quantity),
    ...(opts.levelLimit ? { coverageAtLevelLimit: { ...opts.levelLimit, efficiency: coverageEfficiency(cdf, opts.levelLimit.threshold, quantity) } } : {}),
    curve: coverageCurve(cdf, quantity, opts.curveStepDb),
    solidAngleSr: grid.solidAngleSr,
    beams: m.beams.map((b, k) => {
      const at = peakIndex(b.values, quantity);
      return {
        id: b.id,
        peak: { value: b.values[at], thetaDeg: grid.thetaDeg[at], phiDeg: grid.phiDeg[at] }, // beamPeak's rule (peakIndex)
        trpDbm: !hasTrp(quantity) ? null : beamTrpDbm(b.values, grid.weightSr, full, grid.solidAngleSr),
        bestShare: shares[k],
        pointing: beamPointing(b.values, grid, vectors(), quantity, at),
      };
    }),
  };
  return { tsp, metrics, cdf };
}
