import type { Quantity } from '../types.js';
import type { WeightedCdf } from './weightedCdf.js';
import { percentilePlan } from './percentileRule.js';


/**
 * Percentile of the solid-angle-weighted CDF over the full sphere: "levelPct p gives the value
 * v with p % of the sphere at or below v" (CONTRACT.md). The rule itself lives in
 * percentileRule.ts (shared with the fast selectors); this reads it off a sorted CDF.
 *
 * Step rule, no interpolation: the smallest distinct value v whose F(v) reaches p/100, with
 * F(v) = (U + Σ w[x ≤ v]) / 4π for eirp/gain and Σ w[x ≤ v] / 4π for eis (Eq. 1); "reaches"
 * allows a relative 1e-12 slack, so weights that sum to 4π(1 − 1e-15) still reach 100 %.
 * Unmeasured part of the sphere U = 4π − Σw counts as the worst value: −∞ for eirp/gain (it
 * sits below every measured value), +∞ for eis. A level that falls into U is not evaluable →
 * null: on a partial sphere every eirp/gain level p ≤ 100·U/4π (including 0 %) and every eis
 * level p > 100·Σw/4π (including 100 %). A full sphere (Σw within 1e-6 of 4π) has U = 0 and
 * divides by Σw (sphereNormSr).
 * Edges: p = 0 → the minimum (when evaluable), p = 100 → the maximum; ties are one step, so a
 * plateau is returned as its value; zero-weight points never move the result.
 * For eis the same CDF of EIS values is read: p = 50 is the median EIS; 100 % is the worst
 * (largest) EIS.
 * Cost O(log n).
 * @throws RangeError when levelPct is not in [0, 100].
 * @example percentile(weightedCdf([1, 2, 3, 4], [π, π, π, π]), 50, 'eirp') // 2
 */
export function percentile(cdf: WeightedCdf, levelPct: number, quantity: Quantity): number | null {
  const { values, cumulativeSr, sphereSr } = cdf;
  const m = values.length;
  const plan = percentilePlan(quantity, levelPct, sphereSr, cdf.measuredSr, m);
  if (plan.mode === 'none') return null;
  if (plan.mode === 'minimum') return values[0];
  let lo = 0, hi = m - 1;
  while (lo < hi) { const mid = (lo + hi) >> 1; if (cumulativeSr[mid] >= plan.reachSr) hi = mid; else lo = mid + 1; } // Eq. 1
  return values[lo];
}
