import type { GridBuild } from './buildGrid.js';

const LN10_OVER_10 = Math.LN10 / 10;

export interface MergedValues {
  /** One dB value per grid point; NaN where no finite sample exists. */
  values: Float64Array;
  /** Largest (max − min) among the samples merged into one point, dB (0 when none merged). */
  maxSpreadDb: number;
  /** Grid points without any finite sample. */
  missing: number;
  /** True when `values` is a view over the input's storage (`reuseInput` was granted). */
  inPlace: boolean;
}

/** Raw order of a build's samples: 2 = pointOf non-decreasing, 1 = pointOf[i] ≤ i, 0 = neither. */
const orderKinds = new WeakMap<GridBuild, number>();

/**
 * How a build's raw samples are ordered (one O(n) scan, cached per build): 2 when pointOf is
 * non-decreasing (θ-major export without a φ = 360 column), 1 when every sample maps to a point
 * index at most its own (θ-major with a seam column: merging in place is still safe), else 0.
 */
export function rawOrderKind(build: GridBuild): 0 | 1 | 2 {
  let k = orderKinds.get(build);
  if (k === undefined) {
    const p = build.pointOf;
    let sorted = true;
    let below = true;
    for (let i = 0; i < p.length && below; i++) {
      if (p[i] > i) below = false;
      else if (i > 0 && p[i] < p[i - 1]) sorted = false;
    }
    k = !below ? 0 : sorted ? 2 : 1;
    orderKinds.set(build, k);
  }
  return k as 0 | 1 | 2;
}

const segmentsOf = new WeakMap<GridBuild, Int32Array>();

/**
 * The raw samples of a build with non-decreasing pointOf, cut into segments in point order,
 * triples (first sample, length, first point): a run of points holding one sample each has a
 * negative length (−points), a point holding several samples a positive one (its samples).
 * One O(n) scan cached per build: the beams of a unit share their build, so each beam's merge
 * is a few block copies plus the merged points (a 1° export: two pole groups).
 */
export function sortedSegments(build: GridBuild): Int32Array {
  let seg = segmentsOf.get(build);
  if (seg !== undefined) return seg;
  const p = build.pointOf;
  const n = p.length;
  const out: number[] = [];
  let i = 0;
  while (i < n) {
    let j = i + 1;
    while (j < n && p[j] === p[i]) j++;
    if (j - i > 1) {
      out.push(i, j - i, p[i]);
    } else if (out.length > 0 && out[out.length - 2] < 0 && out[out.length - 3] - out[out.length - 2] === i) {
      out[out.length - 2]--; // extends the run of single-sample points that ends at i
    } else {
      out.push(i, -1, p[i]);
    }
    i = j;
  }
  seg = Int32Array.from(out);
  segmentsOf.set(build, seg);
  return seg;
}

/** Scratch for the unordered route, reused across calls (grown, never shrunk; single-threaded). */
let scratchCount = new Int32Array(0);
let scratchLo = new Float64Array(0);
let scratchHi = new Float64Array(0);
let scratchSum = new Float64Array(0);

/**
 * Maps raw per-sample dB values onto the grid points of `build`.
 *
 * Merge rule for coincident samples (φ = 0 and 360, pole rows, repeated rows): the power
 * average v = 10·log10((1/k) Σ 10^(vⱼ/10)) (Eq. 1) — the mean power seen in that direction;
 * for equal samples it returns the sample. maxSpreadDb lets the caller warn
 * ('duplicate-differs') when samples disagree, e.g. by more than 0.5 dB (common practice for
 * positioner repeatability, not a standard's value). Non-finite samples are skipped; a point
 * left without one is NaN and counted in `missing` (the caller must resolve it before
 * createMeasurement). Both routes sum the linear powers in raw sample order, so they agree
 * bit for bit.
 *
 * `reuseInput`: when every raw sample i maps to a point p ≤ i (an export written θ-major then
 * φ, with or without a φ = 360 column; rawOrderKind), the merged values are written over the
 * first m entries of `rawValues` and returned as a view of it (`inPlace`), so no second copy of
 * the beam exists; `rawValues` is then consumed. Entry p is only written by samples of point
 * p, all at indices ≥ p, so raw entry p has been read before; no unread sample is overwritten.
 * Cost O(n), exponentials only for coincident samples; the sorted route copies runs of
 * single-sample points as blocks (sortedSegments, cached per build), the other reuses module
 * scratch; each allocates only the output, and only when not in place.
 * @throws RangeError when rawValues does not have one value per raw sample.
 * @example mergeSamples(build, [0, 10] /* one point *\/) // 7.404 dB, spread 10 dB
 */
