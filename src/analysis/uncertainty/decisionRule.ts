import type { DecisionRule } from './uncertaintySpec.js';

/** ILAC-G8:09/2019 §4.2.3 non-binary statements; the binary rules use 'pass' and 'fail' only. */
export type ConformityStatement = 'pass' | 'conditional pass' | 'conditional fail' | 'fail';

export interface Decision {
  /** The value the measured value is compared with, in the check's unit. */
  acceptanceLimit: number;
  /** Measured value minus the acceptance limit (lower bound) or the reverse (upper bound). */
  margin: number;
  /** Binary outcome: the measured value is on the good side of the acceptance limit (at it passes). */
  pass: boolean;
  statement: ConformityStatement;
}

/**
 * Apply a decision rule to one measured value against a one-sided limit.
 *
 * d = x − L (lower bound: at least L) or L − x (upper bound: at most L), L the limit as written.
 * - shared-risk (3GPP TS 38.101-2 §4.1: the minimum requirement relaxed by the test tolerance
 *   TT, the measured value compared as it is): acceptance limit L ∓ TT, pass ⇔ d + TT ≥ 0.  Eq. (D1)
 * - guarded (ILAC-G8:09/2019 §4.2.2, guarded acceptance): acceptance limit L ± w, i.e. moved
 *   into the conforming zone by the guard band w; pass ⇔ d − w ≥ 0. TT is not applied: the
 *   guard band replaces it.                                                              Eq. (D2)
 * - non-binary (ILAC-G8:09/2019 §4.2.3): d ≥ U pass; 0 ≤ d < U conditional pass; −U < d < 0
 *   conditional fail; d ≤ −U fail. The binary outcome is simple acceptance at L (§4.2.1):
 *   pass ⇔ d ≥ 0.                                                                          Eq. (D3)
 * Units: x, L, TT, w, U in the same unit (dB for dB checks). Boundary rule: a value exactly at
 * the acceptance limit passes; exactly at L + U is 'pass'.
 * Cost O(1).
 * @example decideValue(11.5, 11.5, 'lower', { rule: 'guarded', toleranceDb: 0, guardBandDb: 1, expandedDb: 1 }).pass // false
 */
export function decideValue(x: number, limit: number, bound: 'lower' | 'upper',
  p: { rule: DecisionRule; toleranceDb: number; guardBandDb: number; expandedDb: number }): Decision {
  const s = bound === 'lower' ? 1 : -1;
  const d = s * (x - limit);
  const snap = (v: number): number => Math.round(v * 1e9) / 1e9; // as evaluateCheck: float noise cannot flip a verdict
  if (p.rule === 'shared-risk') {
    const margin = snap(d + p.toleranceDb); // Eq. (D1)
    return { acceptanceLimit: snap(limit - s * p.toleranceDb), margin, pass: margin >= 0, statement: margin >= 0 ? 'pass' : 'fail' };
  }
  if (p.rule === 'guarded') {
    const margin = snap(d - p.guardBandDb); // Eq. (D2)
    return { acceptanceLimit: snap(limit + s * p.guardBandDb), margin, pass: margin >= 0, statement: margin >= 0 ? 'pass' : 'fail' };
  }
  const margin = snap(d);
  return { acceptanceLimit: limit, margin, pass: margin >= 0, statement: nonBinary(margin, p.expandedDb) }; // Eq. (D3)
}

/**
 * The non-binary statement for a signed distance d from the limit (positive = conforming side)
 * and expanded uncertainty U (ILAC-G8:09/2019 §4.2.3, Eq. (D3) of decideValue).
 * @example nonBinary(0.2, 1) // 'conditional pass'
 */
export function nonBinary(d: number, expanded: number): ConformityStatement {
  if (d >= expanded) return 'pass';
  if (d >= 0) return 'conditional pass';
  if (d > -expanded) return 'conditional fail';
  return 'fail';
}

/**
 * The same rules for a coverage check (efficiency E(t) at threshold t must reach e_min): a shift
 * of the pattern by δ dB moves the threshold instead, so each rule reads E at a moved threshold
 * (Eq. D4): shared-risk E(t − σ·TT), guarded E(t + σ·w), non-binary zones from E(t + σU),
 * E(t), E(t − σU); σ = +1 when larger is better (eirp, gain), −1 for eis.
 * Returns the decision on the efficiency (margin in fraction of 4π) and the threshold used.
 * Cost: three calls of `efficiencyAt` at most.
 * @example decideCoverage((t) => (t <= 10 ? 0.6 : 0.4), 10, 0.5, 1, { rule: 'guarded', toleranceDb: 0, guardBandDb: 1, expandedDb: 1 }).pass // false
 */
export function decideCoverage(efficiencyAt: (threshold: number) => number, threshold: number, minEfficiency: number,
  sense: 1 | -1, p: { rule: DecisionRule; toleranceDb: number; guardBandDb: number; expandedDb: number }): Decision & { threshold: number; value: number } {
  const snap = (v: number): number => Math.round(v * 1e9) / 1e9;
  const at = (t: number): { t: number; e: number; ok: boolean } => {
    const tt = snap(t);
    const e = efficiencyAt(tt);
    return { t: tt, e, ok: snap(e - minEfficiency) >= 0 };
  };
  if (p.rule !== 'non-binary') {
    const r = at(p.rule === 'shared-risk' ? threshold - sense * p.toleranceDb : threshold + sense * p.guardBandDb); // Eq. (D4)
    const margin = snap(r.e - minEfficiency);
    return { acceptanceLimit: minEfficiency, margin, pass: margin >= 0, statement: margin >= 0 ? 'pass' : 'fail', threshold: r.t, value: r.e };
  }
  const mid = at(threshold);
  let statement: ConformityStatement;
  if (at(threshold + sense * p.expandedDb).ok) statement = 'pass'; // Eq. (D4)
  else if (mid.ok) statement = 'conditional pass';
  else if (at(threshold - sense * p.expandedDb).ok) statement = 'conditional fail';
  else statement = 'fail';
  const margin = snap(mid.e - minEfficiency);
  return { acceptanceLimit: minEfficiency, margin, pass: margin >= 0, statement, threshold: mid.t, value: mid.e };
}
