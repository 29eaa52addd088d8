/** A simulated unit (src/sim handset model + measurement noise) as a Measurement, for the viewer tests and the size figure. */
import { createMeasurement } from '../../src/measurement.js';
import { buildSphereGrid } from '../../src/sphere/buildGrid.js';
import { applyMeasurementNoise, handsetModule, regularGrid, simulateBeams } from '../../src/sim/index.js';
import type { Measurement } from '../../src/types.js';

export function simUnit(stepDeg: number, beams: number, seed = 7): Measurement {
  const samples = regularGrid({ thetaStepDeg: stepDeg, phiStepDeg: stepDeg, polesOnce: true });
  const { model, codebook } = handsetModule({ conductedPowerDbm: 13, extraBeams: Math.max(0, beams - 16) });
  const sim = applyMeasurementNoise(simulateBeams(model, codebook.slice(0, beams), samples, 28e9), { sigmaDb: 0.2, noiseFloorDbm: -30, seed });
  const { grid, pointOf } = buildSphereGrid(Float64Array.from(samples.thetaDeg), Float64Array.from(samples.phiDeg));
  const n = grid.thetaDeg.length;
  return createMeasurement({
    unit: 'SIM-01', frequencyHz: 28e9, quantity: 'eirp', valueUnit: 'dBm', grid,
    beams: sim.map((b) => {
      const values = new Float64Array(n);
      for (let i = 0; i < pointOf.length; i++) values[pointOf[i]] = b.eirpDbm[i];
      return { id: b.id, values };
    }),
  });
}
