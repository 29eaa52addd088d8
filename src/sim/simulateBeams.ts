import { unitVector } from '../sphere/direction.js';
import { elementGain } from './elementPattern.js';
import { C_M_PER_S, excitation } from './steering.js';
import type { ArrayModel, SampleGrid, SimulatedBeam, SteeringBeam } from './types.js';

const DEG = Math.PI / 180;

/**
 * EIRP of every codeword of an array model in every sample direction, at any frequency.
 * The steering phases are fixed at the design frequency, so evaluating at f ≠ f₀ makes the
 * beams squint (sin of the scan angle scales about f₀/f).
 *
 * Formula (array factor with element patterns, Balanis, Antenna Theory, 4th ed., §6.1
 * pattern multiplication generalized to elements with their own patterns and positions):
 * E_c(û) = Σₙ wₙ · p_c,n · √Gₙ(û) · e^{j k û·rₙ},  k = 2π f / c               Eq. (A1)
 * EIRP_c = |E_c|² (mW), c ∈ {θ, φ}, p_θ = cos χₙ, p_φ = sin χₙ; EIRP = EIRP_θ + EIRP_φ.
 * With N identical ideal elements in phase this gives EIRP = P·N·G (array gain N).
 * Units: frequencyHz in Hz; outputs in dBm (−Infinity where the field is exactly zero).
 * Boundary rule: the polarization split χ is constant over the sphere (a model
 * simplification; a real element's θ/φ split varies with direction).
 * Cost: O(points · elements) trig for the beam-independent element terms, then
 * O(beams · points · driven elements) multiply-adds.
 * @throws Error when a codeword names an element the model does not have.
 * @example
 * const beams = simulateBeams(model, codebook, regularGrid({ thetaStepDeg: 5, phiStepDeg: 5 }), 28e9);
 */
export function simulateBeams(
  model: ArrayModel,
  codebook: SteeringBeam[],
  grid: SampleGrid,
  frequencyHz: number,
): SimulatedBeam[] {
  const nPts = grid.thetaDeg.length;
  const nEl = model.elements.length;
  const k = (2 * Math.PI * frequencyHz) / C_M_PER_S;
  // h[n·nPts + i] = √G_n(û_i) · e^{j k û_i·r_n}: beam-independent, computed once.
  const hRe = new Float64Array(nEl * nPts);
  const hIm = new Float64Array(nEl * nPts);
  for (let i = 0; i < nPts; i++) {
    const [ux, uy, uz] = unitVector(grid.thetaDeg[i], grid.phiDeg[i]);
    for (let n = 0; n < nEl; n++) {
      const el = model.elements[n];
      const b = el.boresight;
      const r = el.positionM;
      const amp = Math.sqrt(elementGain(ux * b[0] + uy * b[1] + uz * b[2], el.q, el.floorDb));
      const phase = k * (ux * r[0] + uy * r[1] + uz * r[2]);
      hRe[n * nPts + i] = amp * Math.cos(phase);
      hIm[n * nPts + i] = amp * Math.sin(phase);
    }
  }
  const polTheta = model.elements.map((el) => Math.cos(el.polarizationDeg * DEG));
  const polPhi = model.elements.map((el) => Math.sin(el.polarizationDeg * DEG));
  return codebook.map((beam) => {
    const w = excitation(model, beam);
    const driven = beam.elements.filter((n) => w.re[n] !== 0 || w.im[n] !== 0);
    const tRe = new Float64Array(nPts);
    const tIm = new Float64Array(nPts);
    const fRe = new Float64Array(nPts);
    const fIm = new Float64Array(nPts);
    for (const n of driven) {
      const wr = w.re[n];
      const wi = w.im[n];
      const ct = polTheta[n];
      const cf = polPhi[n];
      const off = n * nPts;
      for (let i = 0; i < nPts; i++) {
        const er = wr * hRe[off + i] - wi * hIm[off + i]; // Eq. (A1)
        const ei = wr * hIm[off + i] + wi * hRe[off + i];
        tRe[i] += ct * er;
        tIm[i] += ct * ei;
        fRe[i] += cf * er;
        fIm[i] += cf * ei;
      }
    }
    const eirpThetaDbm = new Float64Array(nPts);
    const eirpPhiDbm = new Float64Array(nPts);
    const eirpDbm = new Float64Array(nPts);
    for (let i = 0; i < nPts; i++) {
      const pt = tRe[i] * tRe[i] + tIm[i] * tIm[i];
      const pf = fRe[i] * fRe[i] + fIm[i] * fIm[i];
      eirpThetaDbm[i] = 10 * Math.log10(pt);
      eirpPhiDbm[i] = 10 * Math.log10(pf);
      eirpDbm[i] = 10 * Math.log10(pt + pf);
    }
    return { id: beam.id, eirpDbm, eirpThetaDbm, eirpPhiDbm };
  });
}
