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
 * Work reuse: the running total scan pattern is kept, and for each remaining beam the points
 * where it beats that pattern. The next value lies between the current one and the full
 * codebook's (merging only improves), so those points are split: inside that window (filtered
 * every step) and wholly outside it (for good, as the window only narrows; filtered only when a
 * fallback or a tie needs them). A candidate is evaluated by `createPatchedPercentile` on the
 * inside points alone: value bins of the running pattern, rebuilt once per step; the
 * candidate's weight moves; an exact selection inside the crossing bin, or an early "worse than
 * the best so far" from the crossing bin; the plain quickselect on the merged copy when
 * rounding could matter. The mean tie-break compares the improvement sums Σ w·(b − r) when they
 * differ by more than a rounding bound of the plain means, else computes the plain means as the
 * straightforward evaluation does. A candidate that is nowhere better than the running pattern
 * is not re-evaluated. Results are identical, bit for bit, to merging and selecting every
 * candidate from scratch (test/analysis/greedyFastPath.test.ts).
 * Cost: O(B·n) for the first step and the lists after it, then per step O(n + Σ inside points
 * + B·bins) (n/16 bins); memory at most B·n int32 for the lists (shrinking).
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
  // Per remaining beam, after the first step: the points where it beats the running pattern, in
  // one array: the relevant ones (inside the window, re-filtered every step) at the front, the
  // others (outside the window for good: the window only narrows) at the back, re-filtered only
  // when needed (a fallback, or a tie decided by the gains).
  const lists: (Int32Array | null)[] = beams.map(() => null);
  const relevant = new Int32Array(B), others = new Int32Array(B), othersStep = new Int32Array(B).fill(-1);
  const relevantGain = new Float64Array(B), othersGain = new Float64Array(B);
  const firstList = new Int32Array(n), spare = new Int32Array(n);
  let lowCut = -Infinity, highCut = Infinity;
  /** Σ w·(b − r) over the points where beam k beats the running pattern (any order; compared with a margin). */
  const gainOf = (k: number): number => {
    if (othersStep[k] !== subset.length) {
      const kept = refreshOthers(lists[k]!, others[k], beams[k], running, weightSr, lowerIsBetter);
      others[k] = kept.count;
      othersGain[k] = kept.gain;
      othersStep[k] = subset.length;
    }
    return relevantGain[k] + othersGain[k];
  };
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
      // Values strictly worse than the best so far are of no interest: the evaluator may say so (undefined).
      const below: number = !lowerIsBetter && pickValue !== null ? pickValue : -Infinity;
      const above: number = lowerIsBetter && pickValue !== null ? pickValue : Infinity;
      let raw: number | null | undefined;
      if (subset.length === 0) {
        // First step: the merged pattern is the beam itself (better than worst wherever it is not NaN).
        raw = range.nan ? select(mergedInto(running, beams[k], scratch, lowerIsBetter)) : evaluator.evaluateWhole(beams[k], range.lo, range.hi, below, above);
      } else if (relevant[k] === 0 && others[k] === 0) raw = current; // nowhere better: nothing to evaluate
      else {
        const list = lists[k]!;
        raw = evaluator.evaluate(list, relevant[k], beams[k], lowCut, highCut, below, above, list, list.length - others[k]);
      }
      if (raw === undefined) continue; // certainly worse than the pick: the comparison below would skip it
      const value: number | null = finite(raw);
      const cmp = pick < 0 ? 1 : compare(value, pickValue, lowerIsBetter);
      if (cmp < 0) continue;
      if (cmp === 0) {
        let decided = 0, sum = NaN, mean = NaN;
        if (sumsDecide) {
          if (Number.isNaN(pickSum)) pickSum = gainOf(pick);
          sum = gainOf(k);
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
    mergePick(running, beams[pick], lists[pick], relevant[pick], others[pick], lowerIsBetter);
    current = pickValue;
    curve.push({ count: subset.length, value: current });
    lists[pick] = null;
    if (subset.length === B || (full !== null && current !== null && Math.abs(full - current) <= toleranceDb + 1e-12)) break;
    // The next value lies between the current one and the full codebook's (merging only
    // improves); a point whose old and new values are both outside that window cannot move it.
    // Never widened, so a point once outside stays outside.
    lowCut = Math.max(lowCut, (lowerIsBetter ? full : current) ?? -Infinity);
    highCut = Math.min(highCut, (lowerIsBetter ? current : full) ?? Infinity);
    const spanLo = Number.isFinite(lowCut) ? lowCut : tspRange[0], spanHi = Number.isFinite(highCut) ? highCut : tspRange[1];
    const pad = 0.1 * (spanHi - spanLo) + 1e-9 * Math.max(1, Math.abs(spanLo), Math.abs(spanHi));
    evaluator.setBase(running, spanLo - pad, spanHi + pad);
    for (let k = 0; k < B; k++) {
      if (chosen[k]) continue;
      let list = lists[k];
      if (list === null) {
        const first = refine(null, n, beams[k], running, weightSr, firstList, spare, lowCut, highCut, lowerIsBetter);
        list = lists[k] = new Int32Array(first.relevant + first.moved);
        list.set(firstList.subarray(0, first.relevant));
        list.set(spare.subarray(0, first.moved), list.length - first.moved);
        relevant[k] = first.relevant;
        others[k] = first.moved;
        relevantGain[k] = first.gain;
        othersStep[k] = -1;
        continue;
      }
      const kept = refine(list, relevant[k], beams[k], running, weightSr, list, spare, lowCut, highCut, lowerIsBetter);
      const end = list.length - others[k];
      list.set(spare.subarray(0, kept.moved), end - kept.moved); // newly outside points join the back part
      relevant[k] = kept.relevant;
      others[k] += kept.moved;
      relevantGain[k] = kept.gain;
      othersStep[k] = -1;
    }
  }
  return { levelPct, toleranceDb, beams: subset, curve };
}

