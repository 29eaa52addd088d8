import type { Quantity } from '../types.js';
import { createPercentileSelector, selectorPlan, weightedSelect } from './percentileSelector.js';
import { isLowerBetter } from '../quantity.js';

/** Unit roundoff doubled (2^-52): the per-operation error allowance of the certainty margin. */
const ROUND = 2 ** -52;

/**
 * Percentile of a base pattern with a sparse patch applied, for hot loops that evaluate many
 * candidates differing from one base in a few points (greedy subset: a candidate beam raises the
 * running total scan pattern where it beats it; beam removal: the runner-up takes over where the
 * removed beam was best). Same rule and same result, bit for bit, as
 * `createPercentileSelector(weightSr, quantity, levelPct)` applied to the patched array:
 * the smallest v with Σ wᵢ [xᵢ ≤ v] ≥ T (Eq. 1, T from `selectorPlan`).
 *
 * Method: `setBase` sorts the base into n/16 equal value bins over [lo, hi] (clamped at the
 * ends, plus one bin each for −∞ and +∞), with per-bin solid angle and member lists (counting
 * sort). `evaluate` moves the weight of each patched point from its old bin to its new one in a
 * copy of the bin masses, scans from the base's crossing bin to the one where the cumulative
 * solid angle crosses T, and selects inside that bin among its unpatched members and the
 * patched points that land there, with the residual target.
 * Exactness: the bin function is monotone, so the bins only narrow the search; the found v is
 * accepted only when its exact masses clear T by a margin δ = (6n + 2·bins + 64)·2⁻⁵²·S that
 * bounds the rounding of both this evaluation and the quickselect's sums in any order (where
 * the true masses are separated by more than the rounding, every summation order decides the
 * same way). Otherwise (a cumulative within δ of T, such as an exact tie at the 50 % mark on
 * a symmetric grid) the patched array is built and the reference selector is called. So are a
 * result of ±0 (equal values with different bits, where the quickselect's pivot decides), p = 0
 * (the minimum) and inputs with NaN.
 * Cost: setBase O(n + bins); evaluate O(patch + bins + |crossing bin|), O(n) on the reference
 * path; no allocation after construction.
 * @throws Error when levelPct is outside [0, 100].
 * @example const e = createPatchedPercentile(w, 'eirp', 50); e.setBase(tsp, 0, 30); e.evaluate(pts, pts.length, beam)
 */
