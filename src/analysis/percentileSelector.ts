import { sphereNormSr } from '../coverage/sphereNormSr.js';
import type { Quantity } from '../types.js';

/** Cumulative solid angle short of the target by less than this (relative) still reaches it; as the core's percentile. */
const REACH_EPS = 1e-12;

/**
 * A reusable, sort-free evaluator of the solid-angle-weighted percentile of a value array on a
 * fixed grid, for hot loops (beam removal, greedy subset) that evaluate thousands of candidate
 * total scan patterns.
 *
 * Rule (the same step rule as the core's `percentile`): the p-th percentile is the smallest
 * value v with F(v) = (U₋ + Σ wᵢ [xᵢ ≤ v]) / S ≥ p/100 (Eq. 1), where S = sphereNormSr(Σw) (4π,
 * or Σw itself when that is within 1e-6 of 4π) and the unmeasured part U = S − Σ wᵢ counts as
 * worst: at −∞ for eirp/gain (U₋ = U), at +∞ for eis (U₋ = 0). When the level can only be
 * reached inside the unmeasured part the result is null. p = 0 is the minimum (null for
 * eirp/gain on a partial sphere, whose worst is unmeasured); p = 100 is the maximum.
 * A cumulative sum short of the target by less than 1e-12·S reaches it (rounding of Σ w).
 *
 * Method: weighted quickselect (three-way partition around a median-of-three pivot, then recurse
 * into the side that holds the target mass) on scratch copies; expected O(n) per call instead of
 * the O(n log n) sort; no allocation per call.
 * @throws Error when levelPct is outside [0, 100].
 * @example createPercentileSelector(grid.weightSr, 'eirp', 50)(tsp.values) // median EIRP, dBm
 */
export function createPercentileSelector(
  weightSr: Float64Array,
  quantity: Quantity,
  levelPct: number,
): (values: Float64Array) => number | null {
  if (!(levelPct >= 0 && levelPct <= 100)) throw new Error(`percentile level ${levelPct} is outside [0, 100]`);
  const n = weightSr.length;
  let measured = 0, c = 0;
  for (let i = 0; i < n; i++) {
    const t = measured + weightSr[i];
    c += Math.abs(measured) >= weightSr[i] ? measured - t + weightSr[i] : weightSr[i] - t + measured;
    measured = t;
  }
  measured += c;
  const sphereSr = sphereNormSr(measured);
  const below = quantity === 'eis' ? 0 : Math.max(0, sphereSr - measured);
  const eps = REACH_EPS * sphereSr;
  const target = (levelPct / 100) * sphereSr;
  const sv = new Float64Array(n), sw = new Float64Array(n);
  return (values: Float64Array): number | null => {
    if (n === 0) return null;
    if (below > 0 && below >= target - eps) return null; // reached at −∞, inside the unmeasured part
    if (target <= eps) return minimum(values);
    if (below + measured < target - eps) return null; // reached only at +∞ (eis, partial sphere)
    sv.set(values);
    sw.set(weightSr);
    return select(sv, sw, n, target - eps - below); // Eq. 1
  };
}

function minimum(values: Float64Array): number {
  let m = Infinity;
  for (let i = 0; i < values.length; i++) if (values[i] < m) m = values[i];
  return m;
}

/** Smallest v with Σ w[x ≤ v] ≥ target, over sv[0..len), reordering sv/sw in place. */
function select(sv: Float64Array, sw: Float64Array, len: number, target: number): number {
  let lo = 0, hi = len, below = 0;
  for (;;) {
    if (hi - lo <= 16) return smallTail(sv, sw, lo, hi, target - below);
    const a = sv[lo], b = sv[(lo + hi) >>> 1], c = sv[hi - 1];
    const pivot = a < b ? (b < c ? b : a < c ? c : a) : a < c ? a : b < c ? c : b;
    // Dutch-flag partition: [lo, lt) < pivot, [lt, i) == pivot, [gt, hi) > pivot.
    let lt = lo, i = lo, gt = hi, wLess = 0, wEqual = 0;
    while (i < gt) {
      const v = sv[i];
      if (v < pivot) { wLess += sw[i]; swap(sv, sw, lt++, i++); }
      else if (v > pivot) swap(sv, sw, i, --gt);
      else { wEqual += sw[i]; i++; }
    }
    if (below + wLess >= target) hi = lt;
    else if (below + wLess + wEqual >= target) return pivot;
    else { below += wLess + wEqual; lo = gt; }
    if (lo >= hi) return pivot; // rounding left the target just beyond the last value
  }
}

function smallTail(sv: Float64Array, sw: Float64Array, lo: number, hi: number, need: number): number {
  for (let i = lo + 1; i < hi; i++) {
    const v = sv[i], w = sw[i];
    let j = i - 1;
    for (; j >= lo && sv[j] > v; j--) { sv[j + 1] = sv[j]; sw[j + 1] = sw[j]; }
    sv[j + 1] = v; sw[j + 1] = w;
  }
  let acc = 0;
  for (let i = lo; i < hi; i++) {
    acc += sw[i];
    if (acc >= need) return sv[i];
  }
  return sv[hi - 1];
}

function swap(sv: Float64Array, sw: Float64Array, i: number, j: number): void {
  const v = sv[i]; sv[i] = sv[j]; sv[j] = v;
  const w = sw[i]; sw[i] = sw[j]; sw[j] = w;
}
