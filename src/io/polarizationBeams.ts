import { isLowerBetter } from '../quantity.js';
import { powerSumDbArrays } from '../units.js';
import type { RawBeam } from './types.js';

/**
 * The raw beams a θ/φ value pair gives, by quantity.
 *
 * - eis: the two components, each its own beam tagged with its polarization; no total. A power
 *   sum of two sensitivities means nothing (it would make −90/−90 dBm read −86.99 dBm, worse than
 *   either): each polarization is judged on its own (3GPP TS 38.101-2 §7, receive requirements in
 *   each of two orthogonal polarizations; verify against the current release).
 * - eirp / gain: the total 10·log10(10^(θ/10) + 10^(φ/10)) (DESIGN.md "Polarization pair"; the
 *   transmit requirements use the total component) untagged, which carries the verdict, plus both
 *   components tagged, for per-polarization metrics beside it.
 *
 * Cost: O(samples); the total is one new array, the components are the arrays passed in.
 * @example polarizationBeams(base, t, p).map((b) => b.polarization) // eirp: [undefined, 'theta', 'phi']
 */
export function polarizationBeams(base: Omit<RawBeam, 'values'>, thetaDb: Float64Array, phiDb: Float64Array): RawBeam[] {
  const theta: RawBeam = { ...base, values: thetaDb, polarization: 'theta' };
  const phi: RawBeam = { ...base, values: phiDb, polarization: 'phi' };
  if (isLowerBetter(base.quantity)) return [theta, phi]; // a sensitivity: the components are never summed
  return [{ ...base, values: powerSumDbArrays(thetaDb, phiDb) }, theta, phi];
}
