import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { nearestPointFinder } from '../../src/sphere/nearestPoint.js';
import { angularDistanceDeg } from '../../src/sphere/direction.js';

// Oracle: brute force over every point with the great-circle distance of src/sphere/direction.ts
// (atan2 form), on a Fibonacci sphere (golden-angle spiral, equal-area latitudes).
function fibonacci(n: number): { theta: Float64Array; phi: Float64Array } {
  const theta = new Float64Array(n), phi = new Float64Array(n);
  const golden = 180 * (3 - Math.sqrt(5));
  for (let i = 0; i < n; i++) {
    theta[i] = (Math.acos(1 - (2 * (i + 0.5)) / n) * 180) / Math.PI;
    phi[i] = (i * golden) % 360;
  }
  return { theta, phi };
}

describe('nearestPointFinder: one finder, exact or limited to a maximum angle', () => {
  const { theta, phi } = fibonacci(1500);
  const distDeg = (i: number, t: number, p: number) => angularDistanceDeg({ thetaDeg: theta[i], phiDeg: phi[i] }, { thetaDeg: t, phiDeg: p });
  const brute = (t: number, p: number) => {
    let best = 0;
    for (let i = 1; i < theta.length; i++) if (distDeg(i, t, p) < distDeg(best, t, p)) best = i;
    return best;
  };
  const exact = nearestPointFinder(theta, phi);
  const maxAngleRad = (4 * Math.PI) / 180; // about 1.2 point spacings of this grid (√(4π/1500) ≈ 5.2°)
  const limited = nearestPointFinder(theta, phi, { maxAngleRad });

  it('exact and limited searches find a nearest point (ties: the same distance), −1 only beyond the limit', () => {
    fc.assert(fc.property(fc.double({ min: 0, max: 180, noNaN: true }), fc.double({ min: 0, max: 359.999, noNaN: true }), (t, p) => {
      const want = distDeg(brute(t, p), t, p);
      expect(distDeg(exact.nearest(t, p), t, p)).toBeCloseTo(want, 9);
      expect(exact.distanceRad * 180 / Math.PI).toBeCloseTo(want, 9);
      const k = limited.nearest(t, p);
      if (want < (maxAngleRad * 180) / Math.PI - 1e-9) {
        expect(distDeg(k, t, p)).toBeCloseTo(want, 9);
        expect(limited.distanceRad * 180 / Math.PI).toBeCloseTo(want, 6);
      } else if (k === -1) expect(limited.distanceRad).toBe(Infinity);
    }), { seed: 15, numRuns: 300 });
  });

  it('a limit smaller than the spacing leaves directions between the points unmeasured', () => {
    const tiny = nearestPointFinder(theta, phi, { maxAngleRad: 1e-6 });
    expect(tiny.nearest(theta[700], phi[700])).toBe(700);
    expect(tiny.nearest(theta[700] + 1, phi[700])).toBe(-1);
    expect(() => nearestPointFinder(new Float64Array(0), new Float64Array(0))).toThrow(RangeError);
  });
});
