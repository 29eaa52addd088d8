/**
 * viewer.html's storage: the packed grid is lossless, beam values are within half a quantum
 * (0.005 dB), and the step-rule percentiles of the stored values are the rounded percentiles of
 * the originals (rounding is monotone; src/viewer/quantize.ts) — so the page's recomputed
 * figures can be compared with results.json at a stated tolerance.
 */
import { describe, expect, it } from 'vitest';
import { packViewerUnit, packValues } from '../../src/report/viewerPack.js';
import { unpackBeams, unpackGrid, unpackMeasurement } from '../../src/viewer/unpack.js';
import { quantizeDb, dequantizeDb } from '../../src/viewer/quantize.js';
import { computeMetrics } from '../../src/coverage/computeMetrics.js';
import type { UnitResult } from '../../src/types.js';
import { expectClose } from '../helpers/expectClose.js';
import { simUnit } from './simUnit.js';

const dummyResult = { tsp: { peak: { value: 0, thetaDeg: 0, phiDeg: 0 }, percentiles: [], coverage: [], relativeCoverage: [], curve: [{ threshold: 0, efficiency: 1 }] } } as unknown as UnitResult;

describe('viewer packing', () => {
  const m = simUnit(5, 16);
  const packed = packViewerUnit(m, dummyResult, 'SIM-01@28000000000');

  it('keeps the grid exactly (the page weighs with the tool\'s own solid angles)', async () => {
    const g = await unpackGrid(packed.grid);
    expect(g.weightSr).toEqual(m.grid.weightSr);
    expect(g.thetaDeg).toEqual(m.grid.thetaDeg);
    expect(g.phiDeg).toEqual(m.grid.phiDeg);
    expect(g.regular?.rowStart).toEqual(m.grid.regular?.rowStart);
    expect(g.solidAngleSr).toBe(m.grid.solidAngleSr);
  });

  it('stores beam values within half a quantum (0.005 dB), as zig-zag Int16 deltas', async () => {
    expect(packed.beams.type).toBe('u16');
    const beams = await unpackBeams(packed, m.grid.thetaDeg.length);
    let worst = 0;
    m.beams.forEach((b, k) => b.values.forEach((v, i) => { worst = Math.max(worst, Math.abs(beams[k][i] - v)); }));
    expect(worst).toBeLessThanOrEqual(0.005 + 1e-12);
    expect(packed.result.tsp.curve).toEqual([]); // the page recomputes the long curve
  });

  it('gives percentiles equal to the rounded percentiles of the original values (monotone rounding)', async () => {
    const back = await unpackMeasurement(packed);
    const levels = [0, 1, 5, 10, 20, 50, 80, 95, 100];
    const opts = { percentilesPct: levels, thresholds: [], relativeDb: [] };
    const orig = computeMetrics(m, opts).metrics.percentiles;
    const now = computeMetrics(back, opts).metrics.percentiles;
    levels.forEach((_, k) => expect(now[k].value).toBe(dequantizeDb(quantizeDb(orig[k].value as number))));
  });

  it('keeps non-finite values and falls back to Int32 when a delta does not fit Int16', async () => {
    const a = Float64Array.of(1, NaN, -Infinity, 400, -400);
    const { packed: p, nonFinite } = packValues([a], a.length);
    expect(p.type).toBe('i32'); // 400 → −400 dB is a step of 80,000 quanta
    const back = await unpackBeams({ ...packed, beamIds: ['x'], beams: p, nonFinite }, a.length);
    expect(Array.from(back[0])).toEqual([1, NaN, -Infinity, 400, -400]);
  });

  it('is compact: 64 beams on a 1° grid with 0.2 dB noise', () => {
    // The size figure stated in README.md; deflate is deterministic for the same input and level.
    const big = simUnit(1, 64);
    const p = packViewerUnit(big, dummyResult, 'SIM-64');
    const bytes = p.beams.b64.length + JSON.stringify(p.grid).length;
    const values = big.beams.length * big.grid.thetaDeg.length;
    expect(values).toBe(64 * (179 * 360 + 2));
    expectClose(bytes / values, 1.0, 0.25, 'about 1 byte a value after quantising, zig-zag delta coding, byte planes, deflate and base64');
  });
});
