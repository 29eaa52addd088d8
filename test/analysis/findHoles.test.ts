import { describe, expect, it } from 'vitest';
import { findHoles } from '../../src/analysis/findHoles.js';
import type { SphereGrid, TotalScanPattern } from '../../src/types.js';
import { expectClose } from '../helpers/expectClose.js';
import { angleDeg, fullGrid, unit } from './fixtures.js';

/** TSP as the per-point best (max for eirp, min for eis); written here so the test does not lean on the core. */
function tspOf(beams: Float64Array[], lowerIsBetter = false): TotalScanPattern {
  const n = beams[0].length;
  const values = new Float64Array(n), bestBeam = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    let b = 0;
    for (let k = 1; k < beams.length; k++) if (lowerIsBetter ? beams[k][i] < beams[b][i] : beams[k][i] > beams[b][i]) b = k;
    values[i] = beams[b][i];
    bestBeam[i] = b;
  }
  return { values, bestBeam };
}

/** Angle ψ (deg) of every grid point from an axis. */
function psiFrom(grid: SphereGrid, thetaDeg: number, phiDeg: number): Float64Array {
  const a = unit(thetaDeg, phiDeg);
  return Float64Array.from(grid.thetaDeg, (t, i) => angleDeg(a, unit(t, grid.phiDeg[i])));
}

// A unit whose codebook is: beam 0, a wide beam that reaches the 10 dBm threshold everywhere
// except inside a cap of half-angle α around `axis` (value 10 + 0.5·(ψ − α) dBm), and beam 1, the
// beam that fills that cap (25 dBm inside, −10 outside). Beam 1 has failed: 17 dB down.
function unitWithFailedBeam(grid: SphereGrid, axis: [number, number], alphaDeg: number, failedDb = 17) {
  const psi = psiFrom(grid, axis[0], axis[1]);
  const wide = psi.map((p) => 10 + 0.5 * (p - alphaDeg));
  const filler = psi.map((p) => (p <= alphaDeg ? 25 : -10) - failedDb);
  const spare = new Float64Array(psi.length).fill(-20);
  return { beams: [wide, filler, spare], ids: ['wide', 'filler', 'spare'] };
}

