import { describe, it, expect } from 'vitest';
import { expectClose } from '../helpers/expectClose.js';
import {
  applyMeasurementNoise, createRng, eisFromEirp, excitation, failElement, handsetModule, perturbElements,
  quantizePhase, simulateBeams, regularGrid,
} from '../../src/sim/index.js';
import type { ArrayModel } from '../../src/sim/index.js';
import { beamAll, zLineArray } from './helpers.js';
import { maxOf } from './quadrature.js';

const F0 = 28e9;
const one = { thetaDeg: Float64Array.of(90), phiDeg: Float64Array.of(0) };

describe('prng', () => {
  it('is reproducible and has the moments of U(0,1) and N(0,1)', () => {
    const a = createRng(42);
    const b = createRng(42);
    for (let i = 0; i < 10; i++) expect(a.uniform()).toBe(b.uniform());
    const r = createRng(7);
    const n = 40000;
    let su = 0, sz = 0, szz = 0;
    for (let i = 0; i < n; i++) {
      const u = r.uniform();
      expect(u >= 0 && u < 1).toBe(true);
      su += u;
      const z = r.normal();
      sz += z;
      szz += z * z;
    }
    // Standard errors: 0.29/√n = 0.0014 (uniform mean), 1/√n = 0.005 (normal mean), √(2/n) = 0.007 (variance); ~5σ bounds.
    expectClose(su / n, 0.5, 0.007, 'uniform mean');
    expectClose(sz / n, 0, 0.025, 'normal mean');
    expectClose(szz / n, 1, 0.035, 'normal variance');
  });
});

describe('phase quantization', () => {
  it('rounds to multiples of 2π/2ⁿ and leaves ideal shifters alone', () => {
    expect(quantizePhase(1.234, null)).toBe(1.234);
    expectClose(quantizePhase((50 * Math.PI) / 180, 3), Math.PI / 4, 1e-15, '3 bits: 45° steps');
    expectClose(quantizePhase((-100 * Math.PI) / 180, 2), -Math.PI / 2, 1e-15, '2 bits: 90° steps');
  });

  it('costs gain on a scanned beam, and the loss shrinks with more bits', () => {
    const base = zLineArray(16, 0.5);
    const peakAt = (bits: number | null): number => {
      const model: ArrayModel = { ...base, phaseBits: bits };
      const thetaDeg = Float64Array.from({ length: 1201 }, (_, i) => 30 + i * 0.05);
      const [b] = simulateBeams(model, [beamAll(model, 57)], { thetaDeg, phiDeg: new Float64Array(1201) }, F0);
      return maxOf(b.eirpDbm);
    };
    const ideal = peakAt(null);
    const l1 = ideal - peakAt(1);
    const l3 = ideal - peakAt(3);
    const l6 = ideal - peakAt(6);
    // Quantization lobes/loss: a 1-bit shifter loses ≥ 2 dB (|E[e^{jε}]|², ε ~ U(−π/2, π/2) → (2/π)², −3.9 dB for
    // random phases, common practice estimate); 3 bits ≈ 0.2 dB; 6 bits almost nothing.
    expect(l1).toBeGreaterThan(2);
    expect(l3).toBeGreaterThan(0);
    expect(l3).toBeLessThan(0.5);
    expect(l6).toBeLessThan(0.02);
  });
});

describe('element errors', () => {
  it('a common phase error changes nothing, a common amplitude error shifts EIRP by itself', () => {
    const model = zLineArray(4, 0.5);
    const grid = regularGrid({ thetaStepDeg: 15, phiStepDeg: 30 });
    const [ref] = simulateBeams(model, [beamAll(model, 70)], grid, F0);
    const shifted: ArrayModel = { ...model, elements: model.elements.map((e) => ({ ...e, phaseErrorDeg: 33, amplitudeErrorDb: 1.5 })) };
    const [b] = simulateBeams(shifted, [beamAll(shifted, 70)], grid, F0);
    for (let i = 0; i < grid.thetaDeg.length; i++) expectClose(b.eirpDbm[i] - ref.eirpDbm[i], 1.5, 1e-9, 'common error');
  });

  it('perturbElements is seeded and only touches the chosen elements; failElement validates its index', () => {
    const model = zLineArray(4, 0.5);
    const a = perturbElements(model.elements, { amplitudeSigmaDb: 1, phaseSigmaDeg: 20, seed: 5, only: [2] });
    const b = perturbElements(model.elements, { amplitudeSigmaDb: 1, phaseSigmaDeg: 20, seed: 5, only: [2] });
    expect(a).toEqual(b);
    expect(a[0].phaseErrorDeg).toBe(0);
    expect(a[2].phaseErrorDeg).not.toBe(0);
    expect(failElement(model.elements, 3)[3].failed).toBe(true);
    expect(() => failElement(model.elements, 4)).toThrow(/no element 4/);
    const w = excitation({ ...model, elements: failElement(model.elements, 0) }, beamAll(model, 90));
    expect([w.re[0], w.im[0]]).toEqual([0, 0]);
  });

  it('random phase errors lower the peak on average (Ruze-like loss ≈ σ² in nepers of power)', () => {
    // Common practice: random phase error σ (rad) keeps a fraction ≈ e^{−σ²} of the peak power
    // for many elements. 64 elements, σ = 30°: e^{−0.274} → −1.19 dB; averaged over 20 seeds.
    const model = zLineArray(64, 0.5);
    let loss = 0;
    for (let s = 0; s < 20; s++) {
      const m: ArrayModel = { ...model, elements: perturbElements(model.elements, { amplitudeSigmaDb: 0, phaseSigmaDeg: 30, seed: s }) };
      const thetaDeg = Float64Array.from({ length: 201 }, (_, i) => 85 + i * 0.05);
      const [b] = simulateBeams(m, [beamAll(m, 90)], { thetaDeg, phiDeg: new Float64Array(201) }, F0);
      loss += 10 * Math.log10(64) - maxOf(b.eirpDbm);
    }
    expectClose(loss / 20, 1.19, 0.35, 'Ruze estimate; seed-average spread ≈ 0.1 dB plus the 1/N term');
  });
});

