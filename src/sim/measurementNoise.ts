import { createRng } from './prng.js';
import type { SimulatedBeam } from './types.js';

/**
 * Seeded chamber measurement noise on simulated beams: each polarization component gets the
 * receiver's noise floor added in linear power, then a log-normal ripple of σ dB.
 * Formula: P'_c = (P_c + P_floor) · 10^(σ z / 10), z ~ N(0, 1) per sample and component;
 * EIRP' = P'_θ + P'_φ (power sum of the components, DESIGN.md polarization rule).      Eq. (N1)
 * Units: sigmaDb in dB, noiseFloorDbm in dBm (per component); output dBm.
 * Boundary rule: sigmaDb = 0 and noiseFloorDbm = −Infinity return the values unchanged
 * (copies); draws are taken in beam, then point, then θ-before-φ order, so the same seed and
 * inputs give the same output.
 * Cost: O(beams · points).
 * @example
 * applyMeasurementNoise(beams, { sigmaDb: 0.2, noiseFloorDbm: -25, seed: 11 });
 */
export function applyMeasurementNoise(
  beams: SimulatedBeam[],
  opts: { sigmaDb: number; noiseFloorDbm: number; seed: number },
): SimulatedBeam[] {
  const rng = createRng(opts.seed);
  const floorMw = 10 ** (opts.noiseFloorDbm / 10);
  // 10^(x/10) = e^{x·ln10/10}: exp is several times faster than pow on V8.
  const toLin = Math.LN10 / 10;
  const toDb = 10 / Math.LN10;
  const ripple = opts.sigmaDb * toLin;
  return beams.map((b) => {
    const n = b.eirpDbm.length;
    const eirpThetaDbm = new Float64Array(n);
    const eirpPhiDbm = new Float64Array(n);
    const eirpDbm = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const pt = (Math.exp(b.eirpThetaDbm[i] * toLin) + floorMw) * Math.exp(ripple * rng.normal());
      const pf = (Math.exp(b.eirpPhiDbm[i] * toLin) + floorMw) * Math.exp(ripple * rng.normal());
      eirpThetaDbm[i] = toDb * Math.log(pt);
      eirpPhiDbm[i] = toDb * Math.log(pf);
      eirpDbm[i] = toDb * Math.log(pt + pf); // Eq. (N1)
    }
    return { id: b.id, eirpDbm, eirpThetaDbm, eirpPhiDbm };
  });
}
