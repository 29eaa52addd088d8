import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { percentile } from '../../src/coverage/percentile.js';
import { beamTrpDbm } from '../../src/coverage/trp.js';
import { weightedCdf } from '../../src/coverage/weightedCdf.js';
import { buildSphereGrid } from '../../src/sphere/buildGrid.js';
import { isFullSphere } from '../../src/sphere/isFullSphere.js';
import { expectClose, expectRelClose } from '../helpers/expectClose.js';
import { bruteVoronoiAreas } from './bruteVoronoi.js';
import { capSr, FOUR_PI, type Angles } from './gridFixtures.js';
import { densityStep, fibonacciScan, randomScan, ringScan, stepScan, stitched, windowScan, without } from './scanFamilies.js';

const RAD = Math.PI / 180;
const build = (a: Angles) => buildSphereGrid(a.theta, a.phi);
/** Area of the zone cos θ₁ − cos θ₂ times Δφ (rad): (cos θ₁ − cos θ₂)·Δφ (geometry). */
const zoneSr = (t1: number, t2: number, dphiDeg = 360) => (Math.cos(t1 * RAD) - Math.cos(t2 * RAD)) * dphiDeg * RAD;

// Every family below covers the whole sphere (issue 12's table, generated the same way).
const FULL: [string, () => Angles][] = [
  ['density step 1.1× in a hemisphere', () => densityStep(1500, 1.1, (t) => t < 90, 11)],
  ['density step 2× in a hemisphere', () => densityStep(1000, 2, (t) => t < 90, 12)],
  ['density step 5× in a hemisphere', () => densityStep(400, 5, (t) => t < 90, 13)],
  ['a 40° band at 3× density', () => densityStep(1000, 3, (t) => t > 70 && t < 110, 14)],
  ['a 30° cap at 3× density', () => densityStep(1200, 3, (t) => t < 30, 15)],
  ['ring scan, φ step ∝ 1/sin θ, 3× coarser in the lower half', () => ringScan(3, 16, 0, (t) => (t < 90 ? 1 : 3))],
  ['ring scan with jitter of half a step', () => ringScan(4, 17, 2)],
  ['stitched 2°/4° grids', () => stitched(2, 4)],
  ['stitched 2°/3° grids', () => stitched(2, 3)],
  ['stitched 3°/5° grids', () => stitched(3, 5)],
  ['a 1° window on a 5° grid', () => windowScan()],
  ['1,000 uniformly random directions', () => randomScan(1000, 21).angles()],
  ['3,000 uniformly random directions', () => randomScan(3000, 22).angles()],
  ['5,000 uniformly random directions', () => randomScan(5000, 23).angles()],
  ['a 2° grid with one sample missing', () => without(stepScan(2).angles(), (t, p) => t === 60 && p === 100)],
  ['a 5° grid with a few samples missing', () => without(stepScan(5).angles(), (t, p) => (t === 60 && p === 100) || (t === 120 && (p === 200 || p === 205)) || (t === 5 && p === 0))],
];

describe('full spheres stay full (issue 12)', () => {
  for (const [name, make] of FULL) {
    it(`${name}: Σw = 4π, no unmeasured region, isotropic TRP = its level`, () => {
      const { grid } = build(make());
      // Geometry: Voronoi cells / exact lattice cells tile the sphere, so Σw = 4π. Random and
      // ring sets reach ~1e-13; stitched and windowed lattices (four cocircular samples a
      // square, samples on one meridian) reach ~3e-9 relative through near-degenerate Delaunay
      // triangles: tolerance 1e-8 relative (the issue asked 1e-9; see the note of issue 12).
      expectRelClose(grid.solidAngleSr, FOUR_PI, 1e-8, 'cells tile the sphere');
      expect(grid.unmeasured).toEqual([]);
      expect(isFullSphere(grid)).toBe(true);
      // Definition: TRP = (1/4π)∮EIRP dΩ; an isotropic 7.5 dBm pattern has TRP 7.5 dBm.
      const trp = beamTrpDbm(new Float64Array(grid.weightSr.length).fill(7.5), grid.weightSr, isFullSphere(grid), grid.solidAngleSr);
      expectClose(trp!, 7.5, 1e-9, 'isotropic TRP = EIRP (rounding only)');
    });
  }

  it('missing samples on a lattice are named with the solid angle their neighbours absorbed', () => {
    const { grid } = build(FULL[15][1]());
    expect(grid.missing!.map((m) => [m.thetaDeg, m.phiDeg])).toEqual([[5, 0], [60, 100], [120, 200], [120, 205]]);
    // Exact cell of a 5° grid at θ = 60°: Δφ·(cos 57.5° − cos 62.5°) (zone area, geometry).
    expectRelClose(grid.missing![1].absorbedSr, zoneSr(57.5, 62.5, 5), 1e-12, 'exact regular cell');
  });

  it('the weights of uneven full scans equal an independent Voronoi implementation to 1e-6', () => {
    // bruteVoronoi.ts: half-plane clipping in the gnomonic projection + l'Huilier areas, no
    // triangulation shared with the production code (d3-geo-voronoi + Van Oosterom–Strackee).
    for (const a of [densityStep(300, 3, (t) => t < 90, 31), ringScan(9, 32, 4), randomScan(600, 33).angles()]) {
      const { grid } = build(a);
      const ref = bruteVoronoiAreas(grid.thetaDeg, grid.phiDeg);
      let worst = 0;
      for (let i = 0; i < ref.length; i++) worst = Math.max(worst, Math.abs(grid.weightSr[i] - ref[i]) / ref[i]);
      expect(worst, 'largest relative cell difference').toBeLessThan(1e-6);
    }
  });
});

