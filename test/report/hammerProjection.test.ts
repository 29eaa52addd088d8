import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { HAMMER_HALF_HEIGHT, HAMMER_HALF_WIDTH, hammerForward, hammerForwardLonLat, hammerInverse } from '../../src/report/hammerProjection.js';
import { expectClose, expectRelClose } from '../helpers/expectClose.js';

const RAD = Math.PI / 180;

/** Spherical cap of half-angle α: Ω = 2π(1 − cos α) (closed form; DESIGN.md / fr2-requirements textbook values). */
const capSr = (alphaDeg: number) => 2 * Math.PI * (1 - Math.cos(alphaDeg * RAD));

function unit(thetaDeg: number, phiDeg: number): [number, number, number] {
  const t = thetaDeg * RAD;
  const p = phiDeg * RAD;
  return [Math.sin(t) * Math.cos(p), Math.sin(t) * Math.sin(p), Math.cos(t)];
}

/** Boundary of a cap around (θc, φc) as directions, by rotating a small circle. */
function capBoundary(thetaC: number, phiC: number, alphaDeg: number, n: number): [number, number][] {
  const c = unit(thetaC, phiC);
  const e1 = unit(thetaC + 90, phiC); // orthogonal to c in the meridian plane
  const e2: [number, number, number] = [c[1] * e1[2] - c[2] * e1[1], c[2] * e1[0] - c[0] * e1[2], c[0] * e1[1] - c[1] * e1[0]];
  const a = alphaDeg * RAD;
  const out: [number, number][] = [];
  for (let k = 0; k < n; k++) {
    const s = (2 * Math.PI * k) / n;
    const v = [0, 1, 2].map((i) => Math.cos(a) * c[i] + Math.sin(a) * (Math.cos(s) * e1[i] + Math.sin(s) * e2[i]));
    out.push([Math.acos(Math.max(-1, Math.min(1, v[2]))) / RAD, (((Math.atan2(v[1], v[0]) / RAD) % 360) + 360) % 360]);
  }
  return out;
}

describe('Hammer equal-area projection', () => {
  it('maps the example points of the doc comment', () => {
    const [x0, y0] = hammerForward(90, 0);
    expectClose(x0, 0, 1e-15, 'centre of the map is exact');
    expectClose(y0, 0, 1e-15, 'centre of the map is exact');
    expectClose(hammerForward(0, 0)[1], Math.SQRT2, 1e-15, 'north pole at the top point');
    const d = hammerInverse(0, 0)!;
    expect(d.thetaDeg).toBe(90);
    expect(d.phiDeg).toBe(0);
    expect(hammerInverse(HAMMER_HALF_WIDTH + 1e-6, 0)).toBeNull();
  });

  it('inverts the forward projection everywhere off the seam (property, fixed seed)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.5, max: 179.5, noNaN: true }), fc.double({ min: 0, max: 359.9, noNaN: true }), fc.double({ min: -180, max: 180, noNaN: true }), (t, p, c) => {
        // The seam λ = ±180° is the map edge, where rounding may land just outside: excluded.
        if (180 - Math.abs(((p - c + 540) % 360) - 180) < 1e-3) return true;
        const [x, y] = hammerForward(t, p, c);
        const d = hammerInverse(x, y, c)!;
        const dp = Math.abs(((d.phiDeg - p + 540) % 360) - 180);
        // 1e-7°: a few ulps through atan2/asin, amplified near the poles where φ is ill-conditioned (θ ≥ 0.5° here).
        return Math.abs(d.thetaDeg - t) < 1e-7 && dp < 1e-7;
      }),
      { seed: 20260101, numRuns: 400 },
    );
  });

  it('has area element cos β dλ dβ (Jacobian determinant, finite differences)', () => {
    // Equal area with unit scale: |∂(x,y)/∂(λ,β)| = cos β, the sphere's area element.
    fc.assert(
      fc.property(fc.double({ min: -170, max: 170, noNaN: true }), fc.double({ min: -85, max: 85, noNaN: true }), (lon, lat) => {
        const h = 1e-4;
        const [xa, ya] = hammerForwardLonLat(lon + h, lat);
        const [xb, yb] = hammerForwardLonLat(lon - h, lat);
        const [xc, yc] = hammerForwardLonLat(lon, lat + h);
        const [xd, yd] = hammerForwardLonLat(lon, lat - h);
        const s = 2 * h * RAD;
        const det = ((xa - xb) / s) * ((yc - yd) / s) - ((ya - yb) / s) * ((xc - xd) / s);
        return Math.abs(det - Math.cos(lat * RAD)) < 1e-6;
      }),
      { seed: 7, numRuns: 300 },
    );
  });

  it('projects spherical caps to regions of area 2π(1 − cos α) (shoelace of the projected boundary)', () => {
    for (const [tc, pc, alpha] of [[90, 0, 20], [60, 45, 35], [120, 300, 10], [30, 260, 25], [150, 90, 28]] as const) {
      const pts = capBoundary(tc, pc, alpha, 4000).map(([t, p]) => hammerForward(t, p));
      let area = 0;
      for (let k = 0; k < pts.length; k++) {
        const [x1, y1] = pts[k];
        const [x2, y2] = pts[(k + 1) % pts.length];
        area += x1 * y2 - x2 * y1;
      }
      // 4000-gon: chord error ~ (2π/4000)²/6 ≈ 4e-7 relative; 1e-5 leaves room for curvature of the projected edge.
      expectRelClose(Math.abs(area) / 2, capSr(alpha), 1e-5, `cap θ=${tc} φ=${pc} α=${alpha}`);
    }
  });

  it('pixel counts of projected caps, also across the seam and over a pole, follow the cap formula', () => {
    const W = 1600;
    const H = 800;
    const pixelSr = ((2 * HAMMER_HALF_WIDTH) / W) * ((2 * HAMMER_HALF_HEIGHT) / H);
    for (const [tc, pc, alpha] of [[90, 180, 30], [0, 0, 40], [100, 170, 45], [180, 0, 90]] as const) {
      const c = unit(tc, pc);
      const cosA = Math.cos(alpha * RAD);
      let count = 0;
      for (let j = 0; j < H; j++) {
        for (let i = 0; i < W; i++) {
          const d = hammerInverse(((i + 0.5) / W) * 2 * HAMMER_HALF_WIDTH - HAMMER_HALF_WIDTH, HAMMER_HALF_HEIGHT - ((j + 0.5) / H) * 2 * HAMMER_HALF_HEIGHT);
          if (!d) continue;
          const u = unit(d.thetaDeg, d.phiDeg);
          if (u[0] * c[0] + u[1] * c[1] + u[2] * c[2] >= cosA) count++;
        }
      }
      // Boundary pixels: about perimeter/pixel side of them are split, error ≲ 1 %.
      expectRelClose(count * pixelSr, capSr(alpha), 0.01, `pixel area of cap θ=${tc} φ=${pc} α=${alpha}`);
    }
  });

  it('the whole ellipse is 4π', () => {
    expectClose(Math.PI * HAMMER_HALF_WIDTH * HAMMER_HALF_HEIGHT, 4 * Math.PI, 1e-12, 'ellipse area πab with a = 2√2, b = √2');
  });
});
