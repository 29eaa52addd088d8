import { describe, expect, it } from 'vitest';
import { beamRemoval } from '../../src/analysis/beamRemoval.js';
import { greedySubset } from '../../src/analysis/greedySubset.js';
import { expectClose } from '../helpers/expectClose.js';
import { fullGrid, gaussianBeam } from './fixtures.js';
import { bestOf, bruteForcePercentile } from './reference.js';

const grid = fullGrid(5);

/** A codebook of Gaussian beams whose axes follow a golden-angle spiral (even spread). */
function spiralCodebook(count: number, hpbwDeg: number): Float64Array[] {
  return Array.from({ length: count }, (_, k) => {
    const theta = (Math.acos(1 - (2 * (k + 0.5)) / count) * 180) / Math.PI;
    const phi = (k * 137.50776405003785) % 360;
    return gaussianBeam(grid, theta, phi, hpbwDeg, 20 - k * 0.1);
  });
}

describe('beamRemoval', () => {
  it('a duplicated beam is removable at zero cost; the unique ones are not', () => {
    const beams = spiralCodebook(8, 60);
    beams.push(Float64Array.from(beams[3])); // beam 8 duplicates beam 3
    const r = beamRemoval(grid, beams, 'eirp', 50, 10);
    expect(r[3]).toEqual({ percentileLossDb: 0, coverageLoss: 0 });
    expect(r[8]).toEqual({ percentileLossDb: 0, coverageLoss: 0 });
    // The 50 % value of an 8-beam spiral drops when any unique beam goes (a gap opens).
    for (const k of [0, 1, 2, 4, 5, 6, 7]) expect(r[k].percentileLossDb!).toBeGreaterThan(0);
  });

  it('matches recomputing from scratch, and the hemisphere closed form', () => {
    // Beam 0 covers θ ≤ 90 at 20 dBm, beam 1 covers θ > 90; both 0 dBm elsewhere.
    const up = grid.thetaDeg.map((t) => (t <= 90 ? 20 : 0));
    const down = grid.thetaDeg.map((t) => (t > 90 ? 20 : 0));
    const r = beamRemoval(grid, [up, down], 'eirp', 50, 10);
    // Rows θ ≤ 90 own the cells up to θ = 92.5° (halfway to the next row): the cap 2π(1 − cos 92.5°) over 4π.
    const capShare = (1 - Math.cos((92.5 * Math.PI) / 180)) / 2;
    expectClose(r[0].coverageLoss!, capShare, 1e-12, 'cap fraction, closed form, rounding only');
    expectClose(r[1].coverageLoss!, 1 - capShare, 1e-12, 'complementary cap');
    expect(r[0].percentileLossDb).toBe(20); // without beam 0, 52 % of the sphere is at 0 dBm
    expect(r[1].percentileLossDb).toBe(0); // without beam 1, 52 % at 20 dBm still holds the median

    const beams = spiralCodebook(10, 50);
    const fast = beamRemoval(grid, beams, 'eirp', 20, 8);
    beams.forEach((_, b) => {
      const rest = beams.filter((_, k) => k !== b);
      const full = bruteForcePercentile(bestOf(beams), grid.weightSr, 'eirp', 20)!;
      const without = bruteForcePercentile(bestOf(rest), grid.weightSr, 'eirp', 20)!;
      expect(fast[b].percentileLossDb).toBe(full - without);
      const cov = (v: Float64Array) => v.reduce((s, x, i) => s + (x >= 8 ? grid.weightSr[i] : 0), 0) / (4 * Math.PI);
      expectClose(fast[b].coverageLoss!, cov(bestOf(beams)) - cov(bestOf(rest)), 1e-12, 'difference of direct sums, rounding only');
    });
  });

  it('eis: removing the only good beam raises the EIS percentile', () => {
    const good = grid.thetaDeg.map(() => -100);
    const poor = grid.thetaDeg.map(() => -80);
    const r = beamRemoval(grid, [good, poor, Float64Array.from(poor)], 'eis', 50, -90);
    expect(r[0]).toEqual({ percentileLossDb: 20, coverageLoss: expect.closeTo(1, 12) });
    expect(r[1]).toEqual({ percentileLossDb: 0, coverageLoss: 0 });
  });

  it('a single beam has no evaluable percentile without it', () => {
    const r = beamRemoval(grid, [grid.thetaDeg.map(() => 15)], 'eirp', 50, 10);
    expect(r[0].percentileLossDb).toBeNull();
    expectClose(r[0].coverageLoss!, 1, 1e-12, 'all coverage lost');
  });
});

describe('greedySubset', () => {
  it('reaches the full value within tolerance, never picks a duplicate, curve matches the oracle', () => {
    const beams = spiralCodebook(12, 45);
    beams.push(Float64Array.from(beams[0]), Float64Array.from(beams[5]));
    const ids = beams.map((_, k) => `b${k}`);
    const full = bruteForcePercentile(bestOf(beams), grid.weightSr, 'eirp', 50)!;
    const s = greedySubset(grid, beams, ids, 'eirp', 50, 0.5);
    expect(s.levelPct).toBe(50);
    expect(s.toleranceDb).toBe(0.5);
    expect(new Set(s.beams).size).toBe(s.beams.length);
    expect(s.beams.includes('b0') && s.beams.includes('b12')).toBe(false);
    expect(s.beams.includes('b5') && s.beams.includes('b13')).toBe(false);
    expect(full - s.curve[s.curve.length - 1].value!).toBeLessThanOrEqual(0.5);
    if (s.curve.length > 1) expect(full - s.curve[s.curve.length - 2].value!).toBeGreaterThan(0.5); // stopped at the first step within tolerance
    s.curve.forEach((pt, k) => {
      expect(pt.count).toBe(k + 1);
      const chosen = s.beams.slice(0, k + 1).map((id) => beams[ids.indexOf(id)]);
      expect(pt.value).toBe(bruteForcePercentile(bestOf(chosen), grid.weightSr, 'eirp', 50));
      if (k > 0) expect(pt.value!).toBeGreaterThanOrEqual(s.curve[k - 1].value!);
    });
    // First pick: the best single beam by the same percentile.
    const single = beams.map((b) => bruteForcePercentile(b, grid.weightSr, 'eirp', 50)!);
    expect(s.beams[0]).toBe(ids[single.indexOf(Math.max(...single))]);
  });

  it('with zero tolerance on a duplicate-only codebook stops after one beam', () => {
    const b = gaussianBeam(grid, 90, 0, 90, 20);
    const s = greedySubset(grid, [b, Float64Array.from(b), Float64Array.from(b)], ['a', 'b', 'c'], 'eirp', 50, 0);
    expect(s.beams).toEqual(['a']);
  });

  it('ranks the whole codebook when the level is not evaluable (partial sphere)', () => {
    const half = { ...grid, weightSr: grid.weightSr.map((w, i) => (grid.thetaDeg[i] <= 90 ? w : 1e-300)) };
    const beams = spiralCodebook(4, 60);
    const s = greedySubset(half, beams, ['0', '1', '2', '3'], 'eirp', 10);
    expect(s.beams.length).toBe(4);
    expect(s.curve.every((p) => p.value === null)).toBe(true);
  });
});
