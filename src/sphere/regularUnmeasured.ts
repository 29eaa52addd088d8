import type { RegularLayout, UnmeasuredRegion } from '../types.js';
import { seamGap } from './regularLayout.js';

const RAD = Math.PI / 180;
const DEG = 180 / Math.PI;

/**
 * The unmeasured regions of a regular grid, from the same cell bounds as regularWeights: a
 * polar cap above the first row's cell (Ω = 2π(1 − cos θ_lo)), one below the last row's cell
 * (Ω = 2π(1 + cos θ_hi)), and, when the φ columns do not wrap, the φ wedge between the cells
 * beside the seam gap over the measured θ band (Ω = Δφ·(cos θ_lo − cos θ_hi)) (Eq. 1,
 * spherical zone and lune areas). Σ Ω = 4π − Σw exactly.
 * Cost O(columns).
 * @throws never.
 * @example regularUnmeasured(layoutOf(θ ≤ 150° on a 5° grid))[0].thetaRangeDeg // [152.5, 180]
 */
export function regularUnmeasured(layout: RegularLayout): UnmeasuredRegion[] {
  const rows = layout.thetaRowsDeg;
  const nr = rows.length;
  const t0 = rows[0];
  const t1 = rows[nr - 1];
  const lo = t0 === 0 ? 0 : Math.max(0, t0 - (rows[1] - t0) / 2);
  const hi = t1 === 180 ? 180 : Math.min(180, t1 + (t1 - rows[nr - 2]) / 2);
  const out: UnmeasuredRegion[] = [];
  const cosLo = Math.cos(lo * RAD);
  const cosHi = Math.cos(hi * RAD);
  if (lo > 0) {
    out.push({ solidAngleSr: 2 * Math.PI * (1 - cosLo), centre: { thetaDeg: 0, phiDeg: 0 }, radiusDeg: lo, thetaRangeDeg: [0, lo], phiRangeDeg: [0, 360] }); // Eq. 1
  }
  if (hi < 180) {
    out.push({ solidAngleSr: 2 * Math.PI * (1 + cosHi), centre: { thetaDeg: 180, phiDeg: 0 }, radiusDeg: 180 - hi, thetaRangeDeg: [hi, 180], phiRangeDeg: [0, 360] }); // Eq. 1
  }
  const cols = layout.phiColsDeg;
  const m = cols.length;
  const s = layout.phiWraps ? -1 : seamGap(cols);
  if (s >= 0 && m >= 2) {
    const gap = (c: number): number => (c + 1 < m ? cols[c + 1] - cols[c] : 360 - cols[m - 1] + cols[0]);
    const start = cols[s] + gap((s + m - 1) % m) / 2;
    const end = cols[(s + 1) % m] - gap((s + 1) % m) / 2;
    const width = (((end - start) % 360) + 360) % 360;
    if (width > 0) {
      const mid = (start + width / 2) % 360;
      const band = Math.max(0, cosLo - cosHi);
      const midTheta = (lo + hi) / 2;
      const reach = (t: number, p: number) => angleDeg(midTheta, mid, t, p);
      const radiusDeg = Math.max(reach(lo, start), reach(lo, start + width), reach(hi, start), reach(hi, start + width), midTheta - lo, hi - midTheta);
      const norm = (v: number) => Math.round(((((v % 360) + 360) % 360)) * 1e6) / 1e6;
      out.push({ solidAngleSr: width * RAD * band, centre: { thetaDeg: midTheta, phiDeg: mid }, radiusDeg, thetaRangeDeg: [lo, hi], phiRangeDeg: width >= 360 ? [0, 360] : [norm(start), norm(start + width)] }); // Eq. 1
    }
  }
  return out.filter((r) => r.solidAngleSr > 0).sort((a, b) => b.solidAngleSr - a.solidAngleSr);
}

function angleDeg(t1: number, p1: number, t2: number, p2: number): number {
  const a = t1 * RAD, b = t2 * RAD, dp = (p2 - p1) * RAD;
  const c = Math.cos(a) * Math.cos(b) + Math.sin(a) * Math.sin(b) * Math.cos(dp);
  return Math.acos(Math.max(-1, Math.min(1, c))) * DEG;
}
