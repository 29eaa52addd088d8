import { describe, expect, it } from 'vitest';
import { computeMetrics } from '../../src/coverage/computeMetrics.js';
import { createMeasurement } from '../../src/measurement.js';
import { buildSphereGrid } from '../../src/sphere/buildGrid.js';
import type { Quantity, SphereGrid } from '../../src/types.js';
import { expectClose } from '../helpers/expectClose.js';
import { capSr, combos, fibonacci, FOUR_PI, range, stepGrid } from '../sphere/gridFixtures.js';

const opts = { percentilesPct: [0, 50, 100], thresholds: [5], relativeDb: [3] };
function m(grid: SphereGrid, beams: Float64Array[], quantity: Quantity = 'eirp') {
  return createMeasurement({ unit: 'P', frequencyHz: 28e9, quantity, valueUnit: quantity === 'gain' ? 'dBi' : 'dBm', grid, beams: beams.map((values, k) => ({ id: `b${k}`, values })) });
}

describe('computeMetrics', () => {
  it('two hemisphere beams on a regular grid: best shares, percentiles, coverage, TRP', () => {
    const g = buildSphereGrid(stepGrid(5).theta, stepGrid(5).phi).grid;
    // Beam 0: 10 dBm on θ < 90, 0 elsewhere; beam 1: 10 dBm on θ > 90. Equator row: a tie (beam 0 wins).
    const up = Float64Array.from(g.thetaDeg, (t) => (t <= 90 ? 10 : 0));
    const down = Float64Array.from(g.thetaDeg, (t) => (t >= 90 ? 10 : 0));
    const { tsp, metrics } = computeMetrics(m(g, [up, down]), opts);
    expect(tsp.values.every((v) => v === 10)).toBe(true);
    // Geometry: beam 0 is best on the cap θ ≤ 92.5° (its rows end at the midpoint).
    expectClose(metrics.beams[0].bestShare, capSr(92.5) / FOUR_PI, 1e-12, 'cap 2π(1 − cos α)/4π');
    expectClose(metrics.beams[0].bestShare + metrics.beams[1].bestShare, 1, 1e-12, 'shares of a full sphere sum to 1');
    expect(metrics.percentiles.map((p) => p.value)).toEqual([10, 10, 10]);
    expect(metrics.coverage[0].efficiency).toBe(1);
    // TRP of a two-level pattern: (10·cap(92.5°) + 1·(4π − cap(92.5°)))/4π mW (Eq. TRP, closed form).
    const frac = capSr(92.5) / FOUR_PI;
    expectClose(metrics.beams[0].trpDbm as number, 10 * Math.log10(10 * frac + (1 - frac)), 1e-9, 'closed-form two-level TRP');
    expect(metrics.peak).toEqual({ value: 10, thetaDeg: 0, phiDeg: 0 });
  });

  it('scattered grid: an isotropic beam gives every percentile = the value and TRP = EIRP', () => {
    const f = fibonacci(1500);
    const g = buildSphereGrid(f.theta, f.phi).grid;
    const { metrics } = computeMetrics(m(g, [new Float64Array(g.weightSr.length).fill(7)]), opts);
    expect(metrics.percentiles.map((p) => p.value)).toEqual([7, 7, 7]);
    expectClose(metrics.beams[0].trpDbm as number, 7, 1e-12, 'isotropic: TRP = EIRP');
    expectClose(metrics.beams[0].bestShare, 1, 1e-12, 'one beam is best everywhere');
  });

  it('eis: the TSP is the minimum, the peak is the most sensitive value, TRP is null', () => {
    const g = buildSphereGrid(stepGrid(15).theta, stepGrid(15).phi).grid;
    const a = Float64Array.from(g.thetaDeg, (t) => -90 + t / 10);
    const b = Float64Array.from(g.thetaDeg, (t) => -72 - t / 10);
    const { metrics } = computeMetrics(m(g, [a, b], 'eis'), { ...opts, relativeDb: [0] });
    expect(metrics.peak.value).toBe(-90);
    expect(metrics.beams.every((x) => x.trpDbm === null)).toBe(true);
    expect(metrics.percentiles[0].value).toBe(-90);
    expect(metrics.percentiles[2].value).toBe(-81);
    expect(metrics.relativeCoverage[0].threshold).toBe(-90);
  });

  it('partial sphere (θ ≤ 150°): TRP null, low eirp levels null, coverage below 1', () => {
    const a = combos(range(0, 150, 5), range(0, 355, 5));
    const g = buildSphereGrid(a.theta, a.phi).grid;
    const { metrics } = computeMetrics(m(g, [new Float64Array(g.weightSr.length).fill(3)]), { ...opts, thresholds: [3], percentilesPct: [0, 5, 6, 50] });
    expect(metrics.beams[0].trpDbm).toBeNull();
    // Unmeasured share 1 − cap(152.5°)/4π = (1 + cos 152.5°)/2 = 5.65 %: levels up to it are not evaluable.
    expect(metrics.percentiles.map((p) => p.value)).toEqual([null, null, 3, 3]);
    expectClose(metrics.coverage[0].efficiency, capSr(152.5) / FOUR_PI, 1e-12, 'measured cap share');
  });
});