export function createPatchedPercentile(
  weightSr: Float64Array,
  quantity: Quantity,
  levelPct: number,
  fastAllowed = true,
): PatchedPercentile {
  const plan = selectorPlan(weightSr, quantity, levelPct);
  const reference = createPercentileSelector(weightSr, quantity, levelPct);
  const n = plan.n, T = plan.selectTargetSr;
  const fast = fastAllowed && plan.mode === 'select';
  const bins = Math.max(64, Math.ceil(n / 16)), last = bins + 1;
  const margin = (6 * n + 2 * bins + 64) * ROUND * Math.max(plan.sphereSr, plan.measuredSr);
  const size = fast ? n : 0;
  const pointBin = new Int32Array(size), members = new Int32Array(size), mark = new Int32Array(size), newBin = new Int32Array(size);
  const start = new Int32Array(fast ? bins + 3 : 0);
  const mass = new Float64Array(fast ? bins + 2 : 0), cur = new Float64Array(fast ? bins + 2 : 0);
  const gv = new Float64Array(size), gw = new Float64Array(size);
  const scratch = new Float64Array(n);
  const stats = { fast: 0, reference: 0 };
  // Mutable state lives in one object; hot loops copy what they need into locals (fast in V8).
  // k0/p0: the base's crossing bin and the mass before it, where each evaluation starts its scan.
  const st = { base: new Float64Array(0) as Float64Array, lo: 0, inv: 0, stamp: 0, crossCum: 0, k0: 0, p0: 0 };

  const lowerIsBetter = isLowerBetter(quantity);
  const viaReference = (points: Int32Array, count: number, patch: Float64Array, rest: Int32Array | null, restFrom: number): number | null => {
    stats.reference++;
    scratch.set(st.base);
    for (let j = 0; j < count; j++) scratch[points[j]] = patch[points[j]];
    if (rest !== null) {
      for (let j = restFrom; j < rest.length; j++) {
        const i = rest[j];
        if (lowerIsBetter ? patch[i] < scratch[i] : patch[i] > scratch[i]) scratch[i] = patch[i];
      }
    }
    return reference(scratch);
  };
  /** First bin of cur where the cumulative solid angle reaches T (−1: none, rounding); sets crossCum to the mass below it. */
  const crossingBin = (): number => {
    let cum = 0;
    for (let b = 0; b <= last; b++) {
      const m = cur[b];
      if (cum + m >= T) { st.crossCum = cum; return b; }
      cum += m;
    }
    return -1;
  };
  /** Selection among the g gathered members of the crossing bin; undefined unless certain (see above) and inside [lowCut, highCut]. */
  const certified = (g: number, lowCut: number, highCut: number): number | undefined => {
    if (g === 0) return undefined;
    const cum = st.crossCum;
    const v = weightedSelect(gv, gw, g, T - cum); // Eq. 1, inside the crossing bin
    if (!(v >= lowCut && v <= highCut)) return undefined;
    if (v === 0) return undefined; // +0 and −0 tie but differ in bits: which one the quickselect returns depends on its pivots
    let less = 0, equal = 0;
    for (let s = 0; s < g; s++) if (gv[s] < v) less += gw[s]; else if (gv[s] === v) equal += gw[s];
    if (!(cum + less < T - margin && cum + less + equal >= T + margin)) return undefined;
    stats.fast++;
    return v;
  };

  /**
   * Whether the answer is certainly below `below` (or above `above`), judged from the crossing
   * bin k alone: every value in a lower bin is smaller (the bin index is monotone), so mass
   * through bin k ≥ T + δ puts the answer below any value of a higher bin, and mass before bin k
   * < T − δ puts it above any value of a lower bin.
   */
  const outside = (k: number, lo: number, inv: number, below: number, above: number): boolean => {
    if (below > -Infinity && k < binIndex(below, lo, inv, bins) && st.crossCum + cur[k] >= T + margin) return true;
    return above < Infinity && k > binIndex(above, lo, inv, bins) && st.crossCum < T - margin;
  };

  return {
    stats,
    setBase(values: Float64Array, loValue: number, hiValue: number): void {
      st.base = values;
      if (!fast) return;
      [st.lo, st.inv] = binScale(loValue, hiValue, bins);
      const lo = st.lo, inv = st.inv;
      start.fill(0);
      mass.fill(0);
      for (let i = 0; i < n; i++) {
        const v = values[i];
        let b = Math.floor((v - lo) * inv); // monotone bin index (same expression in every loop)
        b = b < 0 ? 1 : b >= bins ? bins : b + 1;
        if (v === -Infinity) b = 0; else if (v === Infinity) b = last;
        pointBin[i] = b;
        start[b + 1]++;
        mass[b] += weightSr[i];
      }
      for (let b = 0; b <= last; b++) start[b + 1] += start[b];
      for (let i = 0; i < n; i++) members[start[pointBin[i]]++] = i;
      for (let b = last; b >= 0; b--) start[b + 1] = start[b]; // undo the fill's advance
      start[0] = 0;
      cur.set(mass);
      const k0 = crossingBin();
      st.k0 = k0 < 0 ? last : k0;
      st.p0 = k0 < 0 ? 0 : st.crossCum;
      if (k0 < 0) for (let b = 0; b < last; b++) st.p0 += mass[b];
    },
    evaluate(
      points: Int32Array, relevant: number, patch: Float64Array, lowCut = -Infinity, highCut = Infinity,
      below = -Infinity, above = Infinity, rest: Int32Array | null = null, restFrom = 0,
    ): number | null | undefined {
      if (plan.mode === 'none') return null;
      if (!fast) return viaReference(points, relevant, patch, rest, restFrom);
      if (++st.stamp === 0x7fffffff) { mark.fill(0); st.stamp = 1; }
      const stamp = st.stamp, lo = st.lo, inv = st.inv, base = st.base, k0 = st.k0;
      cur.set(mass);
      let movedBelow = 0; // change of the mass before bin k0
      for (let j = 0; j < relevant; j++) {
        const i = points[j], v = patch[i], w = weightSr[i], ob = pointBin[i];
        let nb = Math.floor((v - lo) * inv);
        nb = nb < 0 ? 1 : nb >= bins ? bins : nb + 1;
        if (v === -Infinity) nb = 0; else if (v === Infinity) nb = last;
        newBin[j] = nb;
        mark[i] = stamp;
        cur[ob] -= w;
        cur[nb] += w;
        if (ob < k0) movedBelow -= w;
        if (nb < k0) movedBelow += w;
      }
      // Crossing bin: scan from the base's crossing bin, down or up (the rounding of these sums is within δ).
      let k = k0, cum = st.p0 + movedBelow;
      if (cum >= T) {
        do { k--; if (k < 0) break; cum -= cur[k]; } while (cum >= T);
      } else {
        while (k <= last && cum + cur[k] < T) { cum += cur[k]; k++; }
        if (k > last) k = -1;
      }
      if (k < 0) return viaReference(points, relevant, patch, rest, restFrom);
      st.crossCum = cum;
      // Dropped points sit wholly outside [lowCut, highCut], so masses at bounds inside it are exact.
      if (outside(k, lo, inv, below >= lowCut && below <= highCut ? below : -Infinity, above >= lowCut && above <= highCut ? above : Infinity)) { stats.fast++; return undefined; }
      let g = 0;
      for (let s = start[k]; s < start[k + 1]; s++) {
        const i = members[s];
        if (mark[i] !== stamp) { gv[g] = base[i]; gw[g++] = weightSr[i]; }
      }
      for (let j = 0; j < relevant; j++) if (newBin[j] === k) { const i = points[j]; gv[g] = patch[i]; gw[g++] = weightSr[i]; }
      const v = certified(g, lowCut, highCut);
      return v === undefined ? viaReference(points, relevant, patch, rest, restFrom) : v;
    },
    evaluateWhole(values: Float64Array, loValue: number, hiValue: number, below = -Infinity, above = Infinity): number | null | undefined {
      if (plan.mode === 'none') return null;
      if (!fast) { stats.reference++; return reference(values); }
      const [lo, inv] = binScale(loValue, hiValue, bins);
      cur.fill(0);
      for (let i = 0; i < n; i++) {
        const v = values[i];
        let b = Math.floor((v - lo) * inv);
        b = b < 0 ? 1 : b >= bins ? bins : b + 1;
        if (v === -Infinity) b = 0; else if (v === Infinity) b = last;
        newBin[i] = b;
        cur[b] += weightSr[i];
      }
      const k = crossingBin();
      if (k >= 0 && outside(k, lo, inv, below, above)) { stats.fast++; return undefined; }
      let g = 0;
      if (k >= 0) for (let i = 0; i < n; i++) if (newBin[i] === k) { gv[g] = values[i]; gw[g++] = weightSr[i]; }
      const v = k < 0 ? undefined : certified(g, -Infinity, Infinity);
      if (v === undefined) { stats.reference++; return reference(values); }
      return v;
    },
  };
}

