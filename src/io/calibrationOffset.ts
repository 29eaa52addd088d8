import type { CalibrationPoint } from './types.js';

/**
 * Calibration offset (dB) at a frequency, by linear interpolation in frequency between the
 * two neighbouring table points: off(f) = off₀ + (off₁ − off₀)·(f − f₀)/(f₁ − f₀)   Eq. (C1)
 * (piecewise-linear interpolation; a table point is returned exactly). EIRP = P_rx + off(f).
 * Refuses to extrapolate: returns null outside [f_first, f_last].
 * `table` must be sorted by frequency (loadJobFile sorts it). Cost O(log n).
 * @example calibrationOffsetDb([{frequencyHz: 26e9, offsetDb: 30}, {frequencyHz: 28e9, offsetDb: 32}], 27e9) // 31
 */
export function calibrationOffsetDb(table: CalibrationPoint[], frequencyHz: number): number | null {
  const n = table.length;
  if (n === 0 || frequencyHz < table[0].frequencyHz || frequencyHz > table[n - 1].frequencyHz) return null;
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (table[mid].frequencyHz <= frequencyHz) lo = mid;
    else hi = mid;
  }
  const a = table[lo];
  const b = table[hi];
  if (frequencyHz === a.frequencyHz || a.frequencyHz === b.frequencyHz) return a.offsetDb;
  if (frequencyHz === b.frequencyHz) return b.offsetDb;
  return a.offsetDb + ((b.offsetDb - a.offsetDb) * (frequencyHz - a.frequencyHz)) / (b.frequencyHz - a.frequencyHz); // Eq. (C1)
}
