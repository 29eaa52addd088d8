import { describe, expect, it } from 'vitest';
import { NeumaierAccumulator, neumaierAddAt, neumaierError, neumaierSum } from '../../src/sphere/neumaierSum.js';

// Oracle: exact sums of terms whose plain left-to-right float sum loses them (Neumaier 1974's
// motivating case), and the bit-identity of the four forms the module offers.
describe('compensated sums (src/sphere/neumaierSum.ts)', () => {
  const cases: number[][] = [
    [1, 1e100, 1, -1e100], // exact 2; a plain loop gives 0
    [1e16, 1, 1, 1, 1, -1e16], // exact 4; a plain loop gives 0 (1 is below half an ulp of 1e16)
    [0.1, 0.2, 0.3, -0.6], // exact in reals 0, floats: the decimal inputs are not exact; compare forms only
  ];
  it('gives the exact sum where a plain loop loses the small terms', () => {
    expect(neumaierSum(cases[0])).toBe(2);
    expect(neumaierSum(cases[1])).toBe(4);
    expect(cases[1].reduce((a, b) => a + b, 0)).toBe(0); // the loss the compensation repairs
  });
  it('accumulator, per-bin sums and the bare correction term give the same bits as neumaierSum', () => {
    for (const xs of cases) {
      const acc = new NeumaierAccumulator();
      const sums = new Float64Array(2), comps = new Float64Array(2);
      let s = 0, c = 0;
      for (const x of xs) {
        acc.add(x);
        neumaierAddAt(sums, comps, 1, x);
        const t = s + x;
        c += neumaierError(s, x, t);
        s = t;
      }
      const want = neumaierSum(xs);
      expect(Object.is(acc.total(), want)).toBe(true);
      expect(Object.is(sums[1] + comps[1], want)).toBe(true);
      expect(Object.is(s + c, want)).toBe(true);
      expect(sums[0] + comps[0]).toBe(0); // the other bin is untouched
    }
  });
  it('reads a running total without ending the sum', () => {
    const acc = new NeumaierAccumulator();
    acc.add(1e100); acc.add(1);
    expect(acc.total()).toBe(1e100);
    acc.add(-1e100);
    expect(acc.total()).toBe(1);
  });
});
