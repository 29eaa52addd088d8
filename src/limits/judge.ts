import type { CheckResult, CoverageMetrics, Quantity, UnitResult, Verdict } from '../types.js';
import type { LimitSet } from './limitSet.js';
import { evaluateCheck } from './evaluateCheck.js';

export interface JudgeResult {
  checks: CheckResult[];
  verdict: Verdict;
  worstCheck: UnitResult['worstCheck'];
}

/**
 * Judge a unit's metrics against a limit set.
 *
 * Verdict rule: 'fail' if any check fails (even when others are not evaluable — one failure is
 * enough to know); 'pass' only if there is at least one check and every check was evaluated and
 * passed; otherwise 'none' (no checks, or some not evaluable and none failed: a pass cannot be
 * claimed for what was not judged).
 *
 * worstCheck: among evaluated checks, failed ones first, then the smallest margin in dB. A
 * min-coverage check's margin is a fraction of 4π; it is ranked by its dB equivalent (marginDb,
 * Eq. L4 of evaluateCheck) when that level was computed, else by the fraction as a plain number.
 *
 * Cost O(checks × metrics).
 * @example judge(metrics, { ...ls, checks: [] }, { quantity: 'eirp', fullSphere: true }).verdict // 'none'
 */
export function judge(metrics: CoverageMetrics, ls: LimitSet,
  ctx: { quantity: Quantity; fullSphere: boolean }): JudgeResult {
  const checks = ls.checks.map((c) => evaluateCheck(c, metrics, ctx.quantity, ctx.fullSphere, ls.quantity));
  return summarizeChecks(checks);
}

/**
 * The verdict and worst check of judged checks (the rules documented on `judge`); also used when
 * a decision rule re-judges the checks (src/analysis/uncertainty).
 * Cost O(checks).
 * @example summarizeChecks([]).verdict // 'none'
 */
export function summarizeChecks(checks: CheckResult[]): JudgeResult {
  const anyFail = checks.some((c) => c.status === 'fail');
  const allPass = checks.length > 0 && checks.every((c) => c.status === 'pass');
  const verdict: Verdict = anyFail ? 'fail' : allPass ? 'pass' : 'none';
  let worst: CheckResult | null = null;
  const rank = (c: CheckResult): number => (c.marginDb ?? c.margin) as number;
  for (const c of checks) {
    if (c.margin === null) continue;
    if (!worst || (c.pass === false && worst.pass === true)
      || (c.pass === worst.pass && rank(c) < rank(worst))) worst = c;
  }
  return {
    checks,
    verdict,
    worstCheck: worst
      ? { name: worst.name, margin: worst.margin as number, marginUnit: worst.marginUnit ?? 'dB', ...(worst.marginDb === undefined ? {} : { marginDb: worst.marginDb }) }
      : null,
  };
}
