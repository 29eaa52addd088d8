import { describe, it, expect } from 'vitest';
import { expectClose } from '../helpers/expectClose.js';
import { blockThetaRange, fibonacciGrid, regularGrid } from '../../src/sim/index.js';

describe('regular chamber grids', () => {
  it('gives the 3GPP constant-step direction counts with each pole once', () => {
    // Reference file, "Grids": (180/Δθ − 1)·(360/Δφ) + 2; 15° → 266 (TS 38.521-2 Annex M),
    // 7.5° → 1106, 5° → 2522, 3.6° → 4902, 3° → 7082, 2.5° → 10226 (S5 Table M.2.1.1).
    const counts: [number, number][] = [[15, 266], [7.5, 1106], [5, 2522], [3.6, 4902], [3, 7082], [2.5, 10226]];
    for (const [step, n] of counts) {
      expect(regularGrid({ thetaStepDeg: step, phiStepDeg: step, polesOnce: true }).thetaDeg.length).toBe(n);
    }
  });

  it('writes poles at every φ by default and supports the three φ conventions', () => {
    expect(regularGrid({ thetaStepDeg: 1, phiStepDeg: 1 }).thetaDeg.length).toBe(65160);
    const a = regularGrid({ thetaStepDeg: 30, phiStepDeg: 90 });
    expect(Array.from(a.phiDeg.slice(0, 4))).toEqual([0, 90, 180, 270]);
    const b = regularGrid({ thetaStepDeg: 30, phiStepDeg: 90, phiConvention: '-180-180' });
    expect(Array.from(b.phiDeg.slice(0, 4))).toEqual([-180, -90, 0, 90]);
    const c = regularGrid({ thetaStepDeg: 30, phiStepDeg: 90, phiConvention: '0-360-inclusive' });
    expect(Array.from(c.phiDeg.slice(0, 5))).toEqual([0, 90, 180, 270, 360]);
    expect(c.thetaDeg.length).toBe(7 * 5);
  });

  it('prints non-binary steps exactly and supports anisotropic steps and θ sub-ranges', () => {
    const g = regularGrid({ thetaStepDeg: 3.6, phiStepDeg: 7.2, thetaMinDeg: 0, thetaMaxDeg: 90 });
    expect(g.thetaDeg[g.thetaDeg.length - 1]).toBe(90);
    expect(new Set(g.thetaDeg).has(10.8)).toBe(true);
    expect(g.thetaDeg.length).toBe(26 * 50);
    expect(() => regularGrid({ thetaStepDeg: 7, phiStepDeg: 5 })).toThrow(/does not divide/);
  });

  it('blocks a θ band for a partial-sphere scan', () => {
    const g = blockThetaRange(regularGrid({ thetaStepDeg: 5, phiStepDeg: 5, polesOnce: true }), 160, 180);
    expect(Math.max(...g.thetaDeg)).toBe(155);
    expect(g.thetaDeg.length).toBe(2522 - 4 * 72 - 1);
  });
});

describe('Fibonacci constant-density grid', () => {
  it('spreads n points evenly in cos θ (equal-area bands) and in φ', () => {
    const n = 800;
    const g = fibonacciGrid(n);
    expect(g.thetaDeg.length).toBe(n);
    // Equal-area property: the share of points in a cap θ ≤ α equals the cap's share of 4π,
    // 2π(1 − cos α)/4π (spherical cap area, reference file), to within one point.
    for (const alpha of [30, 60, 90, 120]) {
      const inCap = Array.from(g.thetaDeg).filter((t) => t <= alpha).length;
      expectClose(inCap, (n * (1 - Math.cos((alpha * Math.PI) / 180))) / 2, 1, `cap ${alpha}°`);
    }
    for (const p of g.phiDeg) expect(p >= 0 && p < 360).toBe(true);
    expect(() => fibonacciGrid(0)).toThrow();
  });
});
