/**
 * Hammer (Hammer–Aitoff) equal-area projection of the whole sphere onto a 2:1 ellipse.
 *
 * Why this projection: area on the page must be proportional to solid angle, so that a coverage
 * hole looks as big as it is. Hammer is equal-area, shows the whole sphere in one piece and has a
 * closed-form inverse (one `asin`, one `atan2` a pixel), which keeps rasterizing cheap.
 *
 * Angles: latitude β = 90° − θ (θ = 0 at the top of the map), longitude λ = φ − φ₀ wrapped to
 * (−180°, 180°], φ₀ the central meridian. Map units are chosen so that the area of a region on
 * the map equals its solid angle in steradians (the ellipse has semi-axes 2√2 and √2: area 4π).
 *
 * Forward (Eq. H1):  x = 2√2 cos β sin(λ/2) / √(1 + cos β cos(λ/2)),
 *                    y =  √2 sin β          / √(1 + cos β cos(λ/2)).
 * Inverse (Eq. H2):  z = √(1 − (x/4)² − (y/2)²),  λ = 2 atan2(z·x, 2(2z² − 1)),  β = asin(z·y).
 * Source: Snyder & Voxland, An Album of Map Projections, USGS Prof. Paper 1453 (1989),
 * "Hammer" (formulas from MEMORY; the tests check equal area against the spherical-cap formula
 * 2π(1 − cos α) and forward∘inverse round trips, so a wrong formula cannot pass).
 *
 * Boundary rule: λ = ±180° is the map's left/right edge (the φ₀ + 180° seam); the poles map to
 * the top and bottom points. Cost: O(1) a point.
 */

export const HAMMER_HALF_WIDTH = 2 * Math.SQRT2;
export const HAMMER_HALF_HEIGHT = Math.SQRT2;

const RAD = Math.PI / 180;

/** Longitude λ in degrees, (−180, 180], of azimuth φ relative to the central meridian φ₀. */
export function longitudeDeg(phiDeg: number, centerPhiDeg = 0): number {
  let lon = (((phiDeg - centerPhiDeg) % 360) + 360) % 360;
  if (lon > 180) lon -= 360;
  return lon;
}

/**
 * Project a direction (θ, φ) in degrees to map units [x, y] (y up, θ = 0 at the top).
 * @example hammerForward(90, 0) // → [0, 0]; hammerForward(0, 0) // → [0, √2]
 */
export function hammerForward(thetaDeg: number, phiDeg: number, centerPhiDeg = 0): [number, number] {
  return hammerForwardLonLat(longitudeDeg(phiDeg, centerPhiDeg), 90 - thetaDeg);
}

/** Forward projection from longitude/latitude in degrees (λ ∈ [−180, 180], β ∈ [−90, 90]). */
export function hammerForwardLonLat(lonDeg: number, latDeg: number): [number, number] {
  const beta = latDeg * RAD;
  const half = (lonDeg * RAD) / 2;
  const d = Math.sqrt(1 + Math.cos(beta) * Math.cos(half));
  return [(2 * Math.SQRT2 * Math.cos(beta) * Math.sin(half)) / d, (Math.SQRT2 * Math.sin(beta)) / d]; // Eq. H1
}

/**
 * Inverse projection: map units → direction, or null outside the ellipse x²/8 + y²/2 ≤ 1.
 * @example hammerInverse(0, 0) // → { thetaDeg: 90, phiDeg: 0 }
 */
export function hammerInverse(x: number, y: number, centerPhiDeg = 0): { thetaDeg: number; phiDeg: number } | null {
  if ((x * x) / 8 + (y * y) / 2 > 1) return null;
  const z = Math.sqrt(Math.max(0, 1 - (x / 4) ** 2 - (y / 2) ** 2));
  const lon = 2 * Math.atan2(z * x, 2 * (2 * z * z - 1)); // Eq. H2
  const lat = Math.asin(Math.max(-1, Math.min(1, z * y))); // Eq. H2, clamped against rounding
  let phiDeg = (lon / RAD + centerPhiDeg) % 360;
  if (phiDeg < 0) phiDeg += 360;
  return { thetaDeg: 90 - lat / RAD, phiDeg };
}
