import { lazyPackage } from '../lazyPackage.js';

/** What spherecov reads of d3-geo-voronoi's spherical Delaunay triangulation (the package ships no types). */
export interface GeoDelaunay {
  triangles: [number, number, number][];
  centers: [number, number][];
  polygons: (number[] | undefined)[];
  edges: [number, number][];
}

/**
 * d3-geo-voronoi, loaded on the first scattered grid (src/lazyPackage.ts): regular grids, the
 * common case, never need it, and it is the largest module tree spherecov loads.
 */
export const d3GeoVoronoi = lazyPackage<{ geoDelaunay: (points: [number, number][]) => GeoDelaunay }>('d3-geo-voronoi');

/**
 * The spherical Delaunay triangulation of [longitude, latitude] points in degrees
 * (d3-geo-voronoi `geoDelaunay`). Cost O(n log n).
 * @example geoDelaunay([[0, 0], [90, 0], [0, 90], [180, 0]]).triangles.length // 4
 */
export function geoDelaunay(points: [number, number][]): GeoDelaunay {
  return d3GeoVoronoi().geoDelaunay(points);
}
