import type { BeamSubset, Quantity, SphereGrid } from '../types.js';
import { createPatchedPercentile } from './patchedPercentile.js';
import { createPercentileSelector } from './percentileSelector.js';

/**
 * A small subset of the codebook that keeps the chosen percentile of the total scan pattern
 * within a tolerance of the full codebook's value, found greedily: start from no beam; at each
 * step add the beam whose addition gives the best percentile of the running total scan pattern
 * (ties: the better solid-angle-weighted mean dB value, then the earlier beam); stop as soon as
 * |P(full) − P(subset)| ≤ toleranceDb. The curve lists the value after each step
 * (count = beams in the subset). Greedy is not guaranteed minimal (set cover is NP-hard); it is
 * the usual first answer and shows the diminishing return of each added beam.
 *
 * When P(full) is not evaluable (the level falls in the unmeasured part of a partial sphere), no
 * subset can be shown to match it: every beam is ranked by the same rule and `beams` is the whole
 * codebook in greedy order.
 *
 * Work reuse: the running total scan pattern is kept, and for each remaining beam the list of
 * points where it beats that pattern (the list only shrinks, so it is filtered after each step).
 * A candidate is evaluated by `createPatchedPercentile` (value bins of the running pattern,
 * rebuilt once per step; the candidate's weight moves; an exact selection inside the crossing
 * bin; the plain quickselect when rounding could matter), so its cost is O(points it improves +
 * bins) instead of O(n). The mean tie-break compares the improvement sums Σ w·(b − r) over those
 * points when they differ by more than a rounding bound of the plain means, else computes the
 * plain means as the straightforward evaluation does. A candidate that is nowhere better than
 * the running pattern is not re-evaluated. Results are identical, bit for bit, to merging and
 * selecting every candidate from scratch (test/analysis/greedyFastPath.test.ts).
 * Cost: O(B·n) for the first two steps, then per step O(n + Σ list lengths + B·bins); memory
 * O(B·n) int32 at most for the lists (shrinking).
 * Units: values and tolerance in dB (dBm/dBi).
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
): BeamSubset {
  if (beams.length !== ids.length) throw new Error(`greedySubset: ${beams.length} beams but ${ids.length} ids`);
  if (!(toleranceDb >= 0)) throw new Error(`greedySubset: tolerance ${toleranceDb} dB must be ≥ 0`);
  const n = grid.weightSr.length, weightSr = grid.weightSr, B = beams.length;
  const lowerIsBetter = quantity === 'eis';
  const worst = lowerIsBetter ? Infinity : -Infinity;
  const select = createPercentileSelector(weightSr, quantity, levelPct);
  const finite = (v: number | null): number | null => (v === null || !Number.isFinite(v) ? null : v);
  const running = new Float64Array(n).fill(worst);
  const range = fullPatternAndRange(beams, running, lowerIsBetter);
  const full = finite(select(running));
  const evaluator = createPatchedPercentile(weightSr, quantity, levelPct, !range.nan);
  const tspRange = finiteRange(running);
  running.fill(worst);
  evaluator.setBase(running, tspRange[0], tspRange[1]);
  let totalSr = 0;
  for (let i = 0; i < n; i++) totalSr += weightSr[i];
  // Rounding bound of the difference of two plain weighted sums of n terms (and of the division).
  const meanMargin = (8 * n + 64) * 2 ** -52 * totalSr * range.maxAbs;
  const lists: (Int32Array | null)[] = beams.map(() => null); // built after the first step
  const counts = new Int32Array(B), relevant = new Int32Array(B), gains = new Float64Array(B);
  const firstList = new Int32Array(n), spare = new Int32Array(n);
  let lowCut = -Infinity, highCut = Infinity;
  const scratch = new Float64Array(n);
  const chosen = new Uint8Array(B);
  const subset: string[] = [];
  const curve: { count: number; value: number | null }[] = [];
  let current: number | null = null;
  const plainMean = (k: number): number => weightedMean(mergedInto(running, beams[k], scratch, lowerIsBetter), weightSr, lowerIsBetter);
  while (subset.length < B && !(full !== null && current !== null && Math.abs(full - current) <= toleranceDb + 1e-12)) {
    // The sums compare like the plain means only when every merged value is finite (none skipped).
    const sumsDecide = subset.length > 0 && range.allFinite;
    let pick = -1, pickValue: number | null = null, pickMean = NaN, pickSum = NaN;
    for (let k = 0; k < B; k++) {
      if (chosen[k]) continue;
      let value: number | null;
      if (subset.length === 0) {
        // First step: the merged pattern is the beam itself (better than worst wherever it is not NaN).
        value = finite(range.nan ? select(mergedInto(running, beams[k], scratch, lowerIsBetter)) : evaluator.evaluateWhole(beams[k], range.lo, range.hi));
      } else if (counts[k] === 0) value = current;
      else value = finite(evaluator.evaluate(lists[k]!, counts[k], beams[k], relevant[k], lowCut, highCut));
      const cmp = pick < 0 ? 1 : compare(value, pickValue, lowerIsBetter);
      if (cmp < 0) continue;
      if (cmp === 0) {
        let decided = 0, sum = NaN, mean = NaN;
        if (sumsDecide) {
          if (Number.isNaN(pickSum)) pickSum = gains[pick];
          sum = gains[k];
          decided = sum - pickSum > meanMargin ? 1 : sum - pickSum < -meanMargin ? -1 : 0; // +1: mean surely larger
        }
        if (decided === 0) {
          if (Number.isNaN(pickMean)) pickMean = plainMean(pick);
          mean = plainMean(k);
          if (!(lowerIsBetter ? mean < pickMean : mean > pickMean)) continue;
        } else if (decided !== (lowerIsBetter ? -1 : 1)) continue;
        pickMean = mean;
        pickSum = sum;
      } else { pickMean = NaN; pickSum = NaN; }
      pick = k;
      pickValue = value;
    }
    chosen[pick] = 1;
    subset.push(ids[pick]);
    mergedInto(running, beams[pick], running, lowerIsBetter);
    current = pickValue;
    curve.push({ count: subset.length, value: current });
    lists[pick] = null;
    if (subset.length === B || (full !== null && current !== null && Math.abs(full - current) <= toleranceDb + 1e-12)) break;
    // The next value lies between the current one and the full codebook's (merging only
    // improves); a point whose old and new values are both outside that window cannot move it.
    lowCut = (lowerIsBetter ? full : current) ?? -Infinity;
    highCut = (lowerIsBetter ? current : full) ?? Infinity;
    const spanLo = Number.isFinite(lowCut) ? lowCut : tspRange[0], spanHi = Number.isFinite(highCut) ? highCut : tspRange[1];
    const pad = 0.1 * (spanHi - spanLo) + 1e-9 * Math.max(1, Math.abs(spanLo), Math.abs(spanHi));
    evaluator.setBase(running, spanLo - pad, spanHi + pad);
    for (let k = 0; k < B; k++) {
      if (chosen[k]) continue;
      const list = lists[k];
      const kept = refine(list, list === null ? n : counts[k], beams[k], running, weightSr, list ?? firstList, spare, lowCut, highCut, lowerIsBetter);
      if (list === null) lists[k] = firstList.slice(0, kept.count);
      counts[k] = kept.count;
      relevant[k] = kept.relevant;
      gains[k] = kept.gain;
    }
  }
  return { levelPct, toleranceDb, beams: subset, curve };
}

/**
 * Keeps the points (of list[0..count), or of 0..count when list is null) where beam is better
 * than running, written to out (may be list: in place) with the relevant ones first: those whose
 * old and new values are not both below lowCut nor both above highCut. Also returns the gain
 * Σ w·(beam − running) over the kept points (any order: only compared with a rounding margin).
 */
