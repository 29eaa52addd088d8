import { describe, it, expect } from 'vitest';
import { expectClose, expectRelClose } from '../helpers/expectClose.js';
import { elementGain, simulateBeams, C_M_PER_S } from '../../src/sim/index.js';
import type { ArrayModel } from '../../src/sim/index.js';
import { directivity, fineGrid, integrateLinear, maxOf } from './quadrature.js';
import { beamAll, zLineArray } from './helpers.js';

const F0 = 28e9;

/** Exact broadside directivity of N isotropic elements at spacing d (derived: ∮e^{jkd(m−n)cos θ}dΩ = 4π·sin x/x). */
function exactBroadsideDirectivity(n: number, spacingWl: number): number {
  const kd = 2 * Math.PI * spacingWl;
  let s = 0;
  for (let m = 1; m < n; m++) s += ((n - m) * Math.sin(m * kd)) / (m * kd);
  return n / (1 + (2 / n) * s);
}

describe('uniform linear array, broadside (array along z, beam at θ = 90°)', () => {
  // θ step 0.05° resolves a 5° beam; φ is irrelevant for isotropic elements on the z axis.
  const grid = fineGrid(0.05, 30);

  it('directivity ≈ 2·N·d/λ for large N', () => {
    const model = zLineArray(32, 0.3);
    const [b] = simulateBeams(model, [beamAll(model, 90)], grid, F0);
    const d = directivity(b.eirpDbm, grid.weightSr);
    // Balanis, Antenna Theory, 4th ed., ch. 6 (uniform linear arrays, broadside directivity
    // D₀ ≈ 2N(d/λ), a large-N approximation; from memory). For N = 32, d = 0.3λ the exact
    // value is 0.7 % above it, so the approximation is checked to 2 %.
    expectRelClose(d, 2 * 32 * 0.3, 0.02, 'large-N broadside approximation');
    // The exact closed form (derived above) pins the model and the quadrature much tighter.
    expectRelClose(d, exactBroadsideDirectivity(32, 0.3), 2e-3, 'exact ULA sum, quadrature error of a 0.05° θ grid');
  });

  it('directivity is exactly N at d = λ/2 with isotropic elements', () => {
    // Reference file /work/shared/reference/fr2-requirements.md, "Textbook check values"
    // (MEMORY, numerically verified): broadside ULA of N isotropic elements at λ/2 has D = N.
    for (const n of [4, 8]) {
      const model = zLineArray(n, 0.5);
      const [b] = simulateBeams(model, [beamAll(model, 90)], grid, F0);
      expectRelClose(directivity(b.eirpDbm, grid.weightSr), n, 1e-3, `N = ${n}; 0.05° θ-grid quadrature`);
    }
  });

  it('total radiated power equals the conducted power at d = λ/2 (no coupling in the model)', () => {
    // Follows from D = N above: EIRP_peak = P·N and TRP = EIRP_peak / D = P.
    const model = zLineArray(8, 0.5, F0, 10);
    const [b] = simulateBeams(model, [beamAll(model, 90)], grid, F0);
    expectClose(10 * Math.log10(integrateLinear(b.eirpDbm, grid.weightSr) / (4 * Math.PI)), 10, 0.01, 'TRP = 10 dBm');
  });
});

