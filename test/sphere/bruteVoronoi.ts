/**
 * A second, independent spherical Voronoi implementation for cross-checks (tests only).
 *
 * The cell of point g is the intersection of the hemispheres {x : x·(g − q) ≥ 0} over the other
 * points q. In the gnomonic projection onto the tangent plane at g (x ↦ (x·e₁, x·e₂)/(x·g)),
 * great circles are straight lines, so each hemisphere is a half-plane
 * (1 − g·q) − u·(e₁·q) − v·(e₂·q) ≥ 0 and the cell is a convex polygon (Sutherland–Hodgman
 * clipping of a large square). The vertices go back to the sphere and the area is the fan of
 * spherical triangles (g, vₖ, vₖ₊₁) by l'Huilier's theorem — a different triangle-area formula
 * from the production code's Van Oosterom–Strackee. Points are tried nearest first; clipping
 * stops once the next point is farther than twice the cell's farthest vertex (no farther point
 * can cut the cell). Valid for cells within 80° of their point. O(n²) — tests only.
 */
type V3 = [number, number, number];

const RAD = Math.PI / 180;

export function bruteVoronoiAreas(thetaDeg: ArrayLike<number>, phiDeg: ArrayLike<number>): Float64Array {
  const n = thetaDeg.length;
  const pts: V3[] = [];
  for (let i = 0; i < n; i++) {
    const t = thetaDeg[i] * RAD, p = phiDeg[i] * RAD;
    pts.push([Math.sin(t) * Math.cos(p), Math.sin(t) * Math.sin(p), Math.cos(t)]);
  }
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const g = pts[i];
    let e1: V3 = Math.abs(g[2]) < 0.9 ? [-g[1], g[0], 0] : [0, -g[2], g[1]];
    const l = Math.hypot(...e1);
    e1 = [e1[0] / l, e1[1] / l, e1[2] / l];
    const e2: V3 = [g[1] * e1[2] - g[2] * e1[1], g[2] * e1[0] - g[0] * e1[2], g[0] * e1[1] - g[1] * e1[0]];
    const big = Math.tan(80 * RAD);
    let poly: [number, number][] = [[-big, -big], [big, -big], [big, big], [-big, big]];
    const order = Array.from({ length: n }, (_, j) => j).filter((j) => j !== i);
    const dist = order.map((j) => Math.acos(Math.max(-1, Math.min(1, dot(g, pts[j])))));
    const idx = order.map((_, k) => k).sort((a, b) => dist[a] - dist[b]);
    for (const k of idx) {
      const reach = Math.max(...poly.map(([u, v]) => Math.atan(Math.hypot(u, v))));
      if (dist[k] > 2 * reach + 1e-9) break;
      const q = pts[order[k]];
      const a = 1 - dot(g, q), bu = dot(e1, q), bv = dot(e2, q);
      poly = clip(poly, (u, v) => a - u * bu - v * bv);
    }
    const verts = poly.map(([u, v]): V3 => {
      const x: V3 = [g[0] + u * e1[0] + v * e2[0], g[1] + u * e1[1] + v * e2[1], g[2] + u * e1[2] + v * e2[2]];
      const m = Math.hypot(...x);
      return [x[0] / m, x[1] / m, x[2] / m];
    });
    let area = 0;
    for (let k = 0; k < verts.length; k++) area += lhuilier(g, verts[k], verts[(k + 1) % verts.length]);
    out[i] = area;
  }
  return out;
}

function dot(a: V3, b: V3): number {
  return a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
}

/** Sutherland–Hodgman: keep the part of a convex polygon where f ≥ 0 (f affine). */
function clip(poly: [number, number][], f: (u: number, v: number) => number): [number, number][] {
  const out: [number, number][] = [];
  for (let k = 0; k < poly.length; k++) {
    const p = poly[k], q = poly[(k + 1) % poly.length];
    const fp = f(p[0], p[1]), fq = f(q[0], q[1]);
    if (fp >= 0) out.push(p);
    if ((fp >= 0) !== (fq >= 0)) {
      const s = fp / (fp - fq);
      out.push([p[0] + s * (q[0] - p[0]), p[1] + s * (q[1] - p[1])]);
    }
  }
  return out;
}

/** Spherical excess of triangle (a, b, c) by l'Huilier's theorem: tan(E/4) = √(tan(s/2)·Π tan((s − x)/2)). */
function lhuilier(a: V3, b: V3, c: V3): number {
  const side = (x: V3, y: V3) => Math.acos(Math.max(-1, Math.min(1, dot(x, y))));
  const A = side(b, c), B = side(c, a), C = side(a, b);
  const s = (A + B + C) / 2;
  const t = Math.tan(s / 2) * Math.tan((s - A) / 2) * Math.tan((s - B) / 2) * Math.tan((s - C) / 2);
  return 4 * Math.atan(Math.sqrt(Math.max(0, t)));
}