/** The bin index of v (the expression the hot loops repeat inline). */
function binIndex(v: number, lo: number, inv: number, bins: number): number {
  let b = Math.floor((v - lo) * inv);
  b = b < 0 ? 1 : b >= bins ? bins : b + 1;
  if (v === -Infinity) b = 0; else if (v === Infinity) b = bins + 1;
  return b;
}

/**
 * Offset and scale of the bin index floor((v − lo)·inv) + 1 for `bins` bins over [lo, hi]. Any
 * range gives the same results (values outside are clamped into the end bins); a range around
 * the answers keeps the crossing bin small. A degenerate range puts every finite value in bin 1.
 */
function binScale(lo: number, hi: number, bins: number): [number, number] {
  const ok = Number.isFinite(lo) && Number.isFinite(hi) && hi > lo;
  return ok ? [lo, bins / (hi - lo)] : [Number.isFinite(lo) ? lo : 0, 0];
}

/** See `createPatchedPercentile`. `stats` counts evaluations by path (for tests and profiling). */
export interface PatchedPercentile {
  /**
   * Sets the base pattern (kept by reference: do not change it before the next setBase) and the
   * value range [lo, hi] spanned by the bins (speed only; clamped outside).
   */
  setBase(values: Float64Array, lo: number, hi: number): void;
  /**
   * Percentile of base with base[i] := patch[i] for i in points[0..relevant) and, for i in
   * rest[restFrom..) (may include points where the patch is not better), base[i] := the better
   * of base[i] and patch[i] (max; min for eis). The caller promises that every rest point whose
   * value changes has base and patch values both below lowCut or both above highCut: only the
   * first list is binned, a result outside [lowCut, highCut] is recomputed on the reference
   * path (inside it such points cannot change any mass at or below the result), and the rest is
   * read only there. When the result is certainly below `below` or above `above` (values of no
   * interest to the caller), undefined may be returned instead. Points must be distinct.
   */
  evaluate(
    points: Int32Array, relevant: number, patch: Float64Array, lowCut?: number, highCut?: number,
    below?: number, above?: number, rest?: Int32Array | null, restFrom?: number,
  ): number | null | undefined;
  /** Percentile of values itself (no base), on bins over [lo, hi] for this call only. */
  evaluateWhole(values: Float64Array, lo: number, hi: number, below?: number, above?: number): number | null | undefined;
  readonly stats: { fast: number; reference: number };
}
