// The incremental fast paths (patched percentile, greedy subset, beam removal) against the
// straightforward evaluation they replace (./straightforward.ts: merge every candidate into a
// full copy and run the weighted quickselect), bit for bit, on seeded random cases with many
// ties, duplicated and constant beams, −∞ samples, partial spheres (null percentiles) and eis.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { beamRemoval } from '../../src/analysis/beamRemoval.js';
import { greedySubset } from '../../src/analysis/greedySubset.js';
import { createPatchedPercentile } from '../../src/analysis/patchedPercentile.js';
import { createPercentileSelector } from '../../src/analysis/percentileSelector.js';
import { totalScanPattern } from '../../src/coverage/totalScanPattern.js';
import type { Quantity, SphereGrid } from '../../src/types.js';
import { fullGrid, gaussianBeam, regularGrid, steps } from './fixtures.js';
import { straightBeamRemoval, straightGreedySubset } from './straightforward.js';

function lcg(seed: number): () => number {
  let s = seed >>> 0;
  return () => ((s = (Math.imul(s, 1103515245) + 12345) >>> 0) / 4294967296);
}

/** Full 10°/15°/20°/30° grids, a hemisphere (partial sphere: eirp low levels and eis high levels are null) and a 60° cap. */
const grids: SphereGrid[] = [
  fullGrid(10),
  fullGrid(15),
  fullGrid(20),
  regularGrid(steps(0, 90, 15), steps(0, 345, 15)),
  regularGrid(steps(0, 60, 10), steps(0, 340, 20)),
  fullGrid(30),
];

/** A random codebook: smooth beams, coarse-quantized copies (ties), duplicates, a constant beam, rare −∞. */
function codebook(grid: SphereGrid, count: number, rnd: () => number, quantity: Quantity): Float64Array[] {
  const out: Float64Array[] = [];
  for (let k = 0; k < count; k++) {
    const kind = rnd();
    let b: Float64Array;
    if (kind < 0.15 && out.length > 0) b = Float64Array.from(out[Math.floor(rnd() * out.length)]); // duplicate
    else if (kind < 0.22) b = new Float64Array(grid.weightSr.length).fill(Math.round(rnd() * 20)); // constant
    else {
      b = gaussianBeam(grid, rnd() * 180, rnd() * 360, 30 + rnd() * 90, 10 + rnd() * 10);
      const q = kind < 0.6 ? 1 : kind < 0.8 ? 0.25 : 0; // integer dB, quarter dB, or unquantized
      if (q > 0) for (let i = 0; i < b.length; i++) b[i] = Math.max(-20, Math.round(b[i] * q) / q);
    }
    if (rnd() < 0.1) b[Math.floor(rnd() * b.length)] = -Infinity;
    if (quantity === 'eis') for (let i = 0; i < b.length; i++) b[i] = -b[i] - 70; // EIS in dBm: lower is better
    out.push(b);
  }
  return out;
}

const caseArb = fc.record({
  g: fc.integer({ min: 0, max: grids.length - 1 }),
  count: fc.integer({ min: 1, max: 14 }),
  seed: fc.integer({ min: 0, max: 0x7fffffff }),
  levelPct: fc.oneof(fc.constantFrom(50, 50, 10, 90, 0, 100, 25), fc.double({ min: 0, max: 100, noNaN: true })),
  quantity: fc.constantFrom<Quantity>('eirp', 'eis', 'gain'),
  toleranceDb: fc.constantFrom(0, 0.5, 2),
});

describe('greedySubset fast path = straightforward evaluation (bit for bit)', () => {
  it('on seeded random codebooks, full and partial spheres, eirp and eis', () => {
    fc.assert(
      fc.property(caseArb, ({ g, count, seed, levelPct, quantity, toleranceDb }) => {
        const grid = grids[g];
        const beams = codebook(grid, count, lcg(seed), quantity);
        const ids = beams.map((_, k) => `b${k}`);
        expect(greedySubset(grid, beams, ids, quantity, levelPct, toleranceDb)).toEqual(straightGreedySubset(grid, beams, ids, quantity, levelPct, toleranceDb));
      }),
      { seed: 4711, numRuns: 150 },
    );
  });

  it('given the total scan pattern (the batch passes computeMetrics\' one), the same answer; NaN samples too', () => {
    fc.assert(
      fc.property(caseArb, fc.boolean(), ({ g, count, seed, levelPct, quantity, toleranceDb }, withNaN) => {
        const grid = grids[g], rnd = lcg(seed);
        const beams = codebook(grid, count, rnd, quantity);
        // A NaN in beam 0 stays in the TSP (no beam is better than NaN there) but never wins in the search.
        if (withNaN) for (const b of beams) if (rnd() < 0.5) b[Math.floor(rnd() * b.length)] = NaN;
        const ids = beams.map((_, k) => `b${k}`);
        const tsp = totalScanPattern(beams, quantity);
        expect(greedySubset(grid, beams, ids, quantity, levelPct, toleranceDb, tsp)).toEqual(straightGreedySubset(grid, beams, ids, quantity, levelPct, toleranceDb));
      }),
      { seed: 4712, numRuns: 150 },
    );
  });

  it('on a 64-beam case the size of a real run (2,594 points), including exact 50 % ties', () => {
    const grid = fullGrid(5);
    const rnd = lcg(99);
    const beams = codebook(grid, 40, rnd, 'eirp');
    // Hemisphere beams: the TSP splits the sphere into equal-weight halves (cumulative exactly at 50 %).
    beams.push(grid.thetaDeg.map((t) => (t < 90 ? 30 : 0)), grid.thetaDeg.map((t) => (t > 90 ? 30 : 0)));
    const ids = beams.map((_, k) => `b${k}`);
    for (const [level, tol] of [[50, 0], [50, 0.5], [20, 0], [95, 0.1]]) {
      expect(greedySubset(grid, beams, ids, 'eirp', level, tol)).toEqual(straightGreedySubset(grid, beams, ids, 'eirp', level, tol));
    }
  });
});

