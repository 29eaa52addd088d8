import { describe, expect, it } from 'vitest';
import { frequencyTrend } from '../../src/analysis/frequencyTrend.js';
import { pointingDrift } from '../../src/analysis/pointingDrift.js';
import { referenceDeltas } from '../../src/analysis/referenceDeltas.js';
import { tspDifference } from '../../src/analysis/tspDifference.js';
import type { BeamMetrics, CoverageMetrics } from '../../src/types.js';
import { expectClose } from '../helpers/expectClose.js';
import { fullGrid, gaussianBeam, unit } from './fixtures.js';
import { bestOf } from './reference.js';

function metrics(shift: number, extra: Partial<CoverageMetrics> = {}): CoverageMetrics {
  const beam = (id: string, peak: number, trp: number | null): BeamMetrics => ({
    id, peak: { value: peak + shift, thetaDeg: 90, phiDeg: 0 }, trpDbm: trp === null ? null : trp + shift, bestShare: 0.5,
  });
  return {
    peak: { value: 22 + shift, thetaDeg: 90, phiDeg: 0 },
    percentiles: [{ levelPct: 10, value: null }, { levelPct: 50, value: 11.8 + shift }, { levelPct: 2.5, value: 3 + shift }],
    coverage: [{ threshold: 10, efficiency: 0.61 }],
    relativeCoverage: [{ threshold: 19, dbBelowPeak: 3, efficiency: 0.2 }],
    curve: [],
    solidAngleSr: 4 * Math.PI,
    beams: [beam('a', 20, 10.5), beam('b', 22, 9.9)],
    ...extra,
  };
}

describe('referenceDeltas', () => {
  it('a reference compared with itself differs by zero in every evaluable metric', () => {
    const d = referenceDeltas(metrics(0), metrics(0));
    expect(d).toEqual({
      peak: 0, p10: null, p50: 0, 'p2.5': 0, 'coverage@10': 0, 'relativeCoverage@3dB': 0, trpBestBeamDbm: 0, trpMaxDbm: 0,
    });
  });

  it('gives unit − reference, with TRP of the best-peak beam, and null for a metric one side lacks', () => {
    const unit = metrics(-0.8, { coverage: [{ threshold: 10, efficiency: 0.55 }, { threshold: 12, efficiency: 0.4 }] });
    const d = referenceDeltas(unit, metrics(0));
    expectClose(d.p50!, -0.8, 1e-12, 'uniform shift');
    expectClose(d.peak!, -0.8, 1e-12, 'uniform shift');
    expectClose(d.trpBestBeamDbm!, -0.8, 1e-12, 'beam b (best peak) TRP 9.9 − 0.8 vs 9.9');
    expectClose(d['coverage@10']!, -0.06, 1e-12, '0.55 − 0.61');
    expect(d['coverage@12']).toBeNull();
  });
});

describe('tspDifference', () => {
  const g5 = fullGrid(5);
  it('is zero everywhere for the same TSP on the same grid', () => {
    const beams = [gaussianBeam(g5, 60, 30, 50, 20), gaussianBeam(g5, 120, 200, 50, 19)];
    const tsp = { values: bestOf(beams), bestBeam: new Int32Array(g5.thetaDeg.length) };
    const copy = { values: Float64Array.from(tsp.values), bestBeam: tsp.bestBeam };
    expect(tspDifference(g5, tsp, fullGrid(5), copy).every((x) => x === 0)).toBe(true);
  });

  it('resamples a reference on another grid: a unit 1 dB above the reference differs by 1 dB', () => {
    const g25 = fullGrid(2.5);
    // A smooth pattern on the sphere (degree-1 harmonic): v = 20 + 8·(û·â) dB.
    const a = unit(70, 100);
    const pattern = (g: typeof g5, offset: number) => Float64Array.from(g.thetaDeg, (t, i) => {
      const u = unit(t, g.phiDeg[i]);
      return 20 + offset + 8 * (u[0] * a[0] + u[1] * a[1] + u[2] * a[2]);
    });
    const ref = { values: pattern(g5, 0), bestBeam: new Int32Array(g5.thetaDeg.length) };
    const uni = { values: pattern(g25, 1), bestBeam: new Int32Array(g25.thetaDeg.length) };
    const d = tspDifference(g25, uni, g5, ref);
    expect(d.length).toBe(g25.thetaDeg.length);
    // Bilinear error ≤ (h²/8)·(|f_θθ| + |f_φφ|), second derivatives ≤ 8·(π/180)² dB/deg², h = 5°:
    // ≈ 0.015 dB (standard linear-interpolation error bound).
    const bound = (25 / 8) * 2 * 8 * (Math.PI / 180) ** 2;
    for (const x of d) expectClose(x, 1, bound, 'bilinear resampling of a smooth pattern');
  });
});

describe('frequencyTrend', () => {
  it('sorts by frequency and keeps the same names in every row', () => {
    const rows = frequencyTrend([
      { frequencyHz: 29.5e9, metrics: metrics(-1) },
      { frequencyHz: 26.5e9, metrics: metrics(0.5, { coverage: [] }) },
      { frequencyHz: 28e9, metrics: metrics(0) },
    ]);
    expect(rows.map((r) => r.frequencyHz)).toEqual([26.5e9, 28e9, 29.5e9]);
    expect(rows.map((r) => r.p50)).toEqual([12.3, 11.8, 10.8]);
    expect(rows[0]['coverage@10']).toBeNull();
    expect(Object.keys(rows[0]).sort()).toEqual(Object.keys(rows[2]).sort());
  });
});

