import { NeumaierAccumulator, neumaierAddAt } from '../sphere/neumaierSum.js';
import { sphereNormSr } from './sphereNormSr.js';

/** The solid-angle-weighted distribution of a pattern as a step function over distinct values. */
export interface WeightedCdf {
  /** Distinct values, ascending. */
  values: Float64Array;
  /** cumulativeSr[k] = Σ w[x ≤ values[k]], sr (compensated). */
  cumulativeSr: Float64Array;
  /** Σ w over all points, sr. */
  measuredSr: number;
  /** Divisor of every fraction (sphereNormSr): 4π, or measuredSr on a full sphere. */
  sphereSr: number;
}

/**
 * Solid-angle-weighted CDF: F(v) = Σ w_i [x_i ≤ v] / 4π (Eq. 1; DESIGN.md "CDF").
 *
 * Values with two decimals (the usual export) are ranked without a sort (latticeSteps); others
 * by one sort of a Float64Array copy of the values (native numeric sort) and a binary search
 * per point. Either way ties collapse into one step, each point's weight is added to its value's
 * step in point order, and the steps are accumulated with a Neumaier running sum, so both routes
 * give the same bits. Zero weights are allowed (they add nothing).
 * Cost O(n) for two-decimal values, else O(n log n); four or five typed arrays.
 * @throws RangeError when the lengths differ or a value is NaN.
 * @example weightedCdf([3, 1, 3], [1, 2, 1]) // values [1, 3], cumulativeSr [2, 4]
 */
export function weightedCdf(values: ArrayLike<number>, weightSr: ArrayLike<number>): WeightedCdf {
  return sortedSteps(values, weightSr, false);
}

/** A weighted CDF that also keeps, per input value, the index of its step (for subsetCdf). */
export interface RankedCdf extends WeightedCdf {
  /** stepOf[i]: index in `values` of input value i. */
  stepOf: Int32Array;
}

/**
 * weightedCdf (same definition, same bits) keeping each input value's step index, so the CDF of
 * any subset of the points (subsetCdf) needs no second sort. Values with two decimals are
 * ranked without a sort (latticeSteps).
 * Cost O(n log n), O(n) for two-decimal values; five typed arrays.
 * @throws RangeError when the lengths differ or a value is NaN.
 * @example rankedCdf([3, 1, 3], [1, 2, 1]).stepOf // [1, 0, 1]
 */
export function rankedCdf(values: ArrayLike<number>, weightSr: ArrayLike<number>): RankedCdf {
  return sortedSteps(values, weightSr, true) as RankedCdf;
}

/**
 * weightedCdf by its sort route alone, whatever the values: the route for values off the
 * two-decimal lattice, and the independent oracle the lattice route is tested against
 * (test/coverage/weightedCdf.test.ts). Same definition, same bits; O(n log n).
 * @example sortedCdf([3, 1, 3], [1, 2, 1]) // values [1, 3], cumulativeSr [2, 4]
 */
export function sortedCdf(values: ArrayLike<number>, weightSr: ArrayLike<number>): WeightedCdf {
  return sortedSteps(values, weightSr, false, false);
}

/** weightedCdf's work, with the step index of each value kept when asked (rankedCdf); the lattice route unless `allowLattice` is false. */
function sortedSteps(values: ArrayLike<number>, weightSr: ArrayLike<number>, keepSteps: boolean, allowLattice = true): WeightedCdf | RankedCdf {
  const n = values.length;
  if (weightSr.length !== n) throw new RangeError(`weightedCdf: ${n} values but ${weightSr.length} weights`);
  const lattice = allowLattice ? latticeSteps(values) : null;
  if (lattice !== null) {
    const { distinct, stepOf } = lattice;
    const stepSr = new Float64Array(distinct.length);
    const stepComp = new Float64Array(distinct.length);
    for (let i = 0; i < n; i++) neumaierAddAt(stepSr, stepComp, stepOf[i], weightSr[i]);
    const cdf = accumulate(distinct, stepSr, stepComp, null);
    return keepSteps ? { ...cdf, stepOf } : cdf;
  }
  const sorted = Float64Array.from(values).sort();
  if (n > 0 && Number.isNaN(sorted[n - 1])) throw new RangeError('weightedCdf: NaN value');
  let m = 0;
  for (let i = 0; i < n; i++) if (i === 0 || sorted[i] !== sorted[m - 1]) sorted[m++] = sorted[i];
  const distinct = sorted.slice(0, m);
  const stepSr = new Float64Array(m);
  const stepComp = new Float64Array(m);
  const stepOf = keepSteps ? new Int32Array(n) : null;
  for (let i = 0; i < n; i++) {
    const v = values[i];
    let lo = 0, hi = m - 1;
    while (lo < hi) { const mid = (lo + hi) >> 1; if (distinct[mid] < v) lo = mid + 1; else hi = mid; }
    if (stepOf !== null) stepOf[i] = lo;
    neumaierAddAt(stepSr, stepComp, lo, weightSr[i]);
  }
  const cdf = accumulate(distinct, stepSr, stepComp, null);
  return stepOf === null ? cdf : { ...cdf, stepOf };
}

/**
 * Distinct values and each value's step without a sort, for patterns written with at most two
 * decimals (v = k/100 bit for bit, k = ⌊100·v + 0.5⌋, the usual export; a total scan pattern of a 64-beam 1° unit
 * has 64,442 values but about a thousand distinct ones): the values on that lattice are counted
 * by k, the few others (merged pole or seam samples) sorted apart and merged in by value. The
 * same distinct values in the same order as sorting all of them, so the same CDF bit for bit.
 * −0 (an export's "-0.00") shares +0's lattice point, as it shares +0's step when sorted, and
 * that step's value is then −0, the one sorting puts first (TypedArray sort orders −0 before +0).
 * Null (the caller sorts) for an empty pattern, a NaN, ±∞, |v| beyond 1e10, a lattice span
 * over 2n + 1024 steps, or more than n/4 values off it.
 * Cost O(n + span), n log n only for the values off the lattice.
 */
