import type { Quantity } from '../../src/types.js';

/**
 * Brute-force weighted percentile written straight from the definition (CONTRACT.md
 * "Semantics" and the core's step rule): sort, accumulate, take the first value whose cumulative
 * solid angle over 4π reaches p; the unmeasured part of 4π sits at the worst end (−∞ for
 * eirp/gain, +∞ for eis); null when the level falls there; p = 0 is the minimum. A grid whose
 * Σw is within 1e-6 of 4π is a full sphere and divides by Σw (the core's sphereNormSr rule).
 * Used as the oracle for the fast quickselect evaluator.
 */
export function bruteForcePercentile(values: Float64Array, weightSr: Float64Array, quantity: Quantity, levelPct: number): number | null {
  const order = Array.from(values.keys()).sort((a, b) => values[a] - values[b]);
  const measured = weightSr.reduce((s, w) => s + w, 0);
  const fourPi = Math.abs(measured - 4 * Math.PI) <= 1e-6 * 4 * Math.PI ? measured : 4 * Math.PI;
  const eps = 1e-12 * fourPi;
  const outside = Math.max(0, fourPi - measured);
  let cum = quantity === 'eis' ? 0 : outside;
  const target = (levelPct / 100) * fourPi;
  if (cum > 0 && cum >= target - eps) return null; // the level lies in the unmeasured mass at −∞
  if (target <= eps) return values[order[0]]; // 0 %: the minimum
  for (const i of order) {
    cum += weightSr[i];
    if (cum >= target - eps) return values[i];
  }
  return null;
}

/** Per-point best of a set of beams (max, or min for eis). */
export function bestOf(beams: Float64Array[], lowerIsBetter = false): Float64Array {
  const out = Float64Array.from(beams[0]);
  for (const b of beams) for (let i = 0; i < out.length; i++) if (lowerIsBetter ? b[i] < out[i] : b[i] > out[i]) out[i] = b[i];
  return out;
}
