import type { SampleGrid } from './types.js';

/** How the φ axis of a constant-step scan is written. */
export type PhiConvention = '0-360' | '-180-180' | '0-360-inclusive';

/**
 * Sample directions of a constant-step chamber scan, θ rows then φ columns, as a positioner
 * writes them: θ from thetaMinDeg to thetaMaxDeg inclusive; φ over [0, 360), [−180, 180) or
 * [0, 360] (the seam written twice).
 * Formula: θᵢ = θ_min + i·Δθ, φⱼ = φ_start + j·Δφ, values rounded to 1e−9° so that steps
 * that are not binary fractions (e.g. 7.5°, 3.6°) print exactly.
 * Boundary rule: with polesOnce each pole row holds one sample (φ = 0); otherwise the pole is
 * written at every φ, as most chambers do. Full 5° grid with polesOnce: 2,522 directions
 * (3GPP TS 38.521-2 Annex M.2.1 count, see reference file).
 * Cost: O(points).
 * @throws Error when a step does not divide its range.
 * @example
 * regularGrid({ thetaStepDeg: 15, phiStepDeg: 15, polesOnce: true }).thetaDeg.length; // 266
 */
export function regularGrid(opts: {
  thetaStepDeg: number;
  phiStepDeg: number;
  phiConvention?: PhiConvention;
  thetaMinDeg?: number;
  thetaMaxDeg?: number;
  polesOnce?: boolean;
}): SampleGrid {
  const tMin = opts.thetaMinDeg ?? 0;
  const tMax = opts.thetaMaxDeg ?? 180;
  const conv = opts.phiConvention ?? '0-360';
  const nTheta = stepsIn(tMax - tMin, opts.thetaStepDeg, 'theta') + 1;
  const nPhiSpan = stepsIn(360, opts.phiStepDeg, 'phi');
  const nPhi = conv === '0-360-inclusive' ? nPhiSpan + 1 : nPhiSpan;
  const phiStart = conv === '-180-180' ? -180 : 0;
  const theta: number[] = [];
  const phi: number[] = [];
  for (let i = 0; i < nTheta; i++) {
    const t = round9(tMin + i * opts.thetaStepDeg);
    const pole = t === 0 || t === 180;
    const cols = pole && opts.polesOnce ? 1 : nPhi;
    for (let j = 0; j < cols; j++) {
      theta.push(t);
      phi.push(pole && opts.polesOnce ? 0 : round9(phiStart + j * opts.phiStepDeg));
    }
  }
  return { thetaDeg: Float64Array.from(theta), phiDeg: Float64Array.from(phi) };
}

function stepsIn(span: number, step: number, axis: string): number {
  const n = Math.round(span / step);
  if (!(step > 0) || Math.abs(n * step - span) > 1e-9) {
    throw new Error(`regularGrid: ${axis} step ${step}° does not divide ${span}°`);
  }
  return n;
}

function round9(x: number): number {
  return Math.round(x * 1e9) / 1e9;
}
