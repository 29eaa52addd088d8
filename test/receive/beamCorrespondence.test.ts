/**
 * Beam correspondence (ΔEIRP_BC, 3GPP TS 38.101-2 §6.6.4 via the reference notes) and the
 * inter-band joint coverage (§6.2A.1), against closed forms.
 */
import { describe, expect, it } from 'vitest';
import { beamCorrespondence } from '../../src/coverage/beamCorrespondence.js';
import { upperShareRegion } from '../../src/coverage/upperShareRegion.js';
import { jointCoverage } from '../../src/coverage/jointCoverage.js';
import { expectClose } from '../helpers/expectClose.js';

const RAD = Math.PI / 180;

/** Cells of a θ/φ grid with rows at θ = step/2 + k·step (cell edges at multiples of the step): exact areas Δφ(cos θ1 − cos θ2). */
function cellGrid(stepDeg: number): { theta: Float64Array; w: Float64Array } {
  const theta: number[] = [];
  const w: number[] = [];
  for (let t = stepDeg / 2; t < 180; t += stepDeg) {
    for (let f = 0; f < 360; f += stepDeg) {
      theta.push(t);
      w.push(stepDeg * RAD * (Math.cos((t - stepDeg / 2) * RAD) - Math.cos((t + stepDeg / 2) * RAD)));
    }
  }
  return { theta: Float64Array.from(theta), w: Float64Array.from(w) };
}

describe('ΔEIRP_BC', () => {
  it('is identically 0 dB when the receive side picks the best transmit beam everywhere (EIS by reciprocity)', () => {
    const g = cellGrid(5);
    // Three cos-lobes pointing at θ = 30°, 90°, 150° (analytic, dBm); EIS = S − (EIRP − P) (reciprocity).
    const eirp = [30, 90, 150].map((t0) => g.theta.map((t) => 20 + 10 * Math.log10(Math.max(Math.cos((t - t0) * RAD), 1e-3) ** 2)));
    const eis = eirp.map((e) => e.map((x) => -95 - (x - 13)));
    const bc = beamCorrespondence(g.w, eirp, eis, 85, 50);
    expect([...bc.deltaDb].every((d) => d === 0)).toBe(true);
    expect(bc.value).toBe(0);
  });

  it('a receive choice shifted to the neighbouring beam of a 2× oversampled DFT codebook costs the crossover loss of the orthogonal beams at every beam peak', () => {
    // Uniform linear array of N isotropic elements at λ/2 on the z axis, u = cos θ. Array factor
    // (Balanis, Antenna Theory, 4th ed., §6.3; Mailloux, Phased Array Antenna Handbook, ch. 1):
    //   |AF(u)| = |sin(Nπ(u − u_b)/2) / (N sin(π(u − u_b)/2))|.
    // Orthogonal DFT beams are 2/N apart in u; a 2× oversampled codebook puts a beam halfway,
    // 1/N from its neighbours, so at a beam's peak its neighbour is at the orthogonal set's
    // crossover: |AF| = 1/(N sin(π/2N)) → loss 20·log10(N sin(π/2N)) dB (N = 8: 3.87 dB, the
    // reference notes' value).
    const N = 8;
    const ub = Array.from({ length: 2 * N - 1 }, (_, b) => -1 + (b + 1) / N); // beams 1/N apart, inside (−1, 1)
    const af = (u: number, u0: number): number => {
      const x = (Math.PI * (u - u0)) / 2;
      return Math.abs(Math.sin(x) < 1e-15 ? 1 : Math.sin(N * x) / (N * Math.sin(x)));
    };
    // Directions: exactly the beam peaks, equal weights (a 1-D check of the per-direction rule).
    const u = Float64Array.from(ub.slice(1, -1)); // interior beams: both neighbours exist
    const w = new Float64Array(u.length).fill(1);
    const eirp = ub.map((u0) => u.map((x) => 20 + 20 * Math.log10(Math.max(af(x, u0), 1e-9))));
    // Receive patterns shifted by one beam: the EIS filed under beam b is beam b+1's (best where b+1 points).
    const eis = ub.map((_, b) => eirp[Math.min(b + 1, ub.length - 1)].map((x) => -95 - (x - 13)));
    const bc = beamCorrespondence(w, eirp, eis, 85, 100);
    const want = 20 * Math.log10(N * Math.sin(Math.PI / (2 * N)));
    expectClose(want, 3.87, 0.005, 'reference notes: N = 8 → −3.87 dB');
    for (let i = 0; i < u.length; i++) {
      expect(bc.rxChoice[i]).not.toBe(i + 1); // not the beam pointing there
      expectClose(bc.deltaDb[i], want, 1e-9, `beam peak ${i + 1}: crossover loss (closed form)`);
    }
  });
});

describe('upper 50 % of EIRP2 by solid angle', () => {
  it('on a pattern decreasing in θ is the cap θ ≤ 90°, 2π sr (hemisphere, closed form)', () => {
    const g = cellGrid(5);
    const tsp = g.theta.map((t) => 30 - t / 10); // strictly decreasing in θ
    const r = upperShareRegion(tsp, g.w, 50);
    expectClose(r.regionSr, 2 * Math.PI, 1e-9, 'cells with edges on multiples of 5°: the cap θ ≤ 90° exactly');
    expect(r.floor).toBe(30 - 87.5 / 10); // the lowest row inside the cap
  });
  it('the 25 % share of the same pattern is the cap 2π(1 − cos α) = π, α = 60°', () => {
    const g = cellGrid(5);
    const r = upperShareRegion(g.theta.map((t) => -t), g.w, 25);
    expectClose(r.regionSr, 2 * Math.PI * (1 - Math.cos(60 * RAD)), 1e-9, 'spherical cap of half-angle 60°');
  });
});

describe('inter-band joint coverage', () => {
  it('two patterns covering θ ≤ 100° and θ ≥ 60° share (cos 60° − cos 100°)/2 = 0.3368 of 4π (geometry)', () => {
    const g = cellGrid(5);
    const a = g.theta.map((t) => (t <= 100 ? 12 : 0)); // band A reaches its level up to θ = 100°
    const b = g.theta.map((t) => (t >= 60 ? 7 : -5)); // band B from θ = 60°
    const j = jointCoverage(g.w, a, 12 - 6, b, 7 - 6);
    const want = (Math.cos(60 * RAD) - Math.cos(100 * RAD)) / 2;
    expectClose(want, 0.3368, 5e-5, 'the issue\'s worked value');
    expectClose(j.share, want, 1e-12, 'exact cell areas, edges at 60° and 100°');
    expectClose(j.shareA, (1 - Math.cos(100 * RAD)) / 2, 1e-12, 'cap θ ≤ 100°');
  });
});
