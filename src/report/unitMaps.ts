import type { Measurement, Quantity, TotalScanPattern } from '../types.js';
import { CATEGORICAL, colorAt, divergingAt, type ColorMapName, type Rgb } from './colorMap.js';
import { niceRange } from './format.js';
import { classBoundaries, rasterizeGrid, type MapRaster } from './mapRaster.js';
import { paintPng } from './paintMap.js';

/** A value → colour scale with best at t = 1 (top of the bar) for every quantity. */
/** Differences to the reference beyond ± this many dB are outlined on the difference map. */
export const DELTA_OUTLINE_DB = 1;

export interface ValueScale {
  lo: number;
  hi: number;
  step: number;
  ticks: number[];
  invert: boolean;
}

export function valueScale(lo: number, hi: number, q: Quantity): ValueScale {
  const r = niceRange(lo, hi, 6);
  return { lo: r.lo, hi: r.hi, step: r.step, ticks: r.ticks, invert: q === 'eis' };
}

/** Position on the colour bar, 0 … 1, of a value (best at 1). */
export function scaleT(s: ValueScale, v: number): number {
  const t = (v - s.lo) / (s.hi - s.lo);
  return s.invert ? 1 - t : t;
}

export const better = (q: Quantity, v: number, t: number): boolean => (q === 'eis' ? v <= t : v >= t);

/** Everything drawn on a unit's maps, rasterized once. */
export interface UnitMaps {
  raster: MapRaster;
  tspPng: Buffer;
  scale: ValueScale;
  bestPng: Buffer;
  bestEdges: number[];
  contour: number[] | null;
  deltaPng: Buffer | null;
  deltaMaxDb: number;
  deltaEdges: number[];
}

export const beamColor = (b: number): Rgb => CATEGORICAL[b % CATEGORICAL.length];

function finiteRange(values: ArrayLike<number>): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (Number.isFinite(v)) {
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
  }
  return Number.isFinite(lo) ? [lo, hi] : [0, 1];
}

/** Rasterize the unit's grid once and paint the TSP, best-beam and (optional) difference maps. */
export function buildUnitMaps(
  m: Measurement,
  tsp: TotalScanPattern,
  opts: { widthPx: number; centerPhiDeg: number; colorMap: ColorMapName; threshold: number | null; delta?: Float64Array },
): UnitMaps {
  const raster = rasterizeGrid(m.grid, opts.widthPx, opts.centerPhiDeg);
  const { point, width, height } = raster;
  const outside = (k: number) => point[k] === -2;
  const [lo, hi] = finiteRange(tsp.values);
  const scale = valueScale(lo, hi, m.quantity);
  const tspPng = paintPng(width, height, (k) => {
    const p = point[k];
    if (p < 0 || !Number.isFinite(tsp.values[p])) return null;
    return colorAt(opts.colorMap, scaleT(scale, tsp.values[p]));
  }, outside);
  const bestPng = paintPng(width, height, (k) => (point[k] < 0 || tsp.bestBeam[point[k]] < 0 ? null : beamColor(tsp.bestBeam[point[k]])), outside);
  const bestCls = new Int32Array(point.length);
  for (let k = 0; k < point.length; k++) bestCls[k] = point[k] < 0 ? -1 : tsp.bestBeam[point[k]];
  const bestEdges = classBoundaries(bestCls, width, height);
  let contour: number[] | null = null;
  if (opts.threshold !== null) {
    const cls = new Int32Array(point.length);
    const t = opts.threshold;
    for (let k = 0; k < point.length; k++) {
      const p = point[k];
      cls[k] = p < 0 || !Number.isFinite(tsp.values[p]) ? -1 : better(m.quantity, tsp.values[p], t) ? 1 : 0;
    }
    contour = classBoundaries(cls, width, height);
  }
  let deltaPng: Buffer | null = null;
  let deltaMaxDb = 0;
  let deltaEdges: number[] = [];
  const delta = opts.delta;
  if (delta && delta.length === m.grid.thetaDeg.length) {
    const [dlo, dhi] = finiteRange(delta);
    deltaMaxDb = niceRange(0, Math.max(Math.abs(dlo), Math.abs(dhi), 0.5), 4).hi;
    deltaPng = paintPng(width, height, (k) => {
      const p = point[k];
      return p < 0 || !Number.isFinite(delta[p]) ? null : divergingAt(0.5 + delta[p] / (2 * deltaMaxDb));
    }, outside);
    const cls = new Int32Array(point.length);
    // Outline where the units differ by more than the repeatability of an OTA measurement
    // (about ±1 dB, common practice); a zero-difference line would only trace the noise.
    for (let k = 0; k < point.length; k++) {
      const d = point[k] < 0 ? NaN : delta[point[k]];
      cls[k] = !Number.isFinite(d) ? -1 : d >= DELTA_OUTLINE_DB ? 2 : d <= -DELTA_OUTLINE_DB ? 0 : 1;
    }
    deltaEdges = classBoundaries(cls, width, height);
  }
  return { raster, tspPng, scale, bestPng, bestEdges, contour, deltaPng, deltaMaxDb, deltaEdges };
}
