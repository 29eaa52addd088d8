import { describe, expect, it } from 'vitest';
import { gridNeighbors } from '../../src/sphere/neighbors.js';
import type { SphereGrid } from '../../src/types.js';
import { angleDeg, fullGrid, regularGrid, steps, unit } from '../analysis/fixtures.js';

function neighboursOf(adj: ReturnType<typeof gridNeighbors>, i: number): number[] {
  return Array.from(adj.neighbors.subarray(adj.offsets[i], adj.offsets[i + 1]));
}

function isSymmetric(adj: ReturnType<typeof gridNeighbors>, n: number): boolean {
  for (let i = 0; i < n; i++) for (const j of neighboursOf(adj, i)) if (!neighboursOf(adj, j).includes(i) || j === i) return false;
  return true;
}

function indexOf(grid: SphereGrid, thetaDeg: number, phiDeg: number): number {
  for (let i = 0; i < grid.thetaDeg.length; i++) if (grid.thetaDeg[i] === thetaDeg && grid.phiDeg[i] === phiDeg) return i;
  throw new Error(`no point at ${thetaDeg}, ${phiDeg}`);
}

describe('gridNeighbors, regular grids (4-connectivity)', () => {
  const grid = fullGrid(15); // 11 ordinary rows × 24 columns + 2 poles
  const adj = gridNeighbors(grid);
  const n = grid.thetaDeg.length;

  it('is symmetric, without self-loops, and each interior point has 4 neighbours', () => {
    expect(isSymmetric(adj, n)).toBe(true);
    expect(neighboursOf(adj, indexOf(grid, 90, 45)).length).toBe(4);
  });

  it('joins each pole to the whole adjacent ring', () => {
    const north = indexOf(grid, 0, 0);
    const ring = neighboursOf(adj, north).map((j) => grid.thetaDeg[j]);
    expect(ring.length).toBe(24);
    expect(ring.every((t) => t === 15)).toBe(true);
    expect(neighboursOf(adj, indexOf(grid, 180, 0)).every((j) => grid.thetaDeg[j] === 165)).toBe(true);
  });

  it('wraps the φ seam: φ = 345 touches φ = 0 in the same row', () => {
    expect(neighboursOf(adj, indexOf(grid, 60, 345))).toContain(indexOf(grid, 60, 0));
    expect(neighboursOf(adj, indexOf(grid, 60, 0))).toContain(indexOf(grid, 60, 345));
  });

  it('does not wrap a partial φ range', () => {
    const g = regularGrid(steps(30, 150, 10), steps(0, 90, 10), false);
    const a = gridNeighbors(g);
    expect(neighboursOf(a, indexOf(g, 60, 90))).not.toContain(indexOf(g, 60, 0));
    expect(isSymmetric(a, g.thetaDeg.length)).toBe(true);
  });

  it('joins opposite points across the pole when the first row reaches it (cell-centred grid)', () => {
    const g = regularGrid(steps(5, 175, 10), steps(5, 355, 10));
    const a = gridNeighbors(g);
    expect(neighboursOf(a, indexOf(g, 5, 15))).toContain(indexOf(g, 5, 195));
    expect(neighboursOf(a, indexOf(g, 175, 95))).toContain(indexOf(g, 175, 275));
    expect(isSymmetric(a, g.thetaDeg.length)).toBe(true);
  });

  it('every neighbour is within one grid step (great circle) except pole ring joins', () => {
    for (let i = 0; i < n; i++) {
      for (const j of neighboursOf(adj, i)) {
        const d = angleDeg(unit(grid.thetaDeg[i], grid.phiDeg[i]), unit(grid.thetaDeg[j], grid.phiDeg[j]));
        expect(d).toBeLessThanOrEqual(15 + 1e-9);
      }
    }
  });
});

