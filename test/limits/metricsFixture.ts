import type { BeamMetrics, CoverageMetrics } from '../../src/types.js';

/** Hand-made metrics (invented numbers) so every check's arithmetic can be worked out by hand. */
export function metricsFixture(over: Partial<CoverageMetrics> = {}): CoverageMetrics {
  const beam = (id: string, peak: number, trpDbm: number | null): BeamMetrics =>
    ({ id, peak: { value: peak, thetaDeg: 90, phiDeg: 0 }, trpDbm, bestShare: 0.25 });
  return {
    peak: { value: 23.0, thetaDeg: 45, phiDeg: 90 },
    percentiles: [{ levelPct: 20, value: 5.2 }, { levelPct: 50, value: 11.0 }, { levelPct: 85, value: null }],
    coverage: [{ threshold: 10, efficiency: 0.55 }, { threshold: 8.5, efficiency: 0.62 }],
    relativeCoverage: [],
    curve: [{ threshold: 9, efficiency: 0.6 }],
    solidAngleSr: 4 * Math.PI,
    beams: [beam('0', 21.5, 12.25), beam('1', 22.0, 13.5), beam('2', 23.0, 12.0)],
    ...over,
  };
}
