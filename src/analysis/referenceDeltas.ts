import type { CoverageMetrics } from '../types.js';
import { metricRow } from './metricRow.js';

/**
 * The difference of every metric between a unit and the reference (golden) unit:
 * Δ = unit − reference (Eq. 1), per name of `metricRow` (peak and percentiles in dB, coverage
 * efficiencies as fractions of 4π, TRP in dB). A metric that either side lacks or could not
 * evaluate gives null. The sign is raw: for eis a positive Δ of a percentile is worse.
 * Names in the unit's order, then names only the reference has.
 * Cost O(metrics + beams).
 * @example referenceDeltas(unit, golden).p50 // −0.8: the unit's median is 0.8 dB below the reference
 */
export function referenceDeltas(unitMetrics: CoverageMetrics, referenceMetrics: CoverageMetrics): Record<string, number | null> {
  const u = metricRow(unitMetrics);
  const r = metricRow(referenceMetrics);
  const out: Record<string, number | null> = {};
  for (const key of new Set([...Object.keys(u), ...Object.keys(r)])) {
    const a = u[key], b = r[key];
    out[key] = a === null || a === undefined || b === null || b === undefined ? null : a - b; // Eq. 1
  }
  return out;
}
