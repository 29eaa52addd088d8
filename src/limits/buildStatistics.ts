import { mean as ssMean, sampleStandardDeviation } from 'simple-statistics';
import type { BuildMetricStats, BuildSummary, UnitNotAnalyzed, UnitResult } from '../types.js';
import { QUANTITIES, type Quantity } from '../quantity.js';
import { processCapability } from './processCapability.js';
import { coverageMetricValues, FAMILY_ORDER, judgementMetricValues, metricsOfUnit, metricUnit, statsKey, statsOnlyWhenDefined, type MetricInstance } from '../metrics/catalogue.js';

interface Series {
  metric: MetricInstance;
  values: number[];
  /** Per judged unit: passed or not (not-evaluable counts as not passed). */
  judged: boolean[];
  limits: Set<number>;
  bound?: 'lower' | 'upper';
  kind?: 'dB' | 'fraction';
}

/**
 * Statistics across the units of a build, per frequency, quantity and metric: the EIRP and the
 * EIS results of one frequency are separate rows (a mean over dBm of transmit power and of
 * receive sensitivity would mean nothing).
 *
 * Metrics: the metric catalogue's statistics metrics (src/metrics/catalogue.ts), by name:
 * `peak`, `p<level>` per percentile, `coverage@<threshold>` per absolute coverage
 * threshold, `maxTrp` (largest beam TRP; full-sphere units only), `minBeamPeak` (worst beam
 * peak: lowest for eirp/gain, highest for eis), one `check:<name>` row per check (the check's
 * value), and `worstMargin` (the unit's worst-check margin in dB; for a coverage check its dB
 * equivalent, so the row never mixes dB and shares). `valueKind` says whether a row's values
 * are in dB or a fraction of 4π.
 * - mean: arithmetic mean of the dB values (common practice for a build summary);
 *   std: sample standard deviation (n − 1 denominator, simple-statistics
 *   sampleStandardDeviation), null below two values.
 * - yield, lowerLimit/upperLimit, cpk: on `check:` rows only (the raw metric rows carry none).
 *   yield = units whose check passed / units that carry the check (a not-evaluable check is
 *   not a pass). Cpk uses the same limit as the yield and the verdict: the limit relaxed by the
 *   test tolerance ("judged at"), so that the two figures of one row never disagree about what
 *   passing means; lowerLimit/upperLimit report that limit. Limits differing between units
 *   (mixed limit sets) give no limit and no Cpk.
 * - yieldInBuild (check rows): passed / units in the build at that frequency, where a unit that
 *   could not be read (frequency unknown) belongs to every frequency: a damaged export can
 *   only lower it. `judged` and `inBuild` state both denominators.
 * - units/passed/failed/notJudged/errored count distinct units: a unit with any part that could
 *   not be read or analyzed is "errored"; otherwise it fails if any of its frequencies fails,
 *   passes if all its frequencies pass, else is not judged. passed + failed + notJudged +
 *   errored = unitsInBuild.
 * Rows are ordered by frequency (ascending, no-frequency last), then quantity (the order of
 * QUANTITIES), then by the metric order above.
 *
 * Cost O(units × metrics).
 * @example buildStatistics([]) // { units: 0, unitsInBuild: 0, passed: 0, failed: 0, notJudged: 0, errored: 0, stats: [] }
 */
