import { describe, expect, it } from 'vitest';
import { buildSphereGrid } from '../../src/sphere/buildGrid.js';
import { isFullSphere } from '../../src/sphere/isFullSphere.js';
import { expectClose, expectRelClose } from '../helpers/expectClose.js';
import { capSr, combos, FOUR_PI, range, stepGrid } from './gridFixtures.js';

describe('buildSphereGrid: regular grids', () => {
  for (const step of [1, 2, 5, 15]) {
    for (const seam of [false, true]) {
      for (const poleAtEveryPhi of [false, true]) {
        it(`${step}° grid (seam ${seam}, pole rows at every φ ${poleAtEveryPhi}) sums to 4π`, () => {
          const a = stepGrid(step, { seam, poleAtEveryPhi });
          const { grid, merged } = buildSphereGrid(a.theta, a.phi);
          expect(grid.kind).toBe('regular');
          // Unique directions (180/Δθ − 1)·(360/Δφ) + 2: fr2-requirements.md (TS 38.521-2 Annex M counts, derived).
          const unique = (180 / step - 1) * (360 / step) + 2;
          expect(grid.thetaDeg.length).toBe(unique);
          expect(merged).toBe(a.theta.length - unique);
          // Geometry: the cells tile the sphere, Σ = 4π; 1e-9 relative is far above rounding (~1e-15).
          expectRelClose(grid.solidAngleSr, FOUR_PI, 1e-9, 'full grid tiles the sphere');
          expect(isFullSphere(grid)).toBe(true);
        });
      }
    }
  }

  it('the weights of the cells above each θ row equal the spherical cap 2π(1 − cos θ) at the row boundary', () => {
    const step = 5;
    const { grid } = buildSphereGrid(stepGrid(step).theta, stepGrid(step).phi);
    for (const rowDeg of [0, 10, 45, 90, 135, 175]) {
      let sum = 0;
      for (let i = 0; i < grid.thetaDeg.length; i++) if (grid.thetaDeg[i] <= rowDeg) sum += grid.weightSr[i];
      // Geometry: cap of half-angle α has 2π(1 − cos α) sr; the rows θ ≤ θr end at θr + Δ/2.
      expectRelClose(sum, capSr(rowDeg + step / 2), 1e-12, `cap above θ = ${rowDeg}°`);
    }
  });

  it('φ given as −180..180 gives the same grid as 0..360', () => {
    const a = buildSphereGrid(stepGrid(5, { seam: true }).theta, stepGrid(5, { seam: true }).phi).grid;
    const s = stepGrid(5, { seam: true, signedPhi: true });
    const b = buildSphereGrid(s.theta, s.phi).grid;
    expect(Array.from(b.phiDeg)).toEqual(Array.from(a.phiDeg));
    expect(Array.from(b.weightSr)).toEqual(Array.from(a.weightSr));
  });

  it('non-uniform θ and φ steps are regular and still tile the sphere', () => {
    const rows = [0, 2, 5, 10, 20, 40, 60, 90, 100, 130, 150, 170, 180];
    const cols = [0, 5, 10, 30, 60, 90, 120, 180, 240, 300, 330];
    const { grid } = buildSphereGrid(combos(rows, cols).theta, combos(rows, cols).phi);
    expect(grid.kind).toBe('regular');
    expect(grid.regular?.phiWraps).toBe(true);
    expectRelClose(grid.solidAngleSr, FOUR_PI, 1e-12, 'midpoint cells tile the sphere');
  });

  it('partial θ range 0–150°: cells end half a step past the last row (not at the pole)', () => {
    const a = combos(range(0, 150, 5), range(0, 355, 5));
    const { grid } = buildSphereGrid(a.theta, a.phi);
    expect(grid.kind).toBe('regular');
    expectRelClose(grid.solidAngleSr, capSr(152.5), 1e-12, 'cap to 150° + Δ/2 (geometry)');
    expect(isFullSphere(grid)).toBe(false);
  });

  it('partial θ range 30–150° without poles: the first row starts half a step above itself', () => {
    const a = combos(range(30, 150, 10), range(0, 350, 10));
    const { grid } = buildSphereGrid(a.theta, a.phi);
    expectRelClose(grid.solidAngleSr, capSr(155) - capSr(25), 1e-12, 'zone 25°–155° (geometry)');
  });

  it('partial φ range 0–90°: boundary columns extend half a step, so 100° of φ is covered', () => {
    const a = combos(range(0, 180, 10), range(0, 90, 10));
    const { grid } = buildSphereGrid(a.theta, a.phi);
    expect(grid.kind).toBe('regular');
    expect(grid.regular?.phiWraps).toBe(false);
    expectRelClose(grid.solidAngleSr, (100 / 360) * FOUR_PI, 1e-12, 'lune of 100° is 4π·100/360 (geometry)');
  });

  it('partial φ range crossing the seam (−45..45°) is found as one sector', () => {
    const a = combos(range(10, 170, 10), range(-45, 45, 15));
    const { grid } = buildSphereGrid(a.theta, a.phi);
    expect(grid.regular?.phiWraps).toBe(false);
    expectRelClose(grid.solidAngleSr, ((105 * Math.PI) / 180) * (Math.cos((5 * Math.PI) / 180) - Math.cos((175 * Math.PI) / 180)), 1e-12, 'Δφ·(cos θ1 − cos θ2)');
  });

  it('a missing combination makes the grid scattered (Voronoi) and it still tiles the sphere', () => {
    const a = stepGrid(15);
    const keep = Array.from(a.theta.keys()).filter((i) => !(a.theta[i] === 90 && a.phi[i] === 45));
    const { grid } = buildSphereGrid(Float64Array.from(keep, (i) => a.theta[i]), Float64Array.from(keep, (i) => a.phi[i]));
    expect(grid.kind).toBe('scattered');
    // The hole is one 15° × 15° equatorial cell, Δφ·(cos 82.5° − cos 97.5°) (geometry). The
    // neighbours' Voronoi cells cover it, limited only by the clip cap (one spacing), so less
    // than 1 % of that cell may stay unmeasured and nothing may be counted twice.
    const cellSr = (Math.PI / 12) * 2 * Math.cos((82.5 * Math.PI) / 180);
    expect(grid.solidAngleSr).toBeLessThanOrEqual(FOUR_PI * (1 + 1e-9));
    expect(FOUR_PI - grid.solidAngleSr).toBeLessThan(0.01 * cellSr);
  });

  it('on a 15° grid the points with θ ≤ 30° are 18.4 % of the points but 10.3 % of the solid angle', () => {
    const { grid } = buildSphereGrid(stepGrid(15).theta, stepGrid(15).phi);
    let count = 0, sr = 0;
    for (let i = 0; i < grid.thetaDeg.length; i++) if (grid.thetaDeg[i] <= 30) { count++; sr += grid.weightSr[i]; }
    // fr2-requirements.md, "Textbook check values" (derived): 49/266 = 18.4 %; cap(37.5°)/4π = 10.3 %.
    expectClose(count / grid.thetaDeg.length, 0.184, 5e-4, 'point share, 3 digits');
    expectClose(sr / FOUR_PI, 0.103, 5e-4, 'solid-angle share, 3 digits');
  });

  it('pointOf maps the seam and pole duplicates onto one point each, canonical order θ then φ', () => {
    const theta = Float64Array.of(90, 0, 0, 90, 180, 90, 180);
    const phi = Float64Array.of(360, 0, 90, 0, 270, 180, -90);
    const b = buildSphereGrid(theta, phi);
    expect(Array.from(b.grid.thetaDeg)).toEqual([0, 90, 90, 180]);
    expect(Array.from(b.grid.phiDeg)).toEqual([0, 0, 180, 0]);
    expect(Array.from(b.pointOf)).toEqual([1, 0, 0, 1, 3, 2, 3]);
    expect(b.merged).toBe(3);
  });

  it('any sample order gives the grid of the canonical order (sorted keys numbered in one pass, others ranked after a sort)', () => {
    // Oracle: the same samples in θ-major order (keys already ascending). A fixed shuffle
    // (LCG) must give bit-identical points and weights, and pointOf must follow each sample.
    const a = stepGrid(15, { seam: true });
    const sorted = buildSphereGrid(a.theta, a.phi);
    const n = a.theta.length;
    const perm = Array.from({ length: n }, (_, i) => i);
    let s = 18;
    for (let i = n - 1; i > 0; i--) {
      s = (s * 1103515245 + 12345) % 2 ** 31;
      const j = s % (i + 1);
      [perm[i], perm[j]] = [perm[j], perm[i]];
    }
    const shuffled = buildSphereGrid(Float64Array.from(perm, (i) => a.theta[i]), Float64Array.from(perm, (i) => a.phi[i]));
    for (const k of ['thetaDeg', 'phiDeg', 'weightSr'] as const) expect(shuffled.grid[k]).toEqual(sorted.grid[k]);
    expect(shuffled.grid.solidAngleSr).toBe(sorted.grid.solidAngleSr);
    expect(Array.from(perm, (_, k) => shuffled.pointOf[k])).toEqual(perm.map((i) => sorted.pointOf[i]));
    expect(shuffled.merged).toBe(sorted.merged);
  });

  it('rejects θ outside [0, 180] and mismatched lengths', () => {
    expect(() => buildSphereGrid(Float64Array.of(-5, 10), Float64Array.of(0, 0))).toThrow(RangeError);
    expect(() => buildSphereGrid(Float64Array.of(5), Float64Array.of(0, 0))).toThrow(RangeError);
  });
});
