import type { CheckResult, UnitResult } from '../types.js';
import { fmt } from './format.js';
import type { LimitMark } from './plots.js';

/**
 * Limits drawable on the value axis of a TSP CDF, at the value the verdict uses (relaxed by the
 * test tolerance). Coverage and TRP checks are in other units, and a per-beam limit
 * (min-beam-peak) is on another quantity than the TSP: neither is drawn there.
 */
export function cdfLimitMarks(checks: CheckResult[]): LimitMark[] {
  const out: LimitMark[] = [];
  for (const c of checks) {
    if (c.kind === 'percentile') out.push({ label: `${c.name}: ${fmt(c.effectiveLimit)}`, value: c.effectiveLimit, levelPct: c.levelPct });
    else if (c.kind === 'min-peak' || c.kind === 'max-peak') out.push({ label: `${c.name}: ${fmt(c.effectiveLimit)}`, value: c.effectiveLimit });
  }
  return out;
}

/** The distinct limits over all units (same label and level: drawn once on the overlaid CDFs). */
export function distinctLimitMarks(units: UnitResult[]): LimitMark[] {
  const seen = new Map<string, LimitMark>();
  for (const u of units) for (const l of cdfLimitMarks(u.checks)) seen.set(`${l.label}|${l.levelPct ?? ''}`, l);
  return [...seen.values()];
}
