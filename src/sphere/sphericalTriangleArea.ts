/**
 * Signed solid angle of the spherical triangle (a, b, c) of unit vectors, in sr:
 * tan(Ω/2) = a·(b×c) / (1 + a·b + b·c + c·a) (Eq. 1), positive when b → c turns
 * counter-clockwise seen from outside at a.
 * Source: A. Van Oosterom and J. Strackee, IEEE Trans. Biomed. Eng. BME-30 (1983) 125–126.
 * Vectors are passed as flat coordinates so that hot loops allocate nothing. Cost O(1).
 * @throws never.
 * @example sphericalTriangleArea(1,0,0, 0,1,0, 0,0,1) // π/2 (one octant)
 */
export function sphericalTriangleArea(
  ax: number, ay: number, az: number,
  bx: number, by: number, bz: number,
  cx: number, cy: number, cz: number,
): number {
  const det = ax * (by * cz - bz * cy) - ay * (bx * cz - bz * cx) + az * (bx * cy - by * cx);
  const den = 1 + ax * bx + ay * by + az * bz + bx * cx + by * cy + bz * cz + cx * ax + cy * ay + cz * az;
  return 2 * Math.atan2(det, den); // Eq. 1
}