describe('findHoles', () => {
  const grid = fullGrid(5);

  it('finds the cap of a failed beam: position and solid angle against 2π(1 − cos α)', () => {
    const alpha = 30;
    const axis: [number, number] = [60, 350]; // straddles the φ seam
    const { beams, ids } = unitWithFailedBeam(grid, axis, alpha);
    const holes = findHoles(grid, tspOf(beams), beams, ids, 10, 'eirp');
    expect(holes.length).toBe(1);
    const capSr = 2 * Math.PI * (1 - Math.cos((alpha * Math.PI) / 180)); // spherical cap area, closed form
    // Grid resolution: the rim of length 2π sin α (rad) is resolved to about half a 5° cell.
    const rimTol = 2 * Math.PI * Math.sin((alpha * Math.PI) / 180) * ((2.5 * Math.PI) / 180);
    expectClose(holes[0].solidAngleSr, capSr, rimTol, 'cap area within half a cell along the rim');
    expect(angleDeg(unit(holes[0].thetaDeg, holes[0].phiDeg), unit(...axis))).toBeLessThan(2.5); // within half a cell
    expect(holes[0].nearestBeam).toBe('filler'); // 8 dBm flat beats the wide beam's cap mean (≈ 5 dBm)
    expect(holes[0].worst).toBe(25 - 17); // the failed filler beam's flat level tops the wide beam inside
  });

  it('joins a hole across the pole into one region', () => {
    const { beams, ids } = unitWithFailedBeam(grid, [10, 123], 25);
    const holes = findHoles(grid, tspOf(beams), beams, ids, 10, 'eirp');
    expect(holes.length).toBe(1);
    expectClose(holes[0].solidAngleSr, 2 * Math.PI * (1 - Math.cos((25 * Math.PI) / 180)), 2 * Math.PI * Math.sin((25 * Math.PI) / 180) * ((2.5 * Math.PI) / 180), 'cap across the pole');
    expect(angleDeg(unit(holes[0].thetaDeg, holes[0].phiDeg), unit(10, 123))).toBeLessThan(2.5);
  });

  it('finds nothing when the beam is healthy, and lists two holes largest first', () => {
    const healthy = unitWithFailedBeam(grid, [90, 90], 30, 0);
    expect(findHoles(grid, tspOf(healthy.beams), healthy.beams, healthy.ids, 10, 'eirp')).toEqual([]);
    // Two failed regions: 40° cap at θ = 130 and a 15° cap at θ = 40, far apart.
    const psiA = psiFrom(grid, 130, 200), psiB = psiFrom(grid, 40, 20);
    const wide = psiA.map((p, i) => Math.min(10 + 0.5 * (p - 40), 10 + 0.5 * (psiB[i] - 15)));
    const holes = findHoles(grid, tspOf([wide]), [wide], ['w'], 10, 'eirp');
    expect(holes.length).toBe(2);
    expect(holes[0].solidAngleSr).toBeGreaterThan(holes[1].solidAngleSr);
    expect(angleDeg(unit(holes[0].thetaDeg, holes[0].phiDeg), unit(130, 200))).toBeLessThan(2.5);
    expect(angleDeg(unit(holes[1].thetaDeg, holes[1].phiDeg), unit(40, 20))).toBeLessThan(2.5);
  });

  it('uses the eis sense: worse means higher than the threshold', () => {
    // EIS = −(EIRP-like pattern) − 90: the same cap is where EIS exceeds −100 dBm.
    const { beams, ids } = unitWithFailedBeam(grid, [100, 250], 30);
    const eis = beams.map((b) => b.map((v) => -90 - v));
    const holes = findHoles(grid, tspOf(eis, true), eis, ids, -100, 'eis');
    expect(holes.length).toBe(1);
    expect(holes[0].nearestBeam).toBe('filler');
    expect(holes[0].worst).toBe(-90 - 8); // the failed filler's flat level
    expectClose(holes[0].solidAngleSr, 2 * Math.PI * (1 - Math.cos(Math.PI / 6)), Math.PI * ((2.5 * Math.PI) / 180), 'cap area');
  });

  it('counts a missing (NaN) point as not covered', () => {
    const flat = new Float64Array(grid.thetaDeg.length).fill(20);
    flat[100] = NaN;
    const holes = findHoles(grid, { values: flat, bestBeam: new Int32Array(flat.length) }, [flat], ['0'], 10, 'eirp');
    expect(holes.length).toBe(1);
    expectClose(holes[0].solidAngleSr, grid.weightSr[100], 1e-15, 'one cell');
  });
});

describe('findHoles on a scattered (constant-density) grid', () => {
  it('finds a failed cap on a Fibonacci grid with Voronoi weights: area vs 2π(1 − cos α)', async () => {
    const { fibonacciGrid } = await import('../../src/sim/fibonacciGrid.js');
    const { buildSphereGrid } = await import('../../src/sphere/buildGrid.js');
    const s = fibonacciGrid(3000);
    const grid = buildSphereGrid(s.thetaDeg, s.phiDeg).grid;
    expect(grid.kind).toBe('scattered');
    const alpha = 35;
    const { beams, ids } = unitWithFailedBeam(grid, [150, 10], alpha);
    const holes = findHoles(grid, tspOf(beams), beams, ids, 10, 'eirp');
    expect(holes.length).toBe(1);
    // Point spacing ≈ sqrt(4π/3000) rad ≈ 3.7°: the rim (length 2π sin α) is resolved to about half a spacing.
    const spacing = Math.sqrt((4 * Math.PI) / 3000);
    expectClose(holes[0].solidAngleSr, 2 * Math.PI * (1 - Math.cos((alpha * Math.PI) / 180)), 2 * Math.PI * Math.sin((alpha * Math.PI) / 180) * (spacing / 2), 'cap on Voronoi cells');
    expect(angleDeg(unit(holes[0].thetaDeg, holes[0].phiDeg), unit(150, 10))).toBeLessThan(2);
  });
});
