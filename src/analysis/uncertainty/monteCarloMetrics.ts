import type { Quantity } from '../../types.js';
import { betterSign } from '../../quantity.js';
import { createRng } from '../../sim/prng.js';
import { weightedCdf } from '../../coverage/weightedCdf.js';
import { percentile } from '../../coverage/percentile.js';
import { coverageEfficiency } from '../../coverage/coverageEfficiency.js';

/** A beam that trails the best one by more than this many u_r cannot win a direction (P < 1e−8 for the difference of two normals). */
export const CANDIDATE_CUT_SIGMAS = 8;

export interface MonteCarloRequest {
  /** CDF levels, % (the core's percentile rule). */
  levelsPct: number[];
  /** Absolute coverage thresholds, value unit. */
  thresholds: number[];
  /** Per-beam peaks (for min-beam-peak checks). */
  beamPeaks: boolean;
  /** Per-beam TRP, dBm, as measured (null: not available); re-drawn when given. */
  trpDbm?: (number | null)[];
  /** Windows d (dB towards worse from the re-drawn TSP peak) for coverage relative to the peak. */
  relativeDb?: number[];
}

export interface MonteCarloDraws {
  draws: number;
  /** [level][draw]; NaN where the level is not evaluable. */
  percentiles: Float64Array[];
  /** [threshold][draw], fraction of the sphere. */
  coverage: Float64Array[];
  /** [window][draw]: coverage within d dB of each draw's own TSP peak. */
  relative: Float64Array[];
  /** Best value of the total scan pattern per draw (max; min for eis). */
  peak: Float64Array;
  /** [beam][draw] when requested, else empty. */
  beamPeaks: Float64Array[];
  /** [beam][draw] where the TRP is known, else an empty array for that beam. */
  trpDbm: Float64Array[];
  /** Candidate (direction, beam) pairs drawn per draw: the cost driver. */
  pairsPerDraw: number;
  /** The common draw of each trial as a shift of the values (c; −c for eis), for bias estimates free of its scatter. */
  common: Float64Array;
}

/**
 * Seeded Monte-Carlo of a unit's coverage metrics under measurement uncertainty.
 *
 * Model (Eq. M1): every beam value is perturbed as v*_{b,i} = v_{b,i} + c + r_{b,i}, with one
 * common draw c ~ N(0, u_c²) per trial (calibration, reference-antenna gain) and independent
 * r_{b,i} ~ N(0, u_r²) per beam and direction (positioning, noise, reflections). Each trial
 * rebuilds the total scan pattern (max over beams; min for eis), its solid-angle-weighted CDF
 * (`weightedCdf`), and re-reads the percentiles (`percentile`, the one percentile rule) and the
 * coverage efficiencies (`coverageEfficiency`); the per-beam peaks and TRPs when asked.
 * Pruning (exact to < 1e−8 per direction): a beam more than 8·u_r behind the best beam of a
 * direction is not drawn there (it cannot win), and a beam's peak is re-read among the
 * directions within 8·u_r of it. With u_r = 0 the trial is an exact shift: percentiles + c,
 * coverage read at t − c (t + c for eis), no re-sort.
 * TRP (Eq. M2): TRP* = TRP + c + z·u_r·√(Σ(w p)²)/Σ(w p), z ~ N(0, 1), the linearized effect
 * of the independent part on a power-weighted mean (delta method; p = 10^(v/10)).
 * Units: dB values, u in dB, weights in sr. Draw order (fixed, for reproducibility): c, then
 * the pairs in (direction, beam) order, then one z per beam with a TRP.
 * Cost: O(draws · (pairs + n log n)) time, O(pairs + n) memory besides the outputs.
 * @throws RangeError for no beams or unequal lengths.
 * @example monteCarloMetrics(w, beams, 'eirp', { commonDb: 1, perDirectionDb: 0.3, draws: 1000, seed: 1 }, { levelsPct: [50], thresholds: [], beamPeaks: false })
 */
