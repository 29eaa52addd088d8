import type { BeamSubset, Quantity, SphereGrid, TotalScanPattern } from '../types.js';
import { createPercentileSelector } from './percentileSelector.js';
import { createPatchedPercentile } from './patchedPercentile.js';
import { isLowerBetter, worstValue } from '../quantity.js';

/**
 * A small subset of the codebook that keeps the chosen percentile of the total scan pattern
 * within a tolerance of the full codebook's value.
 *
 * The criterion is a coverage problem at one fixed level. Let P be the full codebook's
 * percentile at levelPct and T = P − tol (eirp/gain; T = P + tol for eis, where lower is
 * better). A subset's pattern is never better than the full one, so it keeps the percentile
 * within tol exactly when its own percentile is at T or better, i.e. when the solid angle where
 * it reaches T (b ≥ T; b ≤ T for eis) is large enough (the step rule of the core's percentile).
 * So the search is weighted maximum coverage (Eq. 1): start from no beam; at each step add the
 * beam that reaches T over the largest solid angle not yet reached by the subset (ties: the
 * earlier beam); stop as soon as |P − P(subset)|≤ tol, with P(subset) read by the core's rule
 * after every step. This is the classic greedy for set cover with partial coverage (within
 * ln(n) of the smallest subset; the smallest one is NP-hard). The curve lists P(subset) after
 * each step (count = beams in the subset).
 *
 * When P is not evaluable (the level falls in the unmeasured part of a partial sphere) there is
 * no level to cover and no subset can be shown to match it: `beams` is the whole codebook,
 * largest best share first (ties: the earlier beam).
 *
 * Method: lazy greedy. Gains only shrink as the subset grows, so last step's gains are upper
 * bounds; candidates are re-evaluated in order of bound (then index) until none left can beat
 * or tie the best fresh gain with a smaller index. A fresh gain is Σ w over the beam's points
 * that reach T and are not reached yet, summed in point order (the same sum as a recount from
 * scratch, bit for bit). Each beam's list of points that reach T is compacted as points get
 * reached.
 * The subset's percentile after each step is read by `createPatchedPercentile`'s whole-array
 * evaluation (the selector's rule, bit for bit) on bins between the previous step's value and P:
 * the running pattern only gets better, so P(subset) never goes back and never passes P.
 * The full pattern is the total scan pattern; a caller that has it (`tsp`, from
 * `totalScanPattern` of the same beams) saves one pass over every beam, used only when it holds
 * no NaN (where a beam has none, NaN never wins here but stays in the TSP from beam 0).
 * Cost: O(B·n) to list the points, then per step O(n) for the percentile plus the compaction of
 * the lists re-evaluated (O(B·n) over the whole search); memory ≤ B·n int32, shrinking.
 * Units: values and tolerance in dB (dBm/dBi).
 * Source: greedy weighted maximum coverage / set cover (Eq. 1), e.g. Vazirani, Approximation
 * Algorithms (2001), ch. 2; lazy evaluation of a submodular gain, Minoux (1978).
 * @throws Error when ids and beams differ in length, or toleranceDb < 0.
 * @example greedySubset(grid, beams, ids, 'eirp', 50).beams // e.g. ['3', '12', '7']
 */
export function greedySubset(
  grid: SphereGrid,
  beams: Float64Array[],
  ids: string[],
  quantity: Quantity,
  levelPct: number,
  toleranceDb = 0.5,
  tsp?: TotalScanPattern,
): BeamSubset {
  if (beams.length !== ids.length) throw new Error(`greedySubset: ${beams.length} beams but ${ids.length} ids`);
  if (!(toleranceDb >= 0)) throw new Error(`greedySubset: tolerance ${toleranceDb} dB must be ≥ 0`);
  const n = grid.weightSr.length, weightSr = grid.weightSr, B = beams.length;
  const lowerIsBetter = isLowerBetter(quantity);
  const select = createPercentileSelector(weightSr, quantity, levelPct);
  const finite = (v: number | null): number | null => (v === null || !Number.isFinite(v) ? null : v);
  const { running, bestBeam } = fullPattern(beams, n, quantity, tsp);
  const full = finite(select(running));
  const within = (v: number | null): boolean => full !== null && v !== null && Math.abs(full - v) <= toleranceDb + 1e-12;
  running.fill(worstValue(quantity));
  const order = full === null ? shareOrder(bestBeam(), weightSr, B) : coverageOrder(beams, weightSr, lowerIsBetter ? full + toleranceDb : full - toleranceDb, lowerIsBetter);
  const subset: string[] = [];
  const curve: { count: number; value: number | null }[] = [];
  const patched = createPatchedPercentile(weightSr, quantity, levelPct); // running never holds NaN
  let previous: number | null = null;
  for (const k of order) {
    subset.push(ids[k]);
    mergeBeam(running, beams[k], lowerIsBetter);
    const value = finite(previous === null || full === null ? select(running) : stepPercentile(patched, running, previous, full));
    curve.push({ count: subset.length, value });
    previous = value;
    if (within(value)) break;
  }
  return { levelPct, toleranceDb, beams: subset, curve };
}

