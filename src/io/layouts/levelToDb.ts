import { mwToDbm, wToDbm } from '../../units.js';
import { inSaneRange, LEVEL_RANGE } from '../saneRange.js';

/**
 * One value cell as written (in the file's value unit) to dB: mW and W are converted to dBm, and
 * the level must lie in the sane range (LEVEL_RANGE). Returns the level in dB, or, for a cell
 * the readers refuse, the "expected …" text of the located error.
 * @example levelToDb(100, 'mW') // 20
 * @example levelToDb(0, 'W') // 'a positive power in W'
 */
export function levelToDb(v: number, fileValueUnit: 'dBm' | 'dBi' | 'mW' | 'W'): number | string {
  const linear = fileValueUnit === 'mW' || fileValueUnit === 'W';
  if (linear) {
    if (!(v > 0)) return `a positive power in ${fileValueUnit}`;
    v = fileValueUnit === 'mW' ? mwToDbm(v) : wToDbm(v);
  }
  if (!inSaneRange(v, LEVEL_RANGE)) return `${LEVEL_RANGE.expected}${linear ? ` after conversion from ${fileValueUnit}` : ''}`;
  return v;
}

/**
 * The cells levelToDb returns unchanged: a dB unit (dBm, dBi) and a level inside LEVEL_RANGE;
 * null for mW and W (always converted). For a per-row fast path that must agree with levelToDb.
 */
export function unchangedLevels(fileValueUnit: 'dBm' | 'dBi' | 'mW' | 'W'): { lo: number; hi: number } | null {
  return fileValueUnit === 'mW' || fileValueUnit === 'W' ? null : { lo: LEVEL_RANGE.lo, hi: LEVEL_RANGE.hi };
}