export function monteCarloMetrics(
  weightSr: Float64Array,
  beams: Float64Array[],
  quantity: Quantity,
  u: { commonDb: number; perDirectionDb: number; draws: number; seed: number },
  req: MonteCarloRequest,
): MonteCarloDraws {
  if (beams.length === 0) throw new RangeError('monteCarloMetrics: no beams');
  const n = weightSr.length;
  for (const b of beams) if (b.length !== n) throw new RangeError('monteCarloMetrics: beam length differs from the grid');
  const N = u.draws;
  const rng = createRng(u.seed);
  const s = betterSign(quantity); // work in "goodness" g = s·v: larger is better for every quantity
  const ur = u.perDirectionDb;
  const cut = CANDIDATE_CUT_SIGMAS * ur;
  const out: MonteCarloDraws = {
    draws: N,
    percentiles: req.levelsPct.map(() => new Float64Array(N)),
    coverage: req.thresholds.map(() => new Float64Array(N)),
    relative: (req.relativeDb ?? []).map(() => new Float64Array(N)),
    peak: new Float64Array(N),
    beamPeaks: req.beamPeaks ? beams.map(() => new Float64Array(N)) : [],
    trpDbm: beams.map((_, b) => (req.trpDbm?.[b] != null ? new Float64Array(N) : new Float64Array(0))),
    pairsPerDraw: 0,
    common: new Float64Array(N),
  };
  // Best goodness per direction (the measured TSP) and per beam (the measured beam peak).
  const best = new Float64Array(n).fill(-Infinity);
  const beamBest = new Float64Array(beams.length).fill(-Infinity);
  beams.forEach((v, b) => {
    for (let i = 0; i < n; i++) {
      const g = s * v[i];
      if (g > best[i]) best[i] = g;
      if (g > beamBest[b]) beamBest[b] = g;
    }
  });
  // Candidate pairs, direction-major: TSP candidates, plus beam-peak candidates when requested.
  const start = new Int32Array(n + 1);
  const pairBeam: number[] = [];
  const pairValue: number[] = [];
  const pairTsp: number[] = [];
  const peakPairs: number[][] = beams.map(() => []);
  for (let i = 0; i < n; i++) {
    start[i] = pairBeam.length;
    for (let b = 0; b < beams.length; b++) {
      const g = s * beams[b][i];
      const tspCand = g >= best[i] - cut;
      const peakCand = req.beamPeaks && g >= beamBest[b] - cut;
      if (!tspCand && !peakCand) continue;
      if (peakCand) peakPairs[b].push(pairBeam.length);
      pairBeam.push(b);
      pairValue.push(g);
      pairTsp.push(tspCand ? 1 : 0);
    }
  }
  start[n] = pairBeam.length;
  const pv = Float64Array.from(pairValue);
  const pt = Uint8Array.from(pairTsp);
  const pp = peakPairs.map((l) => Int32Array.from(l));
  const noisy = new Float64Array(pv.length);
  out.pairsPerDraw = ur > 0 ? pv.length : 0;
  const tsp = new Float64Array(n);
  for (let i = 0; i < n; i++) tsp[i] = s * best[i];
  const baseCdf = weightedCdf(tsp, weightSr);
  // TRP: sensitivity of the dB TRP to the independent part (Eq. M2).
  const trpScale = beams.map((v, b) => {
    if (req.trpDbm?.[b] == null) return 0;
    let sw = 0, sw2 = 0;
    for (let i = 0; i < n; i++) { const x = weightSr[i] * 10 ** (v[i] / 10); sw += x; sw2 += x * x; }
    return sw > 0 ? Math.sqrt(sw2) / sw : 0;
  });
  const star = new Float64Array(n);
  for (let k = 0; k < N; k++) {
    const c = u.commonDb * rng.normal(); // Eq. (M1), common part
    out.common[k] = s * c;
    if (ur > 0) {
      let peak = -Infinity;
      for (let i = 0; i < n; i++) {
        let m = -Infinity;
        for (let j = start[i]; j < start[i + 1]; j++) {
          const g = pv[j] + ur * rng.normal(); // Eq. (M1), independent part
          noisy[j] = g;
          if (pt[j] === 1 && g > m) m = g;
        }
        star[i] = s * (m + c);
        if (m + c > peak) peak = m + c;
      }
      out.peak[k] = s * peak;
      const cdf = weightedCdf(star, weightSr);
      req.levelsPct.forEach((p, l) => { out.percentiles[l][k] = percentile(cdf, p, quantity) ?? NaN; });
      req.thresholds.forEach((t, l) => { out.coverage[l][k] = coverageEfficiency(cdf, t, quantity); });
      (req.relativeDb ?? []).forEach((d, l) => { out.relative[l][k] = coverageEfficiency(cdf, s * (peak - d), quantity); });
      for (let b = 0; b < pp.length && req.beamPeaks; b++) {
        let m = -Infinity;
        for (const j of pp[b]) if (noisy[j] > m) m = noisy[j];
        out.beamPeaks[b][k] = s * (m + c);
      }
    } else {
      // u_r = 0: an exact common shift of every value.
      const top = best.reduce((a, g) => (g > a ? g : a), -Infinity);
      out.peak[k] = s * (top + c);
      (req.relativeDb ?? []).forEach((d, l) => { out.relative[l][k] = coverageEfficiency(baseCdf, s * (top - d), quantity); }); // shift-invariant
      req.levelsPct.forEach((p, l) => { const v = percentile(baseCdf, p, quantity); out.percentiles[l][k] = v === null ? NaN : v + s * c; });
      req.thresholds.forEach((t, l) => { out.coverage[l][k] = coverageEfficiency(baseCdf, t - s * c, quantity); });
      for (let b = 0; b < out.beamPeaks.length; b++) out.beamPeaks[b][k] = s * (beamBest[b] + c);
    }
    for (let b = 0; b < beams.length; b++) {
      const trp = req.trpDbm?.[b];
      if (trp == null) continue;
      out.trpDbm[b][k] = trp + c + trpScale[b] * ur * rng.normal(); // Eq. (M2)
    }
  }
  return out;
}
