import type { BeamSubset, Quantity, SphereGrid } from '../types.js';
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
 * Work reuse: the running total scan pattern is kept; a candidate is evaluated by one O(n)
 * merge and a sort-free weighted quickselect (`createPercentileSelector`, the core's step rule);
 * a candidate that is nowhere better than the running pattern is not re-evaluated.
 * Cost: O(B² · n) worst case, expected; no allocation inside the loop.
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
  const n = grid.weightSr.length;
  const lowerIsBetter = quantity === 'eis';
  const worst = lowerIsBetter ? Infinity : -Infinity;
  const select = createPercentileSelector(grid.weightSr, quantity, levelPct);
  const finite = (v: number | null): number | null => (v === null || !Number.isFinite(v) ? null : v);
  const running = new Float64Array(n).fill(worst);
  for (const b of beams) for (let i = 0; i < n; i++) if (lowerIsBetter ? b[i] < running[i] : b[i] > running[i]) running[i] = b[i];
  const full = finite(select(running));
  running.fill(worst);
  const scratch = new Float64Array(n);
  const chosen = new Uint8Array(beams.length);
  const subset: string[] = [];
  const curve: { count: number; value: number | null }[] = [];
  let current: number | null = null;
  while (subset.length < beams.length && !(full !== null && current !== null && Math.abs(full - current) <= toleranceDb + 1e-12)) {
    let pick = -1, pickValue: number | null = null, pickMean = NaN;
    for (let k = 0; k < beams.length; k++) {
      if (chosen[k]) continue;
      const changes = merge(running, beams[k], scratch, lowerIsBetter);
      const value: number | null = subset.length > 0 && !changes ? current : finite(select(scratch));
      const cmp = pick < 0 ? 1 : compare(value, pickValue, lowerIsBetter);
      if (cmp < 0) continue;
      if (cmp === 0) {
        if (Number.isNaN(pickMean)) pickMean = weightedMean(mergedInto(running, beams[pick], scratch, lowerIsBetter), grid.weightSr, lowerIsBetter);
        const mean = weightedMean(mergedInto(running, beams[k], scratch, lowerIsBetter), grid.weightSr, lowerIsBetter);
        if (!(lowerIsBetter ? mean < pickMean : mean > pickMean)) continue;
        pickMean = mean;
      } else pickMean = NaN;
      pick = k;
      pickValue = value;
    }
    chosen[pick] = 1;
    subset.push(ids[pick]);
    mergedInto(running, beams[pick], running, lowerIsBetter);
    current = pickValue;
    curve.push({ count: subset.length, value: current });
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
