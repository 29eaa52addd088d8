import type { SphereGrid } from '../types.js';
import { HAMMER_HALF_HEIGHT, HAMMER_HALF_WIDTH } from './hammerProjection.js';
import { nearestGridPoint } from './nearestGridPoint.js';

/** Pixel classes in MapRaster.point besides grid point indices. */
export const OUTSIDE = -2;
export const UNMEASURED = -1;

/**
 * Which grid point each pixel of an equal-area (Hammer) map shows. Computed once per unit and
 * reused by every map of that unit (values, best beam, reference difference).
 */
export interface MapRaster {
  width: number;
  height: number;
  centerPhiDeg: number;
  /** Per pixel (row-major, top row first): grid point index, UNMEASURED or OUTSIDE. */
  point: Int32Array;
}

/** Map units of the centre of pixel (i, j); y up. */
export function pixelToMap(i: number, j: number, width: number, height: number): [number, number] {
  return [((i + 0.5) / width) * 2 * HAMMER_HALF_WIDTH - HAMMER_HALF_WIDTH, HAMMER_HALF_HEIGHT - ((j + 0.5) / height) * 2 * HAMMER_HALF_HEIGHT];
}

/**
 * Rasterize a grid by inverse projection of every pixel centre and a cell lookup (no scan over
 * points per pixel). Cost: O(width·height·log n) for regular grids, about O(width·height) for
 * scattered ones. height = width / 2 (the ellipse is 2:1).
 */
export function rasterizeGrid(grid: SphereGrid, width: number, centerPhiDeg = 0): MapRaster {
  const height = Math.round(width / 2);
  const lookup = nearestGridPoint(grid);
  const point = new Int32Array(width * height);
  const DEG = 180 / Math.PI;
  for (let j = 0; j < height; j++) {
    const y = HAMMER_HALF_HEIGHT - ((j + 0.5) / height) * 2 * HAMMER_HALF_HEIGHT;
    for (let i = 0; i < width; i++) {
      const x = ((i + 0.5) / width) * 2 * HAMMER_HALF_WIDTH - HAMMER_HALF_WIDTH;
      if ((x * x) / 8 + (y * y) / 2 > 1) {
        point[j * width + i] = OUTSIDE;
        continue;
      }
      // hammerInverse inlined (Eq. H2) to avoid an allocation per pixel.
      const z = Math.sqrt(Math.max(0, 1 - (x / 4) ** 2 - (y / 2) ** 2));
      const lonDeg = 2 * Math.atan2(z * x, 2 * (2 * z * z - 1)) * DEG;
      const latDeg = Math.asin(Math.max(-1, Math.min(1, z * y))) * DEG;
      let phiDeg = (lonDeg + centerPhiDeg) % 360;
      if (phiDeg < 0) phiDeg += 360;
      point[j * width + i] = lookup(90 - latDeg, phiDeg);
    }
  }
  return { width, height, centerPhiDeg, point };
}

/** Per-pixel values (NaN where unmeasured or outside the map), e.g. for thumbnails. */
export function rasterValues(raster: MapRaster, values: ArrayLike<number>): Float32Array {
  const out = new Float32Array(raster.point.length);
  for (let k = 0; k < out.length; k++) {
    const p = raster.point[k];
    out[k] = p >= 0 && Number.isFinite(values[p]) ? values[p] : NaN;
  }
  return out;
}

/** True when pixel (i, j) lies inside the map ellipse. */
export function insideEllipse(i: number, j: number, width: number, height: number): boolean {
  const [x, y] = pixelToMap(i, j, width, height);
  return (x * x) / 8 + (y * y) / 2 <= 1;
}

/**
 * Region boundaries of a pixel classification as merged axis-parallel runs, in pixel units:
 * [x1, y1, x2, y2, ...]. An edge is drawn between two neighbouring pixels whose classes are both
 * ≥ 0 and differ (unmeasured and outside pixels get no contour; they are shown by hatching and the
 * ellipse outline). Cost: O(width·height).
 */
export function classBoundaries(cls: Int32Array, width: number, height: number): number[] {
  const seg: number[] = [];
  const differs = (a: number, b: number) => a >= 0 && b >= 0 && a !== b;
  for (let j = 0; j + 1 < height; j++) {
    let start = -1;
    for (let i = 0; i <= width; i++) {
      const on = i < width && differs(cls[j * width + i], cls[(j + 1) * width + i]);
      if (on && start < 0) start = i;
      if (!on && start >= 0) {
        seg.push(start, j + 1, i, j + 1);
        start = -1;
      }
    }
  }
  for (let i = 0; i + 1 < width; i++) {
    let start = -1;
    for (let j = 0; j <= height; j++) {
      const on = j < height && differs(cls[j * width + i], cls[j * width + i + 1]);
      if (on && start < 0) start = j;
      if (!on && start >= 0) {
        seg.push(i + 1, start, i + 1, j);
        start = -1;
      }
    }
  }
  return seg;
}