export function mergeSamples(build: GridBuild, rawValues: Float64Array, reuseInput = false): MergedValues {
  const { pointOf } = build;
  const n = rawValues.length;
  if (n !== pointOf.length) {
    throw new RangeError(`mergeSamples: ${n} values for ${pointOf.length} samples`);
  }
  const m = build.grid.thetaDeg.length;
  const kind = rawOrderKind(build);
  const inPlace = reuseInput && kind > 0;
  if (kind === 2) {
    const values = inPlace ? rawValues.subarray(0, m) : new Float64Array(m);
    let maxSpreadDb = 0;
    let missing = 0;
    const seg = sortedSegments(build);
    for (let s = 0; s < seg.length; s += 3) {
      const start = seg[s];
      const p = seg[s + 2];
      if (seg[s + 1] < 0) {
        // A run of points with one sample each: copied as they are (in place the copy only
        // moves samples down, p ≤ start, reading ahead of what it writes); a non-finite
        // sample leaves its point missing (v − v is NaN only for NaN and ±∞).
        const shift = start - p;
        const end = p - seg[s + 1];
        for (let q = p; q < end; q++) {
          const v = rawValues[q + shift];
          if (v - v === 0) values[q] = v;
          else {
            values[q] = NaN;
            missing++;
          }
        }
        continue;
      }
      const end = start + seg[s + 1];
      let count = 0;
      let lo = Infinity;
      let hi = -Infinity;
      let sumLin = 0;
      for (let i = start; i < end; i++) {
        const v = rawValues[i];
        if (!Number.isFinite(v)) continue;
        // Linear power only where samples coincide: a single sample keeps its dB value untouched.
        if (count === 1) sumLin = Math.exp(lo * LN10_OVER_10);
        if (count >= 1) sumLin += Math.exp(v * LN10_OVER_10);
        count++;
        if (v < lo) lo = v;
        if (v > hi) hi = v;
      }
      if (count === 0) {
        values[p] = NaN;
        missing++;
        continue;
      }
      values[p] = count === 1 ? lo : 10 * Math.log10(sumLin / count); // Eq. 1
      if (hi - lo > maxSpreadDb) maxSpreadDb = hi - lo;
    }
    return { values, maxSpreadDb, missing, inPlace };
  }
  if (scratchCount.length < m) {
    scratchCount = new Int32Array(m);
    scratchLo = new Float64Array(m);
    scratchHi = new Float64Array(m);
    scratchSum = new Float64Array(m);
  }
  const count = scratchCount;
  const lo = scratchLo;
  const hi = scratchHi;
  const sumLin = scratchSum;
  count.fill(0, 0, m);
  const values = inPlace ? rawValues.subarray(0, m) : new Float64Array(m);
  for (let i = 0; i < n; i++) {
    const v = rawValues[i];
    if (!Number.isFinite(v)) continue;
    const p = pointOf[i];
    const c = count[p];
    count[p] = c + 1;
    if (c === 0) {
      values[p] = v;
      continue;
    }
    if (c === 1) {
      const first = values[p];
      lo[p] = first;
      hi[p] = first;
      sumLin[p] = Math.exp(first * LN10_OVER_10);
    }
    sumLin[p] += Math.exp(v * LN10_OVER_10);
    if (v < lo[p]) lo[p] = v;
    if (v > hi[p]) hi[p] = v;
  }
  let maxSpreadDb = 0;
  let missing = 0;
  for (let p = 0; p < m; p++) {
    const c = count[p];
    if (c === 0) {
      values[p] = NaN;
      missing++;
    } else if (c > 1) {
      values[p] = 10 * Math.log10(sumLin[p] / c); // Eq. 1
      if (hi[p] - lo[p] > maxSpreadDb) maxSpreadDb = hi[p] - lo[p];
    }
  }
  return { values, maxSpreadDb, missing, inPlace };
}
