import { describe, expect, it } from 'vitest';
import { buildSphereGrid } from '../../src/sphere/buildGrid.js';
import { mergeSamples } from '../../src/sphere/mergeSamples.js';
import { resampleBeam } from '../../src/sphere/resample.js';
import { expectClose } from '../helpers/expectClose.js';
import { combos, fibonacci, range, stepGrid } from './gridFixtures.js';

describe('mergeSamples', () => {
  it('power-averages coincident samples and reports the spread', () => {
    const b = buildSphereGrid(Float64Array.of(0, 0, 90, 90, 90, 180), Float64Array.of(0, 90, 0, 360, 180, 0));
    const r = mergeSamples(b, Float64Array.of(0, 10, 3, 3, -1, NaN));
    // Power average of 1 mW and 10 mW: 10·log10(5.5) = 7.404 dBm (arithmetic).
    expectClose(r.values[0], 10 * Math.log10(5.5), 1e-12, 'power average of 0 and 10 dB');
    expect(r.values[1]).toBe(3);
    expect(r.values[2]).toBe(-1);
    expect(Number.isNaN(r.values[3])).toBe(true);
    expect(r.maxSpreadDb).toBe(10);
    expect(r.missing).toBe(1);
  });
});

describe('resampleBeam', () => {
  it('bilinear on a regular grid reproduces a pattern linear in θ and in φ (away from the seam)', () => {
    const from = buildSphereGrid(stepGrid(10).theta, stepGrid(10).phi).grid;
    const f = (t: number, p: number): number => 0.1 * t + (p < 350 ? 0.02 * p : 0);
    const vals = Float64Array.from(from.thetaDeg, (t, i) => f(t, from.phiDeg[i]));
    const a = combos(range(10, 170, 3), range(1, 341, 7));
    const to = buildSphereGrid(a.theta, a.phi).grid;
    const r = resampleBeam(from, vals, to);
    expect(r.method).toBe('bilinear');
    // Bilinear interpolation is exact for functions bilinear in (θ, φ) (numerical analysis).
    for (let i = 0; i < to.thetaDeg.length; i++) expectClose(r.values[i], f(to.thetaDeg[i], to.phiDeg[i]), 1e-9, 'exact for bilinear data');
    expect(r.maxDistanceDeg).toBeGreaterThan(0);
    expect(r.maxDistanceDeg).toBeLessThan(7.1); // half the 10° cell diagonal at most
  });

  it('identical grids resample to the same values at zero distance; scattered uses the nearest point', () => {
    const fb = fibonacci(500);
    const g = buildSphereGrid(fb.theta, fb.phi).grid;
    const vals = Float64Array.from(g.thetaDeg, (t) => t);
    const r = resampleBeam(g, vals, g);
    expect(r.method).toBe('nearest');
    expect(Array.from(r.values)).toEqual(Array.from(vals));
    expect(r.maxDistanceDeg).toBeLessThan(1e-6);
    const reg = buildSphereGrid(stepGrid(15).theta, stepGrid(15).phi).grid;
    const onReg = resampleBeam(g, vals, reg);
    // Nearest of 500 well-spread points is within about one spacing (≈ 9.7° for n = 500).
    expect(onReg.maxDistanceDeg).toBeLessThan(9.7);
    for (let i = 0; i < reg.thetaDeg.length; i++) expect(Math.abs(onReg.values[i] - reg.thetaDeg[i])).toBeLessThanOrEqual(onReg.maxDistanceDeg + 1e-9);
  });

  it('targets outside a partial grid take the nearest measured value', () => {
    const a = combos(range(0, 90, 10), range(0, 350, 10));
    const from = buildSphereGrid(a.theta, a.phi).grid;
    const vals = Float64Array.from(from.thetaDeg, (t) => t);
    const to = buildSphereGrid(stepGrid(30).theta, stepGrid(30).phi).grid;
    const r = resampleBeam(from, vals, to);
    for (let i = 0; i < to.thetaDeg.length; i++) if (to.thetaDeg[i] > 90) expect(r.values[i]).toBe(90);
    expectClose(r.maxDistanceDeg, 90, 1e-9, 'south pole is 90° from the equator row');
  });
});
