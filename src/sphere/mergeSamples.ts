import type { GridBuild } from './buildGrid.js';

const LN10_OVER_10 = Math.LN10 / 10;

export interface MergedValues {
  /** One dB value per grid point; NaN where no finite sample exists. */
  values: Float64Array;
  /** Largest (max − min) among the samples merged into one point, dB (0 when none merged). */
  maxSpreadDb: number;
  /** Grid points without any finite sample. */
  missing: number;
}

/**
 * Maps raw per-sample dB values onto the grid points of `build`.
 *
 * Merge rule for coincident samples (φ = 0 and 360, pole rows, repeated rows): the power
 * average v = 10·log10((1/k) Σ 10^(vⱼ/10)) (Eq. 1) — the mean power seen in that direction;
 * for equal samples it returns the sample. maxSpreadDb lets the caller warn
 * ('duplicate-differs') when samples disagree, e.g. by more than 0.5 dB (common practice for
 * positioner repeatability, not a standard's value). Non-finite samples are skipped; a point
 * left without one is NaN and counted in `missing` (the caller must resolve it before
 * createMeasurement).
 * Cost O(n) (exponentials only for coincident samples), four typed arrays, no per-point allocation.
 * @throws RangeError when rawValues does not have one value per raw sample.
 * @example mergeSamples(build, [0, 10] /* one point *\/) // 7.404 dB, spread 10 dB
 */
export function mergeSamples(build: GridBuild, rawValues: Float64Array): MergedValues {
  const { pointOf } = build;
  if (rawValues.length !== pointOf.length) {
    throw new RangeError(`mergeSamples: ${rawValues.length} values for ${pointOf.length} samples`);
  }
  const m = build.grid.thetaDeg.length;
  const sumLin = new Float64Array(m);
  const lo = new Float64Array(m).fill(Infinity);
  const hi = new Float64Array(m).fill(-Infinity);
  const count = new Int32Array(m);
  for (let i = 0; i < rawValues.length; i++) {
    const v = rawValues[i];
    if (!Number.isFinite(v)) continue;
    const p = pointOf[i];
    // Linear power only where samples coincide: a single sample keeps its dB value untouched.
    if (count[p] === 1) sumLin[p] = Math.exp(lo[p] * LN10_OVER_10);
    if (count[p] >= 1) sumLin[p] += Math.exp(v * LN10_OVER_10);
    count[p]++;
    if (v < lo[p]) lo[p] = v;
    if (v > hi[p]) hi[p] = v;
  }
  const values = new Float64Array(m);
  let maxSpreadDb = 0;
  let missing = 0;
  for (let p = 0; p < m; p++) {
    if (count[p] === 0) { values[p] = NaN; missing++; continue; }
    // One sample keeps its exact value (no dB → linear → dB round-off).
    values[p] = count[p] === 1 ? lo[p] : 10 * Math.log10(sumLin[p] / count[p]); // Eq. 1
    if (hi[p] - lo[p] > maxSpreadDb) maxSpreadDb = hi[p] - lo[p];
  }
  return { values, maxSpreadDb, missing };
}
