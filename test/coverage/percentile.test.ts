import { describe, expect, it } from 'vitest';
import { coverageCurve } from '../../src/coverage/coverageCurve.js';
import { coverageEfficiency, relativeCoverage } from '../../src/coverage/coverageEfficiency.js';
import { percentile } from '../../src/coverage/percentile.js';
import { weightedCdf } from '../../src/coverage/weightedCdf.js';
import { expectClose } from '../helpers/expectClose.js';

const PI = Math.PI;
// Four equal quarters of the sphere: hand-computed step CDF F = 0.25, 0.5, 0.75, 1.
const quarters = weightedCdf([4, 1, 3, 2], [PI, PI, PI, PI]);

describe('percentile: step rule over 4π (hand-computed cases)', () => {
  it('takes the smallest value whose CDF reaches p', () => {
    expect(percentile(quarters, 25, 'eirp')).toBe(1);
    expect(percentile(quarters, 25.0001, 'eirp')).toBe(2);
    expect(percentile(quarters, 50, 'eirp')).toBe(2);
    expect(percentile(quarters, 99, 'eirp')).toBe(3 + 1);
  });
  it('0 % is the minimum and 100 % the maximum', () => {
    expect(percentile(quarters, 0, 'eirp')).toBe(1);
    expect(percentile(quarters, 100, 'eirp')).toBe(4);
    expect(percentile(quarters, 0, 'eis')).toBe(1);
    expect(percentile(quarters, 100, 'eis')).toBe(4);
  });
  it('ties are one step', () => {
    const c = weightedCdf([5, 5, 5, 7], [PI, PI, PI, PI]);
    expect(Array.from(c.values)).toEqual([5, 7]);
    expect(percentile(c, 75, 'eirp')).toBe(5);
    expect(percentile(c, 76, 'eirp')).toBe(7);
  });
  it('zero weights never move the result', () => {
    const c = weightedCdf([4, 1, 3, 2, -50, 99], [PI, PI, PI, PI, 0, 0]);
    expect(percentile(c, 50, 'eirp')).toBe(2);
    expect(percentile(c, 25, 'eirp')).toBe(1);
  });
  it('a total weight that drifts below 4π in floating point still reaches 100 % and 50 %', () => {
    const w = PI * (1 - 4e-16);
    const c = weightedCdf([1, 2, 3, 4], [w, w, w, w]);
    expect(percentile(c, 100, 'eirp')).toBe(4);
    expect(percentile(c, 50, 'eirp')).toBe(2);
  });
  it('partial sphere: the unmeasured part counts as worst; levels inside it are null', () => {
    // Three quarters measured: eirp puts the missing quarter at −∞, eis at +∞.
    const c = weightedCdf([1, 2, 3], [PI, PI, PI]);
    expect(percentile(c, 0, 'eirp')).toBeNull();
    expect(percentile(c, 25, 'eirp')).toBeNull();
    expect(percentile(c, 26, 'eirp')).toBe(1);
    expect(percentile(c, 50, 'eirp')).toBe(1);
    expect(percentile(c, 100, 'eirp')).toBe(3);
    expect(percentile(c, 0, 'eis')).toBe(1);
    expect(percentile(c, 75, 'eis')).toBe(3);
    expect(percentile(c, 76, 'eis')).toBeNull();
    expect(percentile(c, 100, 'eis')).toBeNull();
  });
  it('rejects levels outside [0, 100]', () => {
    expect(() => percentile(quarters, -1, 'eirp')).toThrow(RangeError);
    expect(() => percentile(quarters, 100.5, 'eirp')).toThrow(RangeError);
    expect(() => percentile(quarters, NaN, 'eirp')).toThrow(RangeError);
  });
});

describe('coverage efficiency (hand-computed cases)', () => {
  it('counts values at or better than the threshold over 4π', () => {
    expect(coverageEfficiency(quarters, 3, 'eirp')).toBe(0.5);
    expect(coverageEfficiency(quarters, 2.5, 'eirp')).toBe(0.5);
    expect(coverageEfficiency(quarters, 0, 'eirp')).toBe(1);
    expect(coverageEfficiency(quarters, 5, 'eirp')).toBe(0);
    expect(coverageEfficiency(quarters, 3, 'eis')).toBe(0.75);
    expect(coverageEfficiency(quarters, 0, 'eis')).toBe(0);
  });
  it('a partial sphere never reaches 1', () => {
    const c = weightedCdf([1, 2, 3], [PI, PI, PI]);
    expect(coverageEfficiency(c, -100, 'eirp')).toBe(0.75);
    expect(coverageEfficiency(c, 100, 'eis')).toBe(0.75);
  });
  it('relative thresholds: dB below the peak (eirp), dB above the best EIS (eis)', () => {
    expect(relativeCoverage(quarters, [1, 3], 'eirp')).toEqual([
      { threshold: 3, efficiency: 0.5, dbBelowPeak: 1 },
      { threshold: 1, efficiency: 1, dbBelowPeak: 3 },
    ]);
    expect(relativeCoverage(quarters, [1], 'eis')).toEqual([{ threshold: 2, efficiency: 0.5, dbBelowPeak: 1 }]);
  });
  it('the curve runs on a 0.1 dB grid from below the minimum to above the maximum, efficiency falling', () => {
    const c = weightedCdf([1.05, 2, 3, 4.04], [PI, PI, PI, PI]);
    const curve = coverageCurve(c, 'eirp');
    expectClose(curve[0].threshold, 1.0, 1e-12, 'floor to the 0.1 grid');
    expectClose(curve[curve.length - 1].threshold, 4.1, 1e-12, 'ceil to the 0.1 grid');
    expect(curve.length).toBe(32);
    expect(curve[0].efficiency).toBe(1);
    expect(curve[curve.length - 1].efficiency).toBe(0);
    for (let k = 1; k < curve.length; k++) expect(curve[k].efficiency).toBeLessThanOrEqual(curve[k - 1].efficiency);
    // A 300 dB span is capped to at most MAX_CURVE_POINTS with a whole-multiple step.
    expect(coverageCurve(weightedCdf([-280, 20], [PI, PI]), 'eirp').length).toBeLessThanOrEqual(2001);
  });
});
