/** One owner for the map colour scales: the PDF and viewer.html read the same scale for a unit. */
import { describe, expect, it } from 'vitest';
import { deltaScaleMaxDb, finiteRange, scaleT, valueScale } from '../../src/report/valueScale.js';
import { diffScale, valueScaleOf } from '../../src/viewer/colors.js';

describe('valueScale', () => {
  it('puts the best value at the top of the bar: high EIRP, low EIS', () => {
    const eirp = valueScale(11.2, 28.7, 'eirp');
    expect(eirp.invert).toBe(false);
    expect(eirp.lo).toBeLessThanOrEqual(11.2);
    expect(eirp.hi).toBeGreaterThanOrEqual(28.7);
    expect(scaleT(eirp, eirp.hi)).toBe(1);
    const eis = valueScale(-101, -84, 'eis');
    expect(eis.invert).toBe(true);
    expect(scaleT(eis, eis.lo)).toBe(1); // the most sensitive (lowest) EIS is best
    expect(scaleT(eis, eis.hi)).toBe(0);
  });

  it('finiteRange skips NaN and ±Infinity; no finite value gives [0, 1]', () => {
    expect(finiteRange([NaN, 3, -Infinity, -2, Infinity])).toEqual([-2, 3]);
    expect(finiteRange([NaN])).toEqual([0, 1]);
  });

  it('the difference scale is symmetric and at least ±0.5 dB', () => {
    expect(deltaScaleMaxDb([0.01, -0.02])).toBeGreaterThanOrEqual(0.5);
    const wide = deltaScaleMaxDb([-3.3, 1.2, NaN]);
    expect(wide).toBeGreaterThanOrEqual(3.3);
    expect(diffScale([-3.3, 1.2])).toMatchObject({ lo: -wide, hi: wide, ticks: [-wide, 0, wide], diverging: true, invert: false });
  });

  it("viewer.html's scale is the PDF's scale over the same values", () => {
    const v = new Float64Array([-97.5, NaN, -88.25, -91]);
    const pdf = valueScale(...finiteRange(v), 'eis');
    expect(valueScaleOf(v, 'eis')).toEqual({ ...pdf, diverging: false });
  });
});
