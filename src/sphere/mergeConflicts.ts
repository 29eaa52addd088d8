import type { GridBuild } from './buildGrid.js';
import { rawOrderKind, sortedSegments } from './mergeSamples.js';

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

/** The samples of a build's merged points, grouped by point (ascending), file order within a group. */
export interface MergedGroups {
  points: Int32Array;
  /** Samples of points[g] are samples[start[g] .. start[g + 1]). */
  start: Int32Array;
  samples: Int32Array;
}

const groupsOf = new WeakMap<GridBuild, MergedGroups>();

/**
 * The points that hold two or more raw samples and their samples (one O(n) pass, cached per
 * build: every beam of a measurement shares its build, so the scan of a 64-beam file's 65,160
 * samples runs once instead of once per beam, and no per-beam grid-sized arrays are made).
 */
export function mergedGroups(build: GridBuild): MergedGroups {
  let g = groupsOf.get(build);
  if (g !== undefined) return g;
  g = rawOrderKind(build) === 2 ? groupsOfSegments(sortedSegments(build)) : groupsOfPoints(build);
  groupsOf.set(build, g);
  return g;
}

/**
 * The merged groups of a build whose samples come point by point (rawOrderKind 2), read off
 * mergeSamples' segments (the groups are the segments with a positive length; their samples are
 * consecutive): no pass over the samples.
 */
function groupsOfSegments(seg: Int32Array): MergedGroups {
  let groups = 0;
  let total = 0;
  for (let s = 0; s < seg.length; s += 3) if (seg[s + 1] > 0) { groups++; total += seg[s + 1]; }
  const points = new Int32Array(groups);
  const start = new Int32Array(groups + 1);
  const samples = new Int32Array(total);
  for (let s = 0, k = 0; s < seg.length; s += 3) {
    const len = seg[s + 1];
    if (len <= 0) continue;
    points[k] = seg[s + 2];
    start[k + 1] = start[k] + len;
    for (let j = 0; j < len; j++) samples[start[k] + j] = seg[s] + j;
    k++;
  }
  return { points, start, samples };
}

/** The merged groups of any build: count the samples of each point, then list them in file order. */
function groupsOfPoints(build: GridBuild): MergedGroups {
  const { pointOf } = build;
  const m = build.grid.thetaDeg.length;
  const count = new Int32Array(m);
  for (let i = 0; i < pointOf.length; i++) count[pointOf[i]]++;
  const slot = new Int32Array(m).fill(-1);
  let groups = 0;
  let total = 0;
  for (let p = 0; p < m; p++) {
    if (count[p] < 2) continue;
    slot[p] = groups++;
    total += count[p];
  }
  const points = new Int32Array(groups);
  const start = new Int32Array(groups + 1);
  for (let p = 0, k = 0; p < m; p++) {
    if (slot[p] < 0) continue;
    points[k] = p;
    start[k + 1] = start[k] + count[p];
    k++;
  }
  const fillAt = start.slice(0, groups);
  const samples = new Int32Array(total);
  for (let i = 0; i < pointOf.length; i++) {
    const k = slot[pointOf[i]];
    if (k >= 0) samples[fillAt[k]++] = i;
  }
  return { points, start, samples };
}

/**
 * Finds the grid points whose coincident raw samples (φ = 0/360 seam, pole rows, repeated
 * rows) spread by more than `limitDb` (max − min of the finite samples, Eq. 1). Every merge of
 * every beam is checked, whatever the row order. Returns nothing without coincident samples.
 * Ties: the lowest (highest) sample is the first in file order among equal values.
 * Cost O(n) once per build (the merged points' samples, cached), then O(merged samples) a beam.
 * @throws RangeError when rawValues does not have one value per raw sample.
 * @example mergeConflicts(build, Float64Array.of(0, 20 /* same direction *\/)).count // 1
 */
export function mergeConflicts(build: GridBuild, rawValues: Float64Array, limitDb = CONFLICT_DB, keep = 5): MergeConflicts {
  const { pointOf } = build;
  const n = rawValues.length;
  if (n !== pointOf.length) throw new RangeError(`mergeConflicts: ${n} values for ${pointOf.length} samples`);
  if (build.merged === 0) return { count: 0, worst: [] };
  const { points, start, samples } = mergedGroups(build);
  const found: MergeConflict[] = [];
  let count = 0;
  for (let k = 0; k < points.length; k++) {
    let lo = -1;
    let hi = -1;
    for (let j = start[k]; j < start[k + 1]; j++) {
      const i = samples[j];
      const v = rawValues[i];
      if (!Number.isFinite(v)) continue;
      if (lo < 0 || v < rawValues[lo]) lo = i;
      if (hi < 0 || v > rawValues[hi]) hi = i;
    }
    if (lo < 0 || lo === hi) continue;
    const a = rawValues[lo], b = rawValues[hi];
    if (!(b - a > limitDb)) continue; // Eq. 1
    count++;
    found.push({ point: points[k], low: lo, high: hi, lowDb: a, highDb: b });
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
