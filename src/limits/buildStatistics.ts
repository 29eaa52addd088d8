import { mean as ssMean, sampleStandardDeviation } from 'simple-statistics';
import type { BuildMetricStats, BuildSummary, UnitNotAnalyzed, UnitResult } from '../types.js';
import { processCapability } from './processCapability.js';
import { worstOf } from '../quantity.js';

interface Series {
  values: number[];
  /** Per judged unit: passed or not (not-evaluable counts as not passed). */
  judged: boolean[];
  limits: Set<number>;
  bound?: 'lower' | 'upper';
}

/**
 * Statistics across the units of a build, per frequency and metric.
 *
 * Metrics: `peak`, `p<level>` per percentile, `coverage@<threshold>` per absolute coverage
 * threshold, `maxTrp` (largest beam TRP; full-sphere units only), `minBeamPeak` (worst beam
 * peak: lowest for eirp/gain, highest for eis), one `check:<name>` row per check (the check's
 * value), and `worstMargin` (the unit's worst-check margin).
 * - mean: arithmetic mean of the dB values (common practice for a build summary);
 *   std: sample standard deviation (n − 1 denominator, simple-statistics
 *   sampleStandardDeviation), null below two values.
 * - yield, lowerLimit/upperLimit, cpk: on `check:` rows only (the raw metric rows carry none).
 *   yield = units whose check passed / units that carry the check (a not-evaluable check is
 *   not a pass). Cpk uses the limit as written, without the test tolerance: it describes the
 *   product against the requirement, while the tolerance is a measurement allowance used only
 *   for the verdict. Limits differing between units (mixed limit sets) give no limit and no Cpk.
 * - yieldInBuild (check rows): passed / units in the build at that frequency, where a unit that
 *   could not be read (frequency unknown) belongs to every frequency: a damaged export can
 *   only lower it. `judged` and `inBuild` state both denominators.
 * - units/passed/failed/notJudged/errored count distinct units: a unit with any part that could
 *   not be read or analyzed is "errored"; otherwise it fails if any of its frequencies fails,
 *   passes if all its frequencies pass, else is not judged. passed + failed + notJudged +
 *   errored = unitsInBuild.
 * Rows are ordered by frequency (ascending, no-frequency last), then by the metric order above.
 *
 * Cost O(units × metrics).
 * @example buildStatistics([]) // { units: 0, unitsInBuild: 0, passed: 0, failed: 0, notJudged: 0, errored: 0, stats: [] }
 */
export function buildStatistics(units: UnitResult[], notAnalyzed: UnitNotAnalyzed[] = []): BuildSummary {
  const byFreq = new Map<number | null, Map<string, Series>>();
  const series = (f: number | null, key: string): Series => {
    let m = byFreq.get(f);
    if (!m) byFreq.set(f, (m = new Map()));
    let s = m.get(key);
    if (!s) m.set(key, (s = { values: [], judged: [], limits: new Set() }));
    return s;
  };
  for (const u of units) {
    const f = u.frequencyHz;
    const add = (key: string, v: number | null): void => {
      const s = series(f, key); // created even when v is null so the row shows count 0
      if (v !== null && Number.isFinite(v)) s.values.push(v);
    };
    add('peak', u.tsp.peak.value);
    for (const p of u.tsp.percentiles) add(`p${p.levelPct}`, p.value);
    for (const c of u.tsp.coverage) add(`coverage@${c.threshold}`, c.efficiency);
    const trps = u.beams.map((b) => b.trpDbm);
    if (trps.length && trps.every((t) => t !== null)) add('maxTrp', Math.max(...(trps as number[])));
    const peaks = u.beams.map((b) => b.peak.value);
    if (peaks.length) add('minBeamPeak', worstOf(u.quantity, peaks));
    for (const c of u.checks) {
      const s = series(f, `check:${c.name}`);
      if (c.value !== null && c.status !== 'not-evaluable') s.values.push(c.value);
      s.judged.push(c.status === 'pass');
      s.limits.add(c.limit);
      s.bound ??= c.bound;
    }
    add('worstMargin', u.worstCheck ? u.worstCheck.margin : null);
  }
  const stats: BuildMetricStats[] = [];
  const freqs = [...byFreq.keys()].sort((a, b) => (a === null ? 1 : b === null ? -1 : a - b));
  for (const f of freqs) {
    const rows = [...(byFreq.get(f) as Map<string, Series>)];
    rows.sort((a, b) => metricRank(a[0]) - metricRank(b[0]));
    const errored = new Set(notAnalyzed.filter((e) => e.frequencyHz === null || e.frequencyHz === f).map((e) => e.unit)).size;
    for (const [metric, s] of rows) stats.push(row(f, metric, s, errored));
  }
  return { ...countUnits(units, notAnalyzed), stats };
}

/** Stable order: peak, percentiles, coverage, TRP, beam peak, checks (insertion order), margin. */
function metricRank(key: string): number {
  if (key === 'peak') return 0;
  if (/^p\d/.test(key)) return 1e3 + Number(key.slice(1));
  if (key.startsWith('coverage@')) return 2e6 + Number(key.slice(9));
  if (key === 'maxTrp') return 5e6;
  if (key === 'minBeamPeak') return 6e6;
  if (key === 'worstMargin') return 9e9;
  return 7e6; // checks: Array.prototype.sort is stable, so they keep the limit-set order
}

function row(frequencyHz: number | null, metric: string, s: Series, errored: number): BuildMetricStats {
  const n = s.values.length;
  const mean = n ? ssMean(s.values) : null;
  const std = n >= 2 ? sampleStandardDeviation(s.values) : null;
  const isCheck = metric.startsWith('check:');
  const limit = isCheck && s.limits.size === 1 ? [...s.limits][0] : null;
  const bound = s.bound ?? null;
  const passed = s.judged.filter(Boolean).length;
  const inBuild = s.judged.length + errored;
  return {
    frequencyHz, metric, count: n, mean, std,
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
