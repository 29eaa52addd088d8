import { describe, expect, it } from 'vitest';
import { monteCarloMetrics } from '../../../src/analysis/uncertainty/monteCarloMetrics.js';
import { normalCdf } from '../../../src/analysis/uncertainty/normalCdf.js';
import { expectClose } from '../../helpers/expectClose.js';

const FOUR_PI = 4 * Math.PI;
const equalWeights = (n: number): Float64Array => new Float64Array(n).fill(FOUR_PI / n);
const flat = (n: number, v: number): Float64Array => new Float64Array(n).fill(v);
const std = (x: Float64Array): number => {
  const m = x.reduce((a, b) => a + b, 0) / x.length;
  return Math.sqrt(x.reduce((a, b) => a + (b - m) ** 2, 0) / (x.length - 1));
};
const mean = (x: Float64Array): number => x.reduce((a, b) => a + b, 0) / x.length;

describe('monteCarloMetrics against closed forms', () => {
  it('a single direction: the value scatters with u = √(u_c² + u_r²), P(v* ≥ L) = Φ((v − L)/u)', () => {
    // Closed form: the sum of two independent normals (any statistics text).
    const r = monteCarloMetrics(equalWeights(1), [flat(1, 12)], 'eirp', { commonDb: 0.8, perDirectionDb: 0.6, draws: 20000, seed: 3 },
      { levelsPct: [50], thresholds: [11.5], beamPeaks: false });
    const u = Math.hypot(0.8, 0.6);
    expectClose(std(r.percentiles[0]), u, 0.02, 'sampling error of a std over 20000 draws ≈ u/√(2N) = 0.005; 4σ');
    expectClose(mean(r.coverage[0]), normalCdf(0.5 / u), 0.014, 'binomial se √(pq/N) ≈ 0.0033; 4σ');
  });
  it('u_r = 0: the common draw shifts every level exactly (uniform pattern)', () => {
    const r = monteCarloMetrics(equalWeights(100), [flat(100, 5)], 'eirp', { commonDb: 1, perDirectionDb: 0, draws: 200, seed: 9 },
      { levelsPct: [10, 90], thresholds: [], beamPeaks: true });
    for (let k = 0; k < 200; k++) {
      expect(r.percentiles[0][k]).toBe(r.percentiles[1][k]);
      expectClose(r.percentiles[0][k] - 5, r.peak[k] - 5, 1e-12, 'one shift for every reading');
      expectClose(r.beamPeaks[0][k], r.peak[k], 1e-12, 'one beam: its peak is the TSP peak');
    }
  });
  it('two equal beams: the total scan pattern reads high by σ/√π on average (order statistics)', () => {
    // E[max(X1, X2)] = σ/√π for independent N(0, σ²) (closed form); its p-quantile is σ·Φ⁻¹(√p).
    // The mean over p of the quantiles is the mean, so the average bias over 100 evenly spread levels → σ/√π.
    const n = 4000, sigma = 0.5;
    const levels = Array.from({ length: 100 }, (_, i) => i + 0.5);
    const r = monteCarloMetrics(equalWeights(n), [flat(n, 0), flat(n, 0)], 'eirp', { commonDb: 0, perDirectionDb: sigma, draws: 60, seed: 5 },
      { levelsPct: levels, thresholds: [], beamPeaks: false });
    const avgBias = levels.reduce((a, _l, i) => a + mean(r.percentiles[i]), 0) / levels.length;
    expectClose(avgBias, sigma / Math.sqrt(Math.PI), 0.01, 'σ/√π = 0.282 dB; the 0.5…99.5 % grid misses the tails by ~0.3 % of σ, sampling ~0.002');
    // Median of the max: Φ(q/σ)² = 0.5 → q = σ·Φ⁻¹(√0.5) = 0.5449σ (Φ⁻¹(0.70711) = 0.5449, A&S 26.2 from memory).
    expectClose(mean(r.percentiles[49]), 0.5449 * sigma, 0.01, 'sample-median scatter σ·1.25/√(2n)/√60 ≈ 0.001; 4000 points');
  });
  it('u_c = 0: the percentile spread shrinks as 1/√N with the number of directions', () => {
    // Sample median of N normals: sd ≈ σ·√(π/2)/√N (Kendall & Stuart, asymptotic; from memory).
    const sds = [200, 800, 3200].map((n) => {
      const r = monteCarloMetrics(equalWeights(n), [flat(n, 0)], 'eirp', { commonDb: 0, perDirectionDb: 1, draws: 400, seed: 17 },
        { levelsPct: [50], thresholds: [], beamPeaks: false });
      return { n, sd: std(r.percentiles[0]) };
    });
    for (const { n, sd } of sds) expectClose(sd * Math.sqrt(n), Math.sqrt(Math.PI / 2), 0.15, `√N·sd at N = ${n}; sd of an sd over 400 draws ≈ 3.5 %`);
    expectClose(sds[0].sd / sds[1].sd, 2, 0.25, '4× the directions halves the spread');
    expectClose(sds[1].sd / sds[2].sd, 2, 0.25, '4× the directions halves the spread');
  });
  it('is reproducible with a seed and changes with another seed', () => {
    const run = (seed: number) => monteCarloMetrics(equalWeights(50), [flat(50, 0), flat(50, 1)], 'eis', { commonDb: 0.5, perDirectionDb: 0.5, draws: 30, seed },
      { levelsPct: [50], thresholds: [0.5], beamPeaks: true });
    expect(Array.from(run(4).percentiles[0])).toEqual(Array.from(run(4).percentiles[0]));
    expect(Array.from(run(4).percentiles[0])).not.toEqual(Array.from(run(5).percentiles[0]));
  });
  it('eis: the total scan pattern is the minimum, so it reads low (better) over two equal beams', () => {
    const n = 2000;
    const r = monteCarloMetrics(equalWeights(n), [flat(n, -80), flat(n, -80)], 'eis', { commonDb: 0, perDirectionDb: 0.5, draws: 40, seed: 2 },
      { levelsPct: [50], thresholds: [], beamPeaks: false });
    expectClose(mean(r.percentiles[0]) + 80, -0.5449 * 0.5, 0.015, 'mirror of the eirp case');
  });
});
