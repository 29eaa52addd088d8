import type { Measurement, Quantity, TotalScanPattern } from '../types.js';
import { CATEGORICAL, colorMapLut, DIVERGING_LUT, lutIndex, type ColorMapName, type Rgb } from './colorMap.js';
import { classBoundaries, type MapRaster } from './mapRaster.js';
import { colorTable, paintMapPng } from './paintMap.js';
import { cachedRaster } from './rasterCache.js';
import { rememberUnitRaster } from './thumbnail.js';
import { isAtOrBetter } from '../quantity.js';
import { deltaScaleMaxDb, finiteRange, scaleT, valueScale, type ValueScale } from './valueScale.js';

/** Differences to the reference beyond ± this many dB are outlined on the difference map. */
export const DELTA_OUTLINE_DB = 1;

export const better = (q: Quantity, v: number, t: number): boolean => isAtOrBetter(q, v, t);

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


/** Per grid point: the colour-table entry of its value, or −1 when the value is not finite. */
function pointColors(values: ArrayLike<number>, entry: (v: number) => number): Int16Array {
  return mapPoints(new Int16Array(values.length), values, (v) => (Number.isFinite(v) ? entry(v) : -1));
}

/**
 * out[p] = f(values[p]) for every point: a loop, since TypedArray.from(values, f) takes V8's
 * generic iterator path (~0.1 µs an element, ~7 ms a map on a 64k-point grid; viewerPack.ts).
 */
function mapPoints<T extends Int16Array | Int32Array>(out: T, values: ArrayLike<number>, f: (v: number) => number): T {
  for (let p = 0; p < values.length; p++) out[p] = f(values[p]);
  return out;
}

/** Per pixel: the class of the grid point it shows, −1 where unmeasured or outside (for classBoundaries). */
function pixelClasses(point: Int32Array, classOf: ArrayLike<number>): Int32Array {
  const cls = new Int32Array(point.length);
  for (let k = 0; k < point.length; k++) {
    const p = point[k];
    cls[k] = p < 0 ? -1 : classOf[p];
  }
  return cls;
}

const BEAM_TABLE = colorTable(CATEGORICAL);

/**
 * Rasterize the unit's grid once (shared with other units on the same grid, cachedRaster) and
 * paint the TSP, best-beam and (optional) difference maps. Colours are chosen per grid point and
 * looked up per pixel. Cost: O(pixels) a map plus the PNG deflate.
 */
export function buildUnitMaps(
  m: Measurement,
  tsp: TotalScanPattern,
  opts: { widthPx: number; centerPhiDeg: number; colorMap: ColorMapName; threshold: number | null; delta?: Float64Array },
): UnitMaps {
  const raster = cachedRaster(m.grid, opts.widthPx, opts.centerPhiDeg);
  rememberUnitRaster(tsp, raster);
  const { point, width, height } = raster;
  const [lo, hi] = finiteRange(tsp.values);
  const scale = valueScale(lo, hi, m.quantity);
  const tspPng = paintMapPng(width, height, point, pointColors(tsp.values, (v) => lutIndex(scaleT(scale, v))), colorMapLut(opts.colorMap));
  const beamOf = mapPoints(new Int16Array(tsp.bestBeam.length), tsp.bestBeam, (b) => (b < 0 ? -1 : b % CATEGORICAL.length));
  const bestPng = paintMapPng(width, height, point, beamOf, BEAM_TABLE);
  const bestEdges = classBoundaries(pixelClasses(point, tsp.bestBeam), width, height);
  let contour: number[] | null = null;
  if (opts.threshold !== null) {
    const t = opts.threshold;
    const side = mapPoints(new Int32Array(tsp.values.length), tsp.values, (v) => (!Number.isFinite(v) ? -1 : better(m.quantity, v, t) ? 1 : 0));
    contour = classBoundaries(pixelClasses(point, side), width, height);
  }
  let deltaPng: Buffer | null = null;
  let deltaMaxDb = 0;
  let deltaEdges: number[] = [];
  const delta = opts.delta;
  if (delta && delta.length === m.grid.thetaDeg.length) {
    const dMax = deltaScaleMaxDb(delta);
    deltaMaxDb = dMax;
    deltaPng = paintMapPng(width, height, point, pointColors(delta, (d) => lutIndex(0.5 + d / (2 * dMax))), DIVERGING_LUT);
    // Outline where the units differ by more than the repeatability of an OTA measurement
    // (about ±1 dB, common practice); a zero-difference line would only trace the noise.
    const side = mapPoints(new Int32Array(delta.length), delta, (d) => (!Number.isFinite(d) ? -1 : d >= DELTA_OUTLINE_DB ? 2 : d <= -DELTA_OUTLINE_DB ? 0 : 1));
    deltaEdges = classBoundaries(pixelClasses(point, side), width, height);
  }
  return { raster, tspPng, scale, bestPng, bestEdges, contour, deltaPng, deltaMaxDb, deltaEdges };
}
