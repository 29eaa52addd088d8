import type { DecisionRule, Quantity, ResolvedUncertainty } from '../../types.js';

export type { DecisionRule };
export const DECISION_RULES: readonly DecisionRule[] = ['shared-risk', 'guarded', 'non-binary'];

/** Coverage factor of an expanded uncertainty at 95 % for a normal model (two-sided). */
export const K95 = 1.959963984540054;

/** The user's measurement uncertainty of one quantity, as written. */
export interface QuantityUncertaintyInput {
  /** Expanded uncertainty U at 95 % (k = 1.96, normal model), dB: the whole measurement. */
  expandedDb: number;
  /** Standard uncertainty of the part independent from direction to direction (positioning, noise, reflections), dB. */
  perDirectionDb: number;
}

/**
 * The `uncertainty:` block of a job file or limit set, as code holds it (the file form and its
 * validation: src/config/uncertaintySchema.ts). Nothing here has a default that stands for a
 * standard's value.
 */
export interface UncertaintySpec {
  decisionRule: DecisionRule;
  /** guarded only: the guard band w, dB; default the quantity's U. */
  guardBandDb?: number;
  /** Monte-Carlo draws (default DEFAULT_DRAWS) and seed (default 1). */
  draws?: number;
  seed?: number;
  /** 3GPP power class whose grid-count rules are warned about (1 or 3; default 3). */
  powerClass?: number;
  quantities: Partial<Record<Quantity, QuantityUncertaintyInput>>;
}

/** Monte-Carlo draws when none are set: binomial standard error ≤ 1.6 % on every probability (√(0.25/1000)). */
export const DEFAULT_DRAWS = 1000;
/**
 * Above this many grid points (finer than about 2.5°) the default is LARGE_GRID_DRAWS instead
 * (standard error ≤ 3.5 %): a 64-beam 1° unit costs about 0.2–0.35 s per draw on the reference
 * machine under load (README, "How sure is the verdict"). Set `draws` to override.
 */
export const LARGE_GRID_POINTS = 10_000;
export const LARGE_GRID_DRAWS = 200;

/** A spec resolved for one quantity: the numbers the computations use (the shape results.json repeats in `confidence`). */
export type { ResolvedUncertainty };

/**
 * Resolve the spec for one quantity: u_c from the split of the combined standard uncertainty
 * u = U / k, k = 1.96 (95 %, normal), u² = u_c² + u_r² (Eq. U1: independent parts add in
 * quadrature, GUM JCGM 100:2008 §5.1.2 — from memory). Null when the spec names no uncertainty
 * for the quantity (then nothing changes: today's shared-risk verdicts).
 * Draws: the spec's, else DEFAULT_DRAWS, or LARGE_GRID_DRAWS on grids of more than
 * LARGE_GRID_POINTS points.
 * Cost O(1).
 * @throws never (the validator rejects u_r > U/k).
 * @example resolveUncertainty(spec, 'eirp') // { expandedDb: 2, commonDb: 0.99…, perDirectionDb: 0.3, … }
 */
export function resolveUncertainty(spec: UncertaintySpec | null | undefined, quantity: Quantity, points = 0): ResolvedUncertainty | null {
  const q = spec?.quantities[quantity];
  if (!spec || !q) return null;
  const u = q.expandedDb / K95;
  const commonDb = Math.sqrt(Math.max(0, u * u - q.perDirectionDb * q.perDirectionDb)); // Eq. U1
  return {
    decisionRule: spec.decisionRule,
    expandedDb: q.expandedDb,
    commonDb,
    perDirectionDb: q.perDirectionDb,
    guardBandDb: spec.decisionRule === 'guarded' && spec.guardBandDb !== undefined ? spec.guardBandDb : q.expandedDb,
    draws: spec.draws ?? (points > LARGE_GRID_POINTS ? LARGE_GRID_DRAWS : DEFAULT_DRAWS),
    seed: spec.seed ?? 1,
  };
}