describe('metrics on uneven full scans (issue 12)', () => {
  /** Half-wave dipole gain relative to its peak: [cos(π/2·cos θ)/sin θ]² (Balanis, Antenna Theory, 4th ed., Eq. 4-84). */
  const dipoleDb = (t: number) => {
    const s = Math.sin(t * RAD);
    const f = s < 1e-9 ? 0 : Math.cos((Math.PI / 2) * Math.cos(t * RAD)) / s;
    return 10 * Math.log10(Math.max(f * f, 1e-12));
  };

  it('half-wave dipole: TRP is 2.15 dB below the peak gain on density-step scans (Balanis: D = 1.643, 2.15 dBi)', () => {
    for (const a of [densityStep(1000, 2, (t) => t < 90, 12), ringScan(3, 16, 0, (t) => (t < 90 ? 1 : 3))]) {
      const { grid } = build(a);
      const trp = beamTrpDbm(Float64Array.from(grid.thetaDeg, dipoleDb), grid.weightSr, isFullSphere(grid), grid.solidAngleSr)!;
      // Exact directivity 4/Cin(2π) = 1.6409 → −2.1509 dB (Balanis quotes 1.643 ≈ 2.15 dBi). The
      // cell quadrature of a smooth pattern with 3–5° cells measured within 5e-4 dB: tolerance 0.005 dB.
      expectClose(trp, -10 * Math.log10(1.6409), 0.005, 'dipole TRP = −D in dB');
    }
  });

  it('an uneven scan gives the same percentiles and TRP as a fine uniform 1° grid, within the cell interpolation error', () => {
    // A tilted cos⁶ beam (peak 20 dBm toward θ 70°, φ 30°) over a −10 dBm floor.
    const beam = (t: number, p: number) => {
      const c = Math.sin(t * RAD) * Math.sin(70 * RAD) * Math.cos((p - 30) * RAD) + Math.cos(t * RAD) * Math.cos(70 * RAD);
      return 10 * Math.log10(Math.max(c, 0) ** 6 + 1e-3) + 20;
    };
    const metrics = (a: Angles) => {
      const { grid } = build(a);
      const v = Float64Array.from(grid.thetaDeg, (t, i) => beam(t, grid.phiDeg[i]));
      const cdf = weightedCdf(v, grid.weightSr);
      return { p: [80, 90, 95].map((l) => percentile(cdf, l, 'eirp')!), trp: beamTrpDbm(v, grid.weightSr, true, grid.solidAngleSr)! };
    };
    const fine = metrics(stepScan(1).angles());
    for (const a of [windowScan(), densityStep(400, 5, (t) => t < 90, 13), ringScan(3, 16, 0, (t) => (t < 90 ? 1 : 3))]) {
      const m = metrics(a);
      // A step-rule CDF on cells of 3–5° moves a level by the pattern's change across the cell
      // edges that straddle it: the beam falls 1–2 dB/° on its skirt (80–95 % levels), and the
      // level set's edge cells are half-filled on average, so ±0.3 dB (measured ≤ 0.19 dB, at
      // 80 %). TRP averages that out: ±0.05 dB (measured ≤ 0.03 dB).
      m.p.forEach((v, k) => expectClose(v, fine.p[k], 0.3, `percentile ${[80, 90, 95][k]} vs the 1° grid`));
      expectClose(m.trp, fine.trp, 0.05, 'TRP vs the 1° grid');
    }
  });
});

