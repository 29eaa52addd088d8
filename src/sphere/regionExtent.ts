import type { UnmeasuredRegion } from '../types.js';

const DEG = 180 / Math.PI;

/** One empty cap that is part of an unmeasured region: its centre (unit vector) and radius. */
export interface RegionCap {
  x: number;
  y: number;
  z: number;
  radiusRad: number;
}

/**
 * Where an unmeasured region is: centre, extent, θ and φ spans, from the empty caps that make
 * it up (and the measured directions on its rim, for the φ span).
 *
 * Centre: the normalized sum of the cap centres weighted by R² (Eq. 1: larger caps hold more
 * of the region). radiusDeg: the largest (angle from the centre to a cap centre + its radius)
 * (Eq. 2). θ span: every cap's θ ± R, clamped to [0, 180]. φ span: the shortest arc holding
 * the φ of the cap centres and rim directions (pole directions carry no φ); [0, 360] when the
 * region reaches a pole with its caps, or when no arc is shorter than the full circle less its
 * largest gap of ≥ 1 % of it.
 * Cost O(k log k) for k caps and rim directions.
 * @throws never.
 * @example regionExtent([{ x: 0, y: 0, z: -1, radiusRad: Math.PI / 6 }], [], 0.84).thetaRangeDeg // [150, 180]
 */
export function regionExtent(caps: RegionCap[], rimPhiDeg: number[], solidAngleSr: number): UnmeasuredRegion {
  let sx = 0, sy = 0, sz = 0;
  for (const c of caps) {
    const w = c.radiusRad * c.radiusRad; // Eq. 1
    sx += w * c.x; sy += w * c.y; sz += w * c.z;
  }
  let norm = Math.hypot(sx, sy, sz);
  if (!(norm > 1e-12)) { sx = caps[0]?.x ?? 0; sy = caps[0]?.y ?? 0; sz = caps[0]?.z ?? 1; norm = Math.hypot(sx, sy, sz) || 1; }
  sx /= norm; sy /= norm; sz /= norm;
  let radius = 0;
  let tLo = 180, tHi = 0;
  let touchesPole = false;
  const phis = rimPhiDeg.slice();
  for (const c of caps) {
    const d = Math.atan2(Math.hypot(sy * c.z - sz * c.y, sz * c.x - sx * c.z, sx * c.y - sy * c.x), sx * c.x + sy * c.y + sz * c.z);
    radius = Math.max(radius, d + c.radiusRad); // Eq. 2
    const t = Math.acos(Math.max(-1, Math.min(1, c.z))) * DEG;
    const r = c.radiusRad * DEG;
    tLo = Math.min(tLo, Math.max(0, t - r));
    tHi = Math.max(tHi, Math.min(180, t + r));
    if (t - r <= 0 || t + r >= 180) touchesPole = true;
    if (Math.hypot(c.x, c.y) > 1e-9) phis.push(((Math.atan2(c.y, c.x) * DEG) % 360 + 360) % 360);
  }
  const centreTheta = Math.acos(Math.max(-1, Math.min(1, sz))) * DEG;
  const centrePhi = Math.hypot(sx, sy) > 1e-12 ? ((Math.atan2(sy, sx) * DEG) % 360 + 360) % 360 : 0;
  return {
    solidAngleSr,
    centre: { thetaDeg: round(centreTheta), phiDeg: round(centrePhi) % 360 },
    radiusDeg: round(Math.min(180, radius * DEG)),
    thetaRangeDeg: [round(tLo), round(tHi)],
    phiRangeDeg: touchesPole ? [0, 360] : phiArc(phis),
  };
}

const round = (v: number): number => Math.round(v * 1e6) / 1e6;

/** Shortest arc [start, end] (counter-clockwise, may wrap) holding all the angles, degrees. */
export function phiArc(phis: number[]): [number, number] {
  if (phis.length === 0) return [0, 360];
  const s = phis.map((p) => ((p % 360) + 360) % 360).sort((a, b) => a - b);
  let gap = 360 - s[s.length - 1] + s[0];
  let start = s[0], end = s[s.length - 1];
  for (let k = 1; k < s.length; k++) {
    const g = s[k] - s[k - 1];
    if (g > gap) { gap = g; start = s[k]; end = s[k - 1]; }
  }
  return gap < 3.6 ? [0, 360] : [round(start), round(end)];
}