describe('array gain', () => {
  it('peak gain of N elements is N times the element gain for ideal weights', () => {
    // Balanis, Antenna Theory, 4th ed., ch. 6 (pattern multiplication: |AF|max = N for
    // uniform in-phase excitation, so with power P/N per element EIRP = P·N·G_element).
    const d = C_M_PER_S / F0 / 2;
    for (const [rows, cols] of [[1, 4], [2, 2], [4, 4]] as const) {
      const elements = [];
      for (let r = 0; r < rows; r++)
        for (let c = 0; c < cols; c++)
          elements.push({
            positionM: [0, c * d, r * d] as const,
            boresight: [1, 0, 0] as const,
            q: 1.5,
            floorDb: -20,
            polarizationDeg: 0,
            amplitudeErrorDb: 0,
            phaseErrorDeg: 0,
            failed: false,
          });
      const model: ArrayModel = { elements, designFrequencyHz: F0, phaseBits: null, conductedPowerDbm: 7 };
      const grid = { thetaDeg: Float64Array.of(90), phiDeg: Float64Array.of(0) };
      const [b] = simulateBeams(model, [beamAll(model, 90, 0)], grid, F0);
      const n = rows * cols;
      expectClose(b.eirpDbm[0] - 7, 10 * Math.log10(n * elementGain(1, 1.5, -20)), 1e-9, `${rows}×${cols}: closed form`);
    }
  });

  it('the element pattern integrates to 4π (gain = directivity) and peaks at 2(q + 1) without floor', () => {
    const grid = fineGrid(0.1, 1);
    for (const [q, floorDb] of [[1, -Infinity], [1.5, -20], [3, -10], [0, 0]] as const) {
      const el = {
        positionM: [0, 0, 0] as const, boresight: [0, 0, 1] as const, q, floorDb,
        polarizationDeg: 0, amplitudeErrorDb: 0, phaseErrorDeg: 0, failed: false,
      };
      const model: ArrayModel = { elements: [el], designFrequencyHz: F0, phaseBits: null, conductedPowerDbm: 0 };
      const [b] = simulateBeams(model, [beamAll(model, 0)], grid, F0);
      // Balanis, Antenna Theory, 4th ed., ch. 2 (directivity of U = cos^q θ over the upper
      // hemisphere is 2(q + 1); from memory) and ∮G dΩ = 4π for a lossless element.
      expectRelClose(integrateLinear(b.eirpDbm, grid.weightSr), 4 * Math.PI, 1e-4, `q = ${q}, floor ${floorDb} dB: 0.1° quadrature`);
      if (floorDb === -Infinity) expectRelClose(10 ** (maxOf(b.eirpDbm) / 10), 2 * (q + 1), 1e-12, 'cos^q peak directivity');
    }
  });

  it('a failed element of N in-phase elements lowers the peak by 20·log10((N − 1)/N)', () => {
    // Closed form: the field sum loses one of N equal terms while each element keeps its power.
    const model = zLineArray(4, 0.5);
    const failed: ArrayModel = { ...model, elements: model.elements.map((e, i) => ({ ...e, failed: i === 1 })) };
    const grid = { thetaDeg: Float64Array.of(90), phiDeg: Float64Array.of(0) };
    const [a] = simulateBeams(model, [beamAll(model, 90)], grid, F0);
    const [b] = simulateBeams(failed, [beamAll(failed, 90)], grid, F0);
    expectClose(b.eirpDbm[0] - a.eirpDbm[0], 20 * Math.log10(3 / 4), 1e-9, 'closed form');
  });
});

describe('DFT beams (orthogonal beams of a λ/2 linear array)', () => {
  it('adjacent beams cross at 1/(N·sin(π/2N)) of the peak field', () => {
    // Mailloux, Phased Array Antenna Handbook (Butler-matrix / orthogonal beams; from memory),
    // values N = 4 → −3.70 dB, N = 8 → −3.87 dB in the reference file (MEMORY, numerically
    // verified). Beams at cos θ = 0 and 2/N; they cross at cos θ = 1/N.
    const expectedDb: Record<number, number> = { 4: -3.7, 8: -3.87 };
    for (const n of [4, 8]) {
      const model = zLineArray(n, 0.5);
      const t1 = (Math.acos(2 / n) * 180) / Math.PI;
      const tc = (Math.acos(1 / n) * 180) / Math.PI;
      const grid = { thetaDeg: Float64Array.of(90, t1, tc), phiDeg: Float64Array.of(0, 0, 0) };
      const [b0, b1] = simulateBeams(model, [beamAll(model, 90, 0, '0'), beamAll(model, t1, 0, '1')], grid, F0);
      const closed = 20 * Math.log10(1 / (n * Math.sin(Math.PI / (2 * n))));
      expectClose(b0.eirpDbm[2] - b0.eirpDbm[0], closed, 1e-9, `N = ${n}, beam 0 at the crossover`);
      expectClose(b1.eirpDbm[2] - b1.eirpDbm[1], closed, 1e-9, `N = ${n}, beam 1 at the crossover`);
      expectClose(closed, expectedDb[n], 0.005, 'reference file value, rounded to 0.01 dB');
    }
  });
});

describe('beam squint with frequency', () => {
  it('a beam steered at f₀ points where cos θ = (f₀/f)·cos θ₀ at frequency f', () => {
    // Mailloux, Phased Array Antenna Handbook (phase-steered arrays squint: sin of the scan
    // angle from broadside scales as f₀/f; from memory). For a z-axis array the scan angle
    // from broadside is 90° − θ, so sin(90° − θ) = cos θ.
    const model = zLineArray(16, 0.5);
    const thetaDeg = Float64Array.from({ length: 9001 }, (_, i) => 30 + i * 0.005);
    const grid = { thetaDeg, phiDeg: new Float64Array(thetaDeg.length) };
    for (const f of [26.5e9, 29.5e9]) {
      const [b] = simulateBeams(model, [beamAll(model, 60)], grid, f);
      let best = 0;
      for (let i = 1; i < b.eirpDbm.length; i++) if (b.eirpDbm[i] > b.eirpDbm[best]) best = i;
      const expected = (Math.acos((F0 / f) * Math.cos(Math.PI / 3)) * 180) / Math.PI;
      expectClose(thetaDeg[best], expected, 0.005, `f = ${f / 1e9} GHz; 0.005° search step`);
    }
    const [atF0] = simulateBeams(model, [beamAll(model, 60)], { thetaDeg: Float64Array.of(60), phiDeg: Float64Array.of(0) }, F0);
    expectClose(atF0.eirpDbm[0], 10 * Math.log10(16), 1e-9, 'no squint at f₀: full array gain on the steering direction');
  });
});
