/**
 * The metric catalogue: every reported metric's identity, label, unit, sense, formatting and its
 * name in each output (metric rows for reference deltas and the frequency trend, build
 * statistics, summary.csv). results.json, summary.csv, build-stats.csv, the console and the PDFs
 * read it; nothing decodes a key back out of a string: consumers iterate the catalogue's metric
 * instances and look values up by the key the catalogue wrote.
 *
 * A metric is a family (peak, percentile, coverage …) and, for the parametric families, a
 * parameter (the level in %, the threshold in the value unit, dB below the peak, a check name).
 * The output names are frozen by the published files (CONTRACT.md; test/golden keeps them byte
 * for byte), which is why one metric can carry different spellings per output (`p50` in all
 * three, `coverage@8` in rows and statistics but `coverage_at_8` in summary.csv, `trpMaxDbm` in
 * rows but `maxTrp` in statistics).
 *
 * results.json's metric fields of a unit (and of a polarization component) are written here too
 * (unitResultMetrics, componentResultMetrics), and read back by metricsOfUnit.
 *
 * Adding a metric: one entry in FAMILIES below (and, when it needs a new computed value, the
 * field in CoverageMetrics that computeMetrics fills). See DEVELOPERS.md "How to add a metric".
 */
import type { BeamRemoval, CoverageMetrics, PolarizationResult, Quantity, UnitResult } from '../types.js';
import { worstOf } from '../quantity.js';

/** What a metric's number is. 'value': the quantity's unit (dBm or dBi); 'fraction': of 4π. */
export type MetricUnit = 'value' | 'dBm' | 'dB' | 'fraction';

/** Which direction is better: the quantity's sense, always higher, or not a judged direction. */
export type MetricSense = 'quantity' | 'higher' | 'lower' | 'none';

export type MetricFamily =
  | 'peak' | 'percentile' | 'coverage' | 'relativeCoverage' | 'coverageAtLevelLimit'
  | 'trpPeakBeam' | 'trpMax' | 'worstBeamPeak' | 'check' | 'worstMargin';

/** One metric: a family and its parameter (a number for levels and thresholds, a name for checks). */
export interface MetricInstance {
  family: MetricFamily;
  param?: number | string;
  /** For check metrics: the check's margin unit, which decides how the value reads. */
  unit?: MetricUnit;
}

/** A metric and its value for one unit. */
export interface MetricValue {
  metric: MetricInstance;
  value: number | null;
}

interface FamilyDef {
  /** Label in words; `unit` is the value unit of the quantity (dBm, dBi). */
  label: (param: number | string | undefined, unit: string) => string;
  unit: MetricUnit;
  sense: MetricSense;
  /** Key in metric rows (reference deltas, frequency trend); absent: not in rows. */
  rowKey?: (param: number | string | undefined) => string;
  /** Name in build statistics; absent: not in the statistics. */
  statsKey?: (param: number | string | undefined) => string;
  /** Leave the statistics row out when the unit has no value (instead of a count-0 row). */
  statsOnlyWhenDefined?: boolean;
  /** summary.csv column; absent: not a summary column. */
  csvColumn?: (param: number | string | undefined) => string;
}

/** Numbers keep their JavaScript shortest form in names (`p2.5`, `coverage@-88`). */
const num = (p: number | string | undefined): string => String(p);

/**
 * The families, in output order (rows, statistics and summary columns follow this order; within
 * a family, rows keep the order of the settings and statistics sort by the parameter).
 */
