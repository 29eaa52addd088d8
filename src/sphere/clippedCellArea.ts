import { sphericalTriangleArea } from './sphericalTriangleArea.js';

/**
 * Solid angle of a convex spherical polygon (a Voronoi cell) intersected with the cap of
 * angular radius R around its generator g, sr.
 *
 * The cell is a fan of triangles (g, vᵢ, vᵢ₊₁). Each edge vᵢ→vᵢ₊₁ is cut where it crosses the
 * cap's circle (x·g = cos R, solved on the arc x(t) = vᵢ cos t + u sin t as
 * √(a²+b²)·cos(t − δ) = cos R); pieces inside the cap add their exact triangle area (Eq. 1,
 * Van Oosterom–Strackee), pieces outside add the cap sector Δα·(1 − cos R) (Eq. 2), with Δα
 * the azimuth the piece spans around g. The result is exact (to rounding) for any R < π/2.
 * Returns |Σ|, so the vertex orientation does not matter.
 * Cost O(k) for a k-gon, no allocation.
 * @throws never.
 * @example clippedCellArea(g, verts, k, Math.PI) // R ≥ every vertex distance → the plain cell area
 */
export function clippedCellArea(
  g: ArrayLike<number>,
  verts: ArrayLike<number>,
  k: number,
  radiusRad: number,
): number {
  const gx = g[0], gy = g[1], gz = g[2];
  const cosR = Math.cos(radiusRad);
  const sector = 1 - cosR;
  // Tangent basis at g with e1 × e2 = g, so azimuth grows counter-clockwise about g.
  let e1x = -gy, e1y = gx, e1z = 0;
  if (Math.abs(gz) > 0.9) { e1x = 0; e1y = -gz; e1z = gy; }
  const e1n = Math.hypot(e1x, e1y, e1z);
  e1x /= e1n; e1y /= e1n; e1z /= e1n;
  const e2x = gy * e1z - gz * e1y, e2y = gz * e1x - gx * e1z, e2z = gx * e1y - gy * e1x;
  const azimuth = (x: number, y: number, z: number): number =>
    Math.atan2(x * e2x + y * e2y + z * e2z, x * e1x + y * e1y + z * e1z);
  const wrap = (d: number): number => (d > Math.PI ? d - 2 * Math.PI : d <= -Math.PI ? d + 2 * Math.PI : d);

  let total = 0;
  for (let i = 0; i < k; i++) {
    const j = (i + 1) % k;
    const ax = verts[3 * i], ay = verts[3 * i + 1], az = verts[3 * i + 2];
    const bx = verts[3 * j], by = verts[3 * j + 1], bz = verts[3 * j + 2];
    const dotAB = Math.min(1, Math.max(-1, ax * bx + ay * by + az * bz));
    const len = Math.acos(dotAB);
    if (len === 0) continue;
    // u: unit tangent at a towards b on the great circle.
    let ux = bx - dotAB * ax, uy = by - dotAB * ay, uz = bz - dotAB * az;
    const un = Math.hypot(ux, uy, uz);
    ux /= un; uy /= un; uz /= un;
    const pa = ax * gx + ay * gy + az * gz;
    const pb = ux * gx + uy * gy + uz * gz;
    const amp = Math.hypot(pa, pb);
    const delta = Math.atan2(pb, pa);
    // Cut parameters in (0, len), ascending; at most two.
    let t1 = -1, t2 = -1;
    if (amp > Math.abs(cosR)) {
      const h = Math.acos(cosR / amp);
      let c1 = delta - h, c2 = delta + h;
      while (c1 < 0) c1 += 2 * Math.PI;
      while (c2 < 0) c2 += 2 * Math.PI;
      c1 %= 2 * Math.PI; c2 %= 2 * Math.PI;
      if (c1 > c2) { const s = c1; c1 = c2; c2 = s; }
      if (c1 > 0 && c1 < len) t1 = c1;
      if (c2 > 0 && c2 < len) { if (t1 < 0) t1 = c2; else t2 = c2; }
    }
    let s0 = 0;
    for (let piece = 0; piece < 3; piece++) {
      const s1 = piece === 0 ? (t1 >= 0 ? t1 : len) : piece === 1 ? (t2 >= 0 ? t2 : len) : len;
      if (s1 > s0) {
        const cs0 = Math.cos(s0), sn0 = Math.sin(s0), cs1 = Math.cos(s1), sn1 = Math.sin(s1);
        const px = ax * cs0 + ux * sn0, py = ay * cs0 + uy * sn0, pz = az * cs0 + uz * sn0;
        const qx = ax * cs1 + ux * sn1, qy = ay * cs1 + uy * sn1, qz = az * cs1 + uz * sn1;
        const mid = (s0 + s1) / 2;
        const inside = pa * Math.cos(mid) + pb * Math.sin(mid) >= cosR;
        total += inside
          ? sphericalTriangleArea(gx, gy, gz, px, py, pz, qx, qy, qz) // Eq. 1
          : wrap(azimuth(qx, qy, qz) - azimuth(px, py, pz)) * sector; // Eq. 2
      }
      s0 = Math.max(s0, s1);
      if (s0 >= len) break;
    }
  }
  return Math.abs(total);
}
