import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { dbToLinear, linearToDb, mwToDbm, powerSumDb, powerSumDbArrays, wToDbm } from '../src/units.js';
import { expectClose } from './helpers/expectClose.js';

describe('units', () => {
  it('definition values: 30 dBm = 1 W, 0 dBm = 1 mW, 3.0103 dB = ×2', () => {
    expectClose(dbToLinear(30), 1000, 1e-9, 'dB definition 10·log10');
    expect(wToDbm(1)).toBe(30);
    expect(mwToDbm(1)).toBe(0);
    expectClose(powerSumDb(10, 10), 10 + 10 * Math.log10(2), 1e-12, 'equal powers add 3.01 dB');
    expect(powerSumDb(-Infinity, 4)).toBe(4);
    expect(powerSumDb(-Infinity, -Infinity)).toBe(-Infinity);
    expect(linearToDb(0)).toBe(-Infinity);
    expect(Array.from(powerSumDbArrays(Float64Array.of(0, 20), Float64Array.of(0, -Infinity)))).toEqual([10 * Math.log10(2), 20]);
  });
  it('power sum against its closed form where the naive 10·log10(10^(a/10) + 10^(b/10)) fails', () => {
    // Closed form: a + 10·log10(1 + 10^(−d/10)) for b = a − d; 10·log10(1.1) for d = 10 dB.
    expectClose(powerSumDb(20, 10), 20 + 10 * Math.log10(1.1), 1e-12, 'closed form, d = 10 dB');
    // Far below: 10·log10(1 + x) = (10/ln 10)(x − x²/2 + …); x = 1e−20, so the x² term is far
    // below one rounding. The naive form rounds 1 + 1e−20 to 1 and returns exactly 0.
    expectClose(powerSumDb(0, -200), (10 / Math.LN10) * 1e-20, 1e-30, 'Taylor series of log10(1 + x), x = 1e−20');
    expect(10 * Math.log10(10 ** (0 / 10) + 10 ** (-200 / 10))).toBe(0); // the loss the stable form avoids
    // Large dB values: 10^(4000/10) overflows to ∞ in the naive form; the sum is 4000 + 10·log10 2.
    expectClose(powerSumDb(4000, 4000), 4000 + 10 * Math.log10(2), 1e-9, 'equal powers add 10·log10 2 at any level');
    expect(10 * Math.log10(10 ** (4000 / 10) + 10 ** (4000 / 10))).toBe(Infinity);
    expect(powerSumDb(Number.NaN, 3)).toBeNaN();
  });
  it('dBm ↔ mW round trip and power sum symmetry (fast-check)', () => {
    fc.assert(fc.property(fc.double({ min: -200, max: 100, noNaN: true }), fc.double({ min: -200, max: 100, noNaN: true }), (a, b) => {
      expectClose(mwToDbm(dbToLinear(a)), a, 1e-9, 'round trip');
      expect(powerSumDb(a, b)).toBe(powerSumDb(b, a));
      expect(powerSumDb(a, b)).toBeGreaterThanOrEqual(Math.max(a, b));
      expectClose(powerSumDb(a, b), linearToDb(dbToLinear(a) + dbToLinear(b)), 1e-9, 'stable form = definition');
    }), { seed: 7, numRuns: 100 });
  });
});
