// @ts-ignore -- d3-geo-voronoi ships no type declarations; the one call used is typed below.
import { geoDelaunay as untypedGeoDelaunay } from 'd3-geo-voronoi';
import { clippedCellArea } from './clippedCellArea.js';

const geoDelaunay = untypedGeoDelaunay as (points: [number, number][]) => {
  centers: [number, number][];
  polygons: (number[] | undefined)[];
  neighbors: (number[] | undefined)[];
};

const RAD = Math.PI / 180;

export interface VoronoiWeights {
  weightSr: Float64Array;
  /** Cells limited by the clip cap (next to an unmeasured region). */
  clipped: number;
}

/**
 * Solid angle of each point's spherical Voronoi cell (the directions closer to it than to any
 * other point), sr — the weighting TS 38.521-2 Annex M.4.3 names for constant-density grids.
 *
 * Cells come from d3-geo-voronoi `geoDelaunay` (Voronoi vertices = circumcentres of the
 * spherical Delaunay triangles); each area is summed exactly from the fan of triangles
 * (generator, vᵢ, vᵢ₊₁) (Van Oosterom–Strackee).
 * Clip rule for partial spheres: a cell is limited to the cap of radius Rᵢ = max(dᵢ, d̃)
 * around its point, dᵢ its nearest-neighbour distance and d̃ the median of all dᵢ (Eq. 1).
 * Cells of a well-spread set lie well inside that cap (a hexagonal cell reaches ≈ 0.58·d), so
 * only cells bordering an unmeasured region are clipped: they reach about one point spacing
 * into it instead of swallowing it.
 * Cost O(n log n); measured ≈ 60 ms for 2,522 points and ≈ 150 ms for 10,226 points.
 * @throws RangeError for fewer than 4 points or a degenerate set (all on one great circle).
 * @example voronoiWeights(fibonacciTheta, fibonacciPhi) // Σ = 4π to ~1e-15
 */
export function voronoiWeights(thetaDeg: Float64Array, phiDeg: Float64Array): VoronoiWeights {
  const n = thetaDeg.length;
  if (n < 4) throw new RangeError(`voronoiWeights: need at least 4 distinct directions, got ${n}`);
  const lonLat: [number, number][] = new Array(n);
  const xyz = new Float64Array(3 * n);
  for (let i = 0; i < n; i++) {
    lonLat[i] = [phiDeg[i] > 180 ? phiDeg[i] - 360 : phiDeg[i], 90 - thetaDeg[i]];
    const t = thetaDeg[i] * RAD, p = phiDeg[i] * RAD, s = Math.sin(t);
    xyz[3 * i] = s * Math.cos(p); xyz[3 * i + 1] = s * Math.sin(p); xyz[3 * i + 2] = Math.cos(t);
  }
  const d = geoDelaunay(lonLat);
  const centers = new Float64Array(3 * d.centers.length);
  for (let c = 0; c < d.centers.length; c++) {
    const lon = d.centers[c][0] * RAD, lat = d.centers[c][1] * RAD, cl = Math.cos(lat);
    centers[3 * c] = cl * Math.cos(lon); centers[3 * c + 1] = cl * Math.sin(lon); centers[3 * c + 2] = Math.sin(lat);
  }
  const nearest = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let best = Math.PI;
    for (const j of d.neighbors[i] ?? []) {
      const dot = xyz[3 * i] * xyz[3 * j] + xyz[3 * i + 1] * xyz[3 * j + 1] + xyz[3 * i + 2] * xyz[3 * j + 2];
      best = Math.min(best, Math.acos(Math.min(1, Math.max(-1, dot))));
    }
    nearest[i] = best;
  }
  const sorted = Float64Array.from(nearest).sort();
  const median = sorted[n >> 1];
  const weightSr = new Float64Array(n);
  let verts = new Float64Array(3 * 16);
  let clipped = 0;
  for (let i = 0; i < n; i++) {
    const poly = d.polygons[i];
    if (!poly || poly.length < 3) throw new RangeError(`voronoiWeights: no Voronoi cell for direction ${i} (degenerate point set)`);
    if (verts.length < 3 * poly.length) verts = new Float64Array(3 * poly.length);
    const radius = Math.max(nearest[i], median); // Eq. 1
    const cosR = Math.cos(radius);
    let outside = false;
    for (let k = 0; k < poly.length; k++) {
      const c = poly[k];
      verts[3 * k] = centers[3 * c]; verts[3 * k + 1] = centers[3 * c + 1]; verts[3 * k + 2] = centers[3 * c + 2];
      const dot = verts[3 * k] * xyz[3 * i] + verts[3 * k + 1] * xyz[3 * i + 1] + verts[3 * k + 2] * xyz[3 * i + 2];
      if (dot < cosR) outside = true;
    }
    const g = xyz.subarray(3 * i, 3 * i + 3);
    weightSr[i] = clippedCellArea(g, verts, poly.length, outside ? radius : Math.PI);
    if (outside) clipped++;
    if (!(weightSr[i] > 0) || !Number.isFinite(weightSr[i])) {
      throw new RangeError(`voronoiWeights: cell ${i} has no area (degenerate point set)`);
    }
  }
  return { weightSr, clipped };
}
