import { percentile } from './percentile.js';
import { weightedCdf } from './weightedCdf.js';

/** Relative slack when deciding that the level falls exactly on a step boundary (summed weights drift). */
const REL_TOL = 1e-12;

/**
 * The upper share of a pattern by solid angle: the directions whose value lies above the value
 * v at the (100 − topSharePct) % level of the solid-angle-weighted CDF over 4π, e.g. "the link
 * angles in the upper 50 % of EIRP2" of 3GPP TS 38.101-2 §6.6.4 (beam correspondence).
 *
 * Formula: v = percentile(F, 100 − s) (the project's one percentile rule, step rule,
 * src/coverage/percentile.ts); region = { i : x_i > v } when F(v) = (100 − s) % exactly (the
 * level falls on a step boundary: the region is exactly s % of 4π), else { i : x_i ≥ v } (a
 * step of tied values straddles the level: the whole step is inside, the region holds at
 * least s %)                                                                      Eq. (U1)
 * Unmeasured solid angle counts as worst (below every value), so on a partial sphere the region
 * is still s % of 4π. `floor` is the smallest value inside the region.
 * Units: values in dB, weights in sr. Cost O(n log n).
 * @example upperShareRegion(Float64Array.of(1, 2, 3, 4), Float64Array.of(π, π, π, π), 50).regionSr // 2π (values 3 and 4)
 */
export function upperShareRegion(values: Float64Array, weightSr: Float64Array, topSharePct: number):
  { inRegion: Uint8Array; floor: number | null; regionSr: number } {
  const cdf = weightedCdf(values, weightSr);
  const v = percentile(cdf, 100 - topSharePct, 'eirp');
  const inRegion = new Uint8Array(values.length);
  let regionSr = 0;
  if (v === null) return { inRegion, floor: null, regionSr };
  const k = cdf.values.indexOf(v);
  const unmeasured = Math.max(0, cdf.sphereSr - cdf.measuredSr);
  const atOrBelow = unmeasured + cdf.cumulativeSr[k];
  const exact = Math.abs(atOrBelow - ((100 - topSharePct) / 100) * cdf.sphereSr) <= REL_TOL * cdf.sphereSr;
  let floor = Infinity;
  for (let i = 0; i < values.length; i++) {
    if (values[i] > v || (!exact && values[i] === v)) { // Eq. (U1)
      inRegion[i] = 1;
      regionSr += weightSr[i];
      floor = Math.min(floor, values[i]);
    }
  }
  return { inRegion, floor: Number.isFinite(floor) ? floor : null, regionSr };
}
