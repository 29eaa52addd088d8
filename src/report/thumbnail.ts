import type { Measurement, TotalScanPattern } from '../types.js';
import { rasterizeGrid, rasterValues, type MapRaster } from './mapRaster.js';
import { downsampleRaster } from './rasterCache.js';
import type { MapThumbnail } from './reportTypes.js';

/** The map raster a unit report drew for a total scan pattern (set by buildUnitMaps). */
const unitRasters = new WeakMap<TotalScanPattern, MapRaster>();
/** Thumbnail rasters sampled from a (shared, per-grid) unit raster, by width. */
const sampled = new WeakMap<MapRaster, Map<number, MapRaster>>();

/** Remember the raster of a unit's maps so its thumbnail is sampled from it, not projected again. */
export function rememberUnitRaster(tsp: TotalScanPattern, raster: MapRaster): void {
  unitRasters.set(tsp, raster);
}

/**
 * A small equal-area (Hammer) raster of a unit's total scan pattern as plain data, so a worker
 * thread can send it to the main thread for the build summary. When this unit's report already
 * rasterized its maps (same centre, at least as wide), the thumbnail is sampled from that raster
 * (downsampleRaster), so the map is rasterized once per unit; otherwise it is projected here.
 * Which of the two happens depends only on this unit's own report, never on other units.
 * Cost: O(widthPx²/2) when sampled, O(widthPx²/2 · log n) when projected.
 * @example unitMapThumbnail(m, tsp).values.length // → 240 × 120
 */
export function unitMapThumbnail(measurement: Measurement, tsp: TotalScanPattern, widthPx = 240, centerPhiDeg = 0): MapThumbnail {
  const src = unitRasters.get(tsp);
  let raster: MapRaster;
  if (src && src.centerPhiDeg === centerPhiDeg && src.width >= widthPx) {
    let byWidth = sampled.get(src);
    if (!byWidth) sampled.set(src, (byWidth = new Map()));
    raster = byWidth.get(widthPx) ?? downsampleRaster(src, widthPx);
    byWidth.set(widthPx, raster);
  } else {
    raster = rasterizeGrid(measurement.grid, widthPx, centerPhiDeg);
  }
  return { width: raster.width, height: raster.height, centerPhiDeg, values: rasterValues(raster, tsp.values) };
}
