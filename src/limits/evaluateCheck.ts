import type { CheckResult, CoverageMetrics, Quantity } from '../types.js';
import type { LimitCheck } from './limitSet.js';
import { kindDef, snap, type CheckOf } from './checkKinds.js';

/** Margins are rounded to 1e-9 (a nano-dB) so float noise of limit − tolerance cannot flip a verdict at the limit. */
export { snap } from './checkKinds.js';

/**
 * Judge one check against a unit's metrics.
 *
 * Effective limit (Eq. L1): lower-bound checks limit − tol, upper-bound checks limit + tol;
 * margin (Eq. L2): value − effectiveLimit (lower) or effectiveLimit − value (upper);
 * pass ⇔ margin ≥ 0 (at the limit passes). min-coverage instead relaxes the threshold by the
 * tolerance (Eq. L3: t − tol for eirp/gain, t + tol for eis) and judges the efficiency there
 * against minEfficiency, margin in fraction of 4π. A value that cannot be had (partial sphere
 * for TRP, a percentile in the unmeasured part, a level or threshold not computed, a beam
 * missing, a quantity mismatch) gives status 'not-evaluable', pass null — never a pass.
 *
 * Cost O(beams + percentiles + coverage points).
 * @example evaluateCheck({ kind: 'min-peak', name: 'p', limit: 20, toleranceDb: 1 }, m, 'eirp', true)
 *   // m.peak.value 19.5 → effectiveLimit 19, margin 0.5, pass
 */
export function evaluateCheck(check: LimitCheck, metrics: CoverageMetrics, quantity: Quantity,
  fullSphere: boolean, limitSetQuantity: Quantity = quantity): CheckResult {
  const def = kindDef(check.kind);
  const bound = def.bound(quantity);
  const tol = check.toleranceDb;
  const isFraction = def.marginUnit === 'fraction';
  const limit = def.limitOf(check as CheckOf<typeof check.kind>);
  const effectiveLimit = isFraction ? limit : snap(bound === 'lower' ? limit - tol : limit + tol); // Eq. L1
  const base: CheckResult = {
    name: check.name, kind: check.kind, value: null, limit, toleranceDb: tol, effectiveLimit,
    margin: null, pass: null, status: 'not-evaluable', bound, marginUnit: def.marginUnit,
    ...(check.source ? { source: check.source } : {}),
  };
  const notEvaluable = (note: string, extra: Partial<CheckResult> = {}): CheckResult => ({ ...base, note, ...extra });
  if (limitSetQuantity !== quantity) return notEvaluable(`limit set is for ${limitSetQuantity}, measurement is ${quantity}`);
  if (!def.appliesTo(quantity)) return notEvaluable(`${check.kind} does not apply to ${quantity}`);
  const e = def.evaluate(check as CheckOf<typeof check.kind>, metrics, { quantity, fullSphere, bound });
  if ('notEvaluable' in e) return notEvaluable(e.notEvaluable, e.extra);
  const margin = snap(bound === 'lower' ? e.value - effectiveLimit : effectiveLimit - e.value); // Eq. L2
  const pass = margin >= 0;
  return { ...base, ...e.extra, value: e.value, margin, pass, status: pass ? 'pass' : 'fail' };
}

export { coverageLevelPct } from './checkKinds.js';
