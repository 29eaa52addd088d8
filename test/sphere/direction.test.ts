import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { angularDistanceDeg, azElToThetaPhi, normalizePhiDeg, unitVector, unitVectors } from '../../src/sphere/direction.js';
import { neumaierSum } from '../../src/sphere/neumaierSum.js';
import { sphericalTriangleArea } from '../../src/sphere/sphericalTriangleArea.js';
import { expectClose } from '../helpers/expectClose.js';

describe('directions', () => {
  it('az/el → θ/φ (DESIGN.md convention θ = 90 − el, φ = az mod 360)', () => {
    expect(azElToThetaPhi(-90, 30)).toEqual({ thetaDeg: 60, phiDeg: 270 });
    expect(azElToThetaPhi(360, -90)).toEqual({ thetaDeg: 180, phiDeg: 0 });
    expect(normalizePhiDeg(-180)).toBe(180);
    expect(Object.is(normalizePhiDeg(-0), 0)).toBe(true);
    expect(normalizePhiDeg(720.5)).toBe(0.5);
  });
  it('angular distance: axes are 90° apart, poles 180° (geometry); symmetric and within [0, 180]', () => {
    expectClose(angularDistanceDeg({ thetaDeg: 0, phiDeg: 0 }, { thetaDeg: 90, phiDeg: 123 }), 90, 1e-12, 'pole to equator');
    expectClose(angularDistanceDeg({ thetaDeg: 0, phiDeg: 0 }, { thetaDeg: 180, phiDeg: 0 }), 180, 1e-12, 'antipodes');
    fc.assert(fc.property(fc.double({ min: 0, max: 180, noNaN: true }), fc.double({ min: 0, max: 360, noNaN: true }), fc.double({ min: 0, max: 180, noNaN: true }), fc.double({ min: 0, max: 360, noNaN: true }), (t1, p1, t2, p2) => {
      const d = angularDistanceDeg({ thetaDeg: t1, phiDeg: p1 }, { thetaDeg: t2, phiDeg: p2 });
      expect(d).toBe(angularDistanceDeg({ thetaDeg: t2, phiDeg: p2 }, { thetaDeg: t1, phiDeg: p1 }));
      expect(d).toBeGreaterThanOrEqual(Math.abs(t1 - t2) - 1e-9); // |Δθ| is a lower bound
      expect(d).toBeLessThanOrEqual(180);
      const [x, y, z] = unitVector(t1, p1);
      expectClose(Math.hypot(x, y, z), 1, 1e-15, 'unit length');
    }), { seed: 11, numRuns: 100 });
  });
  it('Neumaier sum: the classic [1, 1e100, 1, −1e100] gives 2', () => {
    // Neumaier (1974): plain summation returns 0 here.
    expect(neumaierSum([1, 1e100, 1, -1e100])).toBe(2);
  });
  it('spherical triangle: one octant is π/2 sr (geometry), orientation gives the sign', () => {
    expectClose(sphericalTriangleArea(1, 0, 0, 0, 1, 0, 0, 0, 1), Math.PI / 2, 1e-15, 'octant');
    expectClose(sphericalTriangleArea(1, 0, 0, 0, 0, 1, 0, 1, 0), -Math.PI / 2, 1e-15, 'reversed');
  });
  it('unitVectors: the bits of unitVector point by point; axes and the φ = 90° meridian exactly (geometry)', () => {
    const theta = [0, 90, 90, 180, 37.5, 123.25], phi = [0, 0, 90, 0, 271, 12.5];
    const v = unitVectors(theta, phi);
    theta.forEach((t, i) => expect([v.x[i], v.y[i], v.z[i]]).toEqual(unitVector(t, phi[i])));
    expect([v.x[0], v.y[0], v.z[0]]).toEqual([0, 0, 1]);
    expect(v.z[3]).toBe(-1);
    expectClose(Math.hypot(v.x[4], v.y[4], v.z[4]), 1, 1e-15, 'unit length to rounding');
    expect(() => unitVectors([1, 2], [3])).toThrow(RangeError);
  });
});
