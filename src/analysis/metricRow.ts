import type { CoverageMetrics } from '../types.js';

/**
 * Every scalar metric of one unit as a flat, named row, so that metrics can be differenced
 * (reference unit) and tabulated against frequency under the same names:
 * - `peak`: TSP peak value (dBm/dBi);
 * - `p<level>`: each percentile, e.g. `p50` (null when not evaluable);
 * - `coverage@<threshold>`: coverage efficiency at each absolute threshold, fraction of 4π;
 * - `relativeCoverage@<dB>dB`: coverage efficiency at each threshold relative to the peak;
 * - `trpBestBeamDbm`: TRP of the beam with the best peak (the first such beam on a tie;
 *   null off a full sphere); `trpMaxDbm`: the largest beam TRP.
 * Numbers keep their JavaScript shortest form in the names (`p2.5`, `coverage@-88`).
 * Cost O(metrics + beams).
 * @example metricRow(metrics).p50 // the 50 % EIRP, dBm
 */
export function metricRow(m: CoverageMetrics): Record<string, number | null> {
  const row: Record<string, number | null> = { peak: m.peak.value };
  for (const p of m.percentiles) row[`p${p.levelPct}`] = p.value;
  for (const c of m.coverage) row[`coverage@${c.threshold}`] = c.efficiency;
  for (const c of m.relativeCoverage) row[`relativeCoverage@${c.dbBelowPeak}dB`] = c.efficiency;
  let best = -1;
  for (let k = 0; k < m.beams.length; k++) {
    const d = Math.abs(m.beams[k].peak.value - m.peak.value);
    if (best < 0 || d < Math.abs(m.beams[best].peak.value - m.peak.value)) best = k;
  }
  row.trpBestBeamDbm = best < 0 ? null : m.beams[best].trpDbm;
  const trps = m.beams.map((b) => b.trpDbm).filter((t): t is number => t !== null);
  row.trpMaxDbm = trps.length > 0 ? Math.max(...trps) : null;
  return row;
}
