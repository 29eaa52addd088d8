// Known answers on measurements made by the analytic array model (src/sim) and measured by the
// core (src/sphere, src/coverage): the analysis must find what was built into the model.
import { describe, expect, it } from 'vitest';
import { beamRemoval } from '../../src/analysis/beamRemoval.js';
import { findHolesWithLabels } from '../../src/analysis/findHoles.js';
import { greedySubset } from '../../src/analysis/greedySubset.js';
import { referenceDeltas } from '../../src/analysis/referenceDeltas.js';
import { tspDifference } from '../../src/analysis/tspDifference.js';
import { computeMetrics } from '../../src/coverage/computeMetrics.js';
import { createMeasurement } from '../../src/measurement.js';
import { failElement } from '../../src/sim/elementErrors.js';
import { handsetModule } from '../../src/sim/handsetModule.js';
import { regularGrid } from '../../src/sim/regularGrid.js';
import { simulateBeams } from '../../src/sim/simulateBeams.js';
import type { ArrayModel, SteeringBeam } from '../../src/sim/types.js';
import { angularDistanceDeg, unitVector } from '../../src/sphere/direction.js';
import { buildSphereGrid } from '../../src/sphere/buildGrid.js';
import { mergeSamples } from '../../src/sphere/mergeSamples.js';

const samples = regularGrid({ thetaStepDeg: 5, phiStepDeg: 5 });
const build = buildSphereGrid(samples.thetaDeg, samples.phiDeg);
const grid = build.grid;

function measure(unit: string, model: ArrayModel, codebook: SteeringBeam[]) {
  // A chamber never reads below its noise floor (−40 dBm here): dead beams read the floor, not −∞.
  const floor = (v: Float64Array) => v.map((x) => Math.max(x, -40));
  const beams = simulateBeams(model, codebook, samples, 28e9).map((b) => ({ id: b.id, values: mergeSamples(build, floor(b.eirpDbm)).values }));
  const m = createMeasurement({ unit, frequencyHz: 28e9, quantity: 'eirp', valueUnit: 'dBm', grid, beams });
  return { m, ...computeMetrics(m, { percentilesPct: [20, 50, 80], thresholds: [0, 5], relativeDb: [3] }) };
}

describe('analysis on simulated units', () => {
  const { model, codebook } = handsetModule({ conductedPowerDbm: 13 });
  const healthy = measure('GOOD', model, codebook);

  it('a unit whose edge sub-array failed has its largest hole around the edge face (+y)', () => {
    let broken = model.elements;
    for (const k of [4, 5, 6, 7]) broken = failElement(broken, k); // the 1×4 edge sub-array faces +y
    const failed = measure('BAD', { ...model, elements: broken }, codebook);
    const t = healthy.metrics.percentiles.find((p) => p.levelPct === 20)!.value!;
    const ids = failed.m.beams.map((b) => b.id);
    const after = findHolesWithLabels(grid, failed.tsp, failed.m.beams.map((b) => b.values), ids, t, 'eirp');
    const before = findHolesWithLabels(grid, healthy.tsp, healthy.m.beams.map((b) => b.values), ids, t, 'eirp');
    const plusY = { thetaDeg: 90, phiDeg: 90 };
    // The model: the edge face's boresight is +y; with it dead, coverage there comes only from
    // the back face (boresight −x), 90° off. The healthy unit is already weak towards +x/−y (no
    // face points there), so the new loss joins that hole: the region lost by the failure must
    // sit around +y, and the +y direction must now be inside the largest hole.
    const atPlusY = Array.from(grid.thetaDeg.keys()).find((i) => grid.thetaDeg[i] === 90 && grid.phiDeg[i] === 90)!;
    expect(before.holeOf[atPlusY]).toBe(-1);
    expect(after.holeOf[atPlusY]).toBe(0);
    let x = 0, y = 0, z = 0, lostSr = 0;
    for (let i = 0; i < grid.weightSr.length; i++) {
      if (after.holeOf[i] < 0 || before.holeOf[i] >= 0) continue;
      const [ux, uy, uz] = unitVector(grid.thetaDeg[i], grid.phiDeg[i]);
      const w = grid.weightSr[i];
      x += w * ux; y += w * uy; z += w * uz; lostSr += w;
    }
    const lostCentre = { thetaDeg: (Math.acos(z / Math.hypot(x, y, z)) * 180) / Math.PI, phiDeg: (Math.atan2(y, x) * 180) / Math.PI };
    expect(angularDistanceDeg(lostCentre, plusY)).toBeLessThan(30);
    expect(lostSr).toBeGreaterThan(1); // a large part of the +y hemisphere (2π sr)
    // The hole grew by at least the lost region (joined, not double-counted).
    expect(after.holes[0].solidAngleSr).toBeGreaterThanOrEqual(lostSr);
    // The dead edge beams read the noise floor; the nearest beam is a back-face beam (ids 0–8).
    expect(Number(after.holes[0].nearestBeam)).toBeLessThan(9);
    // holeOf agrees with the hole's solid angle.
    const sumSr = grid.weightSr.reduce((s, w, i) => s + (after.holeOf[i] === 0 ? w : 0), 0);
    expect(Math.abs(sumSr - after.holes[0].solidAngleSr)).toBeLessThan(1e-12);
  });

  it('a codebook with a duplicated codeword shows the duplicate removable at zero cost', () => {
    const dup = [...codebook, { ...codebook[11], id: '16', elements: [...codebook[11].elements] }];
    const unit = measure('DUP', model, dup);
    const beams = unit.m.beams.map((b) => b.values);
    const removal = beamRemoval(grid, beams, 'eirp', 50, 0);
    expect(removal[11]).toEqual({ percentileLossDb: 0, coverageLoss: 0 });
    expect(removal[16]).toEqual({ percentileLossDb: 0, coverageLoss: 0 });
    const subset = greedySubset(grid, beams, unit.m.beams.map((b) => b.id), 'eirp', 50, 0.5);
    expect(subset.beams.includes('11') && subset.beams.includes('16')).toBe(false);
    // The greedy curve's last value matches the core's 50 % of that subset exactly (same step rule).
    const chosen = unit.m.beams.filter((b) => subset.beams.includes(b.id));
    const sub = computeMetrics(createMeasurement({ ...unit.m, beams: chosen }), { percentilesPct: [50], thresholds: [], relativeDb: [] });
    expect(subset.curve.at(-1)!.value).toBe(sub.metrics.percentiles[0].value);
    expect(unit.metrics.percentiles.find((p) => p.levelPct === 50)!.value! - subset.curve.at(-1)!.value!).toBeLessThanOrEqual(0.5);
  });

  it('a reference compared with itself differs by zero everywhere', () => {
    const again = measure('GOOD', model, codebook);
    expect(tspDifference(grid, healthy.tsp, grid, again.tsp).every((x) => x === 0)).toBe(true);
    const deltas = referenceDeltas(healthy.metrics, again.metrics);
    expect(Object.keys(deltas).length).toBeGreaterThan(6);
    for (const v of Object.values(deltas)) expect(v).toBe(0);
  });
});
