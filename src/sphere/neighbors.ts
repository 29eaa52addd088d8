import type { RegularLayout, SphereGrid } from '../types.js';
import { seamGap } from './regularLayout.js';
import { geoDelaunay } from './geoDelaunay.js';

/** Adjacency of the grid points in compressed sparse row form. */
export interface GridAdjacency {
  /** neighbors[offsets[i] .. offsets[i + 1]) are the neighbours of point i; length points + 1. */
  offsets: Int32Array;
  /** Neighbour indices, ascending within each point's slice; the relation is symmetric. */
  neighbors: Int32Array;
}

/**
 * Which grid points touch which: the neighbour graph used to grow connected regions
 * (coverage holes) on the sphere.
 *
 * Regular grids (4-connectivity, no diagonals): each point is joined to the previous and next
 * φ column of its θ row, circularly (so φ = 355° meets φ = 0°), except across the unmeasured φ
 * gap when the columns do not wrap (`seamGap`, the core's seam rule), and to the same φ column
 * of the rows above and below. A merged pole point is joined to every point of the adjacent
 * row. When the first (last) row is not a pole but its cells reach the pole (its θ is within
 * half a row step of it) and φ wraps, each point is also joined to the point opposite in φ,
 * because the two cells meet across the pole.
 * Scattered grids: the edges of the spherical Delaunay triangulation of the points, taken as
 * [longitude = φ, latitude = 90° − θ] (d3-geo-voronoi `geoDelaunay().edges`).
 *
 * Cost: O(n) for regular grids; O(n log n) for scattered grids (triangulation).
 * @throws never; a grid of one point has no neighbours.
 * @example gridNeighbors(grid).neighbors.subarray(offsets[0], offsets[1]) // first θ row for a pole at θ = 0
 */
export function gridNeighbors(grid: SphereGrid): GridAdjacency {
  const n = grid.thetaDeg.length;
  const edges: number[] = [];
  if (grid.regular) regularEdges(grid.regular, edges);
  else if (n >= 3) {
    const points = Array.from(grid.thetaDeg, (t, i): [number, number] => [grid.phiDeg[i], 90 - t]);
    for (const [a, b] of geoDelaunay(points).edges) edges.push(a, b);
  } else if (n === 2) edges.push(0, 1);
  return toCsr(n, edges);
}

function isPoleRow(layout: RegularLayout, r: number): boolean {
  return layout.rowLength[r] === 1 && (layout.thetaRowsDeg[r] === 0 || layout.thetaRowsDeg[r] === 180);
}

function regularEdges(layout: RegularLayout, edges: number[]): void {
  const rows = layout.thetaRowsDeg.length;
  const gap = layout.phiWraps ? -1 : seamGap(layout.phiColsDeg); // column c with no data between c and c + 1
  for (let r = 0; r < rows; r++) {
    const start = layout.rowStart[r];
    const len = layout.rowLength[r];
    // Along the row, circularly; the unmeasured φ gap (if any) is not crossed.
    if (len > 1) for (let c = 0; c < len; c++) if (c !== gap) edges.push(start + c, start + ((c + 1) % len));
    if (r + 1 < rows) joinRows(layout, r, r + 1, edges);
  }
  if (rows >= 2) {
    crossPole(layout, 0, 1, 0, edges);
    crossPole(layout, rows - 1, rows - 2, 180, edges);
  }
}

function joinRows(layout: RegularLayout, a: number, b: number, edges: number[]): void {
  const sa = layout.rowStart[a], la = layout.rowLength[a];
  const sb = layout.rowStart[b], lb = layout.rowLength[b];
  if (isPoleRow(layout, a) || isPoleRow(layout, b)) {
    // A pole is one direction: it touches every point of the ring next to it.
    const [pole, ring, ringLen] = isPoleRow(layout, a) ? [sa, sb, lb] : [sb, sa, la];
    for (let c = 0; c < ringLen; c++) edges.push(pole, ring + c);
    return;
  }
  for (let c = 0; c < Math.min(la, lb); c++) edges.push(sa + c, sb + c);
}

function crossPole(layout: RegularLayout, r: number, next: number, poleDeg: number, edges: number[]): void {
  if (isPoleRow(layout, r) || !layout.phiWraps) return;
  const len = layout.rowLength[r];
  const distToPole = Math.abs(layout.thetaRowsDeg[r] - poleDeg);
  const halfStep = Math.abs(layout.thetaRowsDeg[next] - layout.thetaRowsDeg[r]) / 2;
  if (len < 3 || distToPole > halfStep * (1 + 1e-9)) return;
  const start = layout.rowStart[r];
  // Opposite column across the pole: c + len/2 (both neighbours of that position when len is odd).
  for (let c = 0; c < len; c++) {
    const lo = (c + Math.floor(len / 2)) % len;
    const hi = (c + Math.ceil(len / 2)) % len;
    if (lo > c) edges.push(start + c, start + lo);
    if (hi > c && hi !== lo) edges.push(start + c, start + hi);
  }
}

/**
 * Symmetric, de-duplicated CSR from an undirected edge list (self-loops dropped). Each point's
 * slice is sorted in place (insertion sort: slices are short, except a pole's ring) and
 * compacted into one typed array: no per-point sort call, no growing list.
 */
function toCsr(n: number, edges: number[]): GridAdjacency {
  const degree = new Int32Array(n + 1);
  for (let e = 0; e < edges.length; e += 2) {
    if (edges[e] === edges[e + 1]) continue;
    degree[edges[e] + 1]++;
    degree[edges[e + 1] + 1]++;
  }
  for (let i = 0; i < n; i++) degree[i + 1] += degree[i];
  const fill = degree.slice(0, n);
  const raw = new Int32Array(degree[n]);
  for (let e = 0; e < edges.length; e += 2) {
    const a = edges[e], b = edges[e + 1];
    if (a === b) continue;
    raw[fill[a]++] = b;
    raw[fill[b]++] = a;
  }
  const offsets = new Int32Array(n + 1);
  let out = 0;
  for (let i = 0; i < n; i++) {
    const lo = degree[i], hi = degree[i + 1];
    if (hi - lo > 64) raw.subarray(lo, hi).sort();
    else {
      for (let k = lo + 1; k < hi; k++) {
        const x = raw[k];
        let j = k - 1;
        while (j >= lo && raw[j] > x) { raw[j + 1] = raw[j]; j--; }
        raw[j + 1] = x;
      }
    }
    // Compact in place: out ≤ k always, so each entry is read before anything overwrites it;
    // the previous entry is kept in a local (its slot may already hold a compacted value).
    let last = -1;
    for (let k = lo; k < hi; k++) {
      const x = raw[k];
      if (x !== last) raw[out++] = x;
      last = x;
    }
    offsets[i + 1] = out;
  }
  return { offsets, neighbors: raw.slice(0, out) };
}
