// Test oracle: the straightforward implementations of greedySubset, beamRemoval and the
// weighted quickselect as they were before the incremental fast path (commit 9863d66), kept
// verbatim apart from names and imports, so the fast path can be compared bit for bit.
// Cost O(B²·n) (greedy) and O(B·n) (removal); test sizes only.
import { sphereNormSr } from '../../src/coverage/sphereNormSr.js';
import type { BeamRemoval, BeamSubset, Quantity, SphereGrid } from '../../src/types.js';
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
export function straightSelector(
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
export function straightGreedySubset(
  grid: SphereGrid,
  beams: Float64Array[],
  ids: string[],
  quantity: Quantity,
  levelPct: number,
  toleranceDb = 0.5,
): BeamSubset {
  if (beams.length !== ids.length) throw new Error(`greedySubset: ${beams.length} beams but ${ids.length} ids`);
  if (!(toleranceDb >= 0)) throw new Error(`greedySubset: tolerance ${toleranceDb} dB must be ≥ 0`);
  const n = grid.weightSr.length, w = grid.weightSr;
  const lowerIsBetter = quantity === 'eis';
  const worst = lowerIsBetter ? Infinity : -Infinity;
  const select = straightSelector(w, quantity, levelPct);
  const finite = (v: number | null): number | null => (v === null || !Number.isFinite(v) ? null : v);
  const running = new Float64Array(n).fill(worst);
  for (const b of beams) for (let i = 0; i < n; i++) if (lowerIsBetter ? b[i] < running[i] : b[i] > running[i]) running[i] = b[i];
  const full = finite(select(running));
  // Best share per beam (first beam wins ties), for the not-evaluable case.
  const share = new Float64Array(beams.length);
  for (let i = 0; i < n; i++) {
    let best = -1;
    for (let k = 0; k < beams.length; k++) if (lowerIsBetter ? beams[k][i] < (best < 0 ? worst : beams[best][i]) : beams[k][i] > (best < 0 ? worst : beams[best][i])) best = k;
    if (best >= 0) share[best] += w[i];
  }
  running.fill(worst);
  const t = full === null ? NaN : lowerIsBetter ? full + toleranceDb : full - toleranceDb;
  const reaches = (v: number): boolean => (lowerIsBetter ? v <= t : v >= t);
  const reached = new Uint8Array(n);
  const chosen = new Uint8Array(beams.length);
  const subset: string[] = [];
  const curve: { count: number; value: number | null }[] = [];
  while (subset.length < beams.length) {
    // Recount every remaining beam's gain from scratch: Σ w over points it reaches that no chosen beam reached.
    let pick = -1, pickGain = -Infinity;
    for (let k = 0; k < beams.length; k++) {
      if (chosen[k]) continue;
      let gain = 0;
      if (full === null) gain = share[k];
      else for (let i = 0; i < n; i++) if (!reached[i] && reaches(beams[k][i])) gain += w[i];
      if (gain > pickGain) { pick = k; pickGain = gain; }
    }
    chosen[pick] = 1;
    subset.push(ids[pick]);
    for (let i = 0; i < n; i++) {
      const b = beams[pick][i];
      if (full !== null && reaches(b)) reached[i] = 1;
      if (lowerIsBetter ? b < running[i] : b > running[i]) running[i] = b;
    }
    const value = finite(select(running));
    curve.push({ count: subset.length, value });
    if (full !== null && value !== null && Math.abs(full - value) <= toleranceDb + 1e-12) break;
  }
  return { levelPct, toleranceDb, beams: subset, curve };
}

/** out = better(running, beam) per point; returns whether the beam is better anywhere. */
function merge(running: Float64Array, beam: Float64Array, out: Float64Array, lowerIsBetter: boolean): boolean {
  let changed = false;
  for (let i = 0; i < running.length; i++) {
    const r = running[i], b = beam[i];
    if (lowerIsBetter ? b < r : b > r) { out[i] = b; changed = true; } else out[i] = r;
  }
  return changed;
}

function mergedInto(running: Float64Array, beam: Float64Array, out: Float64Array, lowerIsBetter: boolean): Float64Array {
  merge(running, beam, out, lowerIsBetter);
  return out;
}

/** +1 when a is better than b, 0 when equal, −1 when worse; null (not evaluable) is worst. */
function compare(a: number | null, b: number | null, lowerIsBetter: boolean): number {
  if (a === null || b === null) return a === b ? 0 : a === null ? -1 : 1;
  if (a === b) return 0;
  return (lowerIsBetter ? a < b : a > b) ? 1 : -1;
}

/** Solid-angle-weighted mean of the finite values (unfilled points are skipped). */
function weightedMean(values: Float64Array, weightSr: Float64Array, lowerIsBetter: boolean): number {
  let s = 0, w = 0;
  for (let i = 0; i < values.length; i++) if (Number.isFinite(values[i])) { s += weightSr[i] * values[i]; w += weightSr[i]; }
  return w > 0 ? s / w : lowerIsBetter ? Infinity : -Infinity;
}
export function straightBeamRemoval(
  grid: SphereGrid,
  beams: Float64Array[],
  quantity: Quantity,
  levelPct: number,
  threshold: number | null,
): BeamRemoval[] {
  const n = grid.weightSr.length;
  if (beams.length === 0) throw new Error('beamRemoval: no beams');
  for (const b of beams) if (b.length !== n) throw new Error(`beamRemoval: beam of ${b.length} values on a grid of ${n}`);
  const lowerIsBetter = quantity === 'eis';
  const worst = lowerIsBetter ? Infinity : -Infinity;
  const better = (a: number, b: number): boolean => (lowerIsBetter ? a < b : a > b);
  const bestIdx = new Int32Array(n), bestVal = new Float64Array(n), secondVal = new Float64Array(n).fill(worst);
  for (let i = 0; i < n; i++) {
    let bi = 0, bv = beams[0][i], sv = worst;
    for (let k = 1; k < beams.length; k++) {
      const v = beams[k][i];
      if (better(v, bv)) { sv = bv; bv = v; bi = k; }
      else if (!better(sv, v)) sv = v; // ≥ (eis: ≤) so an equal runner-up is kept
    }
    bestIdx[i] = bi; bestVal[i] = bv; secondVal[i] = sv;
  }
  const select = straightSelector(grid.weightSr, quantity, levelPct);
  const finite = (v: number | null): number | null => (v === null || !Number.isFinite(v) ? null : v);
  const full = finite(select(bestVal));
  const covered = (v: number): boolean => threshold !== null && (lowerIsBetter ? v <= threshold : v >= threshold);
  const sphereSr = sphereNormSr(grid.solidAngleSr);
  const without = new Float64Array(n);
  return beams.map((_, b) => {
    without.set(bestVal);
    let lost = 0, c = 0;
    for (let i = 0; i < n; i++) {
      if (bestIdx[i] !== b) continue;
      without[i] = secondVal[i];
      if (covered(bestVal[i]) && !covered(secondVal[i])) {
        const w = grid.weightSr[i], t = lost + w; // Eq. 2: Neumaier sum of the lost solid angle
        c += Math.abs(lost) >= w ? lost - t + w : w - t + lost;
        lost = t;
      }
    }
    const rest = beams.length > 1 ? finite(select(without)) : null;
    const percentileLossDb = full === null || rest === null ? null : lowerIsBetter ? rest - full : full - rest; // Eq. 1
    return { percentileLossDb, coverageLoss: threshold === null ? null : (lost + c) / sphereSr };
  });
}
