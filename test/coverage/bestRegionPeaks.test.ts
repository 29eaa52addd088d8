import { describe, expect, it } from 'vitest';
import { bestRegionPeaks } from '../../src/coverage/bestRegionPeaks.js';

// Hand-worked cases (no outside source needed: the definition is a per-beam arg-best over the
// points where that beam is best).
describe('bestRegionPeaks: where each beam is strongest inside its own best region', () => {
  it('picks the strongest point of each region, not the beam’s global peak (doc @example)', () => {
    // Beam 0 is best at points 0 and 1 (its peak there is point 1, value 3); beam 1 only at point
    // 2, although its values elsewhere do not matter.
    const at = bestRegionPeaks([Float64Array.of(1, 3, 0), Float64Array.of(0, 0, 2)], Int32Array.of(0, 0, 1), 'eirp');
    expect(Array.from(at)).toEqual([1, 2]);
  });

  it('for EIS the strongest is the lowest value; a beam best nowhere gets −1; unmeasured points are skipped', () => {
    const eis = [Float64Array.of(-90, -95, -80, -99), Float64Array.of(-85, -85, -92, -99), Float64Array.of(0, 0, 0, -120)];
    const at = bestRegionPeaks(eis, Int32Array.of(0, 0, 1, -1), 'eis');
    expect(Array.from(at)).toEqual([1, 2, -1]);
  });

  it('ties go to the lower grid index', () => {
    expect(Array.from(bestRegionPeaks([Float64Array.of(5, 5, 5)], Int32Array.of(0, 0, 0), 'gain'))).toEqual([0]);
  });

  it('refuses a best-beam index that names no beam', () => {
    expect(() => bestRegionPeaks([Float64Array.of(1)], Int32Array.of(3), 'eirp')).toThrow(RangeError);
  });
});
