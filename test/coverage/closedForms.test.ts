import { describe, expect, it } from 'vitest';
import { buildSphereGrid } from '../../src/sphere/buildGrid.js';
import { beamPeak } from '../../src/coverage/beamPeak.js';
import { coverageEfficiency } from '../../src/coverage/coverageEfficiency.js';
import { percentile } from '../../src/coverage/percentile.js';
import { totalScanPattern } from '../../src/coverage/totalScanPattern.js';
import { beamTrpDbm } from '../../src/coverage/trp.js';
import { weightedCdf } from '../../src/coverage/weightedCdf.js';
import type { SphereGrid } from '../../src/types.js';
import { expectClose } from '../helpers/expectClose.js';
import { combos, range, stepGrid } from '../sphere/gridFixtures.js';

const RAD = Math.PI / 180;
/** dB floor for pattern nulls: 10^(−30) of the peak adds nothing measurable to any sum. */
const FLOOR_DB = -300;
const toDb = (x: number): number => Math.max(FLOOR_DB, 10 * Math.log10(x));

function pattern(grid: SphereGrid, f: (thetaRad: number) => number): Float64Array {
  return Float64Array.from(grid.thetaDeg, (t) => toDb(f(t * RAD)));
}
function grid(step: number): SphereGrid {
  const a = stepGrid(step);
  return buildSphereGrid(a.theta, a.phi).grid;
}

describe('directivity = peak − TRP (dB) on a 1° grid', () => {
  const g = grid(1);
  const directivityDb = (v: Float64Array): number => beamPeak(v, g, 'gain').value - (beamTrpDbm(v, g.weightSr, true) as number);

  it('short dipole sin²θ: D = 1.5 (1.76 dBi)', () => {
    // Balanis, Antenna Theory, 4th ed., Sec. 4.2 (infinitesimal dipole), D₀ = 3/2.
    expectClose(directivityDb(pattern(g, (t) => Math.sin(t) ** 2)), 10 * Math.log10(1.5), 0.01, 'issue 2 tolerance 0.01 dB');
  });

  it('half-wave dipole [cos(π/2·cos θ)/sin θ]²: D = 1.643 (2.15 dBi)', () => {
    // Balanis, Antenna Theory, 4th ed., Sec. 4.6 (half-wavelength dipole), D₀ = 4/Cin(2π) ≈ 1.643.
    const f = (t: number): number => (Math.sin(t) < 1e-12 ? 0 : (Math.cos((Math.PI / 2) * Math.cos(t)) / Math.sin(t)) ** 2);
    expectClose(directivityDb(pattern(g, f)), 10 * Math.log10(1.643), 0.01, 'issue 2 tolerance 0.01 dB');
  });

  it('isotropic pattern: TRP = EIRP (fr2-requirements.md textbook values)', () => {
    expectClose(beamTrpDbm(new Float64Array(g.weightSr.length).fill(12.5), g.weightSr, true) as number, 12.5, 1e-12, 'exact up to rounding');
    expect(beamTrpDbm(new Float64Array(g.weightSr.length), g.weightSr, false)).toBeNull();
  });
});

/*
 * cosⁿ(θ) on the upper hemisphere, 0 below (linear power). Closed form, derived here:
 * cosⁿθ ≥ t ⇔ θ ≤ α = acos(t^(1/n)); that region is a cap of 2π(1 − cos α) sr, so the
 * coverage efficiency at a linear threshold t is 2π(1 − t^(1/n))/4π = (1 − t^(1/n))/2.
 * Percentile p > 50 %: F(v) = 1 − (1 − t^(1/n))/2 = (1 + t^(1/n))/2 = p ⇒ t = (2p − 1)ⁿ,
 * i.e. v = 10·n·log10(2p − 1) dB.
 * Grid tolerance (derived): the pattern depends on θ only and falls monotonically, so the
 * covered set is a union of whole θ rows ending at a row midpoint, which lies within Δ/2 of α.
 * Hence |error| ≤ [cos(α − Δ/2) − cos(α + Δ/2)]/2 = sin α·sin(Δ/2). The step-rule percentile
 * is the value of the last row θr whose cap above θr − Δ/2 does not exceed cap(α), so
 * |θr − α| ≤ Δ/2 and |error| ≤ max |v(α ± Δ/2) − v(α)| with v(θ) = 10·n·log10(cos θ).
 */
