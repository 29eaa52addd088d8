import type { UnitResult } from '../../types.js';
import { quantityLabel, quantityUnit } from '../../quantity.js';
import type { BuildSummary } from '../../types.js';
import { formatMetric, metricLabel, statsMetricIndex } from '../../metrics/catalogue.js';
import { fmt, fmtFrequency, pct } from '../format.js';
import { contentWidth, heading, note, table, type Column, type Doc } from '../pdfDoc.js';

/** Below this many units a Cpk carries a small-sample caution (common process-capability practice asks for 30 or more). */
export const SMALL_SAMPLE_N = 30;

/** Per frequency, quantity and metric: n, mean, σ, min, max, yield and Cpk, labelled from the metric catalogue; a build with
 * more than one quantity names it beside the frequency. */
export function summaryStatistics(doc: Doc, build: BuildSummary, units: UnitResult[]): void {
  heading(doc, 'Statistics per metric', 40);
  const w = contentWidth(doc);
  const cols: Column[] = [
    { header: 'Frequency', width: 62 }, { header: 'Metric', width: w - 392 }, { header: 'n', width: 26, align: 'right' },
    { header: 'Mean', width: 50, align: 'right' }, { header: 'σ', width: 46, align: 'right' }, { header: 'Min', width: 50, align: 'right' },
    { header: 'Max', width: 50, align: 'right' }, { header: 'Yield', width: 52, align: 'right' }, { header: 'Cpk', width: 56, align: 'right' },
  ];
  const metricOf = statsMetricIndex(units);
  const mixed = new Set(build.stats.map((s) => s.quantity)).size > 1;
  table(doc, cols, build.stats.map((s) => {
    const m = metricOf.get(s.metric);
    const f = (v: number | null) => (m ? formatMetric(m, v) : fmt(v));
    const spread = m ? formatMetric(m, s.std, 'spread') : fmt(s.std);
    const yieldText = s.yield === null ? '—' : s.inBuild ? `${s.passedCount}/${s.inBuild} in build` : pct(s.yield, 0);
    const cpk = s.cpk === null ? '—' : `${fmt(s.cpk)}${s.count < SMALL_SAMPLE_N ? ' *' : ''}`;
    const where = mixed ? `${fmtFrequency(s.frequencyHz)} ${quantityLabel(s.quantity)}` : fmtFrequency(s.frequencyHz);
    return [where, m ? metricLabel(m, quantityUnit(s.quantity)) : s.metric, `${s.count}`, f(s.mean), spread, f(s.min), f(s.max), yieldText, cpk];
  }), { fontSize: 7.2 });
  note(doc, 'σ: sample standard deviation (n − 1). Yield: units whose check passed / units in the build (a unit that could not be read counts as not passed). ' +
    'Cpk: min(mean − lower, upper − mean) / 3σ against the same limit as the yield and the verdict: the limit relaxed by the test tolerance ("judged at" in the unit reports). ' +
    `* fewer than ${SMALL_SAMPLE_N} units: a Cpk from a small sample is uncertain — with n = 10, a computed 1.33 has a one-sided 95 % lower confidence bound near 0.8 (Bissell's approximation, from memory); read it as an indication only. ` +
    'Shares of 4π in %, spreads of shares in percentage points; other values in the unit shown.');
}
