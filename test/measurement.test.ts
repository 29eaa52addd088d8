import { describe, expect, it } from 'vitest';
import { createMeasurement, MeasurementError, type MeasurementInput } from '../src/measurement.js';
import { buildSphereGrid } from '../src/sphere/buildGrid.js';
import { stepGrid } from './sphere/gridFixtures.js';

const grid = buildSphereGrid(stepGrid(30).theta, stepGrid(30).phi).grid;
const n = grid.weightSr.length;
const good = (): MeasurementInput => ({
  unit: 'PX-01', frequencyHz: 28e9, quantity: 'eirp', valueUnit: 'dBm', grid,
  beams: [{ id: '1', values: new Float64Array(n).fill(5) }, { id: '2', values: new Float64Array(n).fill(6) }],
});

describe('createMeasurement', () => {
  it('accepts a valid measurement and fills defaults', () => {
    const m = createMeasurement(good());
    expect(m.beams.length).toBe(2);
    expect(m.sources).toEqual([]);
    expect(m.metadata).toEqual({});
  });
  const cases: [string, (x: MeasurementInput) => MeasurementInput][] = [
    ['no beams', (x) => ({ ...x, beams: [] })],
    ['beam of wrong length', (x) => ({ ...x, beams: [{ id: '1', values: new Float64Array(n - 1) }] })],
    ['non-finite value', (x) => ({ ...x, beams: [{ id: '1', values: new Float64Array(n).fill(NaN) }] })],
    ['duplicate beam id', (x) => ({ ...x, beams: [x.beams[0], { ...x.beams[1], id: '1' }] })],
    ['unit mismatch', (x) => ({ ...x, quantity: 'gain' })],
    ['bad frequency', (x) => ({ ...x, frequencyHz: -1 })],
    ['zero weight', (x) => ({ ...x, grid: { ...grid, weightSr: new Float64Array(n) } })],
    ['solid angle over 4π', (x) => ({ ...x, grid: { ...grid, weightSr: grid.weightSr.map((w) => 2 * w), solidAngleSr: 2 * grid.solidAngleSr } })],
    ['solidAngleSr not Σw', (x) => ({ ...x, grid: { ...grid, solidAngleSr: 1 } })],
    ['θ out of range', (x) => ({ ...x, grid: { ...grid, thetaDeg: grid.thetaDeg.map((t) => t + 200) } })],
  ];
  for (const [name, make] of cases) {
    it(`throws MeasurementError: ${name}`, () => {
      expect(() => createMeasurement(make(good()))).toThrow(MeasurementError);
    });
  }
});
