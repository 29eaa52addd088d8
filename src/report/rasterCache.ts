import { createHash } from 'node:crypto';
import type { SphereGrid } from '../types.js';
import { insideEllipse, OUTSIDE, rasterizeGrid, UNMEASURED, type MapRaster } from './mapRaster.js';

/**
 * Content key of a grid: SHA-1 of its θ, φ and weight arrays (bytes) and its kind. Two units
 * measured on the same grid share the key, whatever objects hold the arrays.
 * Cost: O(points) (about 1 ms per 40,000 points).
 */
export function gridFingerprint(grid: SphereGrid): string {
  const h = createHash('sha1');
  for (const a of [grid.thetaDeg, grid.phiDeg, grid.weightSr]) {
    h.update(new Uint8Array(a.buffer, a.byteOffset, a.byteLength));
    h.update('|');
  }
  h.update(grid.regular ? 'regular' : 'scattered');
  return h.digest('hex');
}

/** Rasters kept per thread, most recently used last (each 4 bytes a pixel: 1.3 MB at 800 px). */
const KEEP = 4;
const recent: { key: string; raster: MapRaster }[] = [];

/**
 * rasterizeGrid with a small per-thread memory: a build measured on one grid (the usual case)
 * rasterizes it once per thread instead of once per unit. rasterizeGrid is a pure function of
 * the grid's content, the width and the centre, so a remembered raster is the one a fresh call
 * would give. The returned raster is shared: read it, never write it.
 * Cost: O(points) for the key, plus rasterizeGrid on a miss.
 */
export function cachedRaster(grid: SphereGrid, widthPx: number, centerPhiDeg: number): MapRaster {
  const key = `${gridFingerprint(grid)}|${widthPx}|${centerPhiDeg}`;
  const k = recent.findIndex((e) => e.key === key);
  if (k >= 0) {
    const [hit] = recent.splice(k, 1);
    recent.push(hit);
    return hit.raster;
  }
  const raster = rasterizeGrid(grid, widthPx, centerPhiDeg);
  recent.push({ key, raster });
  if (recent.length > KEEP) recent.shift();
  return raster;
}

/**
 * A smaller raster of the same map, sampled from a larger one instead of projecting again: each
 * target pixel takes the source pixel under its centre. Pixels outside the target's own ellipse
 * are OUTSIDE; at the rim, where the source pixel under an inside centre lies just outside the
 * source ellipse, the nearest source pixel one or two steps toward the map centre is used.
 * Differs from rasterizeGrid at the target width only where a cell boundary passes within half
 * a source pixel of a target pixel centre.
 * Cost: O(target pixels).
 * @throws RangeError when the target is wider than the source.
 */
export function downsampleRaster(src: MapRaster, widthPx: number): MapRaster {
  if (widthPx > src.width) throw new RangeError(`downsampleRaster: target width ${widthPx} exceeds the source width ${src.width}`);
  const height = Math.round(widthPx / 2);
  const point = new Int32Array(widthPx * height);
  const sx = src.width / widthPx;
  const sy = src.height / height;
  const at = (i: number, j: number) => src.point[Math.min(src.height - 1, Math.max(0, j)) * src.width + Math.min(src.width - 1, Math.max(0, i))];
  for (let j = 0; j < height; j++) {
    const sj = Math.floor((j + 0.5) * sy);
    const dj = sj < src.height / 2 ? 1 : -1;
    for (let i = 0; i < widthPx; i++) {
      if (!insideEllipse(i, j, widthPx, height)) {
        point[j * widthPx + i] = OUTSIDE;
        continue;
      }
      const si = Math.floor((i + 0.5) * sx);
      const di = si < src.width / 2 ? 1 : -1;
      let p = at(si, sj);
      for (let step = 1; p === OUTSIDE && step <= 2; step++) {
        p = at(si + step * di, sj);
        if (p === OUTSIDE) p = at(si, sj + step * dj);
        if (p === OUTSIDE) p = at(si + step * di, sj + step * dj);
      }
      point[j * widthPx + i] = p === OUTSIDE ? UNMEASURED : p;
    }
  }
  return { width: widthPx, height, centerPhiDeg: src.centerPhiDeg, point };
}