describe('unmeasured regions are found by the local rule (issue 12)', () => {
  // "Within about one spacing strip": |measured − closed form| ≤ rim length × one spacing.
  const strip = (rimLengthRad: number, spacingDeg: number) => rimLengthRad * spacingDeg * RAD;

  it('θ ≤ 150° (positioner blockage) on a Fibonacci and a random scan: the cap 2π(1 − cos 150°)', () => {
    for (const [a, spacing] of [[fibonacciScan(4000, (t) => t <= 150), 3.5], [randomScan(3000, 41, (t) => t <= 150).angles(), 3.7]] as const) {
      const { grid } = build(a);
      expect(isFullSphere(grid)).toBe(false);
      expect(grid.unmeasured).toHaveLength(1);
      const r = grid.unmeasured![0];
      // Geometry: the blocked cap θ > 150° is 2π(1 + cos 150°) = 4π − capSr(150).
      expectClose(grid.solidAngleSr, capSr(150), strip(2 * Math.PI * Math.sin(30 * RAD), spacing), 'within one spacing strip of the rim');
      expectClose(r.solidAngleSr, FOUR_PI - grid.solidAngleSr, 1e-9, 'region areas add up to 4π − Σw');
      expect(r.centre.thetaDeg).toBeGreaterThan(175);
      expectClose(r.radiusDeg, 30, spacing * 3, 'extent ≈ the cap radius (the grown rim caps reach up to ~2 spacings past the cut)');
      expect(r.phiRangeDeg).toEqual([0, 360]);
    }
  });

  it('a hemisphere θ ≤ 90° (regular 5° grid and random set): 2π', () => {
    const reg = build(stepScan(5, 0, 90).angles()).grid;
    // Regular rule: the last row's cell reaches half a step past it: 2π(1 − cos 92.5°) exactly.
    expectRelClose(reg.solidAngleSr, capSr(92.5), 1e-12, 'exact cells to θ = 92.5°');
    expectRelClose(reg.unmeasured![0].solidAngleSr, FOUR_PI - capSr(92.5), 1e-12, 'the unmeasured cap, exactly');
    const rnd = build(randomScan(2000, 42, (t) => t <= 90).angles()).grid;
    expectClose(rnd.solidAngleSr, 2 * Math.PI, strip(2 * Math.PI, 4.5), 'within one spacing strip');
    expect(rnd.unmeasured).toHaveLength(1);
  });

  it('a φ wedge missing (scattered ring scan): (cos 0 − cos 180)·Δφ', () => {
    const a = without(ringScan(3, 43), (_t, p) => p > 100 && p < 160);
    const { grid } = build(a);
    expect(grid.unmeasured!.length).toBeGreaterThanOrEqual(1);
    // Lune area 2·Δφ (geometry); near the poles the wedge is narrower than the spacing and is
    // absorbed, so the measured area may exceed the closed form by the strip along both rims.
    expectClose(grid.solidAngleSr, FOUR_PI - zoneSr(0, 180, 60), strip(2 * Math.PI, 3), 'within one spacing strip');
    const r = grid.unmeasured![0];
    // φ span from the rim samples: the ring scan's φ step near θ = 15° is 3°/sin 15° = 11.6°.
    expect(r.phiRangeDeg[0]).toBeGreaterThan(100 - 11.6);
    expect(r.phiRangeDeg[1]).toBeLessThan(160 + 11.6);
  });

  it('a polar cap masked out of an equal-area pixelisation (Fibonacci, θ < 30°)', () => {
    const { grid } = build(fibonacciScan(4000, (t) => t >= 30));
    expectClose(grid.solidAngleSr, FOUR_PI - capSr(30), strip(2 * Math.PI * Math.sin(30 * RAD), 3.5), 'within one spacing strip');
    expect(grid.unmeasured![0].centre.thetaDeg).toBeLessThan(5);
  });

  it('rule edges: a hole of 2 spacings is absorbed, one of 6 spacings is unmeasured; a lattice block over 2 × 2 is unmeasured', () => {
    // Fibonacci spacing ≈ √(4π/n·2/√3) rad = 3.45° for n = 4000 (hexagonal packing, geometry).
    const cut = (r: number) => build(without(fibonacciScan(4000), (t, p) => angle(t, p, 90, 180) < r)).grid;
    expect(cut(2 * 3.45).unmeasured, 'empty cap of 2 spacings: absorbed').toEqual([]);
    const big = cut(6 * 3.45);
    expect(big.unmeasured).toHaveLength(1);
    // Cap of radius 20.7°: 2π(1 − cos 20.7°) within one spacing strip (geometry).
    expectClose(FOUR_PI - big.solidAngleSr, capSr(6 * 3.45), strip(2 * Math.PI * Math.sin(20.7 * RAD), 3.45), 'the cut cap');
    const block = build(without(stepScan(5).angles(), (t, p) => t >= 60 && t <= 70 && p >= 100 && p <= 110)).grid;
    // 3 × 3 missing block: unmeasured with the exact area of its cells, Δφ·(cos 57.5° − cos 72.5°).
    expect(block.missing).toEqual([]);
    expectRelClose(block.unmeasured![0].solidAngleSr, zoneSr(57.5, 72.5, 15), 1e-12, 'exact lattice cells');
    expectClose(block.unmeasured![0].centre.thetaDeg, 65, 0.5, 'centre θ');
    expectClose(block.unmeasured![0].centre.phiDeg, 105, 1e-6, 'centre φ');
  });
});

