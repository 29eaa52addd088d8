import type { CoverageMetrics } from '../types.js';
import { metricRow } from './metricRow.js';

export type FrequencyTrendRow = { frequencyHz: number } & Record<string, number | null>;

/**
 * Every metric of one unit against frequency: one `metricRow` per measured frequency, sorted by
 * frequency ascending (equal frequencies keep their input order). A metric missing at some
 * frequency is null in that row, so every row has the same names (for tables and plots).
 * Units: frequencyHz in Hz; metrics as in `metricRow`.
 * Cost O(F log F + F · metrics).
 * @example frequencyTrend([{ frequencyHz: 28e9, metrics }])[0].p50
 */
export function frequencyTrend(entries: { frequencyHz: number; metrics: CoverageMetrics }[]): FrequencyTrendRow[] {
  const rows = entries
    .map((e, k) => ({ k, frequencyHz: e.frequencyHz, row: metricRow(e.metrics) }))
    .sort((a, b) => a.frequencyHz - b.frequencyHz || a.k - b.k);
  const names = [...new Set(rows.flatMap((r) => Object.keys(r.row)))];
  return rows.map((r) => {
    const out: FrequencyTrendRow = { frequencyHz: r.frequencyHz };
    for (const name of names) out[name] = r.row[name] ?? null;
    return out;
  });
}