function latticeSteps(values: ArrayLike<number>): { distinct: Float64Array; stepOf: Int32Array } | null {
  const n = values.length;
  if (n === 0) return null;
  let kMin = Infinity;
  let kMax = -Infinity;
  let off = 0;
  let negativeZero = false;
  for (let i = 0; i < n; i++) {
    const v = values[i];
    if (!(v - v === 0)) return null;
    if (v === 0 && 1 / v < 0) negativeZero = true;
    // ⌊100·v + 0.5⌋ (never −0, which makes an optimized loop bail out) is k for every v = k/100.
    const k = Math.floor(v * 100 + 0.5);
    if (k / 100 !== v) { off++; continue; }
    if (k < kMin) kMin = k;
    if (k > kMax) kMax = k;
  }
  // Beyond |k| = 1e12 neighbouring k/100 might round to one double; no pattern gets there.
  if (off > n / 4 || Math.abs(kMin) > 1e12 || Math.abs(kMax) > 1e12) return null;
  const span = kMin <= kMax ? kMax - kMin + 1 : 0;
  if (span > 2 * n + 1024) return null;
  const slot = new Int32Array(span).fill(-1);
  const others = new Float64Array(off);
  let o = 0;
  for (let i = 0; i < n; i++) {
    const v = values[i];
    const k = Math.floor(v * 100 + 0.5);
    if (k / 100 === v) slot[k - kMin] = 0;
    else others[o++] = v;
  }
  others.sort();
  let oc = 0;
  for (let j = 0; j < off; j++) if (j === 0 || others[j] !== others[oc - 1]) others[oc++] = others[j];
  let used = 0;
  for (let k = 0; k < span; k++) if (slot[k] === 0) used++;
  // Merge the lattice values (ascending k) with the others (ascending); they never tie (a value
  // equal to some k/100 is on the lattice).
  const distinct = new Float64Array(used + oc);
  const otherStep = new Int32Array(oc);
  let d = 0;
  let j = 0;
  for (let k = 0; k < span; k++) {
    if (slot[k] !== 0) continue;
    const v = k + kMin === 0 && negativeZero ? -0 : (k + kMin) / 100;
    while (j < oc && others[j] < v) { otherStep[j] = d; distinct[d++] = others[j++]; }
    slot[k] = d;
    distinct[d++] = v;
  }
  while (j < oc) { otherStep[j] = d; distinct[d++] = others[j++]; }
  const stepOf = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    const v = values[i];
    const k = Math.floor(v * 100 + 0.5);
    if (k / 100 === v) { stepOf[i] = slot[k - kMin]; continue; }
    let lo = 0, hi = oc - 1;
    while (lo < hi) { const mid = (lo + hi) >> 1; if (others[mid] < v) lo = mid + 1; else hi = mid; }
    stepOf[i] = otherStep[lo];
  }
  return { distinct, stepOf };
}

/**
 * The weighted CDF of a subset of a ranked CDF's points: point j of the subset is point
 * index[j] of the parent, with weight weightSr[j] (a sub-grid re-weights its points). Equal,
 * bit for bit, to weightedCdf(values at index, weightSr): the subset's distinct values are the
 * parent's steps that it uses, in the same order, and each step's weights are added in j order
 * as weightedCdf adds them. No sort.
 * Cost O(k + m) for k subset points and m parent steps; four typed arrays of m.
 * @throws RangeError when index and weightSr differ in length.
 * @example subsetCdf(rankedCdf([3, 1, 3], [1, 2, 1]), Int32Array.of(0, 2), [5, 5]) // values [3], cumulativeSr [10]
 */
export function subsetCdf(parent: RankedCdf, index: Int32Array, weightSr: ArrayLike<number>): WeightedCdf {
  const k = index.length;
  if (weightSr.length !== k) throw new RangeError(`subsetCdf: ${k} points but ${weightSr.length} weights`);
  const m = parent.values.length;
  const used = new Uint8Array(m);
  const stepSr = new Float64Array(m);
  const stepComp = new Float64Array(m);
  for (let j = 0; j < k; j++) {
    const s = parent.stepOf[index[j]];
    used[s] = 1;
    neumaierAddAt(stepSr, stepComp, s, weightSr[j]);
  }
  return accumulate(parent.values, stepSr, stepComp, used);
}

/** Running compensated sum of the steps (those marked `used`, or all), Eq. 1's numerator. */
function accumulate(steps: Float64Array, stepSr: Float64Array, stepComp: Float64Array, used: Uint8Array | null): WeightedCdf {
  let m = steps.length;
  let distinct = steps;
  if (used !== null) {
    m = 0;
    for (let k = 0; k < steps.length; k++) if (used[k] === 1) m++;
    distinct = new Float64Array(m);
  }
  const cumulativeSr = new Float64Array(m);
  const running = new NeumaierAccumulator();
  for (let k = 0, out = 0; k < steps.length; k++) {
    if (used !== null && used[k] === 0) continue;
    running.add(stepSr[k] + stepComp[k]);
    distinct[out] = steps[k];
    cumulativeSr[out++] = running.total(); // Eq. 1 (numerator)
  }
  const measuredSr = m > 0 ? cumulativeSr[m - 1] : 0;
  return { values: distinct, cumulativeSr, measuredSr, sphereSr: sphereNormSr(measuredSr) };
}
