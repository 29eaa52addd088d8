import type { LimitSet } from './limitSet.js';

/**
 * Whether a measurement frequency lies in the limit set's band (inclusive edges). true when the
 * set names no range; null when the measurement has no frequency (cannot tell). The batch can
 * warn on false: a band profile applied to another band is usually a mistake.
 *
 * @example frequencyInRange({ ...ls, frequencyRangeMHz: [26500, 29500] }, 28e9) // true
 */
export function frequencyInRange(ls: LimitSet, frequencyHz: number | null): boolean | null {
  if (!ls.frequencyRangeMHz) return true;
  if (frequencyHz === null) return null;
  const mhz = frequencyHz / 1e6;
  return mhz >= ls.frequencyRangeMHz[0] && mhz <= ls.frequencyRangeMHz[1];
}