const FAMILIES: Record<MetricFamily, FamilyDef> = {
  peak: {
    label: (_, u) => `peak (${u})`, unit: 'value', sense: 'quantity',
    rowKey: () => 'peak', statsKey: () => 'peak',
  },
  percentile: {
    label: (p, u) => `${num(p)} %-tile (${u})`, unit: 'value', sense: 'quantity',
    rowKey: (p) => `p${num(p)}`, statsKey: (p) => `p${num(p)}`, csvColumn: (p) => `p${num(p)}`,
  },
  coverage: {
    label: (p, u) => `coverage ≥ ${num(p)} ${u}`, unit: 'fraction', sense: 'higher',
    rowKey: (p) => `coverage@${num(p)}`, statsKey: (p) => `coverage@${num(p)}`, csvColumn: (p) => `coverage_at_${num(p)}`,
  },
  relativeCoverage: {
    label: (p) => `coverage within ${num(p)} dB of peak`, unit: 'fraction', sense: 'higher',
    rowKey: (p) => `relativeCoverage@${num(p)}dB`, csvColumn: (p) => `coverage_within_${num(p)}db_of_peak`,
  },
  coverageAtLevelLimit: {
    // The share of the sphere at or better than the value the limit set's percentile check asks
    // its level (the parameter, %) to reach; the check passes when it reaches the level's share.
    label: (p) => `coverage at the ${num(p)} %-tile limit`, unit: 'fraction', sense: 'higher',
    rowKey: (p) => `coverageAtLevelLimit@p${num(p)}`, statsKey: (p) => `coverageAtLevelLimit@p${num(p)}`,
    csvColumn: (p) => `coverage_at_p${num(p)}_limit`,
  },
  trpPeakBeam: {
    label: () => 'TRP of the peak beam (dBm)', unit: 'dBm', sense: 'none',
    rowKey: () => 'trpBestBeamDbm',
  },
  trpMax: {
    label: () => 'highest beam TRP (dBm)', unit: 'dBm', sense: 'lower',
    rowKey: () => 'trpMaxDbm', statsKey: () => 'maxTrp', statsOnlyWhenDefined: true,
  },
  worstBeamPeak: {
    label: (_, u) => `weakest beam peak (${u})`, unit: 'value', sense: 'quantity',
    statsKey: () => 'minBeamPeak',
  },
  check: {
    label: (p) => `check: ${String(p)}`, unit: 'value', sense: 'none',
    statsKey: (p) => `check:${String(p)}`,
  },
  worstMargin: {
    label: () => 'worst check margin', unit: 'dB', sense: 'higher',
    statsKey: () => 'worstMargin',
  },
};

/** Order of the families in every output. */
export const FAMILY_ORDER = Object.keys(FAMILIES) as MetricFamily[];

/** Label of a metric in words, for tables and plots. */
export function metricLabel(m: MetricInstance, valueUnit: string): string {
  return FAMILIES[m.family].label(m.param, valueUnit);
}

/** What the metric's number is (value unit, dBm, dB or a fraction of 4π). */
export function metricUnit(m: MetricInstance): MetricUnit {
  return m.unit ?? FAMILIES[m.family].unit;
}

/** Which direction is better for the metric. */
export function metricSense(m: MetricInstance): MetricSense {
  return FAMILIES[m.family].sense;
}

/** Key of the metric in metric rows, or null when rows do not carry it. */
export function rowKey(m: MetricInstance): string | null {
  return FAMILIES[m.family].rowKey?.(m.param) ?? null;
}

/** Name of the metric in build statistics, or null. */
export function statsKey(m: MetricInstance): string | null {
  return FAMILIES[m.family].statsKey?.(m.param) ?? null;
}

/** summary.csv column of the metric, or null. */
export function csvColumn(m: MetricInstance): string | null {
  return FAMILIES[m.family].csvColumn?.(m.param) ?? null;
}

/** Leave the statistics row out when the value is missing. */
export function statsOnlyWhenDefined(m: MetricInstance): boolean {
  return FAMILIES[m.family].statsOnlyWhenDefined === true;
}

/** Fixed decimals, '—' for null/non-finite; '-0.00' printed as '0.00'. */
function fixed(v: number, digits: number): string {
  const s = v.toFixed(digits);
  return /^-0\.?0*$/.test(s) ? s.slice(1) : s;
}

