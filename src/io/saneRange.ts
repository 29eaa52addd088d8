/**
 * Sane ranges for the numbers a user or a file supplies: a finite number outside them is a typo,
 * a unit mix-up or a hostile file, and it would turn into ±Infinity (and then a silent null in
 * results.json) somewhere downstream, e.g. 10^(1e308/10) on the way to linear power. Each range
 * is far wider than any real measurement; the limits are this project's choice (common sense,
 * not a standard): −174 dBm/Hz is the thermal noise floor and a phased array radiates well
 * under +100 dBm, so ±500 leaves room for any dB bookkeeping while keeping every sum finite.
 *
 * One owner for these bounds: readers, the job file, limit sets and the command line ask it.
 */

export interface SaneRange {
  lo: number;
  hi: number;
  /** What is expected, for the message: "a level between -500 and 500 dBm". */
  expected: string;
}

/** An absolute level or a limit/threshold: dBm, dBi (EIRP, EIS, gain). */
export const LEVEL_RANGE: SaneRange = { lo: -500, hi: 500, expected: 'a number between -500 and 500 (dBm or dBi)' };
/** A calibration offset, dB. */
export const OFFSET_RANGE: SaneRange = { lo: -200, hi: 200, expected: 'a finite offset between -200 and 200 dB' };
/** A relative threshold below the TSP peak, dB. */
export const RELATIVE_DB_RANGE: SaneRange = { lo: -500, hi: 500, expected: 'a finite number of dB between -500 and 500 relative to the peak' };
/** A frequency, Hz (0 exclusive, 10 THz). */
export const FREQUENCY_HZ_RANGE: SaneRange = { lo: Number.MIN_VALUE, hi: 1e13, expected: 'a positive frequency up to 10 THz' };

/**
 * True when `v` is a finite number inside `r` (bounds included).
 * @example inSaneRange(-1e308, LEVEL_RANGE) === false
 */
export function inSaneRange(v: unknown, r: SaneRange): v is number {
  return typeof v === 'number' && Number.isFinite(v) && v >= r.lo && v <= r.hi;
}
