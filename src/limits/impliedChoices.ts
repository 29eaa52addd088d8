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
  const checks = ls?.checks ?? [];
  const cov = checks.find((c) => c.kind === 'min-coverage');
  const pct = checks.find((c) => c.kind === 'percentile');
  const threshold = cov?.kind === 'min-coverage' ? cov.threshold
    : pct?.kind === 'percentile' ? pct.limit
    : requestedThresholds.length ? requestedThresholds[0] : null;
  return { threshold, levelPct: pct?.kind === 'percentile' ? pct.levelPct : 50 };
}
