import { powerSumDbArrays } from '../units.js';
import type { RawBeam } from './types.js';

/**
 * The raw beams a polarization pair (two orthogonal components: θ/φ, co/cross, H/V, LHCP/RHCP)
 * gives: today one beam with the total 10·log10(10^(a/10) + 10^(b/10)) (DESIGN.md "Polarization
 * pair", the same power sum as the long layout's _theta/_phi pair). The receive side (issue 13)
 * owns how an EIS pair combines; layouts hand every pair here, so that rule lives in one place.
 * Cost: O(samples).
 * @example polarizationBeams(base, Float64Array.of(3), Float64Array.of(3))[0].values[0] // 6.0103
 */
export function polarizationBeams(base: Omit<RawBeam, 'values'>, firstDb: Float64Array, secondDb: Float64Array): RawBeam[] {
  return [{ ...base, values: powerSumDbArrays(firstDb, secondDb) }];
}
