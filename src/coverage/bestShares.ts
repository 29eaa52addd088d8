import { sphereNormSr } from './sphereNormSr.js';

/**
 * Best share of each beam: the fraction of the sphere where it is the total scan pattern's
 * best beam, Σ w[bestBeam = b] / 4π (Eq. 1; divisor per sphereNormSr, so the shares of a full
 * sphere sum to 1 and those of a partial sphere to Σw/4π). Not compensated per beam (at most
 * n additions of positive terms: relative error ≤ n·ε ≈ 1e-11 for 65k points).
 * Cost O(n).
 * @throws RangeError when a best-beam index is outside [0, beamCount) or lengths differ.
 * @example bestShares(Int32Array.of(0, 1, 1), weights, 2) // [w0, w1 + w2] / 4π
 */
export function bestShares(bestBeam: Int32Array, weightSr: ArrayLike<number>, beamCount: number, solidAngleSr?: number): Float64Array {
  if (bestBeam.length !== weightSr.length) throw new RangeError('bestShares: lengths differ');
  const shares = new Float64Array(beamCount);
  let total = 0;
  for (let i = 0; i < bestBeam.length; i++) {
    const b = bestBeam[i];
    if (!(b >= 0 && b < beamCount)) throw new RangeError(`bestShares: beam index ${b} outside [0, ${beamCount})`);
    shares[b] += weightSr[i];
    total += weightSr[i];
  }
  const norm = sphereNormSr(solidAngleSr ?? total);
  for (let b = 0; b < beamCount; b++) shares[b] /= norm; // Eq. 1
  return shares;
}