describe('cosⁿ upper hemisphere: closed-form coverage and percentiles, weighted vs unweighted', () => {
  const n = 4;
  for (const step of [1, 5]) {
    const g = grid(step);
    const v = pattern(g, (t) => (t <= Math.PI / 2 ? Math.cos(t) ** n : 0));
    const cdf = weightedCdf(v, g.weightSr);
    const points = g.weightSr.length;

    for (const t of [0.1, 0.3, 0.5, 0.8]) {
      it(`${step}° grid, coverage at t = ${t}: (1 − t^(1/n))/2 within sin α·sin(Δ/2); point counting is outside`, () => {
        const alpha = Math.acos(t ** (1 / n));
        const exact = (1 - t ** (1 / n)) / 2;
        const tol = Math.sin(alpha) * Math.sin((step / 2) * RAD) + 1e-12;
        const weighted = coverageEfficiency(cdf, 10 * Math.log10(t), 'gain');
        expectClose(weighted, exact, tol, 'row-midpoint bound (derived above)');
        let count = 0;
        for (let i = 0; i < points; i++) if (v[i] >= 10 * Math.log10(t)) count++;
        const unweighted = count / points;
        expect(Math.abs(unweighted - exact), `unweighted ${unweighted} vs ${exact}`).toBeGreaterThan(tol);
      });
    }

    for (const p of [60, 80, 90, 95]) {
      it(`${step}° grid, ${p} % percentile: 10·n·log10(2p − 1) within v(α ± Δ/2); point counting is outside`, () => {
        const q = p / 100;
        const exact = 10 * n * Math.log10(2 * q - 1);
        const alpha = Math.acos(2 * q - 1);
        const vAt = (t: number): number => 10 * n * Math.log10(Math.cos(t));
        const half = (step / 2) * RAD;
        const tol = Math.max(Math.abs(vAt(alpha - half) - exact), Math.abs(vAt(Math.min(alpha + half, Math.PI / 2 - 1e-9)) - exact)) + 1e-9;
        const weighted = percentile(cdf, p, 'gain') as number;
        expectClose(weighted, exact, tol, 'half-row bound (derived above)');
        // Unweighted: the same step rule with every point counting 1 instead of its solid angle.
        const sorted = Float64Array.from(v).sort();
        const unweighted = sorted[Math.ceil(q * points) - 1];
        expect(Math.abs(unweighted - exact), `unweighted ${unweighted} vs ${exact}`).toBeGreaterThan(tol);
      });
    }
  }
});

/*
 * Two adjacent orthogonal (DFT) beams of an N-element uniform linear array with λ/2 spacing
 * cross at 1/(N·sin(π/2N)) of the peak field, → 2/π (−3.92 dB) for large N.
 * Source: fr2-requirements.md "Textbook check values", marked there as MEMORY (Mailloux,
 * Phased Array Antenna Handbook; Butler-matrix beams), numerically verified — so this check
 * rests on a remembered handbook result plus the array-factor algebra below.
 * Array along z, u = cos θ; beam k steered to u_k with u_± = ±1/N (adjacent, spacing 2/N):
 * |AF(u)| = |sin(Nπ(u − u_k)/2) / (N sin(π(u − u_k)/2))|. The crossover is at u = 0 (θ = 90°).
 */
describe('DFT beams of a ULA cross about 3.9 dB below their peaks', () => {
  for (const N of [4, 8, 64]) {
    it(`N = ${N}: TSP dip between the beams = 20·log10(1/(N sin(π/2N)))`, () => {
      const rows = range(0, 180, 0.01);
      const a = combos(rows, [0, 90, 180, 270]);
      const g = buildSphereGrid(a.theta, a.phi).grid;
      const beam = (uk: number): Float64Array =>
        Float64Array.from(g.thetaDeg, (t) => {
          const x = (Math.PI * (Math.cos(t * RAD) - uk)) / 2;
          const af = Math.abs(x) < 1e-12 ? 1 : Math.sin(N * x) / (N * Math.sin(x));
          return toDb(af * af);
        });
      const b0 = beam(-1 / N), b1 = beam(1 / N);
      const tsp = totalScanPattern([b0, b1], 'eirp');
      const t0 = beamPeak(b0, g, 'eirp'), t1 = beamPeak(b1, g, 'eirp');
      let dip = Infinity;
      for (let i = 0; i < tsp.values.length; i++) {
        const t = g.thetaDeg[i];
        if (t > Math.min(t0.thetaDeg, t1.thetaDeg) && t < Math.max(t0.thetaDeg, t1.thetaDeg)) dip = Math.min(dip, tsp.values[i]);
      }
      const crossover = dip - Math.max(t0.value, t1.value);
      const expected = 20 * Math.log10(1 / (N * Math.sin(Math.PI / (2 * N))));
      // 0.01° rows: the sampled peak is within ~1e-4 dB of the true 0 dB peak.
      expectClose(crossover, expected, 0.005, 'sampling of peak and dip on 0.01° rows');
      if (N === 64) expectClose(crossover, 20 * Math.log10(2 / Math.PI), 0.01, 'large-N limit 2/π (−3.92 dB)');
    });
  }
});

describe('TRP with the grid solid angle', () => {
  it('passing grid.solidAngleSr gives the same bits as summing the weights (regular and Voronoi grids)', () => {
    const a = stepGrid(5);
    for (const g of [buildSphereGrid(a.theta, a.phi).grid, buildSphereGrid(a.theta, a.phi, { forceScattered: true }).grid]) {
      const v = Float64Array.from(g.thetaDeg, (t, i) => 10 * Math.sin(t * RAD) + 0.01 * g.phiDeg[i]);
      expect(Object.is(beamTrpDbm(v, g.weightSr, true, g.solidAngleSr), beamTrpDbm(v, g.weightSr, true))).toBe(true);
    }
  });
});
