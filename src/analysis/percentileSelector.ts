import { sphereNormSr } from '../coverage/sphereNormSr.js';
import type { Quantity } from '../types.js';
import { neumaierSum } from '../sphere/neumaierSum.js';
import { percentilePlan } from '../coverage/percentileRule.js';


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
  const plan = selectorPlan(weightSr, quantity, levelPct);
  const { n, mode, selectTargetSr } = plan;
  const sv = new Float64Array(n), sw = new Float64Array(n);
  return (values: Float64Array): number | null => {
    if (mode === 'none') return null;
    if (mode === 'minimum') return minimum(values);
    sv.set(values);
    sw.set(weightSr);
    return weightedSelect(sv, sw, n, selectTargetSr); // Eq. 1
  };
}

/**
 * The value-independent part of the selector (Eq. 1 of `createPercentileSelector`), shared with
 * the incremental evaluator so both apply the same thresholds: `mode` 'none' (not evaluable:
 * empty grid, or the level lies in the unmeasured part), 'minimum' (p = 0 on a reachable
 * sphere), else 'select': the answer is the smallest v with Σ wᵢ [xᵢ ≤ v] ≥ selectTargetSr, the
 * sum in any order (the 1e-12 slack and the unmeasured share already folded in).
 * `sphereSr` is S, `measuredSr` the Neumaier Σw. Cost O(n).
 * @throws Error when levelPct is outside [0, 100].
 */
export function selectorPlan(weightSr: Float64Array, quantity: Quantity, levelPct: number): SelectorPlan {
  const n = weightSr.length;
  const measured = neumaierSum(weightSr);
  const sphereSr = sphereNormSr(measured);
  const plan = percentilePlan(quantity, levelPct, sphereSr, measured, n); // the core's rule (coverage/percentileRule.ts)
  return { n, mode: plan.mode, selectTargetSr: plan.reachSr, sphereSr, measuredSr: measured };
}

export interface SelectorPlan {
  n: number;
  mode: 'none' | 'minimum' | 'select';
  selectTargetSr: number;
  sphereSr: number;
  measuredSr: number;
}

function minimum(values: Float64Array): number {
  let m = Infinity;
  for (let i = 0; i < values.length; i++) if (values[i] < m) m = values[i];
  return m;
}

/** Smallest v with Σ w[x ≤ v] ≥ target, over sv[0..len), reordering sv/sw in place. Expected O(len). */
export function weightedSelect(sv: Float64Array, sw: Float64Array, len: number, target: number): number {
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
