import type { Measurement, TotalScanPattern } from '../types.js';
import { rasterizeGrid, rasterValues } from './mapRaster.js';
import type { MapThumbnail } from './reportTypes.js';

/**
 * A small equal-area (Hammer) raster of a unit's total scan pattern as plain data, so a worker
 * thread can send it to the main thread for the build summary. Cost: O(widthPx²/2 · log n).
 * @example unitMapThumbnail(m, tsp).values.length // → 240 × 120
 */
export function unitMapThumbnail(measurement: Measurement, tsp: TotalScanPattern, widthPx = 240, centerPhiDeg = 0): MapThumbnail {
  const raster = rasterizeGrid(measurement.grid, widthPx, centerPhiDeg);
  return { width: raster.width, height: raster.height, centerPhiDeg, values: rasterValues(raster, tsp.values) };
}
