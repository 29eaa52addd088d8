import type { AnalysisThreshold, LevelLimit, Quantity } from '../types.js';
import type { LimitSet } from './limitSet.js';

/** The choices a limit set implies for the optional analysis and the report. */
export interface ImpliedChoices {
  /**
   * The one coverage threshold (value unit) of the run's analysis: the hole search, beam removal's
   * covered share, the map contour and the viewer all use it. null: no threshold anywhere.
   */
  threshold: number | null;
  /** The one CDF level (%) that beam removal, the smallest subset and the trend plot follow. */
  levelPct: number;
}

/**
 * The one place that derives the level and threshold a limit set implies (DESIGN.md
 * "limit-implied choices"), so holes, contour, subset, removal, trend and reports agree.
 *
 * threshold: the first min-coverage check's threshold as written (the requirement, without the
 * test tolerance, which only relaxes the verdict); else the first percentile check's limit
 * (the value the requirement asks the level to reach); else the first requested coverage
 * threshold; else null. levelPct: the first percentile check's level, else 50 % (the median,
 * our default). Cost O(checks).
 * @example impliedChoices(null, [8, 14]) // { threshold: 8, levelPct: 50 }
 */
export function impliedChoices(ls: Pick<LimitSet, 'checks'> | null | undefined, requestedThresholds: number[]): ImpliedChoices {
  return {
    threshold: analysisThreshold(ls, requestedThresholds)?.value ?? null,
    levelPct: impliedLevelPct(ls?.checks ?? []),
  };
}

/**
 * The limit set whose values may steer a measurement's analysis: the set itself when it is for
 * the measurement's quantity, else null. A set written for EIRP judges nothing of an EIS unit
 * (evaluateCheck: not evaluable), so its dBm values must not become that unit's hole threshold,
 * contour or coverage-at-limit either: in a build with EIRP and EIS units the EIS units take the
 * requested thresholds instead. The CDF level (a share of the sphere, not a value) is kept.
 * @example limitSetFor({ quantity: 'eirp', checks: [] }, 'eis') // null
 */
export function limitSetFor<T extends Pick<LimitSet, 'quantity'>>(ls: T | null | undefined, quantity: Quantity): T | null {
  return ls && ls.quantity === quantity ? ls : null;
}

/**
 * The level part of impliedChoices on its own, for a reader that holds checks but not the limit
 * set (the report reads the judged checks of a result): the first percentile check's level, else
 * 50 %. Limit-set checks and judged checks both carry `kind` and, for percentile checks, `levelPct`.
 * @example impliedLevelPct([{ kind: 'min-peak' }, { kind: 'percentile', levelPct: 20 }]) // 20
 */
export function impliedLevelPct(checks: readonly { kind: string; levelPct?: number }[]): number {
  return checks.find((c) => c.kind === 'percentile')?.levelPct ?? 50;
}

/**
 * The analysis threshold with where it comes from and whether a test tolerance relaxes it, as
 * results.json records it per unit and the report's caption states it (one value for holes and
 * the map contour). The selection is impliedChoices' (above); the tolerance is never applied:
 * holes and contour show the requirement as written, while the verdict alone is relaxed.
 * null when neither the limit set nor the request names a threshold. Cost O(checks).
 * @example analysisThreshold(null, [8]) // { value: 8, source: 'requested', toleranceApplied: false }
 */
export function analysisThreshold(ls: Pick<LimitSet, 'checks'> | null | undefined, requestedThresholds: number[]): AnalysisThreshold | null {
  const checks = ls?.checks ?? [];
  const cov = checks.find((c) => c.kind === 'min-coverage');
  if (cov?.kind === 'min-coverage') return { value: cov.threshold, source: 'min-coverage-check', toleranceApplied: false };
  const pct = checks.find((c) => c.kind === 'percentile');
  if (pct?.kind === 'percentile') return { value: pct.limit, source: 'percentile-check', toleranceApplied: false };
  if (requestedThresholds.length) return { value: requestedThresholds[0], source: 'requested', toleranceApplied: false };
  return null;
}

/**
 * The level and value of the limit set's percentile requirement: the first percentile check's
 * level (the same check impliedChoices takes its level from) and its limit as written — the
 * EIRP/EIS value the requirement asks that level to reach, without the test tolerance (as
 * analysisThreshold). The coverage efficiency at this value is the catalogue's
 * `coverageAtLevelLimit` metric. null when the limit set has no percentile check.
 * Cost O(checks).
 * @example percentileLimit({ checks: [{ kind: 'percentile', name: 'p50', levelPct: 50, limit: 11.5 }] }) // { levelPct: 50, threshold: 11.5 }
 */
export function percentileLimit(ls: Pick<LimitSet, 'checks'> | null | undefined): LevelLimit | null {
  const pct = (ls?.checks ?? []).find((c) => c.kind === 'percentile');
  return pct?.kind === 'percentile' ? { levelPct: pct.levelPct, threshold: pct.limit } : null;
}
