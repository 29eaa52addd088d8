// bestAndRunnerUp: its TSP is totalScanPattern's bit for bit, its runner-up the best of the other
// beams (checked against a point-by-point brute force), on seeded codebooks with ties, ±∞ and NaN.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { bestAndRunnerUp } from '../../src/analysis/bestAndRunnerUp.js';
import { totalScanPattern } from '../../src/coverage/totalScanPattern.js';
import type { Quantity } from '../../src/types.js';

const sample = fc.oneof(
  { weight: 6, arbitrary: fc.integer({ min: -4, max: 4 }).map((k) => k / 2) }, // coarse: many ties
  { weight: 1, arbitrary: fc.constantFrom(-Infinity, Infinity, NaN) },
);

/** The runner-up by its definition: scan the beams other than the leader in order, keeping an equal-or-better value. */
function bruteRunnerUp(beams: Float64Array[], leader: Int32Array, quantity: Quantity): Float64Array {
  const lower = quantity === 'eis';
  return Float64Array.from(leader, (lead, i) => {
    let r = lower ? Infinity : -Infinity;
    for (let k = 0; k < beams.length; k++) {
      if (k === lead) continue;
      const v = beams[k][i];
      if (!(lower ? r < v : r > v)) r = v;
    }
    return r;
  });
}

describe('bestAndRunnerUp', () => {
  it('gives totalScanPattern\'s values and indices, and the best of the other beams', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 6 }), fc.integer({ min: 1, max: 12 }), fc.constantFrom<Quantity>('eirp', 'eis'), fc.infiniteStream(sample),
        (count, n, quantity, values) => {
          const it = values[Symbol.iterator]();
          const beams = Array.from({ length: count }, () => Float64Array.from({ length: n }, () => it.next().value as number));
          const { tsp, runnerUp } = bestAndRunnerUp(beams, quantity);
          const want = totalScanPattern(beams, quantity);
          for (let i = 0; i < n; i++) expect(Object.is(tsp.values[i], want.values[i])).toBe(true); // bits: NaN and −0 too
          expect(tsp.bestBeam).toEqual(want.bestBeam);
          // With a NaN the pass's runner-up depends on where the NaN sits in the beam order: compared where there is none.
          const brute = bruteRunnerUp(beams, tsp.bestBeam, quantity);
          for (let i = 0; i < n; i++) if (beams.every((b) => !Number.isNaN(b[i]))) expect(runnerUp[i]).toBe(brute[i]);
        }),
      { seed: 1812, numRuns: 300 },
    );
  });

  it('hand-worked: two beams, eirp and eis', () => {
    const a = new Float64Array([1, 5, 3]), b = new Float64Array([3, 2, 3]);
    expect([...bestAndRunnerUp([a, b], 'eirp').runnerUp]).toEqual([1, 2, 3]); // the tie at point 2: beam 0 leads, beam 1 runs up
    expect([...bestAndRunnerUp([a, b], 'eis').runnerUp]).toEqual([3, 5, 3]);
    expect([...bestAndRunnerUp([a], 'eirp').runnerUp]).toEqual([-Infinity, -Infinity, -Infinity]);
  });
});