/**
 * A metric value as text: fractions of 4π as percent (`61.2 %`), the rest with two decimals.
 * `delta`: a difference, fractions in percentage points (`1.25 pt`), the rest in dB (`0.50 dB`).
 * `spread`: a standard deviation, fractions in points (`1.2 pt`), the rest as a bare number.
 */
export function formatMetric(m: MetricInstance, v: number | null | undefined, style: 'value' | 'delta' | 'spread' = 'value', digits?: number): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '—';
  const fraction = metricUnit(m) === 'fraction';
  if (style === 'delta') return fraction ? `${fixed(100 * v, digits ?? 2)} pt` : `${fixed(v, digits ?? 2)} dB`;
  if (style === 'spread') return fraction ? `${fixed(100 * v, digits ?? 1)} pt` : fixed(v, digits ?? 2);
  return fraction ? `${fixed(100 * v, digits ?? 1)} %` : fixed(v, digits ?? 2);
}

/**
 * The beam whose peak is the TSP peak: the first beam whose peak is closest to it (the TSP peak
 * is the best beam peak, so this is the first best beam; CONTRACT.md "peak is the best value").
 * -1 without beams. Cost O(beams).
 */
export function peakBeamIndex(m: Pick<CoverageMetrics, 'beams' | 'peak'>): number {
  let best = -1;
  for (let k = 0; k < m.beams.length; k++) {
    const d = Math.abs(m.beams[k].peak.value - m.peak.value);
    if (best < 0 || d < Math.abs(m.beams[best].peak.value - m.peak.value)) best = k;
  }
  return best;
}

/**
 * The catalogued metrics that a unit's metric row carries, with values, in output order: peak,
 * percentiles, coverage, relative coverage, coverage at the percentile limit, TRP of the peak
 * beam, highest TRP.
 * Cost O(metrics + beams).
 */
function rowValues(m: CoverageMetrics): MetricValue[] {
  const out: MetricValue[] = [{ metric: { family: 'peak' }, value: m.peak.value }];
  for (const p of m.percentiles) out.push({ metric: { family: 'percentile', param: p.levelPct }, value: p.value });
  for (const c of m.coverage) out.push({ metric: { family: 'coverage', param: c.threshold }, value: c.efficiency });
  for (const c of m.relativeCoverage) out.push({ metric: { family: 'relativeCoverage', param: c.dbBelowPeak }, value: c.efficiency });
  const ll = m.coverageAtLevelLimit;
  if (ll) out.push({ metric: { family: 'coverageAtLevelLimit', param: ll.levelPct }, value: ll.efficiency });
  const pb = peakBeamIndex(m);
  out.push({ metric: { family: 'trpPeakBeam' }, value: pb < 0 ? null : m.beams[pb].trpDbm });
  const trps = m.beams.map((b) => b.trpDbm).filter((t): t is number => t !== null);
  out.push({ metric: { family: 'trpMax' }, value: trps.length > 0 ? Math.max(...trps) : null }); // TRP is null for every beam or none (computeMetrics)
  return out;
}

/**
 * Every catalogued metric of one unit's coverage metrics with its value, in output order: the
 * row metrics, then the weakest beam peak (needs the quantity's sense). Check and margin metrics
 * come from judgementMetricValues.
 */
export function coverageMetricValues(m: CoverageMetrics, quantity: Quantity): MetricValue[] {
  const out = rowValues(m);
  const peaks = m.beams.map((b) => b.peak.value);
  if (peaks.length) out.push({ metric: { family: 'worstBeamPeak' }, value: worstOf(quantity, peaks) });
  return out;
}

/** The metrics part of a unit result, in the shape the analysis functions take (the inverse of unitResultMetrics). */
export function metricsOfUnit(u: UnitResult): CoverageMetrics {
  return { ...u.tsp, solidAngleSr: u.solidAngleSr, beams: u.beams };
}