/**
 * |AF(θ)| in the φ = 0 plane of an N-element uniform linear array along x, spacing d, with the
 * progressive phase set at f₀ to steer to θ₀: AF = Σₙ exp(j n (k d sin θ − k₀ d sin θ₀))
 * (Balanis, Antenna Theory, 4th ed., §6.3, uniform linear array, array factor written for an
 * array along x with θ measured from broadside z).
 */
function arrayFactorPeakDeg(n: number, spacingM: number, f0Hz: number, fHz: number, steerDeg: number): number {
  const c = 299792458;
  const k = (2 * Math.PI * fHz) / c, k0 = (2 * Math.PI * f0Hz) / c;
  const beta = -k0 * spacingM * Math.sin((steerDeg * Math.PI) / 180);
  const af = (tDeg: number): number => {
    let re = 0, im = 0;
    const psi = k * spacingM * Math.sin((tDeg * Math.PI) / 180) + beta;
    for (let m = 0; m < n; m++) { re += Math.cos(m * psi); im += Math.sin(m * psi); }
    return Math.hypot(re, im);
  };
  let best = 0;
  for (let t = -90; t <= 90; t += 0.01) if (af(t) > af(best)) best = t;
  // Golden-section refinement on the bracketing ±0.01°.
  let a = best - 0.01, b = best + 0.01;
  const r = (Math.sqrt(5) - 1) / 2;
  for (let it = 0; it < 60; it++) {
    const x1 = b - r * (b - a), x2 = a + r * (b - a);
    if (af(x1) > af(x2)) b = x2; else a = x1;
  }
  return (a + b) / 2;
}

describe('pointingDrift', () => {
  it('matches the phase-steering squint sin θ = (f₀/f)·sin θ₀ of a linear array factor', () => {
    const f0 = 28e9, steer = 45, d = 299792458 / f0 / 2, n = 16;
    const freqs = [26.5e9, 28e9, 29.5e9];
    const perFrequency = freqs.map((f) => {
      const t = arrayFactorPeakDeg(n, d, f0, f, steer);
      // Signed θ in the φ = 0 plane → (θ, φ) on the sphere.
      const beam: BeamMetrics = { id: '7', peak: { value: 20, thetaDeg: Math.abs(t), phiDeg: t < 0 ? 180 : 0 }, trpDbm: null, bestShare: 1 };
      const broadside: BeamMetrics = { id: '0', peak: { value: 20, thetaDeg: arrayFactorPeakDeg(n, d, f0, f, 0), phiDeg: 0 }, trpDbm: null, bestShare: 0 };
      return { frequencyHz: f, beams: [broadside, beam] };
    });
    // Mailloux, Phased Array Antenna Handbook, 2nd ed., ch. 1 (beam squint with phase steering), from memory.
    const squint = (f: number) => (Math.asin((f0 / f) * Math.sin((steer * Math.PI) / 180)) * 180) / Math.PI;
    perFrequency.forEach((p, k) => expectClose(p.beams[1].peak.thetaDeg, squint(freqs[k]), 1e-6, 'AF peak vs squint formula, search converged'));
    const drift = pointingDrift(perFrequency, 3);
    const expected = squint(26.5e9) - squint(29.5e9); // ≈ 6.2°
    expect(drift.map((x) => x.beam)).toEqual(['0', '7']);
    expectClose(drift[1].driftDeg, expected, 1e-6, 'band-edge separation of the peaks');
    expect(drift[1].flagged).toBe(true);
    expect(drift[1].betweenHz).toEqual([26.5e9, 29.5e9]);
    expect(drift[1].frequencies).toBe(3);
    expectClose(drift[0].driftDeg, 0, 1e-6, 'a broadside beam does not squint (sin 0 = 0)');
    expect(drift[0].flagged).toBe(false);
  });

  it('measures the great-circle angle across the φ seam and over the pole; one frequency drifts 0°', () => {
    const at = (t: number, p: number, id = 'x'): BeamMetrics => ({ id, peak: { value: 0, thetaDeg: t, phiDeg: p }, trpDbm: null, bestShare: 0 });
    const d = pointingDrift([
      { frequencyHz: 1, beams: [at(90, 359), at(5, 0, 'pole')] },
      { frequencyHz: 2, beams: [at(90, 1), at(5, 180, 'pole'), at(10, 10, 'once')] },
    ], 2.5);
    expectClose(d[0].driftDeg, 2, 1e-9, 'on the equator 359° → 1° is 2°');
    expectClose(d[1].driftDeg, 10, 1e-9, 'θ = 5 at φ 0 and 180 are 10° apart over the pole');
    expect(d.map((x) => x.flagged)).toEqual([false, true, false]);
    expect(d[2]).toEqual({ beam: 'once', driftDeg: 0, flagged: false, frequencies: 1, betweenHz: null });
  });
});
