import type { Direction } from '../types.js';

/**
 * Direction conventions (DESIGN.md "Directions"): θ from +z in [0, 180], φ in [0, 360);
 * azimuth/elevation convert as θ = 90 − el, φ = az mod 360 (Eq. 1). Unit vector
 * (sin θ cos φ, sin θ sin φ, cos θ) (Eq. 2). Angular distance is atan2(|a×b|, a·b) (Eq. 3),
 * accurate for tiny and near-antipodal separations (acos of a dot product is not).
 * This file is the one place that writes Eq. 2: every unit vector of the code base comes from
 * `unitVector` (one direction) or `unitVectors` (many, as x/y/z arrays).
 * Cost O(1) each; `unitVectors` O(n).
 * @example azElToThetaPhi(-90, 30) // { thetaDeg: 60, phiDeg: 270 }
 */

const RAD = Math.PI / 180;

/** φ mod 360 into [0, 360); −0 becomes 0 and values that round to 360 become 0. */
export function normalizePhiDeg(phiDeg: number): number {
  let r = phiDeg % 360;
  if (r < 0) r += 360;
  if (r >= 360 || r === 0) r = 0; // 360 − ε can round to 360; also turns −0 into 0
  return r;
}

/** Azimuth/elevation (deg) to θ/φ (deg), Eq. 1. */
export function azElToThetaPhi(azDeg: number, elDeg: number): Direction {
  return { thetaDeg: 90 - elDeg, phiDeg: normalizePhiDeg(azDeg) }; // Eq. 1
}

/** Unit vector of (θ, φ) in degrees, Eq. 2. */
export function unitVector(thetaDeg: number, phiDeg: number): [number, number, number] {
  const t = thetaDeg * RAD;
  const p = phiDeg * RAD;
  const s = Math.sin(t);
  return [s * Math.cos(p), s * Math.sin(p), Math.cos(t)]; // Eq. 2
}

/** Unit vectors of many directions, one x, y and z array each. */
export interface UnitVectors {
  x: Float64Array;
  y: Float64Array;
  z: Float64Array;
}

/** Unit vectors of (θ[i], φ[i]) in degrees, Eq. 2; the same bits as `unitVector` point by point. */
export function unitVectors(thetaDeg: ArrayLike<number>, phiDeg: ArrayLike<number>): UnitVectors {
  const n = thetaDeg.length;
  if (phiDeg.length !== n) throw new RangeError(`unitVectors: ${n} θ values but ${phiDeg.length} φ values`);
  const v = { x: new Float64Array(n), y: new Float64Array(n), z: new Float64Array(n) };
  for (let i = 0; i < n; i++) {
    const t = thetaDeg[i] * RAD;
    const p = phiDeg[i] * RAD;
    const s = Math.sin(t);
    v.x[i] = s * Math.cos(p); // Eq. 2
    v.y[i] = s * Math.sin(p);
    v.z[i] = Math.cos(t);
  }
  return v;
}

/** Great-circle angle between two directions, degrees in [0, 180], Eq. 3. */
export function angularDistanceDeg(a: Direction, b: Direction): number {
  const [ax, ay, az] = unitVector(a.thetaDeg, a.phiDeg);
  const [bx, by, bz] = unitVector(b.thetaDeg, b.phiDeg);
  const cx = ay * bz - az * by;
  const cy = az * bx - ax * bz;
  const cz = ax * by - ay * bx;
  return Math.atan2(Math.hypot(cx, cy, cz), ax * bx + ay * by + az * bz) / RAD; // Eq. 3
}
