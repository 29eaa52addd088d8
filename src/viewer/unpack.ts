/**
 * Unpack viewer.html's arrays (the inverse of src/report/viewerPack.ts) with the platform's own
 * DecompressionStream (browsers and Node ≥ 18): no library, no network.
 */
import type { Measurement, SphereGrid } from '../types.js';
import type { PackedArray, PackedGrid, ViewerUnit } from './viewerData.js';
import { dequantizeDb } from './quantize.js';

function base64Bytes(b64: string): Uint8Array {
  const bin = atob(b64);
  const out = new Uint8Array(bin.length);
  for (let i = 0; i < bin.length; i++) out[i] = bin.charCodeAt(i);
  return out;
}

async function inflate(bytes: Uint8Array): Promise<ArrayBuffer> {
  const stream = new Blob([bytes as BlobPart]).stream().pipeThrough(new DecompressionStream('deflate-raw'));
  return new Response(stream).arrayBuffer();
}

export async function unpackArray(p: PackedArray): Promise<Float64Array | Int32Array | Uint16Array> {
  let buf = await inflate(base64Bytes(p.b64));
  if (p.planes) {
    const size = p.type === 'f64' ? 8 : p.type === 'i32' ? 4 : 2;
    const src = new Uint8Array(buf), dst = new Uint8Array(src.length), n = src.length / size;
    for (let i = 0; i < n; i++) for (let k = 0; k < size; k++) dst[i * size + k] = src[k * n + i];
    buf = dst.buffer;
  }
  const arr = p.type === 'f64' ? new Float64Array(buf) : p.type === 'i32' ? new Int32Array(buf) : new Uint16Array(buf);
  if (arr.length !== p.length) throw new Error(`viewer data: expected ${p.length} numbers, found ${arr.length}`);
  return arr;
}

export async function unpackGrid(g: PackedGrid): Promise<SphereGrid> {
  const f64 = async (p: PackedArray) => (await unpackArray(p)) as Float64Array;
  const i32 = async (p: PackedArray) => (await unpackArray(p)) as Int32Array;
  return {
    kind: g.kind,
    solidAngleSr: g.solidAngleSr,
    thetaDeg: await f64(g.thetaDeg),
    phiDeg: await f64(g.phiDeg),
    weightSr: await f64(g.weightSr),
    regular: g.regular
      ? {
        thetaRowsDeg: await f64(g.regular.thetaRowsDeg),
        phiColsDeg: await f64(g.regular.phiColsDeg),
        rowStart: await i32(g.regular.rowStart),
        rowLength: await i32(g.regular.rowLength),
        phiWraps: g.regular.phiWraps,
      }
      : null,
  };
}

/** Beam values in dB, one Float64Array per beam (delta coding and quantisation undone). */
export async function unpackBeams(u: ViewerUnit, points: number): Promise<Float64Array[]> {
  const raw = await unpackArray(u.beams);
  const zz = u.beams.zigzag === true;
  const run = u.beams.delta?.runLength ?? points;
  const beams: Float64Array[] = [];
  for (let b = 0; b < u.beamIds.length; b++) {
    const out = new Float64Array(points);
    let acc = 0;
    for (let i = 0; i < points; i++) {
      const d = raw[b * run + i];
      acc += zz ? (d & 1 ? -(d + 1) / 2 : d / 2) : d;
      out[i] = dequantizeDb(acc);
    }
    beams.push(out);
  }
  for (const nf of u.nonFinite) {
    beams[Math.floor(nf.index / run)][nf.index % run] = nf.value === 'nan' ? NaN : nf.value === 'inf' ? Infinity : -Infinity;
  }
  return beams;
}

/** A Measurement for the tool's own functions (computeMetrics etc.), from a viewer entry. */
export async function unpackMeasurement(u: ViewerUnit): Promise<Measurement> {
  const grid = await unpackGrid(u.grid);
  const values = await unpackBeams(u, grid.thetaDeg.length);
  return {
    unit: u.unit,
    frequencyHz: u.frequencyHz,
    quantity: u.quantity,
    valueUnit: u.valueUnit,
    grid,
    beams: u.beamIds.map((id, k) => ({ id, values: values[k] })),
    sources: [],
    warnings: [],
    metadata: {},
  };
}
