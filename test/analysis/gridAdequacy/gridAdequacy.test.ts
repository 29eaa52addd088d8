import { beforeAll, describe, expect, it } from 'vitest';
import { buildSphereGrid } from '../../../src/sphere/buildGrid.js';
import { subGrids } from '../../../src/analysis/gridAdequacy/subGrids.js';
import { GRID_ADEQUACY_CALIBRATION, gridAdequacy } from '../../../src/analysis/gridAdequacy/gridAdequacy.js';
import { gridCountWarnings } from '../../../src/analysis/gridAdequacy/gridCountWarnings.js';
import { fibonacciGrid, regularGrid } from '../../../src/sim/index.js';
import { calibrationRows, type CalibrationRow } from './calibration.js';
import { expectClose } from '../../helpers/expectClose.js';

const grid = (step: number) => {
  const g = regularGrid({ thetaStepDeg: step, phiStepDeg: step, polesOnce: true });
  return buildSphereGrid(g.thetaDeg, g.phiDeg).grid;
};

describe('subGrids', () => {
  it('a full 5° grid holds four 10° grids, each covering 4π', () => {
    const subs = subGrids(grid(5));
    expect(subs.length).toBe(4);
    // Even rows keep both poles: (180/10 − 1)·36 + 2 = 614 (3GPP constant-step count); odd rows 18 × 36 = 648.
    expect(subs.map((s) => s.grid.thetaDeg.length).sort()).toEqual([614, 614, 648, 648]);
    for (const s of subs) expectClose(s.grid.solidAngleSr, 4 * Math.PI, 1e-9, 'regular weights sum to 4π (zone areas)');
  });
  it('each sub-grid point is its parent point (θ, φ) and the sets follow the row × column parity rule', () => {
    // Oracle: the parity rule written point by point (row r and column c of each parent point,
    // a pole point in both column parities of its row parity), sub-grid k = 2·(r mod 2) + (c mod 2).
    const g = grid(15);
    const reg = g.regular!;
    const want: number[][] = [[], [], [], []];
    for (let r = 0; r < reg.thetaRowsDeg.length; r++) {
      for (let c = 0; c < reg.rowLength[r]; c++) {
        const pole = reg.rowLength[r] === 1;
        for (let k = 0; k < 4; k++) if (k >> 1 === r % 2 && (pole || (k & 1) === c % 2)) want[k].push(reg.rowStart[r] + c);
      }
    }
    const subs = subGrids(g);
    expect(subs.map((s) => Array.from(s.parentIndex))).toEqual(want);
    for (const s of subs) {
      s.parentIndex.forEach((p, j) => expect([s.grid.thetaDeg[j], s.grid.phiDeg[j]]).toEqual([g.thetaDeg[p], g.phiDeg[p]]));
    }
  });
  it('a scattered set is thinned into quarters with their own Voronoi weights', () => {
    const f = fibonacciGrid(800);
    const subs = subGrids(buildSphereGrid(f.thetaDeg, f.phiDeg).grid);
    expect(subs.map((s) => s.grid.thetaDeg.length)).toEqual([200, 200, 200, 200]);
    for (const s of subs) expectClose(s.grid.solidAngleSr, 4 * Math.PI, 1e-9, 'Voronoi cells (rescaled within 1 %) tile the sphere');
  });
});

describe('gridAdequacy', () => {
  it('a uniform pattern is read the same on every sub-grid: ±0 dB', () => {
    const g = grid(10);
    const a = gridAdequacy(g, new Float64Array(g.thetaDeg.length).fill(7), 'eirp', [5, 50], [7]);
    expect(a.percentiles.map((p) => p.adequacyDb)).toEqual([0, 0]);
    expect(a.coverage[0].adequacy).toBe(0);
    // Points saved: 7.5° → 15° full grids, 1106 → 266 points (3GPP TS 38.521-2 Annex M.2.1 counts).
  });
  it('states the points a coarser grid saves with the 3GPP constant-step counts', () => {
    const a = gridAdequacy(grid(7.5), new Float64Array(1106).fill(0), 'eirp', [50], []);
    expectClose(a.coarser[1].pointsSavedShare, 1 - 266 / 1106, 1e-12, '7.5° → 15°: 1106 → 266 points (TS 38.521-2 Annex M.2.1)');
    expectClose(a.coarser[0].pointsSavedShare, 1 - ((180 / 11.25 - 1) * 32 + 2) / 1106, 1e-12, '11.25° grid count by the same formula');
  });
});

