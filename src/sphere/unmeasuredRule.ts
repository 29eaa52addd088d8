/**
 * The unmeasured-region rule: which empty caps of a scattered scan are gaps in the
 * measurement rather than the scan's own spacing.
 *
 * Every Delaunay triangle t of the points has an empty circumcircle: a cap of radius Rₜ
 * around its circumcentre (a Voronoi vertex) that holds no sample. The local spacing of a
 * sample i is ℓᵢ = the second-smallest circumradius among the triangles that touch i (Eq. 1:
 * the smallest can be a sliver, and a sample on the edge of a gap has at most a few triangles
 * on its measured side). The spacing that bounds t is Lₜ = max ℓ over its three corners and
 * the far corners of its three edge neighbours (Eq. 2: six samples around the cap, so a
 * finer-sampled side cannot make a coarser neighbour's ordinary cap look empty).
 * A triangle is unmeasured when Rₜ > K_SEED·Lₜ (Eq. 3), or when it shares an edge with an
 * unmeasured triangle and Rₜ > K_GROW·Lₜ (Eq. 4, grown to a fixed point, so the rim of a gap
 * whose caps are only moderately larger than the spacing joins it).
 *
 * Why these numbers (measured, see test/sphere/unmeasuredRule.test.ts and the note of issue
 * 12): on full scans — density steps up to 5×, stitched grids, windows, jitter, 1,000–5,000
 * uniformly random directions over many seeds — the largest Rₜ/Lₜ seen is 3.5; on a square
 * grid every ratio is 1. On gaps the ratio is about the gap radius over 0.7 spacing: a cap cut
 * at θ = 150° of a 5° grid gives 10, a 30° φ wedge of a 2° grid 7. K_SEED = 4 sits between.
 * So an empty cap must be more than 4 × the local cap radius (≈ 2.8 steps on a square grid,
 * a missing block of about 5 × 5 samples) to be a gap; smaller holes are absorbed by the
 * neighbouring Voronoi cells. The rule only compares a cap with the samples around it, never
 * with a global figure, so density may vary freely across the sphere.
 * Cost O(T) for T triangles (≈ 2n).
 * @throws never.
 * @example gapTriangles(tri, radius, T, n, adjacency) // all false for a Fibonacci sphere
 */

/** Seed ratio Rₜ/Lₜ above which an empty cap is unmeasured (Eq. 3). */
export const K_SEED = 4;
/** Ratio above which a triangle next to an unmeasured one joins it (Eq. 4). */
export const K_GROW = 2;

/**
 * @param tri corners of each triangle, 3 per triangle.
 * @param radiusRad circumradius Rₜ of each triangle, rad.
 * @param across triangle sharing edge k (corners k, k+1) of triangle t at 3t + k, −1 if none.
 * @param n number of samples.
 */
export function gapTriangles(tri: Int32Array, radiusRad: Float64Array, across: Int32Array, n: number): Uint8Array {
  const T = radiusRad.length;
  // ℓᵢ: smallest and second-smallest circumradius among the triangles touching i (Eq. 1).
  const first = new Float64Array(n).fill(Infinity);
  const second = new Float64Array(n).fill(Infinity);
  for (let t = 0; t < T; t++) {
    const r = radiusRad[t];
    for (let k = 0; k < 3; k++) {
      const i = tri[3 * t + k];
      if (r < first[i]) { second[i] = first[i]; first[i] = r; } else if (r < second[i]) second[i] = r;
    }
  }
  const spacing = new Float64Array(n);
  for (let i = 0; i < n; i++) spacing[i] = Number.isFinite(second[i]) ? second[i] : first[i]; // Eq. 1
  const ratio = new Float64Array(T);
  for (let t = 0; t < T; t++) {
    let bound = 0;
    for (let k = 0; k < 3; k++) {
      bound = Math.max(bound, spacing[tri[3 * t + k]]);
      const u = across[3 * t + k];
      if (u < 0) continue;
      for (let j = 0; j < 3; j++) bound = Math.max(bound, spacing[tri[3 * u + j]]); // Eq. 2
    }
    ratio[t] = bound > 0 ? radiusRad[t] / bound : 0;
  }
  const gap = new Uint8Array(T);
  const stack: number[] = [];
  for (let t = 0; t < T; t++) if (ratio[t] > K_SEED) { gap[t] = 1; stack.push(t); } // Eq. 3
  while (stack.length > 0) {
    const t = stack.pop()!;
    for (let k = 0; k < 3; k++) {
      const u = across[3 * t + k];
      if (u >= 0 && !gap[u] && ratio[u] > K_GROW) { gap[u] = 1; stack.push(u); } // Eq. 4
    }
  }
  return gap;
}
