import { describe, expect, it } from 'vitest';
import { buildSphereGrid } from '../../src/sphere/buildGrid.js';
import { angularDistanceDeg, unitVector } from '../../src/sphere/direction.js';
import { beamPeak } from '../../src/coverage/beamPeak.js';
import { beamPointing, gridVectors } from '../../src/coverage/beamPointing.js';
import { stepGrid } from '../sphere/gridFixtures.js';

/** A rotationally symmetric Gaussian lobe (dB) around `axis`, 1/e² half-width `widthDeg`, with a far lobe 2 dB down. */
function lobe(theta: Float64Array, phi: Float64Array, axis: { thetaDeg: number; phiDeg: number }, widthDeg: number): Float64Array {
  const a = unitVector(axis.thetaDeg, axis.phiDeg);
  const far = unitVector(180 - axis.thetaDeg, (axis.phiDeg + 180) % 360);
  const out = new Float64Array(theta.length);
  for (let i = 0; i < theta.length; i++) {
    const u = unitVector(theta[i], phi[i]);
    const psi = (Math.acos(Math.min(1, u[0] * a[0] + u[1] * a[1] + u[2] * a[2])) * 180) / Math.PI;
    const psiFar = (Math.acos(Math.min(1, u[0] * far[0] + u[1] * far[1] + u[2] * far[2])) * 180) / Math.PI;
    const lin = Math.exp(-2 * (psi / widthDeg) ** 2) + 0.63 * Math.exp(-2 * (psiFar / widthDeg) ** 2) + 1e-4;
    out[i] = 20 + 10 * Math.log10(lin);
  }
  return out;
}

describe('beamPointing', () => {
  it('finds the axis of a symmetric lobe between grid samples, where the peak sample is a step off', () => {
    const { grid } = buildSphereGrid(...(Object.values(stepGrid(5)) as [Float64Array, Float64Array]));
    const vec = gridVectors(grid);
    // Off-grid axis; for a symmetric lobe the weighted mean direction of its −3 dB region is its
    // axis exactly (symmetry), so the error left is the 5° grid's sampling of the region.
    for (const axis of [{ thetaDeg: 52.5, phiDeg: 32.5 }, { thetaDeg: 101.3, phiDeg: 208.7 }, { thetaDeg: 7.5, phiDeg: 300 }]) {
      const v = lobe(grid.thetaDeg, grid.phiDeg, axis, 30);
      const peak = beamPeak(v, grid, 'eirp');
      const k = grid.thetaDeg.findIndex((t, i) => t === peak.thetaDeg && grid.phiDeg[i] === peak.phiDeg);
      const p = beamPointing(v, grid, vec, 'eirp', k);
      // 0.5°: a tenth of the grid step, ample for the symmetric region sampled at 5°.
      expect(angularDistanceDeg(p, axis)).toBeLessThan(0.5);
      expect(angularDistanceDeg(peak, axis)).toBeGreaterThan(1.5);
    }
  });

  it('mirrors the rule for eis (lower is better)', () => {
    const { grid } = buildSphereGrid(...(Object.values(stepGrid(5)) as [Float64Array, Float64Array]));
    const axis = { thetaDeg: 62.5, phiDeg: 92.5 };
    const v = lobe(grid.thetaDeg, grid.phiDeg, axis, 30).map((x) => -60 - x);
    const best = beamPeak(v, grid, 'eis');
    const k = grid.thetaDeg.findIndex((t, i) => t === best.thetaDeg && grid.phiDeg[i] === best.phiDeg);
    expect(angularDistanceDeg(beamPointing(v, grid, gridVectors(grid), 'eis', k), axis)).toBeLessThan(0.5);
  });

  it('visits only the θ band within the radius and gives the bits of the full scan', () => {
    // Oracle: the same call on a grid view whose θ array does not match the values (length 0),
    // which makes beamPointing scan every point. Wide lobes (window wider than the 45° radius)
    // and peaks at θ 0/45/90/180 put points exactly 45° away, on the unit-vector test's edge.
    const { grid } = buildSphereGrid(...(Object.values(stepGrid(5)) as [Float64Array, Float64Array]));
    const vec = gridVectors(grid);
    const fullScan = { weightSr: grid.weightSr, thetaDeg: new Float64Array(0) };
    for (const [axis, width] of [[{ thetaDeg: 45, phiDeg: 0 }, 150], [{ thetaDeg: 0, phiDeg: 0 }, 200], [{ thetaDeg: 90, phiDeg: 90 }, 120], [{ thetaDeg: 180, phiDeg: 0 }, 60], [{ thetaDeg: 33, phiDeg: 7 }, 30]] as const) {
      const v = lobe(grid.thetaDeg, grid.phiDeg, axis, width);
      const peak = beamPeak(v, grid, 'eirp');
      const k = grid.thetaDeg.findIndex((t, i) => t === peak.thetaDeg && grid.phiDeg[i] === peak.phiDeg);
      const band = beamPointing(v, grid, vec, 'eirp', k);
      const all = beamPointing(v, fullScan, vec, 'eirp', k);
      expect(Object.is(band.thetaDeg, all.thetaDeg) && Object.is(band.phiDeg, all.phiDeg)).toBe(true);
    }
  });
});
