import type { SphereGrid } from '../../src/types.js';

/**
 * Test-only regular grid on given θ rows and φ columns (degrees), built here so the analysis
 * tests do not depend on the core's grid builder. Poles (θ = 0, 180) are merged to one point.
 * Weights: a cell spans halfway to its neighbours; Ω = Δφ·(cos θ₁ − cos θ₂), pole cells are caps
 * (DESIGN.md "Regular grid weights"); the first/last non-pole row extends to the pole when the
 * rows start within half a step of it, which makes a cell-centred grid cover 4π.
 */
export function regularGrid(thetaRowsDeg: number[], phiColsDeg: number[], phiWraps = true): SphereGrid {
  const rad = Math.PI / 180;
  const rows = thetaRowsDeg.length;
  const cols = phiColsDeg.length;
  const edge = (r: number): [number, number] => {
    const t = thetaRowsDeg[r];
    let lo = r > 0 ? (thetaRowsDeg[r - 1] + t) / 2 : t;
    let hi = r + 1 < rows ? (thetaRowsDeg[r + 1] + t) / 2 : t;
    if (r === 0 && rows > 1 && t <= (thetaRowsDeg[1] - t) / 2 + 1e-9) lo = 0;
    if (r === rows - 1 && rows > 1 && 180 - t <= (t - thetaRowsDeg[r - 1]) / 2 + 1e-9) hi = 180;
    return [lo, hi];
  };
  const dPhi = (c: number): number => {
    if (phiWraps) {
      const prev = phiColsDeg[(c - 1 + cols) % cols] - (c === 0 ? 360 : 0);
      const next = phiColsDeg[(c + 1) % cols] + (c === cols - 1 ? 360 : 0);
      return cols === 1 ? 360 : (next - prev) / 2;
    }
    const lo = c > 0 ? (phiColsDeg[c - 1] + phiColsDeg[c]) / 2 : phiColsDeg[c];
    const hi = c + 1 < cols ? (phiColsDeg[c + 1] + phiColsDeg[c]) / 2 : phiColsDeg[c];
    return hi - lo;
  };
  const theta: number[] = [], phi: number[] = [], w: number[] = [];
  const rowStart = new Int32Array(rows), rowLength = new Int32Array(rows);
  for (let r = 0; r < rows; r++) {
    const [lo, hi] = edge(r);
    const band = Math.cos(lo * rad) - Math.cos(hi * rad);
    rowStart[r] = theta.length;
    const t = thetaRowsDeg[r];
    if (t === 0 || t === 180) {
      const span = phiWraps ? 360 : phiColsDeg[cols - 1] - phiColsDeg[0];
      theta.push(t); phi.push(0); w.push(span * rad * band);
      rowLength[r] = 1;
      continue;
    }
    for (let c = 0; c < cols; c++) {
      theta.push(t); phi.push(phiColsDeg[c]); w.push(dPhi(c) * rad * band);
    }
    rowLength[r] = cols;
  }
  const weightSr = Float64Array.from(w);
  let s = 0;
  for (const x of weightSr) s += x;
  return {
    kind: 'regular',
    thetaDeg: Float64Array.from(theta),
    phiDeg: Float64Array.from(phi),
    weightSr,
    solidAngleSr: s,
    regular: {
      thetaRowsDeg: Float64Array.from(thetaRowsDeg),
      phiColsDeg: Float64Array.from(phiColsDeg),
      rowStart,
      rowLength,
      phiWraps,
    },
  };
}

/** Steps from a to b inclusive. */
export function steps(a: number, b: number, step: number): number[] {
  const out: number[] = [];
  for (let k = 0; a + k * step <= b + 1e-9; k++) out.push(a + k * step);
  return out;
}

/** A full-sphere grid with θ step and φ step (φ from 0 to 360 − step), poles merged. */
export function fullGrid(stepDeg: number): SphereGrid {
  return regularGrid(steps(0, 180, stepDeg), steps(0, 360 - stepDeg, stepDeg));
}

/** Unit vector of (θ, φ) in degrees. */
export function unit(thetaDeg: number, phiDeg: number): [number, number, number] {
  const t = (thetaDeg * Math.PI) / 180, p = (phiDeg * Math.PI) / 180;
  return [Math.sin(t) * Math.cos(p), Math.sin(t) * Math.sin(p), Math.cos(t)];
}

/** Great-circle angle between two directions, degrees (atan2 form, well conditioned). */
export function angleDeg(a: [number, number, number], b: [number, number, number]): number {
  const cx = a[1] * b[2] - a[2] * b[1], cy = a[2] * b[0] - a[0] * b[2], cz = a[0] * b[1] - a[1] * b[0];
  const dot = a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
  return (Math.atan2(Math.hypot(cx, cy, cz), dot) * 180) / Math.PI;
}

/**
 * A beam in dB: peak gain minus a Gaussian roll-off with the angle from its axis,
 * value = peakDb − 12·(ψ/hpbw)² (−3 dB at ψ = hpbw/2; common practice for a Gaussian beam model).
 */
export function gaussianBeam(grid: SphereGrid, axisThetaDeg: number, axisPhiDeg: number, hpbwDeg: number, peakDb: number): Float64Array {
  const axis = unit(axisThetaDeg, axisPhiDeg);
  const out = new Float64Array(grid.thetaDeg.length);
  for (let i = 0; i < out.length; i++) {
    const psi = angleDeg(axis, unit(grid.thetaDeg[i], grid.phiDeg[i]));
    out[i] = peakDb - 12 * (psi / hpbwDeg) ** 2;
  }
  return out;
}