function refine(
  list: Int32Array | null, count: number, beam: Float64Array, running: Float64Array, weightSr: Float64Array,
  out: Int32Array, spare: Int32Array, lowCut: number, highCut: number, lowerIsBetter: boolean,
): { count: number; relevant: number; gain: number } {
  let r = 0, o = 0, gain = 0;
  // Specialized copies of the loop so neither test is re-decided per point (hot path).
  const all = list ?? out; // unused when list is null
  if (!lowerIsBetter && list === null) {
    for (let i = 0; i < count; i++) {
      const b = beam[i], old = running[i];
      if (!(b > old)) continue;
      gain += weightSr[i] * (b - old);
      if (b < lowCut || old > highCut) spare[o++] = i; else out[r++] = i;
    }
  } else if (!lowerIsBetter) {
    for (let j = 0; j < count; j++) {
      const i = all[j], b = beam[i], old = running[i];
      if (!(b > old)) continue;
      gain += weightSr[i] * (b - old);
      if (b < lowCut || old > highCut) spare[o++] = i; else out[r++] = i;
    }
  } else {
    for (let j = 0; j < count; j++) {
      const i = list === null ? j : all[j], b = beam[i], old = running[i];
      if (!(b < old)) continue;
      gain += weightSr[i] * (b - old);
      if (old < lowCut || b > highCut) spare[o++] = i; else out[r++] = i;
    }
  }
  out.set(spare.subarray(0, o), r);
  return { count: r + o, relevant: r, gain };
}

/**
 * Writes the per-point best of all beams to running (which starts at worst) and returns, from the
 * same pass, the finite value range, the largest finite |value|, and whether any value is NaN or
 * any is infinite.
 */
function fullPatternAndRange(beams: Float64Array[], running: Float64Array, lowerIsBetter: boolean): { lo: number; hi: number; maxAbs: number; nan: boolean; allFinite: boolean } {
  let lo = Infinity, hi = -Infinity, nan = false, infinite = false;
  for (const b of beams) {
    for (let i = 0; i < running.length; i++) {
      const v = b[i];
      if (lowerIsBetter ? v < running[i] : v > running[i]) running[i] = v;
      if (v < lo || v > hi) {
        if (v === Infinity || v === -Infinity) infinite = true;
        else { if (v < lo) lo = v; if (v > hi) hi = v; }
      } else if (v !== v) nan = true;
    }
  }
  const allFinite = !nan && !infinite;
  return { lo, hi, maxAbs: Math.max(Math.abs(lo), Math.abs(hi)), nan, allFinite };
}

/** [min, max] of the finite values (±∞ when there are none). */
function finiteRange(values: Float64Array): [number, number] {
  let lo = Infinity, hi = -Infinity;
  for (let i = 0; i < values.length; i++) { const v = values[i]; if (v > -Infinity && v < Infinity) { if (v < lo) lo = v; if (v > hi) hi = v; } }
  return [lo, hi];
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