describe('grid-adequacy calibration on known patterns (truth: a 0.5° grid)', () => {
  let rows: CalibrationRow[];
  beforeAll(() => { rows = calibrationRows(); }, 120_000);
  const share = (pick: (r: CalibrationRow) => number, k: number): number =>
    rows.filter((r) => Math.abs(pick(r)) <= k * r.spreadDb + 1e-9).length / rows.length;
  it('"±x" holds for about 9 in 10 readings at the unit\'s step, 1.5× and 2× coarser', () => {
    // The factors were chosen as the 90th percentile of |true error|/s on this set (README table).
    expect(share((r) => r.errDb, GRID_ADEQUACY_CALIBRATION.atStep)).toBeGreaterThanOrEqual(0.88);
    expect(share((r) => r.err1p5Db, GRID_ADEQUACY_CALIBRATION.at1p5)).toBeGreaterThanOrEqual(0.88);
    expect(share((r) => r.err2Db, GRID_ADEQUACY_CALIBRATION.at2)).toBeGreaterThanOrEqual(0.88);
    // and the estimate is informative: half the factor covers clearly fewer
    expect(share((r) => r.errDb, GRID_ADEQUACY_CALIBRATION.atStep / 3)).toBeLessThan(0.8);
  });
  it('the estimate grows with the step, as the true error does (5° vs 15°)', () => {
    const rms = (step: number, pick: (r: CalibrationRow) => number) => {
      const xs = rows.filter((r) => r.stepDeg === step).map(pick);
      return Math.sqrt(xs.reduce((a, b) => a + b * b, 0) / xs.length);
    };
    expect(rms(15, (r) => r.spreadDb)).toBeGreaterThan(2 * rms(5, (r) => r.spreadDb));
    expect(rms(15, (r) => r.errDb)).toBeGreaterThan(2 * rms(5, (r) => r.errDb));
  });
});

describe('gridCountWarnings (3GPP TS 38.521-2 Annex M.2.1)', () => {
  it('PC3 beam-peak-search minimum: 1106 constant-step, 800 constant-density', () => {
    expect(gridCountWarnings(266, 'regular', 'eirp', undefined).map((w) => w.code)).toEqual(['grid-below-pc3-minimum']);
    expect(gridCountWarnings(1106, 'regular', 'eirp', 3)).toEqual([]);
    expect(gridCountWarnings(799, 'scattered', 'eirp', 3).length).toBe(1);
    expect(gridCountWarnings(800, 'scattered', 'eirp', 3)).toEqual([]);
    expect(gridCountWarnings(266, 'regular', 'eis', 3)).toEqual([]);
  });
  it('PC1 systematic-error table: 0.3 dB needs 10226 / 7000 points', () => {
    expect(gridCountWarnings(10226, 'regular', 'eirp', 1)).toEqual([]);
    expect(gridCountWarnings(7082, 'regular', 'eirp', 1)[0].message).toContain('systematic error 0.5 dB');
    expect(gridCountWarnings(4902, 'regular', 'eirp', 1)[0].message).toContain('systematic error 0.7 dB');
    expect(gridCountWarnings(4901, 'regular', 'eirp', 1)[0].message).toContain('more than 0.7 dB');
    expect(gridCountWarnings(3000, 'scattered', 'eirp', 1)[0].message).toContain('0.7 dB');
    expect(gridCountWarnings(2522, 'regular', 'eirp', 1)[0].code).toBe('grid-pc1-systematic-error');
  });
});