export function buildStatistics(units: UnitResult[], notAnalyzed: UnitNotAnalyzed[] = []): BuildSummary {
  const groups = new Map<string, { frequencyHz: number | null; quantity: Quantity; series: Map<string, Series> }>();
  const series = (u: UnitResult, metric: MetricInstance): Series => {
    const key = statsKey(metric) as string;
    const gk = `${u.frequencyHz}|${u.quantity}`;
    let g = groups.get(gk);
    if (!g) groups.set(gk, (g = { frequencyHz: u.frequencyHz, quantity: u.quantity, series: new Map() }));
    let s = g.series.get(key);
    if (!s) g.series.set(key, (s = { metric, values: [], judged: [], limits: new Set(), kind: metricUnit(metric) === 'fraction' ? 'fraction' : 'dB' }));
    return s;
  };
  for (const u of units) {
    for (const { metric, value } of coverageMetricValues(metricsOfUnit(u), u.quantity)) {
      if (statsKey(metric) === null || (value === null && statsOnlyWhenDefined(metric))) continue;
      const s = series(u, metric); // created even when the value is null so the row shows count 0
      if (value !== null && Number.isFinite(value)) s.values.push(value);
    }
    const judgement = judgementMetricValues(u);
    u.checks.forEach((c, k) => {
      const s = series(u, judgement[k].metric);
      if (judgement[k].value !== null) s.values.push(judgement[k].value as number);
      s.judged.push(c.status === 'pass');
      s.limits.add(c.effectiveLimit);
      s.bound ??= c.bound;
    });
    const margin = judgement[judgement.length - 1];
    const s = series(u, margin.metric);
    if (margin.value !== null && Number.isFinite(margin.value)) s.values.push(margin.value);
  }
  const stats: BuildMetricStats[] = [];
  const ordered = [...groups.values()].sort((a, b) => frequencyOrder(a.frequencyHz, b.frequencyHz) || QUANTITIES.indexOf(a.quantity) - QUANTITIES.indexOf(b.quantity));
  for (const g of ordered) {
    const rows = [...g.series].sort((a, b) => outputOrder(a[1].metric, b[1].metric));
    const errored = new Set(notAnalyzed.filter((e) => e.frequencyHz === null || e.frequencyHz === g.frequencyHz).map((e) => e.unit)).size;
    for (const [key, s] of rows) stats.push(row(g.frequencyHz, g.quantity, key, s, errored));
  }
  return { ...countUnits(units, notAnalyzed), stats };
}

/** Ascending frequency, the rows without a frequency last. */
function frequencyOrder(a: number | null, b: number | null): number {
  return a === b ? 0 : a === null ? 1 : b === null ? -1 : a - b;
}

/** Catalogue order of the families; inside a numeric family by parameter; checks keep the limit-set order (stable sort). */
function outputOrder(a: MetricInstance, b: MetricInstance): number {
  const fa = FAMILY_ORDER.indexOf(a.family), fb = FAMILY_ORDER.indexOf(b.family);
  if (fa !== fb) return fa - fb;
  return typeof a.param === 'number' && typeof b.param === 'number' ? a.param - b.param : 0;
}

function row(frequencyHz: number | null, quantity: Quantity, metric: string, s: Series, errored: number): BuildMetricStats {
  const n = s.values.length;
  const mean = n ? ssMean(s.values) : null;
  const std = n >= 2 ? sampleStandardDeviation(s.values) : null;
  const isCheck = s.metric.family === 'check';
  const limit = isCheck && s.limits.size === 1 ? [...s.limits][0] : null;
  const bound = s.bound ?? null;
  const passed = s.judged.filter(Boolean).length;
  const inBuild = s.judged.length + errored;
  return {
    frequencyHz, quantity, metric, valueKind: s.kind ?? 'dB', count: n, mean, std,
    min: n ? Math.min(...s.values) : null,
    max: n ? Math.max(...s.values) : null,
    yield: isCheck && s.judged.length ? passed / s.judged.length : null,
    ...(isCheck ? { passedCount: passed, judged: s.judged.length, inBuild, yieldInBuild: inBuild ? passed / inBuild : null } : {}),
    lowerLimit: limit !== null && bound === 'lower' ? limit : null,
    upperLimit: limit !== null && bound === 'upper' ? limit : null,
    cpk: limit !== null && bound && mean !== null ? processCapability(mean, std, limit, bound) : null,
  };
}

function countUnits(units: UnitResult[], notAnalyzed: UnitNotAnalyzed[]): Omit<BuildSummary, 'stats'> {
  const verdicts = new Map<string, string[]>();
  for (const u of units) verdicts.set(u.unit, [...(verdicts.get(u.unit) ?? []), u.verdict]);
  const analyzed = verdicts.size;
  for (const e of notAnalyzed) verdicts.set(e.unit, [...(verdicts.get(e.unit) ?? []), 'error']);
  let passed = 0, failed = 0, notJudged = 0, errored = 0;
  for (const v of verdicts.values()) {
    if (v.includes('error')) errored++;
    else if (v.includes('fail')) failed++;
    else if (v.every((x) => x === 'pass')) passed++;
    else notJudged++;
  }
  return { units: analyzed, unitsInBuild: verdicts.size, passed, failed, notJudged, errored };
}