/**
 * The full codebook's pattern (each point's best value, NaN never better, worst where no beam has
 * a value) as a fresh array, and, on demand, each point's best beam (−1: none better than worst).
 * From `tsp` when it has no NaN: there its values are the same maxima (minima for eis), bit for bit.
 */
function fullPattern(beams: Float64Array[], n: number, quantity: Quantity, tsp: TotalScanPattern | undefined):
  { running: Float64Array; bestBeam: () => Int32Array } {
  const lowerIsBetter = isLowerBetter(quantity);
  const merged = (): { running: Float64Array; bestBeam: Int32Array } => {
    const running = new Float64Array(n).fill(worstValue(quantity));
    const bestBeam = new Int32Array(n).fill(-1);
    for (let k = 0; k < beams.length; k++) mergeBeam(running, beams[k], lowerIsBetter, bestBeam, k);
    return { running, bestBeam };
  };
  if (tsp !== undefined && tsp.values.length === n && !tsp.values.some((v) => v !== v)) {
    return { running: Float64Array.from(tsp.values), bestBeam: () => merged().bestBeam };
  }
  const m = merged();
  return { running: m.running, bestBeam: () => m.bestBeam };
}

/**
 * P(subset) after a step, knowing it lies between the previous step's value and P (both
 * finite): bins over that range, padded (any range gives the same answer; a close one keeps the
 * crossing bin small). undefined never comes back: no below/above bounds are passed.
 */
function stepPercentile(patched: ReturnType<typeof createPatchedPercentile>, running: Float64Array, previous: number, full: number): number | null {
  const lo = Math.min(previous, full), hi = Math.max(previous, full);
  const pad = 0.1 * (hi - lo) + 1e-9 * Math.max(1, Math.abs(lo), Math.abs(hi));
  return patched.evaluateWhole(running, lo - pad, hi + pad) ?? null;
}

/**
 * Every beam in greedy maximum-coverage order at level t (Eq. 1 of greedySubset): each next
 * beam reaches t over the largest solid angle not yet reached by those before it; ties: the
 * earlier beam. Lazy: stale gains are upper bounds.
 */
function coverageOrder(beams: Float64Array[], weightSr: Float64Array, t: number, lowerIsBetter: boolean): number[] {
  const n = weightSr.length, B = beams.length;
  const reached = new Uint8Array(n);
  const lists: Int32Array[] = [];
  const counts = new Int32Array(B);
  const bound = new Float64Array(B);
  const scratch = new Int32Array(n);
  for (let k = 0; k < B; k++) {
    const b = beams[k];
    let c = 0, sum = 0;
    for (let i = 0; i < n; i++) {
      if (lowerIsBetter ? b[i] <= t : b[i] >= t) { scratch[c++] = i; sum += weightSr[i]; }
    }
    lists.push(scratch.slice(0, c));
    counts[k] = c;
    bound[k] = sum;
  }
  const fresh = (k: number): number => {
    const list = lists[k];
    let c = 0, sum = 0;
    for (let j = 0; j < counts[k]; j++) {
      const i = list[j];
      if (reached[i]) continue;
      list[c++] = i;
      sum += weightSr[i];
    }
    counts[k] = c;
    return sum;
  };
  const left = Array.from({ length: B }, (_, k) => k);
  const order: number[] = [];
  let isFresh = true; // the first bounds are exact counts
  while (left.length > 0) {
    left.sort((a, b) => bound[b] - bound[a] || a - b);
    let best = -1, bestGain = -Infinity;
    for (const k of left) {
      // Bounds are sorted: once one is below the best fresh gain (or equal with a larger index), none left can win.
      if (best >= 0 && (bound[k] < bestGain || (bound[k] === bestGain && k > best))) break;
      const g = isFresh ? bound[k] : (bound[k] = fresh(k));
      if (g > bestGain || (g === bestGain && k < best)) { best = k; bestGain = g; }
    }
    isFresh = false;
    order.push(best);
    left.splice(left.indexOf(best), 1);
    const list = lists[best];
    for (let j = 0; j < counts[best]; j++) reached[list[j]] = 1;
  }
  return order;
}

/** Every beam, largest share of the sphere where it is the best beam first (ties: the earlier beam). */
function shareOrder(bestBeam: Int32Array, weightSr: Float64Array, B: number): number[] {
  const share = new Float64Array(B);
  for (let i = 0; i < bestBeam.length; i++) if (bestBeam[i] >= 0) share[bestBeam[i]] += weightSr[i];
  return Array.from({ length: B }, (_, k) => k).sort((a, b) => share[b] - share[a] || a - b);
}

/** running = better(running, beam) per point (NaN never better); records the beam index where it wins, when asked. */
function mergeBeam(running: Float64Array, beam: Float64Array, lowerIsBetter: boolean, bestBeam?: Int32Array, k = 0): void {
  for (let i = 0; i < running.length; i++) {
    const b = beam[i];
    if (lowerIsBetter ? b < running[i] : b > running[i]) {
      running[i] = b;
      if (bestBeam) bestBeam[i] = k;
    }
  }
}
