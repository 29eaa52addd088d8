import type { DecisionRule, Quantity, ResolvedUncertainty } from '../../types.js';
import { QUANTITIES } from '../../quantity.js';

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

/** The `uncertainty:` block of a job file or limit set. Nothing here has a default that stands for a standard's value. */
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

type Fail = (path: (string | number)[], found: unknown, expected: string) => void;
const TOP = ['decisionRule', 'guardBandDb', 'draws', 'seed', 'powerClass', ...QUANTITIES];
const Q_KEYS = ['expandedDb', 'perDirectionDb'];

/**
 * Validate a raw `uncertainty:` block (parsed YAML/JSON). Strict: unknown keys are errors. The
 * decision rule must be named (no silent default), and every quantity block gives U and u_r.
 * Errors go to `fail` with the key path under `base`; returns null when anything is wrong.
 * Cost O(keys).
 * @example validateUncertainty({ decisionRule: 'guarded', eirp: { expandedDb: 2, perDirectionDb: 0.3 } }, ['uncertainty'], fail)
 */
export function validateUncertainty(raw: unknown, base: (string | number)[], fail: Fail): UncertaintySpec | null {
  let ok = true;
  const bad: Fail = (p, f, e) => { ok = false; fail(p, f, e); };
  if (raw === null || typeof raw !== 'object' || Array.isArray(raw)) {
    bad(base, raw, 'a mapping with decisionRule and per-quantity uncertainties (eirp: {expandedDb, perDirectionDb})');
    return null;
  }
  const o = raw as Record<string, unknown>;
  for (const k of Object.keys(o)) if (!TOP.includes(k)) bad([...base, k], k, `one of the keys ${TOP.join(', ')}`);
  const rule = o.decisionRule;
  if (!DECISION_RULES.includes(rule as DecisionRule)) bad([...base, 'decisionRule'], rule, `one of ${DECISION_RULES.join(', ')}`);
  const num = (v: unknown, p: (string | number)[], lo: number, hi: number, what: string): number | undefined => {
    if (typeof v === 'number' && Number.isFinite(v) && v >= lo && v <= hi) return v;
    bad(p, v, what);
    return undefined;
  };
  const spec: UncertaintySpec = { decisionRule: rule as DecisionRule, quantities: {} };
  if (o.guardBandDb !== undefined) {
    spec.guardBandDb = num(o.guardBandDb, [...base, 'guardBandDb'], 0, 30, 'a guard band in dB between 0 and 30');
    if (rule !== 'guarded') bad([...base, 'guardBandDb'], o.guardBandDb, 'no guard band unless decisionRule is guarded');
  }
  if (o.draws !== undefined) {
    const d = num(o.draws, [...base, 'draws'], 20, 1e6, 'a whole number of Monte-Carlo draws between 20 and 1000000');
    if (d !== undefined && !Number.isInteger(d)) bad([...base, 'draws'], d, 'a whole number of draws');
    spec.draws = d;
  }
  if (o.seed !== undefined) {
    const s = num(o.seed, [...base, 'seed'], 0, 2 ** 32 - 1, 'a whole-number seed between 0 and 4294967295');
    if (s !== undefined && !Number.isInteger(s)) bad([...base, 'seed'], s, 'a whole-number seed');
    spec.seed = s;
  }
  if (o.powerClass !== undefined) {
    const pc = num(o.powerClass, [...base, 'powerClass'], 1, 7, 'a 3GPP FR2 power class 1 to 7');
    if (pc !== undefined && !Number.isInteger(pc)) bad([...base, 'powerClass'], pc, 'a whole-number power class');
    spec.powerClass = pc;
  }
  for (const q of QUANTITIES) {
    const v = o[q];
    if (v === undefined) continue;
    const p = [...base, q];
    if (v === null || typeof v !== 'object' || Array.isArray(v)) { bad(p, v, 'a mapping {expandedDb, perDirectionDb}'); continue; }
    const qo = v as Record<string, unknown>;
    for (const k of Object.keys(qo)) if (!Q_KEYS.includes(k)) bad([...p, k], k, `one of the keys ${Q_KEYS.join(', ')}`);
    const U = num(qo.expandedDb, [...p, 'expandedDb'], 0, 30, 'the expanded uncertainty U (95 %) in dB, between 0 and 30');
    const ur = num(qo.perDirectionDb, [...p, 'perDirectionDb'], 0, 30, 'the per-direction standard uncertainty u_r in dB, between 0 and 30');
    if (U !== undefined && ur !== undefined) {
      if (ur > U / K95 + 1e-12) bad([...p, 'perDirectionDb'], ur, `at most U/1.96 = ${+(U / K95).toFixed(4)} dB (the per-direction part cannot exceed the whole)`);
      else spec.quantities[q] = { expandedDb: U, perDirectionDb: ur };
    }
  }
  if (Object.keys(spec.quantities).length === 0 && ok) bad(base, raw, 'at least one of eirp, eis, gain with {expandedDb, perDirectionDb}');
  return ok ? spec : null;
}