describe('polarization split and EIS', () => {
  it('χ = 45° puts half the power in each component and keeps the total', () => {
    const model = zLineArray(4, 0.5);
    const slant: ArrayModel = { ...model, elements: model.elements.map((e) => ({ ...e, polarizationDeg: 45 })) };
    const [a] = simulateBeams(model, [beamAll(model, 90)], one, F0);
    const [b] = simulateBeams(slant, [beamAll(slant, 90)], one, F0);
    expectClose(b.eirpDbm[0], a.eirpDbm[0], 1e-9, 'total unchanged');
    expectClose(b.eirpThetaDbm[0], a.eirpDbm[0] - 10 * Math.log10(2), 1e-9, 'θ half');
    expectClose(b.eirpPhiDbm[0], a.eirpDbm[0] - 10 * Math.log10(2), 1e-9, 'φ half');
    expect(a.eirpPhiDbm[0]).toBe(-Infinity);
  });

  it('EIS mirrors the gain pattern', () => {
    expect(Array.from(eisFromEirp(Float64Array.of(25, 10), 13, -95))).toEqual([-107, -92]);
  });
});

describe('measurement noise', () => {
  it('is seeded, has σ dB spread, and adds the floor in linear power', () => {
    const model = zLineArray(4, 0.5);
    const grid = regularGrid({ thetaStepDeg: 1, phiStepDeg: 2 });
    const clean = simulateBeams(model, [beamAll(model, 90)], grid, F0);
    const n1 = applyMeasurementNoise(clean, { sigmaDb: 0.3, noiseFloorDbm: -Infinity, seed: 9 });
    const n2 = applyMeasurementNoise(clean, { sigmaDb: 0.3, noiseFloorDbm: -Infinity, seed: 9 });
    expect(n1[0].eirpDbm).toEqual(n2[0].eirpDbm);
    let s = 0, ss = 0;
    const n = grid.thetaDeg.length;
    for (let i = 0; i < n; i++) {
      const d = n1[0].eirpDbm[i] - clean[0].eirpDbm[i];
      s += d;
      ss += d * d;
    }
    const sd = Math.sqrt(ss / n - (s / n) ** 2);
    // Only the θ component carries power (χ = 0), so the total's ripple is one N(0, σ) draw;
    // the sample σ of 32,580 draws has a standard error of 0.3/√(2n) = 0.0012 dB.
    expectClose(sd, 0.3, 0.006, 'sample standard deviation of the dB ripple');
    const floored = applyMeasurementNoise(clean, { sigmaDb: 0, noiseFloorDbm: -30, seed: 1 });
    expectClose(floored[0].eirpPhiDbm[0], -30, 1e-9, 'empty component reads the floor');
  });
});

describe('handset module', () => {
  it('has 8 elements, 16 beams, and each beam peaks near P + 10·log10(4·G(0))', () => {
    const { model, codebook } = handsetModule({ conductedPowerDbm: 13, phaseBits: null, backElementQ: 1.5, edgeElementQ: 1.5, floorDb: -18 });
    expect(model.elements.length).toBe(8);
    expect(codebook.map((b) => b.id)).toEqual(Array.from({ length: 16 }, (_, i) => String(i)));
    expect(handsetModule({ conductedPowerDbm: 13, extraBeams: 48 }).codebook.length).toBe(64);
    // Broadside beam of each 4-element face, ideal shifters: P + 10·log10(4·G(0)) exactly.
    const grid = { thetaDeg: Float64Array.of(90, 90), phiDeg: Float64Array.of(180, 90) };
    const sim = simulateBeams(model, codebook, grid, 28e9);
    const f = 10 ** -1.8; // −18 dB floor, q = 1.5: G(0) = 1 / ((1 − f)/(2·2.5) + f), Eq. (E1)
    const g0 = 10 * Math.log10(4 / ((1 - f) / 5 + f));
    expectClose(sim[4].eirpDbm[0], 13 + g0, 1e-9, 'back 2×2, beam 4 = (90°, 180°)');
    expectClose(sim[12].eirpDbm[1], 13 + g0, 1e-9, 'edge 1×4, beam 12 = (90°, 90°)');
  });
});
