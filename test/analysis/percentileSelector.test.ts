import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { createPercentileSelector } from '../../src/analysis/percentileSelector.js';
import { bruteForcePercentile } from './reference.js';

const PI = Math.PI;

describe('createPercentileSelector (step rule, unmeasured part counts as worst)', () => {
  it('hand cases on four cells of π sr each (full sphere)', () => {
    const w = Float64Array.of(PI, PI, PI, PI);
    const v = Float64Array.of(4, 2, 1, 3);
    const at = (p: number) => createPercentileSelector(w, 'eirp', p)(v);
    expect(at(0)).toBe(1); // minimum
    expect(at(25)).toBe(1); // F(1) = 1/4 reaches 25 % exactly (step rule, no interpolation)
    expect(at(25.001)).toBe(2);
    expect(at(50)).toBe(2);
    expect(at(100)).toBe(4); // the peak
  });

  it('partial sphere: eirp low levels and eis high levels are not evaluable', () => {
    const w = Float64Array.of(PI, PI, PI); // π sr unmeasured
    const v = Float64Array.of(1, 2, 3);
    expect(createPercentileSelector(w, 'eirp', 0)(v)).toBeNull();
    expect(createPercentileSelector(w, 'eirp', 25)(v)).toBeNull(); // the unmeasured quarter is below everything
    expect(createPercentileSelector(w, 'eirp', 26)(v)).toBe(1);
    expect(createPercentileSelector(w, 'eirp', 100)(v)).toBe(3);
    expect(createPercentileSelector(w, 'eis', 0)(v)).toBe(1);
    expect(createPercentileSelector(w, 'eis', 75)(v)).toBe(3);
    expect(createPercentileSelector(w, 'eis', 76)(v)).toBeNull(); // the unmeasured quarter is above everything
  });

  it('agrees with a sort-and-accumulate oracle on random weighted data with ties (fixed seed)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 300 }),
        fc.integer({ min: 0, max: 0x7fffffff }),
        fc.double({ min: 0, max: 100, noNaN: true }),
        fc.constantFrom('eirp' as const, 'eis' as const),
        fc.double({ min: 0.5, max: 1, noNaN: true }),
        (n, seed, levelPct, quantity, coverage) => {
          let s = seed;
          const rnd = () => ((s = (s * 1103515245 + 12345) % 2147483648) / 2147483648);
          const w = Float64Array.from({ length: n }, () => 0.1 + rnd());
          const total = w.reduce((a, b) => a + b, 0);
          for (let i = 0; i < n; i++) w[i] *= (coverage * 4 * PI) / total;
          const v = Float64Array.from({ length: n }, () => Math.round(rnd() * 40) / 4); // many ties
          const fast = createPercentileSelector(w, quantity, levelPct)(v);
          expect(fast).toBe(bruteForcePercentile(v, w, quantity, levelPct));
        },
      ),
      { seed: 20240611, numRuns: 300 },
    );
  });

  it('does not modify its input and can be reused', () => {
    const w = new Float64Array(1000).fill((4 * PI) / 1000);
    const v = Float64Array.from({ length: 1000 }, (_, i) => (i * 7919) % 1000);
    const copy = Float64Array.from(v);
    const sel = createPercentileSelector(w, 'eirp', 50);
    expect(sel(v)).toBe(499);
    expect(sel(v)).toBe(499);
    expect(v).toEqual(copy);
  });

  it('rejects a level outside [0, 100]', () => {
    expect(() => createPercentileSelector(new Float64Array(1), 'eirp', 101)).toThrow(/is not in \[0, 100\]/);
  });
});

describe('createPercentileSelector agrees with the core percentile (src/coverage)', () => {
  it('same value or null as percentile(weightedCdf(...)) on random data, full and partial spheres', async () => {
    const { weightedCdf } = await import('../../src/coverage/weightedCdf.js');
    const { percentile } = await import('../../src/coverage/percentile.js');
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 400 }),
        fc.integer({ min: 0, max: 0x7fffffff }),
        fc.oneof(fc.constantFrom(0, 100, 50, 25), fc.double({ min: 0, max: 100, noNaN: true })),
        fc.constantFrom('eirp' as const, 'eis' as const, 'gain' as const),
        fc.constantFrom(1, 1 - 1e-9, 0.999, 0.7),
        (n, seed, levelPct, quantity, coverage) => {
          let s = seed;
          const rnd = () => ((s = (s * 1103515245 + 12345) % 2147483648) / 2147483648);
          const w = Float64Array.from({ length: n }, () => 0.05 + rnd());
          const total = w.reduce((a, b) => a + b, 0);
          for (let i = 0; i < n; i++) w[i] *= (coverage * 4 * Math.PI) / total;
          const v = Float64Array.from({ length: n }, () => Math.round(rnd() * 60) / 4 - 5);
          expect(createPercentileSelector(w, quantity, levelPct)(v)).toBe(percentile(weightedCdf(v, w), levelPct, quantity));
        },
      ),
      { seed: 97, numRuns: 400 },
    );
  });

  it('agrees on the 5° grid for every whole percent (exact-boundary levels of a symmetric pattern)', async () => {
    const { weightedCdf } = await import('../../src/coverage/weightedCdf.js');
    const { percentile } = await import('../../src/coverage/percentile.js');
    const { fullGrid } = await import('./fixtures.js');
    const grid = fullGrid(5);
    const v = grid.thetaDeg.map((t) => Math.round(10 * Math.cos((t * Math.PI) / 180))); // hemispheres tie at 0
    const cdf = weightedCdf(v, grid.weightSr);
    for (let p = 0; p <= 100; p++) expect(createPercentileSelector(grid.weightSr, 'eirp', p)(v)).toBe(percentile(cdf, p, 'eirp'));
  });
});
