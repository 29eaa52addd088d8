import type { BeamPattern, Measurement, SourceFile, Warning } from './types.js';
import { FULL_SPHERE_REL_TOL } from './sphere/isFullSphere.js';
import { neumaierSum } from './sphere/neumaierSum.js';
import { isQuantity, quantityUnit } from './quantity.js';

/** A violated Measurement invariant: a programming error upstream, never an input problem. */
export class MeasurementError extends Error {
  override name = 'MeasurementError';
}

export type MeasurementInput = Omit<Measurement, 'sources' | 'warnings' | 'metadata'> & {
  sources?: SourceFile[];
  warnings?: Warning[];
  metadata?: Record<string, string>;
};


/**
 * The one validating factory of Measurement; downstream code trusts what it returns.
 *
 * Invariants: one grid for all beams; θ, φ, weight arrays of equal length n ≥ 1; θ ∈ [0, 180],
 * φ ∈ [0, 360); weights finite and > 0; solidAngleSr = Σw (1e-9 relative) and ≤ 4π (+1e-6
 * relative, the full-sphere tolerance); a regular layout that indexes exactly n points; at
 * least one beam; beam ids unique; every beam has n finite dB values; valueUnit dBm for
 * eirp/eis and dBi for gain; frequencyHz null or finite and > 0.
 * Cost O(n·beams).
 * @throws MeasurementError naming the first violated invariant.
 * @example createMeasurement({ unit: 'PX-01', frequencyHz: 28e9, quantity: 'eirp', valueUnit: 'dBm', grid, beams })
 */
export function createMeasurement(input: MeasurementInput): Measurement {
  const fail = (what: string): never => {
    throw new MeasurementError(`createMeasurement(${input.unit}): ${what}`);
  };
  const { grid, beams, quantity } = input;
  if (!isQuantity(quantity)) fail(`unknown quantity '${String(quantity)}'`);
  if (input.valueUnit !== quantityUnit(quantity)) fail(`valueUnit ${input.valueUnit} does not fit ${quantity} (${quantityUnit(quantity)})`);
  if (input.frequencyHz !== null && !(Number.isFinite(input.frequencyHz) && input.frequencyHz > 0)) {
    fail(`frequencyHz ${input.frequencyHz} is not a positive number`);
  }
  const n = grid.thetaDeg.length;
  if (n < 1) fail('the grid has no points');
  if (grid.phiDeg.length !== n || grid.weightSr.length !== n) fail('grid θ, φ and weight arrays differ in length');
  for (let i = 0; i < n; i++) {
    const t = grid.thetaDeg[i], p = grid.phiDeg[i], w = grid.weightSr[i];
    if (!(t >= 0 && t <= 180)) fail(`grid point ${i}: θ ${t} outside [0, 180]`);
    if (!(p >= 0 && p < 360)) fail(`grid point ${i}: φ ${p} outside [0, 360)`);
    if (!(Number.isFinite(w) && w > 0)) fail(`grid point ${i}: weight ${w} is not finite and positive`);
  }
  const sum = neumaierSum(grid.weightSr);
  if (Math.abs(sum - grid.solidAngleSr) > 1e-9 * sum) fail(`solidAngleSr ${grid.solidAngleSr} ≠ Σ weights ${sum}`);
  if (sum > 4 * Math.PI * (1 + FULL_SPHERE_REL_TOL)) fail(`solid angle ${sum} sr exceeds 4π`);
  if (grid.kind === 'regular') {
    const lay = grid.regular;
    if (!lay) fail('a regular grid needs its layout');
    else {
      let total = 0;
      for (let r = 0; r < lay.rowLength.length; r++) total += lay.rowLength[r];
      if (total !== n) fail(`the regular layout indexes ${total} points, the grid has ${n}`);
    }
  }
  if (beams.length === 0) fail('no beams');
  const ids = new Set<string>();
  for (const b of beams) {
    if (ids.has(b.id)) fail(`beam id '${b.id}' appears twice`);
    ids.add(b.id);
    const v = b.values;
    if (v.length !== n) fail(`beam '${b.id}' has ${v.length} values for ${n} grid points`);
    // v − v is 0 exactly for finite v (NaN for NaN and ±∞): the cheapest test of the one pass
    // over every value a unit holds.
    for (let i = 0; i < n; i++) if (v[i] - v[i] !== 0) fail(`beam '${b.id}' point ${i}: value ${v[i]} is not finite`);
  }
  return {
    unit: input.unit,
    frequencyHz: input.frequencyHz,
    quantity,
    valueUnit: input.valueUnit,
    grid,
    beams: beams.map((b): BeamPattern => ({ id: b.id, values: b.values })),
    sources: input.sources ?? [],
    warnings: input.warnings ?? [],
    metadata: input.metadata ?? {},
    ...(input.mergedSamples === undefined ? {} : { mergedSamples: input.mergedSamples }),
    ...(input.polarization === undefined ? {} : { polarization: input.polarization }),
  };
}
