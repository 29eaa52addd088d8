import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CATEGORICAL, colorMapLut, oklabToLinearSrgb, srgbToOklab } from '../../src/report/colorMap.js';
import { nearestGridPoint } from '../../src/report/nearestGridPoint.js';
import { cdfCurve } from '../../src/report/cdfCurve.js';
import type { SphereGrid } from '../../src/types.js';
import { expectClose } from '../helpers/expectClose.js';
import { regularTestGrid } from './fixture.js';

describe('colour maps', () => {
  it('OKLab matrices are mutual inverses and white is L = 1, a = b = 0 (Ottosson 2020 defines white so)', () => {
    const [L, a, b] = srgbToOklab([255, 255, 255]);
    expectClose(L, 1, 1e-4, 'published matrices are rounded to 10 digits');
    expectClose(a, 0, 1e-4, 'white is neutral');
    expectClose(b, 0, 1e-4, 'white is neutral');
    for (const rgb of [[200, 30, 90], [10, 120, 240], [90, 90, 90]] as [number, number, number][]) {
      const [l2, a2, b2] = srgbToOklab(rgb);
      const lin = oklabToLinearSrgb(l2, a2, b2);
      const back = lin.map((c) => 255 * (c <= 0.0031308 ? 12.92 * c : 1.055 * Math.pow(c, 1 / 2.4) - 0.055));
      back.forEach((v, k) => expectClose(v, rgb[k], 0.02, 'round trip sRGB → OKLab → sRGB within byte rounding'));
    }
  });

  for (const name of ['lumen', 'grey'] as const) {
    it(`${name}: lightness rises monotonically (readable in grey-scale) and steps are even`, () => {
      const lut = colorMapLut(name);
      const lab = Array.from({ length: 256 }, (_, i) => srgbToOklab([lut[3 * i], lut[3 * i + 1], lut[3 * i + 2]]));
      const steps: number[] = [];
      for (let i = 1; i < 256; i++) {
        // Byte rounding can hold L equal across neighbours; it must never fall.
        expect(lab[i][0]).toBeGreaterThanOrEqual(lab[i - 1][0] - 1e-3);
        steps.push(Math.hypot(lab[i][0] - lab[i - 1][0], lab[i][1] - lab[i - 1][1], lab[i][2] - lab[i - 1][2]));
      }
      expect(lab[255][0] - lab[0][0]).toBeGreaterThan(0.6);
      // Perceptual uniformity over 16-entry blocks (byte rounding dominates single steps).
      const blocks = Array.from({ length: 15 }, (_, b) => steps.slice(17 * b, 17 * b + 17).reduce((s, v) => s + v, 0));
      expect(Math.max(...blocks) / Math.min(...blocks)).toBeLessThan(1.6);
    });
  }

  it('categorical colours are distinct', () => {
    expect(new Set(CATEGORICAL.map((c) => c.join(','))).size).toBe(12);
  });
});

/** Fibonacci-sphere points with equal weights: a scattered grid built locally for the test. */
function fibonacciGrid(n: number): SphereGrid {
  const t = new Float64Array(n);
  const p = new Float64Array(n);
  const golden = Math.PI * (3 - Math.sqrt(5));
  for (let i = 0; i < n; i++) {
    const z = 1 - (2 * (i + 0.5)) / n;
    t[i] = (Math.acos(z) * 180) / Math.PI;
    p[i] = ((((i * golden * 180) / Math.PI) % 360) + 360) % 360;
  }
  const w = new Float64Array(n).fill((4 * Math.PI) / n);
  return { kind: 'scattered', thetaDeg: t, phiDeg: p, weightSr: w, solidAngleSr: 4 * Math.PI, regular: null };
}

const RAD = Math.PI / 180;
const dot = (t1: number, p1: number, t2: number, p2: number) =>
  Math.sin(t1 * RAD) * Math.sin(t2 * RAD) * Math.cos((p1 - p2) * RAD) + Math.cos(t1 * RAD) * Math.cos(t2 * RAD);

describe('nearest grid point lookup', () => {
  it('regular grid: every grid direction finds itself, the φ seam wraps, beyond a partial θ range is unmeasured', () => {
    const g = regularTestGrid(5, 150);
    const look = nearestGridPoint(g);
    for (let i = 0; i < g.thetaDeg.length; i += 7) expect(look(g.thetaDeg[i], g.phiDeg[i])).toBe(i);
    expect(look(45, 359)).toBe(look(45, 0));
    expect(look(152, 10)).toBeGreaterThanOrEqual(0);
    expect(look(153, 10)).toBe(-1);
    expect(look(0.4, 123)).toBe(0);
  });

  it('scattered grid: same point as a brute-force nearest search (property, fixed seed)', () => {
    const g = fibonacciGrid(1500);
    const look = nearestGridPoint(g);
    fc.assert(
      fc.property(fc.double({ min: 0, max: 180, noNaN: true }), fc.double({ min: 0, max: 359.99, noNaN: true }), (t, p) => {
        let best = 0;
        for (let i = 1; i < g.thetaDeg.length; i++) if (dot(t, p, g.thetaDeg[i], g.phiDeg[i]) > dot(t, p, g.thetaDeg[best], g.phiDeg[best])) best = i;
        return look(t, p) === best;
      }),
      { seed: 42, numRuns: 300 },
    );
  });
});

describe('cdfCurve', () => {
  it('matches its doc example and counts unmeasured solid angle as worst', () => {
    const c = cdfCurve(Float64Array.of(1, 2), Float64Array.of(2 * Math.PI, 2 * Math.PI));
    expect(Array.from(c.fractions)).toEqual([0.5, 1]);
    const half = cdfCurve(Float64Array.of(3), Float64Array.of(2 * Math.PI));
    expectClose(half.startFraction, 0.5, 1e-15, 'half the sphere unmeasured sits below every value for eirp');
    expectClose(half.fractions[0], 1, 1e-15, 'eirp CDF reaches 1 at the largest value');
    expectClose(cdfCurve(Float64Array.of(3), Float64Array.of(2 * Math.PI), 'eis').fractions[0], 0.5, 1e-15, 'for eis the unmeasured half is never reached');
  });

  it('downsamples to ≤ 400 monotone points ending at the full measured share', () => {
    const g = regularTestGrid(2);
    const v = Float64Array.from(g.thetaDeg, (t, i) => Math.sin(t) * 10 + (i % 13));
    const c = cdfCurve(v, g.weightSr);
    expect(c.values.length).toBeLessThanOrEqual(400);
    for (let k = 1; k < c.values.length; k++) {
      expect(c.values[k]).toBeGreaterThanOrEqual(c.values[k - 1]);
      expect(c.fractions[k]).toBeGreaterThanOrEqual(c.fractions[k - 1]);
    }
    expectClose(c.fractions[c.fractions.length - 1], 1, 1e-12, 'full grid weights sum to 4π');
    expect(c.values[c.values.length - 1]).toBe(Math.max(...v));
    expect(c.values[0]).toBe(Math.min(...v));
  });
});
