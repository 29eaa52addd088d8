import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { computeMetrics } from '../../src/coverage/computeMetrics.js';
import { percentile } from '../../src/coverage/percentile.js';
import { totalScanPattern } from '../../src/coverage/totalScanPattern.js';
import { weightedCdf } from '../../src/coverage/weightedCdf.js';
import { createMeasurement } from '../../src/measurement.js';
import { buildSphereGrid } from '../../src/sphere/buildGrid.js';
import type { Measurement, Quantity, SphereGrid } from '../../src/types.js';
import { combos, range, stepGrid } from '../sphere/gridFixtures.js';

const SETTINGS = { seed: 20261201, numRuns: 40 };
const LEVELS = [0, 5, 20, 50, 85, 100];
const opts = { percentilesPct: LEVELS, thresholds: [-5, 0, 5], relativeDb: [3, 10] };
const grid15 = buildSphereGrid(stepGrid(15).theta, stepGrid(15).phi).grid;
const n15 = grid15.weightSr.length;

const beamsArb = (n: number) =>
  fc.array(fc.array(fc.double({ min: -40, max: 30, noNaN: true }), { minLength: n, maxLength: n }).map((a) => Float64Array.from(a)), { minLength: 1, maxLength: 5 });

function measurement(grid: SphereGrid, beams: Float64Array[], quantity: Quantity = 'eirp'): Measurement {
  return createMeasurement({
    unit: 'P', frequencyHz: null, quantity, valueUnit: quantity === 'gain' ? 'dBi' : 'dBm', grid,
    beams: beams.map((values, k) => ({ id: String(k), values })),
  });
}

describe('properties (fast-check, seeded)', () => {
  it('the TSP is never below any beam (eirp) and never above any beam (eis)', () => {
    fc.assert(fc.property(beamsArb(n15), (beams) => {
      const up = totalScanPattern(beams, 'eirp').values;
      const down = totalScanPattern(beams, 'eis').values;
      for (const b of beams) for (let i = 0; i < n15; i++) { expect(up[i]).toBeGreaterThanOrEqual(b[i]); expect(down[i]).toBeLessThanOrEqual(b[i]); }
    }), SETTINGS);
  });

  it('adding a beam never lowers a percentile (eirp)', () => {
    fc.assert(fc.property(beamsArb(n15), beamsArb(n15), (a, extra) => {
      const before = computeMetrics(measurement(grid15, a), opts).metrics.percentiles;
      const after = computeMetrics(measurement(grid15, [...a, extra[0]]), opts).metrics.percentiles;
      for (let k = 0; k < LEVELS.length; k++) expect(after[k].value as number).toBeGreaterThanOrEqual(before[k].value as number);
    }), SETTINGS);
  });

  it('the order of points and of beams changes nothing', () => {
    const a = stepGrid(15, { seam: true });
    const b0 = buildSphereGrid(a.theta, a.phi);
    fc.assert(fc.property(beamsArb(n15), fc.integer({ min: 1, max: 2147483646 }), (beams, seed) => {
      // Shuffle the raw samples (as the rows of a file could be), rebuild, reverse the beams.
      const perm = Array.from(a.theta.keys());
      let s = seed;
      for (let i = perm.length - 1; i > 0; i--) { s = (s * 16807) % 2147483647; const j = s % (i + 1); [perm[i], perm[j]] = [perm[j], perm[i]]; }
      const b1 = buildSphereGrid(Float64Array.from(perm, (i) => a.theta[i]), Float64Array.from(perm, (i) => a.phi[i]));
      const moved = beams.map((v) => {
        const out = new Float64Array(v.length);
        perm.forEach((raw, k) => { out[b1.pointOf[k]] = v[b0.pointOf[raw]]; });
        return out;
      }).reverse();
      const m0 = computeMetrics(measurement(b0.grid, beams), opts).metrics;
      const m1 = computeMetrics(measurement(b1.grid, moved), opts).metrics;
      expect(m1.percentiles).toEqual(m0.percentiles);
      expect(m1.coverage).toEqual(m0.coverage);
      expect(m1.curve).toEqual(m0.curve);
      expect(m1.peak).toEqual(m0.peak);
      expect(m1.beams.map((b) => b.trpDbm).reverse()).toEqual(m0.beams.map((b) => b.trpDbm));
      // Best shares are order-free except on exact ties (the lower index wins a tie by rule).
      const tied = beams.length > 1 && beams.some((v, k) => k > 0 && v.some((x, i) => beams.some((w, j) => j !== k && w[i] === x)));
      if (!tied) expect(m1.beams.map((b) => b.bestShare).reverse()).toEqual(m0.beams.map((b) => b.bestShare));
    }), { ...SETTINGS, numRuns: 20 });
  });

  it('rotating a regular grid in φ changes no metric', () => {
    const rows = range(0, 180, 15);
    const cols = range(0, 345, 15);
    fc.assert(fc.property(beamsArb(n15), fc.integer({ min: 1, max: 23 }), (beams, shift) => {
      // Same pattern, φ columns relabelled by shift·15°: the sphere is rotated about z.
      const rotatedCols = cols.map((c) => (c + shift * 15) % 360);
      const a = combos(rows, rotatedCols, false);
      const b = buildSphereGrid(a.theta, a.phi);
      // combos() lists the points in the unrotated grid's canonical order, so raw index = old point index.
      const moved = beams.map((v) => {
        const out = new Float64Array(n15);
        b.pointOf.forEach((p, raw) => { out[p] = v[raw]; });
        return out;
      });
      const m0 = computeMetrics(measurement(grid15, beams), opts).metrics;
      const m1 = computeMetrics(measurement(b.grid, moved), opts).metrics;
      expect(m1.percentiles).toEqual(m0.percentiles);
      for (let k = 0; k < m0.coverage.length; k++) expect(Math.abs(m1.coverage[k].efficiency - m0.coverage[k].efficiency)).toBeLessThan(1e-12);
      for (let k = 0; k < m0.beams.length; k++) expect(Math.abs((m1.beams[k].trpDbm as number) - (m0.beams[k].trpDbm as number))).toBeLessThan(1e-9);
    }), SETTINGS);
  });

  it('the CDF is monotone, 0 % is the minimum and 100 % the peak', () => {
    fc.assert(fc.property(beamsArb(n15), (beams) => {
      const tsp = totalScanPattern(beams, 'eirp').values;
      const cdf = weightedCdf(tsp, grid15.weightSr);
      for (let k = 1; k < cdf.values.length; k++) {
        expect(cdf.values[k]).toBeGreaterThan(cdf.values[k - 1]);
        expect(cdf.cumulativeSr[k]).toBeGreaterThan(cdf.cumulativeSr[k - 1]);
      }
      let lo = Infinity, hi = -Infinity;
      for (const v of tsp) { lo = Math.min(lo, v); hi = Math.max(hi, v); }
      expect(percentile(cdf, 0, 'eirp')).toBe(lo);
      expect(percentile(cdf, 100, 'eirp')).toBe(hi);
      let prev = -Infinity;
      for (let p = 0; p <= 100; p += 5) { const v = percentile(cdf, p, 'eirp') as number; expect(v).toBeGreaterThanOrEqual(prev); prev = v; }
    }), SETTINGS);
  });
});
