import { powerSumDb } from '../units.js';

/**
 * Combined sensitivity of two orthogonal polarizations: the EIS a receiver would have if it used
 * both components, combined the way total isotropic sensitivity adds polarizations.
 *
 * Formula: 1/EIS = 1/EIS_θ + 1/EIS_φ in linear power (mW), i.e.
 * EIS = −10·log10(10^(−EIS_θ/10) + 10^(−EIS_φ/10)) dBm                          Eq. (S1)
 * (reference notes ../shared/reference/fr2-requirements.md, "Receive requirements and
 * polarization"; the harmonic rule of total isotropic sensitivity). Two equal components give a
 * value 10·log10(2) = 3.01 dB better (lower) than either. This is an explicit, named view: the
 * default judges each polarization on its own, and EIS values are never power-summed.
 * Units: dBm in, dBm out. Boundary rule: +∞ (no sensitivity in one component) leaves the other.
 * Cost: O(1) per point; the power sum of src/units.ts on −EIS, so nothing overflows.
 * @example combinedSensitivityDbm(-90, -90) // −93.0103
 */
export function combinedSensitivityDbm(thetaDbm: number, phiDbm: number): number {
  return -powerSumDb(-thetaDbm, -phiDbm); // Eq. (S1): 1/EIS is a power, summed by the one power-sum owner
}

/** Eq. (S1) element-wise over two equally long dBm arrays. @throws RangeError when the lengths differ. */
export function combinedSensitivityArrays(thetaDbm: Float64Array, phiDbm: Float64Array): Float64Array {
  if (thetaDbm.length !== phiDbm.length) throw new RangeError(`combinedSensitivityArrays: lengths ${thetaDbm.length} and ${phiDbm.length} differ`);
  const out = new Float64Array(thetaDbm.length);
  for (let i = 0; i < out.length; i++) out[i] = combinedSensitivityDbm(thetaDbm[i], phiDbm[i]);
  return out;
}
