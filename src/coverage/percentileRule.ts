import type { Quantity } from '../types.js';
import { worstValue } from '../quantity.js';

/** Relative slack when comparing F(v) with p, for floating drift in summed weights. */
export const PERCENTILE_REL_TOL = 1e-12;

/** What the percentile rule decides before looking at the values. */
export interface PercentilePlan {
  /** 'none': not evaluable (empty, or the level lies in the unmeasured part); 'minimum': p = 0; 'select': search. */
  mode: 'none' | 'minimum' | 'select';
  /** Unmeasured solid angle that sits below every measured value (at −∞: eirp/gain), sr; 0 for eis. */
  belowSr: number;
  /** The measured cumulative solid angle that reaches the level: the answer is the smallest v with Σ w[x ≤ v] ≥ reachSr. */
  reachSr: number;
}

/**
 * The one percentile rule, shared by the core's `percentile` and the fast selectors
 * (percentileSelector, patchedPercentile): the step rule "levelPct p gives the smallest value v
 * with F(v) = (U₋ + Σ w[x ≤ v]) / S ≥ p/100" (Eq. 1; CONTRACT.md), S the sphere norm (4π, or Σw
 * on a full sphere), the unmeasured share U = S − Σw counted as the worst value (src/quantity.ts
 * worstValue: U₋ = U for eirp/gain, 0 for eis), "≥" with a relative 1e-12·S slack. A level that
 * falls inside U is not evaluable ('none'); p = 0 is the minimum when evaluable.
 * Cost O(1).
 * @throws RangeError when levelPct is not in [0, 100].
 * @example percentilePlan('eirp', 50, 4 * Math.PI, 4 * Math.PI).reachSr // 2π − 4π·1e-12
 */
export function percentilePlan(quantity: Quantity, levelPct: number, sphereSr: number, measuredSr: number, n: number): PercentilePlan {
  if (!(levelPct >= 0 && levelPct <= 100)) throw new RangeError(`percentile: level ${levelPct} % is not in [0, 100]`);
  const target = (levelPct / 100) * sphereSr;
  const tol = PERCENTILE_REL_TOL * sphereSr;
  const unmeasured = Math.max(0, sphereSr - measuredSr);
  const belowSr = worstValue(quantity) === -Infinity ? unmeasured : 0; // Eq. 1: the unmeasured mass sits at the worst value
  let mode: PercentilePlan['mode'] = 'select';
  if (n === 0) mode = 'none';
  else if (belowSr > 0 && belowSr >= target - tol) mode = 'none'; // reached at −∞, inside the unmeasured part
  else if (target <= tol) mode = 'minimum';
  else if (belowSr + measuredSr < target - tol) mode = 'none'; // reached only at +∞ (eis, partial sphere)
  return { mode, belowSr, reachSr: target - tol - belowSr };
}
