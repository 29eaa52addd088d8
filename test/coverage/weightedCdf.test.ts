import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { rankedCdf, sortedCdf, subsetCdf, weightedCdf, type WeightedCdf } from '../../src/coverage/weightedCdf.js';

/** Bit-for-bit equality of two CDFs (Object.is on every number). */
function sameCdf(a: WeightedCdf, b: WeightedCdf): boolean {
  const same = (x: Float64Array, y: Float64Array) => x.length === y.length && x.every((v, i) => Object.is(v, y[i]));
  return same(a.values, b.values) && same(a.cumulativeSr, b.cumulativeSr) && Object.is(a.measuredSr, b.measuredSr) && Object.is(a.sphereSr, b.sphereSr);
}

// Oracle: the sort route (sortedCdf: sort, binary search, per-step sums in point order), which
// takes no lattice shortcut; weightedCdf, the ranked and the subset forms must give its bits,
// since the metrics, the reports and gridAdequacy's sub-grids read percentiles through them.
describe('weightedCdf, rankedCdf and subsetCdf equal the sort route bit for bit', () => {
  const points = fc.array(fc.tuple(fc.integer({ min: -40, max: 40 }), fc.double({ min: 0, max: 1, noNaN: true }), fc.boolean(), fc.double({ min: 0, max: 1, noNaN: true })), { minLength: 1, maxLength: 120 });

  it('ranked: same CDF, and stepOf names each value\'s step (ties, zero weights; fast-check, seeded)', () => {
    fc.assert(fc.property(points, (pts) => {
      const v = Float64Array.from(pts, (p) => p[0] / 4);
      const w = Float64Array.from(pts, (p) => p[1]);
      const r = rankedCdf(v, w);
      expect(sameCdf(r, sortedCdf(v, w))).toBe(true);
      expect(sameCdf(weightedCdf(v, w), sortedCdf(v, w))).toBe(true);
      for (let i = 0; i < v.length; i++) expect(r.values[r.stepOf[i]]).toBe(v[i]);
    }), { seed: 18, numRuns: 200 });
  });

  it('subset with its own weights: same CDF as sorting the subset\'s values (fast-check, seeded)', () => {
    fc.assert(fc.property(points, (pts) => {
      const v = Float64Array.from(pts, (p) => p[0] / 4);
      const w = Float64Array.from(pts, (p) => p[1]);
      const index = Int32Array.from(pts.flatMap((p, i) => (p[2] ? [i] : [])));
      const sw = Float64Array.from(index, (i) => pts[i][3]);
      const want = sortedCdf(Float64Array.from(index, (i) => v[i]), sw);
      expect(sameCdf(subsetCdf(rankedCdf(v, w), index, sw), want)).toBe(true);
    }), { seed: 18, numRuns: 200 });
  });

  it('weightedCdf and rankedCdf without a sort (two-decimal values) or with one (anything else): the bits of the sort route', () => {
    // Two-decimal values with some off the lattice (merged pole samples), −0 beside 0, NaN,
    // ±∞, huge values and a sparse lattice: each takes its route and gives the sorted CDF.
    const L = (k: number) => k / 100;
    const cases: number[][] = [
      [L(2921), L(2921), L(-5), 29.213456, L(3000), 29.213456, 7.123456789, L(0), L(1)],
      [L(0), -0, L(3), L(3)],
      [-0, L(3), -0],
      [L(5), -0, L(-5), L(0), L(0), -0],
      [L(0), L(-1), L(1)],
      [L(5), Infinity, L(2), -Infinity],
      [1e15, L(3), L(4), L(5), L(6)],
      [L(-300000), L(0), L(300000)],
      [0.1, 0.2, 0.30000000000000004, 0.3, L(30), L(31)],
    ];
    for (const v of cases) {
      const w = v.map((_, i) => 0.5 + i / 7);
      const r = rankedCdf(v, w);
      expect(sameCdf(r, sortedCdf(v, w))).toBe(true);
      expect(sameCdf(weightedCdf(v, w), sortedCdf(v, w))).toBe(true);
      for (let i = 0; i < v.length; i++) expect(Object.is(r.values[r.stepOf[i]], v[i]) || r.values[r.stepOf[i]] === v[i]).toBe(true);
    }
    expect(() => rankedCdf([L(1), NaN], [1, 1])).toThrow(RangeError);
    expect(() => weightedCdf([L(1), NaN], [1, 1])).toThrow(RangeError);
    fc.assert(fc.property(fc.array(fc.tuple(fc.integer({ min: -5000, max: 5000 }), fc.integer({ min: 0, max: 9 }), fc.double({ min: 0, max: 1, noNaN: true })), { minLength: 1, maxLength: 150 }), (pts) => {
      const v = pts.map(([k, off]) => (off === 0 ? k / 100 + 1e-7 : k / 100)); // about one in ten off the lattice
      const w = pts.map((p) => p[2]);
      expect(sameCdf(rankedCdf(v, w), sortedCdf(v, w))).toBe(true);
      expect(sameCdf(weightedCdf(v, w), sortedCdf(v, w))).toBe(true);
    }), { seed: 18, numRuns: 300 });
  });

  it('the documented example: subset {3, 3} of [3, 1, 3] weighted 5 each', () => {
    const c = subsetCdf(rankedCdf([3, 1, 3], [1, 2, 1]), Int32Array.of(0, 2), [5, 5]);
    expect([Array.from(c.values), Array.from(c.cumulativeSr)]).toEqual([[3], [10]]);
    expect(() => subsetCdf(rankedCdf([1], [1]), Int32Array.of(0), [])).toThrow(RangeError);
  });
});
