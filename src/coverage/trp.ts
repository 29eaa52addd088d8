import { sphereNormSr } from './sphereNormSr.js';

const LN10_OVER_10 = Math.LN10 / 10;

/**
 * Total radiated power of one beam: TRP = (1/4π) Σ w_i · 10^(EIRP_i/10), back to dBm (Eq. 1;
 * DESIGN.md "TRP"; TS 38.521-2 Annex M.4.3 for Voronoi weights on constant-density grids).
 * For gain patterns the same sum gives the sphere-average gain in dBi (radiation efficiency;
 * directivity = peak − this value). Only meaningful on a full sphere: returns null otherwise
 * (the caller warns 'trp-partial-sphere'). On a full sphere the divisor is Σw (≈ 4π within
 * 1e-6, sphereNormSr), so an isotropic pattern gives TRP = EIRP exactly on any grid.
 * Neumaier-compensated sum, no allocation. Not defined for EIS (the caller passes null).
 * Cost O(n).
 * @throws RangeError when the lengths differ.
 * @example beamTrpDbm(new Float64Array(n).fill(10), grid.weightSr, true) // 10
 */
export function beamTrpDbm(values: ArrayLike<number>, weightSr: ArrayLike<number>, fullSphere: boolean): number | null {
  const n = values.length;
  if (weightSr.length !== n) throw new RangeError(`beamTrpDbm: ${n} values but ${weightSr.length} weights`);
  if (!fullSphere) return null;
  let sum = 0, comp = 0, wSum = 0, wComp = 0;
  for (let i = 0; i < n; i++) {
    const w = weightSr[i];
    const x = w * Math.exp(values[i] * LN10_OVER_10); // Eq. 1
    const t = sum + x;
    comp += Math.abs(sum) >= Math.abs(x) ? sum - t + x : x - t + sum;
    sum = t;
    const u = wSum + w;
    wComp += Math.abs(wSum) >= Math.abs(w) ? wSum - u + w : w - u + wSum;
    wSum = u;
  }
  return 10 * Math.log10((sum + comp) / sphereNormSr(wSum + wComp)); // Eq. 1
}