describe('beamRemoval fast path = straightforward evaluation (bit for bit)', () => {
  it('on seeded random codebooks', () => {
    fc.assert(
      fc.property(caseArb, fc.integer({ min: -5, max: 25 }), ({ g, count, seed, levelPct, quantity }, t) => {
        const grid = grids[g];
        const beams = codebook(grid, count, lcg(seed), quantity);
        const threshold = quantity === 'eis' ? -t - 70 : t;
        expect(beamRemoval(grid, beams, quantity, levelPct, threshold)).toEqual(straightBeamRemoval(grid, beams, quantity, levelPct, threshold));
        expect(beamRemoval(grid, beams, quantity, levelPct, null)).toEqual(straightBeamRemoval(grid, beams, quantity, levelPct, null));
      }),
      { seed: 815, numRuns: 150 },
    );
  });
});

describe('createPatchedPercentile = selector on the patched copy', () => {
  it('random bases and patches, with window cuts; both the bin path and the reference path are taken', () => {
    let fastSeen = 0, referenceSeen = 0;
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: grids.length - 1 }),
        fc.integer({ min: 0, max: 0x7fffffff }),
        fc.constantFrom(50, 10, 90, 0, 100, 33.3),
        fc.constantFrom<Quantity>('eirp', 'eis'),
        fc.boolean(),
        (g, seed, levelPct, quantity, coarse) => {
          const grid = grids[g], n = grid.weightSr.length, rnd = lcg(seed);
          const value = () => (coarse ? Math.round(rnd() * 8) : rnd() * 40 - 10); // coarse: heavy ties
          const base = Float64Array.from({ length: n }, value);
          const patch = Float64Array.from({ length: n }, value);
          const points = Int32Array.from(Array.from({ length: n }, (_, i) => i).filter(() => rnd() < 0.3));
          const evaluator = createPatchedPercentile(grid.weightSr, quantity, levelPct);
          evaluator.setBase(base, rnd() * 10 - 5, 5 + rnd() * 30);
          const copy = Float64Array.from(base);
          for (const i of points) copy[i] = patch[i];
          const select = createPercentileSelector(grid.weightSr, quantity, levelPct);
          const expected = select(copy);
          expect(evaluator.evaluate(points, points.length, patch)).toBe(expected);
          expect(evaluator.evaluateWhole(copy, -10, 30)).toBe(expected);
          // Window promise: points whose old and new values are both outside [lowCut, highCut] go to
          // the rest list (applied only where better), with stale points whose patch is not better.
          if (expected !== null) {
            const better = (i: number) => (quantity === 'eis' ? patch[i] < base[i] : patch[i] > base[i]);
            const lowCut = expected - 3 * rnd(), highCut = expected + 3 * rnd();
            const outside = (i: number) => (base[i] < lowCut && patch[i] < lowCut) || (base[i] > highCut && patch[i] > highCut);
            const all = Array.from({ length: n }, (_, i) => i);
            const inside = Int32Array.from(all.filter((i) => better(i) && !outside(i)));
            const rest = Int32Array.from([-1, -1, ...all.filter((i) => !better(i) || outside(i))]); // from index 2
            const merged = Float64Array.from(base, (b, i) => (better(i) ? patch[i] : b));
            const want = select(merged);
            expect(evaluator.evaluate(inside, inside.length, patch, lowCut, highCut, -Infinity, Infinity, rest, 2)).toBe(want);
            // Of no interest below/above a bound: undefined only when the value really is beyond it.
            if (want !== null) {
              const bound = want + (rnd() - 0.5) * 4;
              const low = evaluator.evaluate(inside, inside.length, patch, lowCut, highCut, bound, Infinity, rest, 2);
              expect(low === undefined ? want < bound : low === want).toBe(true);
              const high = evaluator.evaluate(inside, inside.length, patch, lowCut, highCut, -Infinity, bound, rest, 2);
              expect(high === undefined ? want > bound : high === want).toBe(true);
            }
          }
          fastSeen += evaluator.stats.fast;
          referenceSeen += evaluator.stats.reference;
        },
      ),
      { seed: 2024, numRuns: 300 },
    );
    expect(fastSeen).toBeGreaterThan(100);
    expect(referenceSeen).toBeGreaterThan(10); // ties at the crossing and p = 0 go the reference way
  });

  it('an exact 50 % tie on a symmetric grid is handed to the reference quickselect', () => {
    const grid = fullGrid(10);
    const up = grid.thetaDeg.map((t) => (t < 90 ? 20 : t > 90 ? 0 : 10));
    const evaluator = createPatchedPercentile(grid.weightSr, 'eirp', 50);
    evaluator.setBase(up, 0, 20);
    const equator = Int32Array.from(Array.from(grid.thetaDeg.keys()).filter((i) => grid.thetaDeg[i] === 90));
    const lowered = new Float64Array(grid.weightSr.length); // equator to 0 dBm: the lower half weighs exactly 2π
    const want = createPercentileSelector(grid.weightSr, 'eirp', 50)(grid.thetaDeg.map((t) => (t < 90 ? 20 : 0)));
    expect(evaluator.evaluate(equator, equator.length, lowered)).toBe(want);
  });
});