/**
 * The metric fields of a unit result (results.json `solidAngleSr`, `beams`, `tsp`) from the unit's
 * coverage metrics, in the published order; metricsOfUnit reads them back. Each beam carries its
 * removal cost (the per-unit analysis; absent with --core-only) and whether it is never the best
 * beam anywhere (bestShare 0).
 */
export function unitResultMetrics(m: CoverageMetrics, removal: readonly (BeamRemoval | undefined)[] = []): Pick<UnitResult, 'solidAngleSr' | 'beams' | 'tsp'> {
  return {
    solidAngleSr: m.solidAngleSr,
    beams: m.beams.map((b, i) => ({ ...b, removal: removal[i], neverBest: b.bestShare === 0 })),
    tsp: {
      peak: m.peak, percentiles: m.percentiles, coverage: m.coverage, relativeCoverage: m.relativeCoverage,
      ...(m.coverageAtLevelLimit ? { coverageAtLevelLimit: m.coverageAtLevelLimit } : {}), // only with a percentile check
      curve: m.curve,
    },
  };
}

/**
 * The metric fields of one θ or φ component of a polarization pair (results.json
 * `polarizations[].tsp` and `.beams`): the summary values without the coverage curve, and per
 * beam its id, peak and best share.
 */
export function componentResultMetrics(m: Pick<CoverageMetrics, 'peak' | 'percentiles' | 'coverage' | 'relativeCoverage' | 'beams'>): Pick<PolarizationResult, 'tsp' | 'beams'> {
  return {
    tsp: { peak: m.peak, percentiles: m.percentiles, coverage: m.coverage, relativeCoverage: m.relativeCoverage },
    beams: m.beams.map((b) => ({ id: b.id, peak: b.peak, bestShare: b.bestShare })),
  };
}

/** The check metrics (one per check, its value) and the worst margin of a judged unit. */
export function judgementMetricValues(u: Pick<UnitResult, 'checks' | 'worstCheck'>): MetricValue[] {
  const out: MetricValue[] = u.checks.map((c) => ({
    metric: { family: 'check', param: c.name, unit: c.marginUnit === 'fraction' ? 'fraction' : 'value' } as MetricInstance,
    value: c.value === null || c.status === 'not-evaluable' ? null : c.value,
  }));
  // In dB for every unit (the family's unit): a coverage check's margin is its dB equivalent, never a share of 4π.
  const w = u.worstCheck;
  out.push({ metric: { family: 'worstMargin' }, value: w ? (w.marginUnit === 'fraction' ? w.marginDb ?? null : w.margin) : null });
  return out;
}

/**
 * The metric row of one unit: row key → value for every metric that rows carry, in output order.
 * Reference deltas and the frequency trend are rows; tables walk rowMetrics() for the labels.
 * @example metricRow(metrics).p50 // the 50 % EIRP, dBm
 */
export function metricRow(m: CoverageMetrics): Record<string, number | null> {
  const row: Record<string, number | null> = {};
  for (const { metric, value } of rowValues(m)) row[rowKey(metric) as string] = value;
  return row;
}

/** The metrics that a unit's rows carry, in order, with their row keys (for tables of rows). */
export function rowMetrics(m: CoverageMetrics): { metric: MetricInstance; key: string }[] {
  return rowValues(m).map(({ metric }) => ({ metric, key: rowKey(metric) as string }));
}

/**
 * The metric behind each build-statistics name, for tables that show the statistics: built by
 * writing the names of the units' metrics (never by reading names back).
 */
export function statsMetricIndex(units: UnitResult[]): Map<string, MetricInstance> {
  const index = new Map<string, MetricInstance>();
  for (const u of units) {
    for (const { metric } of [...coverageMetricValues(metricsOfUnit(u), u.quantity), ...judgementMetricValues(u)]) {
      const k = statsKey(metric);
      if (k !== null && !index.has(k)) index.set(k, metric);
    }
  }
  return index;
}
