import { describe, expect, it } from 'vitest';
import { buildSphereGrid } from '../../src/sphere/buildGrid.js';
import { mergeSamples, rawOrderKind } from '../../src/sphere/mergeSamples.js';
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

/** The merge as first written (four arrays per call), kept as the bit-for-bit reference. */
function referenceMerge(pointOf: Int32Array, m: number, raw: Float64Array) {
  const k = Math.LN10 / 10;
  const sumLin = new Float64Array(m);
  const lo = new Float64Array(m).fill(Infinity);
  const hi = new Float64Array(m).fill(-Infinity);
  const count = new Int32Array(m);
  for (let i = 0; i < raw.length; i++) {
    const v = raw[i];
    if (!Number.isFinite(v)) continue;
    const p = pointOf[i];
    if (count[p] === 1) sumLin[p] = Math.exp(lo[p] * k);
    if (count[p] >= 1) sumLin[p] += Math.exp(v * k);
    count[p]++;
    if (v < lo[p]) lo[p] = v;
    if (v > hi[p]) hi[p] = v;
  }
  const values = new Float64Array(m);
  let maxSpreadDb = 0;
  let missing = 0;
  for (let p = 0; p < m; p++) {
    if (count[p] === 0) { values[p] = NaN; missing++; continue; }
    values[p] = count[p] === 1 ? lo[p] : 10 * Math.log10(sumLin[p] / count[p]);
    if (hi[p] - lo[p] > maxSpreadDb) maxSpreadDb = hi[p] - lo[p];
  }
  return { values, maxSpreadDb, missing };
}

describe('mergeSamples routes agree bit for bit', () => {
  /** Deterministic noise (LCG), with a few NaN samples. */
  function noisy(n: number, seed: number): Float64Array {
    let s = seed;
    return Float64Array.from({ length: n }, () => {
      s = (s * 1103515245 + 12345) % 2 ** 31;
      return s % 97 === 0 ? NaN : Math.round((s / 2 ** 31) * 6000 - 3000) / 100;
    });
  }
  const same = (a: Float64Array, b: Float64Array) => a.length === b.length && a.every((x, i) => Object.is(x, b[i]));

  for (const seam of [false, true]) {
    it(`θ-major export with pole rows${seam ? ' and a φ = 360 column' : ''}: allocating and in-place routes equal the reference`, () => {
      const a = stepGrid(10, { seam });
      const b = buildSphereGrid(a.theta, a.phi);
      expect(rawOrderKind(b)).toBe(seam ? 1 : 2);
      const raw = noisy(a.theta.length, 7);
      const ref = referenceMerge(b.pointOf, b.grid.thetaDeg.length, raw);
      const alloc = mergeSamples(b, raw);
      expect(alloc.inPlace).toBe(false);
      expect(same(alloc.values, ref.values)).toBe(true);
      const copy = raw.slice();
      const inPlace = mergeSamples(b, copy, true);
      expect(inPlace.inPlace).toBe(true);
      expect(inPlace.values.buffer).toBe(copy.buffer);
      expect(same(inPlace.values, ref.values)).toBe(true);
      expect([inPlace.maxSpreadDb, inPlace.missing]).toEqual([ref.maxSpreadDb, ref.missing]);
      expect(ref.maxSpreadDb).toBeGreaterThan(0);
      expect(ref.missing).toBeGreaterThan(0);
    });
  }

  it('θ-major export with a repeated row and infinite samples: the block-copy route equals the reference', () => {
    // A repeated sample right after its first keeps pointOf non-decreasing (route 2) and puts a
    // merged point between two runs of single-sample points; ±∞ samples count as missing.
    const a = stepGrid(10);
    const dup = 400;
    const theta = Float64Array.from([...a.theta.subarray(0, dup + 1), a.theta[dup], ...a.theta.subarray(dup + 1)]);
    const phi = Float64Array.from([...a.phi.subarray(0, dup + 1), a.phi[dup], ...a.phi.subarray(dup + 1)]);
    const b = buildSphereGrid(theta, phi);
    expect(rawOrderKind(b)).toBe(2);
    const raw = noisy(theta.length, 5);
    raw[dup + 1] = raw[dup] + 3;
    raw[dup + 50] = Infinity;
    raw[dup + 60] = -Infinity;
    const ref = referenceMerge(b.pointOf, b.grid.thetaDeg.length, raw);
    for (const reuse of [false, true]) {
      const got = mergeSamples(b, raw.slice(), reuse);
      expect(got.inPlace).toBe(reuse);
      expect(same(got.values, ref.values)).toBe(true);
      expect([got.maxSpreadDb, got.missing]).toEqual([ref.maxSpreadDb, ref.missing]);
    }
  });

  it('other orders (φ-major export): reused scratch gives the reference on repeated calls, never in place', () => {
    const a = stepGrid(10, { seam: true });
    const order = Array.from(a.theta.keys()).sort((i, j) => a.phi[i] - a.phi[j] || a.theta[i] - a.theta[j]);
    const b = buildSphereGrid(Float64Array.from(order, (i) => a.theta[i]), Float64Array.from(order, (i) => a.phi[i]));
    for (const seed of [3, 11]) {
      const raw = noisy(order.length, seed);
      const ref = referenceMerge(b.pointOf, b.grid.thetaDeg.length, raw);
      const got = mergeSamples(b, raw, true);
      expect(rawOrderKind(b)).toBe(0);
      expect(got.inPlace).toBe(false);
      expect(same(got.values, ref.values)).toBe(true);
      expect([got.maxSpreadDb, got.missing]).toEqual([ref.maxSpreadDb, ref.missing]);
    }
  });
});
