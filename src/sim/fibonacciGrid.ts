import type { SampleGrid } from './types.js';

/**
 * A constant-density grid of n directions: the spherical Fibonacci lattice (equal-area bands
 * in cos θ, successive points turned by the golden angle).
 * Formula: cos θᵢ = 1 − 2(i + ½)/n, φᵢ = i · 180°(3 − √5) mod 360°
 * (González, "Measurement of areas on a sphere using Fibonacci and latitude–longitude
 * lattices", Math. Geosci. 42 (2010); from memory)                             Eq. (F1)
 * Units: degrees. Boundary rule: no point lies on a pole; every point stands for 4π/n sr.
 * Cost: O(n).
 * @throws Error when n is not a positive integer.
 * @example
 * fibonacciGrid(800).thetaDeg.length; // 800
 */
export function fibonacciGrid(n: number): SampleGrid {
  if (!Number.isInteger(n) || n < 1) throw new Error(`fibonacciGrid: n must be a positive integer, got ${n}`);
  const golden = 180 * (3 - Math.sqrt(5));
  const thetaDeg = new Float64Array(n);
  const phiDeg = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    thetaDeg[i] = (Math.acos(1 - (2 * (i + 0.5)) / n) * 180) / Math.PI; // Eq. (F1)
    phiDeg[i] = (i * golden) % 360;
  }
  return { thetaDeg, phiDeg };
}
