import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { rankedCdf, subsetCdf, weightedCdf, type WeightedCdf } from '../../src/coverage/weightedCdf.js';

/** Bit-for-bit equality of two CDFs (Object.is on every number). */
function sameCdf(a: WeightedCdf, b: WeightedCdf): boolean {
  const same = (x: Float64Array, y: Float64Array) => x.length === y.length && x.every((v, i) => Object.is(v, y[i]));
  return same(a.values, b.values) && same(a.cumulativeSr, b.cumulativeSr) && Object.is(a.measuredSr, b.measuredSr) && Object.is(a.sphereSr, b.sphereSr);
}

// Oracle: weightedCdf itself (the sorted definition); the ranked and subset forms must give its
// bits, since gridAdequacy reads the sub-grids' percentiles through them.
describe('rankedCdf and subsetCdf equal weightedCdf bit for bit', () => {
  const points = fc.array(fc.tuple(fc.integer({ min: -40, max: 40 }), fc.double({ min: 0, max: 1, noNaN: true }), fc.boolean(), fc.double({ min: 0, max: 1, noNaN: true })), { minLength: 1, maxLength: 120 });

  it('ranked: same CDF, and stepOf names each value\'s step (ties, zero weights; fast-check, seeded)', () => {
    fc.assert(fc.property(points, (pts) => {
      const v = Float64Array.from(pts, (p) => p[0] / 4);
      const w = Float64Array.from(pts, (p) => p[1]);
      const r = rankedCdf(v, w);
      expect(sameCdf(r, weightedCdf(v, w))).toBe(true);
      for (let i = 0; i < v.length; i++) expect(r.values[r.stepOf[i]]).toBe(v[i]);
    }), { seed: 18, numRuns: 200 });
  });

  it('subset with its own weights: same CDF as sorting the subset\'s values (fast-check, seeded)', () => {
    fc.assert(fc.property(points, (pts) => {
      const v = Float64Array.from(pts, (p) => p[0] / 4);
      const w = Float64Array.from(pts, (p) => p[1]);
      const index = Int32Array.from(pts.flatMap((p, i) => (p[2] ? [i] : [])));
      const sw = Float64Array.from(index, (i) => pts[i][3]);
      const want = weightedCdf(Float64Array.from(index, (i) => v[i]), sw);
      expect(sameCdf(subsetCdf(rankedCdf(v, w), index, sw), want)).toBe(true);
    }), { seed: 18, numRuns: 200 });
  });

  it('the documented example: subset {3, 3} of [3, 1, 3] weighted 5 each', () => {
    const c = subsetCdf(rankedCdf([3, 1, 3], [1, 2, 1]), Int32Array.of(0, 2), [5, 5]);
    expect([Array.from(c.values), Array.from(c.cumulativeSr)]).toEqual([[3], [10]]);
    expect(() => subsetCdf(rankedCdf([1], [1]), Int32Array.of(0), [])).toThrow(RangeError);
  });
});
