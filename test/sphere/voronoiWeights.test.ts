import { describe, expect, it } from 'vitest';
import { buildSphereGrid } from '../../src/sphere/buildGrid.js';
import { clippedCellArea } from '../../src/sphere/clippedCellArea.js';
import { voronoiWeights } from '../../src/sphere/voronoiWeights.js';
import { expectClose, expectRelClose } from '../helpers/expectClose.js';
import { capSr, fibonacci, FOUR_PI, stepGrid } from './gridFixtures.js';

describe('spherical Voronoi weights (scattered grids)', () => {
  it('a 2,000-point Fibonacci sphere sums to 4π within 1e-6 relative, no cell clipped', () => {
    const f = fibonacci(2000);
    const { grid, clippedCells } = buildSphereGrid(f.theta, f.phi);
    expect(grid.kind).toBe('scattered');
    // Geometry: Voronoi cells tile the sphere; the tolerance 1e-6 (we see ~1e-14).
    expectRelClose(grid.solidAngleSr, FOUR_PI, 1e-6, 'Voronoi cells tile the sphere');
    expect(clippedCells).toBe(0);
    // A constant-density grid: every cell near the mean area 4π/n (hexagon-like cells).
    for (let i = 0; i < grid.weightSr.length; i++) expectRelClose(grid.weightSr[i], FOUR_PI / 2000, 0.1, `cell ${i} near 4π/n`);
  });

  it('on a regular 5° grid, interior Voronoi cells agree with the exact cell weights', () => {
    const a = stepGrid(5);
    const exact = buildSphereGrid(a.theta, a.phi).grid;
    const vor = buildSphereGrid(a.theta, a.phi, { forceScattered: true }).grid;
    expect(vor.kind).toBe('scattered');
    expect(Array.from(vor.thetaDeg)).toEqual(Array.from(exact.thetaDeg));
    expectRelClose(vor.solidAngleSr, FOUR_PI, 1e-6, 'Voronoi cells tile the sphere');
    let worst = 0;
    for (let i = 0; i < exact.weightSr.length; i++) {
      const t = exact.thetaDeg[i];
      if (t < 30 || t > 150) continue;
      worst = Math.max(worst, Math.abs(vor.weightSr[i] / exact.weightSr[i] - 1));
    }
    // Voronoi cell edges between rows are great circles, not parallels of latitude: they bow
    // by O((Δφ/2)²·tan θ) rad, a relative area difference of order 1e-3 at 5°. The tolerance
    // 5e-3 is this bound with margin; rows 30–150° are "interior" (away from the pole fans).
    expect(worst).toBeLessThan(5e-3);
  });

  it('a blocked cap (scattered partial sphere): border cells are clipped and do not swallow it', () => {
    const f = fibonacci(4000);
    const keep = Array.from(f.theta.keys()).filter((i) => f.theta[i] <= 150);
    const theta = Float64Array.from(keep, (i) => f.theta[i]);
    const phi = Float64Array.from(keep, (i) => f.phi[i]);
    const { grid, clippedCells } = buildSphereGrid(theta, phi);
    // Spacing of a Fibonacci sphere ≈ √(4π/n·2/√3) rad (hexagonal packing) ≈ 3.45° for n = 4000.
    const spacingDeg = (Math.sqrt(((FOUR_PI / 4000) * 2) / Math.sqrt(3)) * 180) / Math.PI;
    expect(clippedCells).toBeGreaterThan(0);
    // Unclipped, the border cells would reach the antipode and the sum would be 4π. Clipped,
    // they reach at most one spacing (the cap radius) past the last points at θ ≤ 150° (geometry: cap 2π(1 − cos α)).
    expect(grid.solidAngleSr).toBeGreaterThan(capSr(150));
    expect(grid.solidAngleSr).toBeLessThan(capSr(150 + 1.5 * spacingDeg));
    // Interior cells untouched: the cell count below 140° keeps the constant-density area.
    for (let i = 0; i < grid.weightSr.length; i++) {
      if (grid.thetaDeg[i] < 140) expectRelClose(grid.weightSr[i], FOUR_PI / 4000, 0.1, 'interior cell near 4π/n');
    }
  });

  it('clippedCellArea is exact: a large cap returns the plain cell, a tiny cap returns the cap', () => {
    // Octant triangle (1,0,0), (0,1,0), (0,0,1): π/2 sr (geometry). Generator at its centre.
    const g = [1 / Math.sqrt(3), 1 / Math.sqrt(3), 1 / Math.sqrt(3)];
    const verts = [1, 0, 0, 0, 1, 0, 0, 0, 1];
    expectClose(clippedCellArea(g, verts, 3, Math.PI / 2 - 1e-9), Math.PI / 2, 1e-12, 'octant, cap larger than the cell');
    // Inscribed-circle radius of the octant from its centre: asin(1/√3)… any r below it
    // (0.3 rad < 0.6155) gives the cap 2π(1 − cos r) exactly (geometry).
    expectClose(clippedCellArea(g, verts, 3, 0.3), 2 * Math.PI * (1 - Math.cos(0.3)), 1e-12, 'cap inside the cell');
    // In between, the area lies strictly between both.
    const mid = clippedCellArea(g, verts, 3, 0.8);
    expect(mid).toBeGreaterThan(2 * Math.PI * (1 - Math.cos(0.6155)));
    expect(mid).toBeLessThan(Math.PI / 2);
  });

  it('rejects fewer than 4 directions', () => {
    expect(() => voronoiWeights(Float64Array.of(10, 20, 30), Float64Array.of(0, 0, 0))).toThrow(RangeError);
  });
});
