/**
 * Pack a measurement for viewer.html (Node side; the page unpacks with src/viewer/unpack.ts).
 *
 * Grid arrays are stored losslessly (Float64/Int32), so the page's solid-angle weights are the
 * tool's own. Beam values are quantised to 0.01 dB (src/viewer/quantize.ts: no visible loss,
 * percentiles off by at most 0.005 dB), delta-coded along the canonical point order (neighbouring
 * points of a smooth pattern differ little, so the bytes repeat and deflate well), stored as
 * zig-zag coded into Uint16 when every delta fits (else plain Int32), split into byte planes, then raw-deflated (RFC 1951) and base64-encoded.
 * Cost O(points·beams) plus deflate.
 */
import { deflateRawSync } from 'node:zlib';
import type { Measurement, SphereGrid, TotalScanPattern, UnitResult } from '../types.js';
import type { PackedArray, PackedGrid, ViewerUnit } from '../viewer/viewerData.js';
import { QUANTUM_DB, quantizeDb } from '../viewer/quantize.js';

function pack(arr: Float64Array | Int32Array | Uint16Array, delta?: { runLength: number }): PackedArray {
  const type = arr instanceof Float64Array ? 'f64' : arr instanceof Int32Array ? 'i32' : 'u16';
  const bytes = Buffer.from(arr.buffer, arr.byteOffset, arr.byteLength);
  if (!delta) return { type, length: arr.length, b64: deflateRawSync(bytes, { level: 6 }).toString('base64') };
  // Delta-coded values are small numbers, zig-zag coded their high bytes are nearly all zero:
  // stored plane by plane, that plane deflates to almost nothing (measured on a noisy 64-beam
  // unit: 0.67 instead of 0.91 bytes a value, and faster).
  const size = arr.BYTES_PER_ELEMENT, n = arr.length;
  const planes = Buffer.alloc(bytes.length);
  for (let k = 0; k < size; k++) {
    const plane = k * n;
    for (let i = 0, j = k; i < n; i++, j += size) planes[plane + i] = bytes[j];
  }
  return { type, length: n, delta, planes: true, ...(type === 'u16' ? { zigzag: true } : {}), b64: deflateRawSync(planes, { level: 6 }).toString('base64') };
}

export function packGrid(grid: SphereGrid): PackedGrid {
  const r = grid.regular;
  return {
    kind: grid.kind,
    solidAngleSr: grid.solidAngleSr,
    thetaDeg: pack(grid.thetaDeg),
    phiDeg: pack(grid.phiDeg),
    weightSr: pack(grid.weightSr),
    regular: r
      ? { thetaRowsDeg: pack(r.thetaRowsDeg), phiColsDeg: pack(r.phiColsDeg), rowStart: pack(r.rowStart), rowLength: pack(r.rowLength), phiWraps: r.phiWraps }
      : null,
  };
}

/** Quantise, delta-code per run of `runLength` values and pack (Int16 when it fits). */
export function packValues(runs: Float64Array[], runLength: number): { packed: PackedArray; nonFinite: ViewerUnit['nonFinite'] } {
  const q = new Int32Array(runs.length * runLength);
  const nonFinite: ViewerUnit['nonFinite'] = [];
  let fits16 = true;
  runs.forEach((values, b) => {
    let prev = 0;
    for (let i = 0; i < runLength; i++) {
      const v = values[i];
      const k = b * runLength + i;
      let cur = prev;
      if (Number.isFinite(v)) cur = quantizeDb(v);
      else nonFinite.push({ index: k, value: v !== v ? 'nan' : v > 0 ? 'inf' : '-inf' });
      const d = cur - prev;
      q[k] = d;
      if (d < -32768 || d > 32767) fits16 = false;
      prev = cur;
    }
  });
  return { packed: pack(fits16 ? zigzag16(q) : q, { runLength }), nonFinite };
}

/**
 * Zig-zag code (0, −1, 1, −2, … → 0, 1, 2, 3, …) of deltas that fit 16 bits, as Uint16.
 * A plain loop: `Uint16Array.from(q, fn)` takes V8's generic iterator path, 30× slower (0.47 s
 * for the 4.1 M values of a 64-beam 1° unit, measured 2026-12-02).
 */
function zigzag16(q: Int32Array): Uint16Array {
  const out = new Uint16Array(q.length);
  for (let i = 0; i < q.length; i++) {
    const d = q[i];
    out[i] = d >= 0 ? 2 * d : -2 * d - 1;
  }
  return out;
}

/** A measurement's grid and beams as the viewer stores them: packViewerUnit's work, a pure function of the grid and the beam values. */
export interface PackedBeams {
  grid: PackedGrid;
  beams: PackedArray;
  nonFinite: ViewerUnit['nonFinite'];
}

/**
 * Pack a grid and its beams (packValues, packGrid). Pure: the insight lane's thread packs a
 * large unit with this while the main thread draws its PDF (src/batch/insightWorker.ts), with
 * the same bytes as here.
 */
export function packBeams(grid: SphereGrid, beams: Float64Array[]): PackedBeams {
  const { packed, nonFinite } = packValues(beams, grid.thetaDeg.length);
  return { grid: packGrid(grid), beams: packed, nonFinite };
}

/**
 * The viewer's entry for one measured unit (its results.json entry without the long curve).
 * `packed`: packBeams of this measurement when it was made elsewhere (the insight lane).
 */
export function packViewerUnit(m: Measurement, result: UnitResult, key: string, packed: PackedBeams = packBeams(m.grid, m.beams.map((b) => b.values))): ViewerUnit {
  return {
    key,
    unit: m.unit,
    frequencyHz: m.frequencyHz,
    quantity: m.quantity,
    valueUnit: m.valueUnit,
    grid: packed.grid,
    beamIds: m.beams.map((b) => b.id),
    beams: packed.beams,
    quantumDb: QUANTUM_DB,
    nonFinite: packed.nonFinite,
    result: { ...result, tsp: { ...result.tsp, curve: [] } },
  };
}

/** A golden unit from its own folder: only its total scan pattern, as one pseudo-beam. */
export function packReferencePattern(grid: SphereGrid, tsp: TotalScanPattern, result: UnitResult, key: string): ViewerUnit {
  const { packed, nonFinite } = packValues([tsp.values], grid.thetaDeg.length);
  return {
    key, unit: result.unit, frequencyHz: result.frequencyHz, quantity: result.quantity, valueUnit: result.valueUnit,
    grid: packGrid(grid), beamIds: ['TSP'], beams: packed, quantumDb: QUANTUM_DB, nonFinite,
    result: { ...result, tsp: { ...result.tsp, curve: [] } },
  };
}
