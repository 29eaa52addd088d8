import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { beamTrpDbm } from '../../src/coverage/trp.js';
import { neumaierSum } from '../../src/sphere/neumaierSum.js';
import { sphereNormSr } from '../../src/coverage/sphereNormSr.js';

// beamTrpDbm writes Neumaier's Eq. 1 out in locals for speed (see the comment in trp.ts); the
// rule's owner is src/sphere/neumaierSum.ts. Oracle: the owner's sum of the same terms, bit for bit.
describe('beamTrpDbm sums like the compensated-sum owner', () => {
  it('equals 10·log10(neumaierSum(wᵢ·10^(vᵢ/10)) / Σw) bit for bit (fast-check, seeded)', () => {
    const L = Math.LN10 / 10;
    fc.assert(fc.property(
      fc.array(fc.tuple(fc.double({ min: -150, max: 60, noNaN: true }), fc.double({ min: 1e-9, max: 1, noNaN: true })), { minLength: 1, maxLength: 200 }),
      (pairs) => {
        const v = Float64Array.from(pairs, (p) => p[0]);
        const w = Float64Array.from(pairs, (p) => p[1]);
        const sumW = neumaierSum(w);
        const norm = sphereNormSr(sumW);
        const want = 10 * Math.log10(neumaierSum(Array.from(v, (x, i) => w[i] * Math.exp(x * L))) / norm);
        expect(Object.is(beamTrpDbm(v, w, true, sumW), want)).toBe(true);
      }), { seed: 15, numRuns: 200 });
  });

  it('takes the same terms for values with two decimals (the memoized exponentials) as for any other value', () => {
    // Values v = k/100 go through trp.ts's table of exponentials; the oracle takes Math.exp of
    // every term. Includes values outside the table (|v| > 300 dB), repeats (table hits) and −0.
    const L = Math.LN10 / 10;
    fc.assert(fc.property(
      fc.array(fc.tuple(fc.integer({ min: -40000, max: 40000 }), fc.double({ min: 1e-9, max: 1, noNaN: true })), { minLength: 1, maxLength: 200 }),
      (pairs) => {
        const v = Float64Array.from(pairs, (p) => (p[0] === 0 ? -0 : p[0] / 100));
        const w = Float64Array.from(pairs, (p) => p[1]);
        const sumW = neumaierSum(w);
        const want = 10 * Math.log10(neumaierSum(Array.from(v, (x, i) => w[i] * Math.exp(x * L))) / sphereNormSr(sumW));
        expect(Object.is(beamTrpDbm(v, w, true, sumW), want)).toBe(true);
        expect(Object.is(beamTrpDbm(v, w, true, sumW), want)).toBe(true); // second call: every term from the table
      }), { seed: 18, numRuns: 200 });
  });
});
