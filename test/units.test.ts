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
  it('dBm ↔ mW round trip and power sum symmetry (fast-check)', () => {
    fc.assert(fc.property(fc.double({ min: -200, max: 100, noNaN: true }), fc.double({ min: -200, max: 100, noNaN: true }), (a, b) => {
      expectClose(mwToDbm(dbToLinear(a)), a, 1e-9, 'round trip');
      expect(powerSumDb(a, b)).toBe(powerSumDb(b, a));
      expect(powerSumDb(a, b)).toBeGreaterThanOrEqual(Math.max(a, b));
      expectClose(powerSumDb(a, b), linearToDb(dbToLinear(a) + dbToLinear(b)), 1e-9, 'stable form = definition');
    }), { seed: 7, numRuns: 100 });
  });
});
