/**
 * Scan families that chambers produce (issue 12): density steps, stitched grids, windows, ring
 * scans with jitter, random sets, missing samples, and truly partial scans. Plain angle arrays
 * (degrees), seeded, no files.
 */
import { createRng } from '../../src/sim/prng.js';
import type { Angles } from './gridFixtures.js';

const DEG = 180 / Math.PI;

class Builder {
  t: number[] = [];
  p: number[] = [];
  add(thetaDeg: number, phiDeg: number): void {
    this.t.push(thetaDeg);
    this.p.push(((phiDeg % 360) + 360) % 360);
  }
  angles(): Angles {
    return { theta: Float64Array.from(this.t), phi: Float64Array.from(this.p) };
  }
}

/** θ/φ grid with step, θ from..to, φ columns from..to (exclusive end); one pole sample. */
export function stepScan(stepDeg: number, thetaFrom = 0, thetaTo = 180, phiFrom = 0, phiTo = 360, into = new Builder()): Builder {
  for (let k = 0; thetaFrom + k * stepDeg <= thetaTo + 1e-9; k++) {
    const t = Math.round((thetaFrom + k * stepDeg) * 1e9) / 1e9;
    if (t === 0 || t === 180) { into.add(t, 0); continue; }
    for (let j = 0; phiFrom + j * stepDeg < phiTo - 1e-9; j++) into.add(t, Math.round((phiFrom + j * stepDeg) * 1e9) / 1e9);
  }
  return into;
}

/** Uniformly random directions (area-uniform), optionally only where keep(θ, φ). */
export function randomScan(n: number, seed: number, keep: (t: number, p: number) => boolean = () => true, into = new Builder()): Builder {
  const rng = createRng(seed);
  let made = 0;
  while (made < n) {
    const t = Math.acos(1 - 2 * rng.uniform()) * DEG;
    const p = rng.uniform() * 360;
    if (!keep(t, p)) continue;
    into.add(t, p);
    made++;
  }
  return into;
}

/** Random points `ratio`× denser (in spacing) where inside(θ) than elsewhere: n base points overall. */
export function densityStep(n: number, ratio: number, inside: (t: number) => boolean, seed: number): Angles {
  const b = randomScan(n, seed, (t) => !inside(t));
  randomScan(Math.round(n * ratio * ratio * shareOf(inside) / (1 - shareOf(inside))), seed + 1, (t) => inside(t), b);
  return b.angles();
}

function shareOf(inside: (t: number) => boolean): number {
  let s = 0;
  const N = 3600;
  for (let k = 0; k < N; k++) {
    const t = Math.acos(1 - (2 * (k + 0.5)) / N) * DEG;
    if (inside(t)) s++;
  }
  return s / N;
}

/** Positioner ring scan: θ step, φ step ∝ 1/sin θ (× stepFactor(θ)), each ring at a random φ offset, jitter (deg) on both angles. */
export function ringScan(stepDeg: number, seed: number, jitterDeg = 0, stepFactor: (t: number) => number = () => 1): Angles {
  const rng = createRng(seed);
  const b = new Builder();
  b.add(0, 0);
  for (let k = 1; k * stepDeg < 180 - 1e-9; k++) {
    const t = k * stepDeg;
    const count = Math.max(3, Math.round((360 * Math.sin(t / DEG)) / (stepDeg * stepFactor(t))));
    const offset = rng.uniform() * 360;
    for (let j = 0; j < count; j++) {
      const jt = (rng.uniform() * 2 - 1) * jitterDeg;
      const jp = ((rng.uniform() * 2 - 1) * jitterDeg) / Math.max(0.05, Math.sin(t / DEG));
      b.add(Math.min(180, Math.max(0, t + jt)), offset + (j * 360) / count + jp);
    }
  }
  b.add(180, 0);
  return b.angles();
}

/** Two step grids stitched at θ = 90°: fine above (θ ≤ 90), coarse below (first coarse row past 90). */
export function stitched(fineDeg: number, coarseDeg: number): Angles {
  const b = stepScan(fineDeg, 0, 90);
  stepScan(coarseDeg, 90 + coarseDeg, 180, 0, 360, b);
  return b.angles();
}

/** A 5° grid with a 1° window θ 60–80°, φ 20–40° (the coarse points inside the window replaced). */
export function windowScan(): Angles {
  const coarse = stepScan(5).angles();
  const b = new Builder();
  for (let i = 0; i < coarse.theta.length; i++) {
    const t = coarse.theta[i], p = coarse.phi[i];
    if (t >= 60 && t <= 80 && p >= 20 && p <= 40) continue;
    b.add(t, p);
  }
  stepScan(1, 60, 80, 20, 41, b);
  return b.angles();
}

/** Spherical Fibonacci lattice (equal-area pixelisation), optionally only where keep(θ, φ). */
export function fibonacciScan(n: number, keep: (t: number, p: number) => boolean = () => true): Angles {
  const b = new Builder();
  const golden = 180 * (3 - Math.sqrt(5));
  for (let i = 0; i < n; i++) {
    const t = Math.acos(1 - (2 * (i + 0.5)) / n) * DEG;
    const p = (i * golden) % 360;
    if (keep(t, p)) b.add(t, p);
  }
  return b.angles();
}

/** Keep only the directions where keep(θ, φ). */
export function without(a: Angles, drop: (t: number, p: number) => boolean): Angles {
  const b = new Builder();
  for (let i = 0; i < a.theta.length; i++) if (!drop(a.theta[i], a.phi[i])) b.add(a.theta[i], a.phi[i]);
  return b.angles();
}

export { Builder };