describe('properties (fast-check, seeded)', () => {
  it('adding points inside a measured region never changes its unmeasured area', () => {
    const base = randomScan(1500, 51, (t) => t <= 140).angles();
    const before = build(base).grid;
    const lost = FOUR_PI - before.solidAngleSr;
    fc.assert(fc.property(fc.array(fc.tuple(fc.double({ min: 0.05, max: 0.75, noNaN: true }), fc.double({ min: 0, max: 359.9, noNaN: true })), { minLength: 1, maxLength: 20 }), (extra) => {
      // Added directions lie at θ ≤ 100° (cos θ from the tuple), more than 10 spacings from the rim at 140°.
      const theta = Float64Array.from([...base.theta, ...extra.map(([c]) => Math.acos(1 - c) / RAD)]);
      const phi = Float64Array.from([...base.phi, ...extra.map(([, p]) => p)]);
      const after = buildSphereGrid(theta, phi).grid;
      expectClose(FOUR_PI - after.solidAngleSr, lost, 1e-9, 'unmeasured area unchanged');
    }), { seed: 1212, numRuns: 12 });
  });

  it('rotating a scattered set changes no weight and no unmeasured area beyond rounding', () => {
    const base = randomScan(1200, 52, (t) => t <= 120).angles();
    const ref = buildSphereGrid(base.theta, base.phi);
    fc.assert(fc.property(fc.double({ min: 0, max: 360, noNaN: true }), fc.double({ min: -40, max: 40, noNaN: true }), (yawDeg, pitchDeg) => {
      const r = rotate(base, yawDeg, pitchDeg);
      const b = buildSphereGrid(r.theta, r.phi);
      // Angles are rounded to 1e-5° (1.7e-7 rad) when the grid is built; against a spacing of
      // ~4° (0.07 rad) that moves cell edges by ~2.5e-6 relative: tolerance 2e-5.
      expectRelClose(b.grid.solidAngleSr, ref.grid.solidAngleSr, 2e-5, 'measured solid angle is rotation invariant');
      expect(b.grid.unmeasured!.length).toBe(ref.grid.unmeasured!.length);
      for (let i = 0; i < base.theta.length; i += 37) {
        expectRelClose(b.grid.weightSr[b.pointOf[i]], ref.grid.weightSr[ref.pointOf[i]], 2e-5, 'cell of sample i');
      }
    }), { seed: 1213, numRuns: 8 });
  });
});

function angle(t1: number, p1: number, t2: number, p2: number): number {
  const c = Math.cos(t1 * RAD) * Math.cos(t2 * RAD) + Math.sin(t1 * RAD) * Math.sin(t2 * RAD) * Math.cos((p1 - p2) * RAD);
  return Math.acos(Math.max(-1, Math.min(1, c))) / RAD;
}

/** Rotate every direction about z by yaw, then about y by pitch. */
function rotate(a: Angles, yawDeg: number, pitchDeg: number): Angles {
  const cy = Math.cos(yawDeg * RAD), sy = Math.sin(yawDeg * RAD), cp = Math.cos(pitchDeg * RAD), sp = Math.sin(pitchDeg * RAD);
  const theta = new Float64Array(a.theta.length), phi = new Float64Array(a.theta.length);
  for (let i = 0; i < a.theta.length; i++) {
    const t = a.theta[i] * RAD, p = a.phi[i] * RAD;
    let x = Math.sin(t) * Math.cos(p), y = Math.sin(t) * Math.sin(p), z = Math.cos(t);
    [x, y] = [cy * x - sy * y, sy * x + cy * y];
    [x, z] = [cp * x + sp * z, -sp * x + cp * z];
    theta[i] = Math.acos(Math.max(-1, Math.min(1, z))) / RAD;
    phi[i] = ((Math.atan2(y, x) / RAD) % 360 + 360) % 360;
  }
  return { theta, phi };
}