describe('gridNeighbors, scattered grids (spherical Delaunay)', () => {
  it('gives a symmetric graph whose edges join nearby points, across the φ seam too', () => {
    // Fibonacci sphere: a constant-density scattered grid (golden-angle spiral).
    const count = 400;
    const theta = new Float64Array(count), phi = new Float64Array(count);
    for (let k = 0; k < count; k++) {
      theta[k] = (Math.acos(1 - (2 * (k + 0.5)) / count) * 180) / Math.PI;
      phi[k] = (((k * 137.50776405003785) % 360) + 360) % 360;
    }
    const grid: SphereGrid = {
      kind: 'scattered', thetaDeg: theta, phiDeg: phi,
      weightSr: new Float64Array(count).fill((4 * Math.PI) / count), solidAngleSr: 4 * Math.PI, regular: null,
    };
    const adj = gridNeighbors(grid);
    expect(isSymmetric(adj, count)).toBe(true);
    // Euler: a triangulation of the sphere has 3n − 6 edges, so the mean degree is 6 − 12/n.
    expect(adj.neighbors.length / count).toBeCloseTo(6 - 12 / count, 6);
    // Mean spacing is about sqrt(4π/n) rad ≈ 10°; Delaunay edges stay within a few spacings.
    let seam = false;
    for (let i = 0; i < count; i++) {
      for (const j of neighboursOf(adj, i)) {
        expect(angleDeg(unit(theta[i], phi[i]), unit(theta[j], phi[j]))).toBeLessThan(25);
        if (Math.abs(phi[i] - phi[j]) > 300) seam = true;
      }
    }
    expect(seam).toBe(true);
  });
});

describe('gridNeighbors on grids built by the core (buildSphereGrid)', () => {
  it('full 10° grid from a chamber scan with repeated pole samples: poles, seam, symmetry', async () => {
    const { buildSphereGrid } = await import('../../src/sphere/buildGrid.js');
    const { regularGrid: scan } = await import('../../src/sim/regularGrid.js');
    const s = scan({ thetaStepDeg: 10, phiStepDeg: 10, phiConvention: '-180-180' });
    const grid = buildSphereGrid(s.thetaDeg, s.phiDeg).grid;
    const adj = gridNeighbors(grid);
    expect(isSymmetric(adj, grid.thetaDeg.length)).toBe(true);
    expect(neighboursOf(adj, indexOf(grid, 0, 0)).length).toBe(36);
    expect(neighboursOf(adj, indexOf(grid, 90, 350))).toContain(indexOf(grid, 90, 0));
  });

  it('a φ range of −90…90 joins 355° to 0° but not 90° to 270° (the unmeasured gap)', async () => {
    const { buildSphereGrid } = await import('../../src/sphere/buildGrid.js');
    const theta: number[] = [], phi: number[] = [];
    for (let t = 10; t <= 170; t += 10) for (let p = -90; p <= 90; p += 5) { theta.push(t); phi.push(p); }
    const grid = buildSphereGrid(Float64Array.from(theta), Float64Array.from(phi)).grid;
    expect(grid.regular?.phiWraps).toBe(false);
    const adj = gridNeighbors(grid);
    expect(neighboursOf(adj, indexOf(grid, 50, 355))).toContain(indexOf(grid, 50, 0));
    expect(neighboursOf(adj, indexOf(grid, 50, 90))).not.toContain(indexOf(grid, 50, 270));
    expect(isSymmetric(adj, grid.thetaDeg.length)).toBe(true);
  });
});

describe('gridNeighbors: the CSR layout', () => {
  it('each slice ascends strictly (sorted, no repeats), the pole rings beyond the short-slice sort too', () => {
    // 5° grid: pole rings of 72 (sorted natively), interior slices of 4 (sorted in place);
    // the 15° grid's rings of 24 take the in-place sort. Oracle: the documented CSR contract.
    for (const grid of [fullGrid(5), fullGrid(15)]) {
      const adj = gridNeighbors(grid);
      const n = grid.thetaDeg.length;
      expect(adj.offsets.length).toBe(n + 1);
      expect(adj.offsets[n]).toBe(adj.neighbors.length);
      for (let i = 0; i < n; i++) {
        const s = neighboursOf(adj, i);
        for (let k = 1; k < s.length; k++) expect(s[k]).toBeGreaterThan(s[k - 1]);
      }
      expect(isSymmetric(adj, n)).toBe(true);
      const north = indexOf(grid, 0, 0);
      expect(neighboursOf(adj, north)).toEqual(Array.from({ length: 360 / (n === 2 + 35 * 72 ? 5 : 15) }, (_, c) => north + 1 + c));
    }
  });

  it('an edge listed twice is kept once (two φ columns: each is the other\'s left and right neighbour)', () => {
    const grid = regularGrid(steps(0, 180, 30), [0, 180]);
    const adj = gridNeighbors(grid);
    // Row θ = 90: the two columns, the points above and below, nothing twice.
    const i = indexOf(grid, 90, 0);
    expect(neighboursOf(adj, i)).toEqual([indexOf(grid, 60, 0), indexOf(grid, 90, 180), indexOf(grid, 120, 0)]);
  });
});
