import type { GridBuild } from './buildGrid.js';

/**
 * Samples merged into one direction that differ by more than this are a conflict, dB (common
 * practice for positioner and chamber repeatability; not a standard's value).
 */
export const CONFLICT_DB = 0.5;

/** How coincident samples become one value (job file `merge_rule`). */
export type MergeRule = 'power-average' | 'first' | 'last' | 'refuse';
export const MERGE_RULES: readonly MergeRule[] = ['power-average', 'first', 'last', 'refuse'];

/** One direction whose merged samples disagree: the raw sample indices and values of the lowest and highest. */
export interface MergeConflict {
  point: number;
  low: number;
  high: number;
  lowDb: number;
  highDb: number;
}

export interface MergeConflicts {
  /** Directions whose samples spread by more than the limit. */
  count: number;
  /** The largest spreads first, at most `keep` of them. */
  worst: MergeConflict[];
}

/**
 * Finds the grid points whose coincident raw samples (φ = 0/360 seam, pole rows, repeated
 * rows) spread by more than `limitDb` (max − min of the finite samples, Eq. 1). Every merge of
 * every beam is checked, whatever the row order. Returns nothing without coincident samples.
 * Cost O(n) and three Int32Arrays of the grid size when the build merged samples; O(1) else.
 * @throws RangeError when rawValues does not have one value per raw sample.
 * @example mergeConflicts(build, Float64Array.of(0, 20 /* same direction *\/)).count // 1
 */
export function mergeConflicts(build: GridBuild, rawValues: Float64Array, limitDb = CONFLICT_DB, keep = 5): MergeConflicts {
  const { pointOf } = build;
  const n = rawValues.length;
  if (n !== pointOf.length) throw new RangeError(`mergeConflicts: ${n} values for ${pointOf.length} samples`);
  if (build.merged === 0) return { count: 0, worst: [] };
  const m = build.grid.thetaDeg.length;
  const lo = new Int32Array(m).fill(-1);
  const hi = new Int32Array(m).fill(-1);
  for (let i = 0; i < n; i++) {
    const v = rawValues[i];
    if (!Number.isFinite(v)) continue;
    const p = pointOf[i];
    if (lo[p] < 0 || v < rawValues[lo[p]]) lo[p] = i;
    if (hi[p] < 0 || v > rawValues[hi[p]]) hi[p] = i;
  }
  const found: MergeConflict[] = [];
  let count = 0;
  for (let p = 0; p < m; p++) {
    if (lo[p] < 0 || lo[p] === hi[p]) continue;
    const a = rawValues[lo[p]], b = rawValues[hi[p]];
    if (!(b - a > limitDb)) continue; // Eq. 1
    count++;
    found.push({ point: p, low: lo[p], high: hi[p], lowDb: a, highDb: b });
  }
  found.sort((x, y) => y.highDb - y.lowDb - (x.highDb - x.lowDb) || x.point - y.point);
  return { count, worst: found.slice(0, keep) };
}

/**
 * Merge values by the 'first' or 'last' rule: each grid point takes its first (last) finite
 * raw sample in file order. NaN where a point has none. Cost O(n).
 * @throws never.
 * @example mergeByOrder(build, Float64Array.of(0, 20), 'last') // [20]
 */
export function mergeByOrder(build: GridBuild, rawValues: Float64Array, rule: 'first' | 'last'): Float64Array {
  const m = build.grid.thetaDeg.length;
  const out = new Float64Array(m).fill(NaN);
  for (let i = 0; i < rawValues.length; i++) {
    const v = rawValues[i];
    if (!Number.isFinite(v)) continue;
    const p = build.pointOf[i];
    if (rule === 'last' || Number.isNaN(out[p])) out[p] = v;
  }
  return out;
}
