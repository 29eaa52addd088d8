import { describe, expect, it } from 'vitest';
import { assembleMeasurements } from '../../src/io/assembleMeasurements.js';
import type { RawBeam } from '../../src/io/types.js';
import { summaryCsv } from '../../src/batch/summaryCsv.js';
import { buildSphereGrid } from '../../src/sphere/buildGrid.js';
import { gridWarnings } from '../../src/sphere/gridWarnings.js';
import { gridSummary } from '../../src/sphere/gridSummary.js';
import type { UnitResult } from '../../src/types.js';
import { stepScan, without } from './scanFamilies.js';
import type { Angles } from './gridFixtures.js';

const beam = (a: Angles, quantity: 'eirp' | 'eis' = 'eirp'): RawBeam => ({
  unit: 'PX-01', beam: '0', frequencyHz: 28e9, quantity, valueUnit: 'dBm',
  thetaDeg: a.theta, phiDeg: a.phi, values: new Float64Array(a.theta.length).fill(10), file: 'px.csv', firstLine: 2,
});

describe('every partial or patched grid says so (issue 12)', () => {
  it('a full grid carries no grid warning', () => {
    expect(gridWarnings(buildSphereGrid(stepScan(5).angles().theta, stepScan(5).angles().phi).grid, 'eirp')).toEqual([]);
  });

  it('θ ≤ 150°: partial-sphere with the region (solid angle, share, centre, extent) and trp-partial-sphere', () => {
    const a = stepScan(5, 0, 150).angles();
    const ws = gridWarnings(buildSphereGrid(a.theta, a.phi).grid, 'eirp', { file: 'px.csv' });
    expect(ws.map((w) => w.code)).toEqual(['partial-sphere', 'trp-partial-sphere']);
    // Cap below θ = 152.5° (half a step past the last row): 2π(1 + cos 152.5°) = 0.7099 sr = 5.65 % of 4π (geometry).
    expect(ws[0].message).toContain('0.7099 sr (5.65 % of 4π) unmeasured in 1 region');
    expect(ws[0].message).toContain('centred at θ 180°, φ 0°, reaching 27.5° from it (θ 152.5–180°, all φ)');
    expect(ws[0].file).toBe('px.csv');
    // EIS has no TRP: only the partial-sphere warning.
    expect(gridWarnings(buildSphereGrid(a.theta, a.phi).grid, 'eis').map((w) => w.code)).toEqual(['partial-sphere']);
  });

  it('missing samples: missing-points lists the directions and the absorbed solid angle; TRP stays evaluable', () => {
    const a = without(stepScan(5).angles(), (t, p) => t === 90 && (p === 10 || p === 200));
    const r = assembleMeasurements([beam(a)], [{ path: 'px.csv', sha256: '' }]);
    const m = r.measurements[0];
    const w = m.warnings.filter((x) => x.code === 'missing-points');
    expect(w).toHaveLength(1);
    // Two equatorial 5° cells: 2 · Δφ·(cos 87.5° − cos 92.5°) = 1.5225e-2 sr (zone area, geometry).
    expect(w[0].message).toBe('2 grid directions without a sample, absorbed by the neighbouring cells (1.523e-2 sr, 0.1212 % of 4π): (θ 90°, φ 10°), (θ 90°, φ 200°)');
    expect(m.warnings.some((x) => x.code === 'partial-sphere')).toBe(false);
    expect(gridSummary(m).fullSphere).toBe(true);
  });

  it('a verdict on a partial sphere is never a bare pass in summary.csv', () => {
    const a = stepScan(5, 0, 90).angles();
    const m = assembleMeasurements([beam(a)], [{ path: 'px.csv', sha256: '' }]).measurements[0];
    const grid = gridSummary(m);
    const u = { unit: 'PX-01', frequencyHz: 28e9, quantity: 'eirp', valueUnit: 'dBm', solidAngleSr: m.grid.solidAngleSr, beams: [],
      tsp: { peak: { value: 10, thetaDeg: 0, phiDeg: 0 }, percentiles: [], coverage: [], relativeCoverage: [], curve: [] },
      checks: [], verdict: 'pass', worstCheck: null, warnings: [], grid, sources: [], limitSet: null } as unknown as UnitResult;
    const [header, row] = summaryCsv([u]).trim().split(/\r?\n/);
    const cells = Object.fromEntries(header.split(',').map((h, k) => [h, row.split(',')[k]]));
    expect(cells.verdict).toBe('pass (partial sphere)');
    expect(cells.full_sphere).toBe('no');
    // summary.csv rounds solid angles to 4 decimals (i14's CSV rounding).
    expect(Number(cells.unmeasured_sr)).toBeCloseTo(2 * Math.PI * (1 + Math.cos((92.5 * Math.PI) / 180)), 4);
  });
});