/**
 * Keeps the points (of list[0..count), or of 0..count when list is null) where beam is better
 * than running: those inside the window (old and new values not both below lowCut nor both
 * above highCut) to out[0..relevant) (out may be list: in place), the others to spare[0..moved).
 * gain = Σ w·(beam − running) over the relevant ones (the others are summed when needed).
 */
function refine(
  list: Int32Array | null, count: number, beam: Float64Array, running: Float64Array, weightSr: Float64Array,
  out: Int32Array, spare: Int32Array, lowCut: number, highCut: number, lowerIsBetter: boolean,
): { relevant: number; moved: number; gain: number } {
  let r = 0, o = 0, gain = 0;
  // Specialized copies of the loop so neither test is re-decided per point (hot path).
  const all = list ?? out; // unused when list is null
  if (!lowerIsBetter && list === null) {
    for (let i = 0; i < count; i++) {
      const b = beam[i], old = running[i];
      if (!(b > old)) continue;
      if (b < lowCut || old > highCut) spare[o++] = i; else { out[r++] = i; gain += weightSr[i] * (b - old); }
    }
  } else if (!lowerIsBetter) {
    for (let j = 0; j < count; j++) {
      const i = all[j], b = beam[i], old = running[i];
      if (!(b > old)) continue;
      if (b < lowCut || old > highCut) spare[o++] = i; else { out[r++] = i; gain += weightSr[i] * (b - old); }
    }
  } else {
    for (let j = 0; j < count; j++) {
      const i = list === null ? j : all[j], b = beam[i], old = running[i];
      if (!(b < old)) continue;
      if (old < lowCut || b > highCut) spare[o++] = i; else { out[r++] = i; gain += weightSr[i] * (b - old); }
    }
  }
  return { relevant: r, moved: o, gain };
}

/**
 * Drops from the back part list[length − count, length) the points where beam no longer beats
 * running (in place, packed toward the end); returns the new count and Σ w·(beam − running) over the rest.
 */
function refreshOthers(list: Int32Array, count: number, beam: Float64Array, running: Float64Array, weightSr: Float64Array, lowerIsBetter: boolean): { count: number; gain: number } {
  let w = list.length, gain = 0;
  for (let j = list.length - 1; j >= list.length - count; j--) {
    const i = list[j], b = beam[i], old = running[i];
    if (!(lowerIsBetter ? b < old : b > old)) continue;
    list[--w] = i;
    gain += weightSr[i] * (b - old);
  }
  return { count: list.length - w, gain };
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

/** running = better(running, beam) per point, visiting only the beam's list when there is one (exact front, stale back). */
function mergePick(running: Float64Array, beam: Float64Array, list: Int32Array | null, relevant: number, others: number, lowerIsBetter: boolean): void {
  if (list === null) { mergedInto(running, beam, running, lowerIsBetter); return; }
  for (let j = 0; j < relevant; j++) running[list[j]] = beam[list[j]];
  for (let j = list.length - others; j < list.length; j++) {
    const i = list[j];
    if (lowerIsBetter ? beam[i] < running[i] : beam[i] > running[i]) running[i] = beam[i];
  }
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
