/** Direction sets for the core tests (plain arrays of angles; no files). */

export interface Angles { theta: Float64Array; phi: Float64Array }

/**
 * Every (θ, φ) combination of the given rows and columns. Pole rows are written once or, with
 * poleAtEveryPhi, at every φ (as many exports do).
 */
export function combos(rowsDeg: number[], colsDeg: number[], poleAtEveryPhi = true): Angles {
  const t: number[] = [];
  const p: number[] = [];
  for (const th of rowsDeg) {
    const pole = th === 0 || th === 180;
    for (const ph of pole && !poleAtEveryPhi ? [0] : colsDeg) { t.push(th); p.push(ph); }
  }
  return { theta: Float64Array.from(t), phi: Float64Array.from(p) };
}

export function range(from: number, to: number, step: number): number[] {
  const out: number[] = [];
  for (let k = 0; from + k * step <= to + 1e-9; k++) out.push(Math.round((from + k * step) * 1e9) / 1e9);
  return out;
}

/** A full constant-step grid; seam = include φ = 360 as well as 0. */
export function stepGrid(stepDeg: number, opts: { seam?: boolean; poleAtEveryPhi?: boolean; signedPhi?: boolean } = {}): Angles {
  const cols = opts.signedPhi
    ? range(-180, opts.seam ? 180 : 180 - stepDeg, stepDeg)
    : range(0, opts.seam ? 360 : 360 - stepDeg, stepDeg);
  return combos(range(0, 180, stepDeg), cols, opts.poleAtEveryPhi ?? true);
}

/** Fibonacci (golden-angle) sphere: n nearly evenly spread points, a constant-density grid. */
export function fibonacci(n: number): Angles {
  const theta = new Float64Array(n);
  const phi = new Float64Array(n);
  const golden = Math.PI * (3 - Math.sqrt(5));
  for (let i = 0; i < n; i++) {
    const z = 1 - (2 * i + 1) / n;
    theta[i] = (Math.acos(z) * 180) / Math.PI;
    phi[i] = (((i * golden) % (2 * Math.PI)) * 180) / Math.PI;
  }
  return { theta, phi };
}

export const FOUR_PI = 4 * Math.PI;
/** Spherical cap of half-angle α: 2π(1 − cos α) sr (geometry). */
export const capSr = (alphaDeg: number): number => 2 * Math.PI * (1 - Math.cos((alphaDeg * Math.PI) / 180));
