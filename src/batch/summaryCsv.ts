/**
 * summary.csv (one row per unit and frequency) and build-stats.csv (per frequency and metric).
 */
import type { BuildSummary, UnitNotAnalyzed, UnitResult } from '../types.js';
import { errorLocation, errorMessage } from '../report/unitStatus.js';
import { confidenceColumns } from '../analysis/uncertainty/confidenceColumns.js';
import { toCsv, type CsvCell } from './csv.js';
import { coverageMetricValues, csvColumn, FAMILY_ORDER, metricsOfUnit, metricUnit, peakBeamIndex, type MetricInstance, type MetricValue } from '../metrics/catalogue.js';
import { roundForCsv as r } from './csvResolution.js';

/** CSV resolution of a metric's number: shares of 4π at 1e-4, everything else (dB, dBm, dBi) at 0.01. */
function scaleOf(m: MetricInstance): 'fraction' | 'dB' {
  return metricUnit(m) === 'fraction' ? 'fraction' : 'dB';
}

/**
 * The metric columns of summary.csv: every catalogued metric with a CSV column, the union over
 * all units in first-seen order within each family, families in catalogue order (every unit of
 * one run normally has the same lists); a unit without a column leaves it empty.
 */
function metricColumns(perUnit: Map<string, MetricValue>[]): string[] {
  const cols = new Map<string, MetricValue['metric']>();
  for (const m of perUnit) for (const [col, v] of m) if (!cols.has(col)) cols.set(col, v.metric);
  return [...cols].sort((a, b) => FAMILY_ORDER.indexOf(a[1].family) - FAMILY_ORDER.indexOf(b[1].family)).map(([c]) => c);
}

/**
 * The verdict as the summary shows it: a verdict reached on a partial sphere says so
 * ("pass (partial sphere)"), so a unit judged without part of the sphere is never a bare pass.
 */
function verdictCell(u: UnitResult): string {
  return u.verdict !== 'none' && !u.grid.fullSphere ? `${u.verdict} (partial sphere)` : u.verdict;
}

/**
 * Rows of summary.csv, one per analyzed unit and frequency and one per unit that could not be
 * read or analyzed (verdict `error`, with its first error's location and message; its metric
 * cells are empty). Rows are sorted by unit, then frequency. Metric columns come from the metric
 * catalogue (see metricColumns). Text cells are neutralized against formula injection (csv.ts).
 */
export function summaryCsv(units: UnitResult[], notAnalyzed: UnitNotAnalyzed[] = []): string {
  const perUnit = units.map((u) => {
    const m = new Map<string, MetricValue>();
    for (const v of coverageMetricValues(metricsOfUnit(u), u.quantity)) {
      const col = csvColumn(v.metric);
      if (col !== null && !m.has(col)) m.set(col, v);
    }
    return m;
  });
  const columns = metricColumns(perUnit);
  const sure = confidenceColumns(units); // issue 17: only when a unit carries a measurement uncertainty
  const header = [
    'unit', 'frequency_hz', 'quantity', 'value_unit', 'beams', 'points', 'measured_solid_angle_sr', 'measured_fraction',
    'peak', 'peak_theta_deg', 'peak_phi_deg',
    ...columns,
    'peak_beam', 'peak_beam_trp_dbm', 'verdict', 'checks_failed', 'checks_not_evaluable', 'worst_check', 'worst_margin', 'worst_margin_unit', 'worst_margin_db',
    'full_sphere', 'unmeasured_sr', 'missing_points', 'warnings', 'error_location', 'error_message',
  ];
  // θ/φ pairs (src/batch/polarizationUnits.ts): each polarization's own peak, levels and verdict,
  // after the unit's metric columns (before full_sphere; the error columns stay last).
  const pols = units.some((u) => u.polarizations?.length) ? (['theta', 'phi'] as const) : [];
  const levels = [...new Set(units.flatMap((u) => u.polarizations?.flatMap((p) => p.tsp.percentiles.map((x) => x.levelPct)) ?? []))];
  header.splice(header.indexOf('full_sphere'), 0, ...(pols.length ? ['polarization_rule', 'limiting_polarization'] : []),
    ...pols.flatMap((p) => [`${p}_peak`, ...levels.map((l) => `${p}_p${String(l)}`), `${p}_verdict`]));
  header.splice(header.indexOf('full_sphere'), 0, ...sure.header);
  type Keyed = { unit: string; f: number | null; row: CsvCell[] };
  const keyed: Keyed[] = units.map((u, k) => {
    const pb = u.beams[peakBeamIndex(metricsOfUnit(u))] ?? null;
    const polCells: CsvCell[] = pols.length ? [u.polarizationRule ?? null, u.limitingPolarization ?? null] : [];
    for (const p of pols) {
      const pr = u.polarizations?.find((x) => x.name === p);
      polCells.push(r(pr?.tsp.peak.value, 'dB'), ...levels.map((l) => r(pr?.tsp.percentiles.find((x) => x.levelPct === l)?.value, 'dB')), pr?.verdict ?? null);
    }
    const row: CsvCell[] = [
      u.unit, r(u.frequencyHz, 'hz'), u.quantity, u.valueUnit, u.beams.length, u.grid.points, r(u.solidAngleSr, 'sr'), r(u.solidAngleSr / (4 * Math.PI), 'fraction'),
      r(u.tsp.peak.value, 'dB'), r(u.tsp.peak.thetaDeg, 'deg'), r(u.tsp.peak.phiDeg, 'deg'),
      ...columns.map((c) => { const v = perUnit[k].get(c); return v ? r(v.value, scaleOf(v.metric)) : null; }),
      pb?.id ?? null, r(pb?.trpDbm, 'dB'), verdictCell(u),
      u.checks.filter((c) => c.status === 'fail').length, u.checks.filter((c) => c.status === 'not-evaluable').length,
      u.worstCheck?.name ?? null, r(u.worstCheck?.margin, u.worstCheck?.marginUnit === 'fraction' ? 'fraction' : 'dB'), u.worstCheck ? u.worstCheck.marginUnit ?? 'dB' : null,
      r(u.worstCheck ? (u.worstCheck.marginUnit === 'fraction' ? u.worstCheck.marginDb ?? null : u.worstCheck.margin) : null, 'dB'),
      ...polCells,
      ...sure.cells(u),
      u.grid.fullSphere ? 'yes' : 'no', r(u.grid.fullSphere ? 0 : 4 * Math.PI - u.solidAngleSr, 'sr'), u.grid.missing?.length ?? 0, u.warnings?.length ?? 0, null, null,
    ];
    return { unit: u.unit, f: u.frequencyHz, row };
  });
  const firstVerdict = header.indexOf('verdict');
  for (const e of notAnalyzed) {
    const row: CsvCell[] = header.map(() => null);
    row[0] = e.unit;
    row[1] = r(e.frequencyHz, 'hz');
    row[firstVerdict] = 'error';
    row[header.length - 2] = errorLocation(e.error);
    row[header.length - 1] = errorMessage(e.error);
    keyed.push({ unit: e.unit, f: e.frequencyHz, row });
  }
  keyed.sort((a, b) => (a.unit < b.unit ? -1 : a.unit > b.unit ? 1 : (a.f ?? -1) - (b.f ?? -1)));
  return toCsv(header, keyed.map((k) => k.row));
}

/**
 * build-stats.csv: one row per frequency, quantity and metric of the build summary, numbers at the
 * resolution of csvResolution.ts (shares and yields 1e-4, dB 0.01, Cpk 0.01). `yield` is passed /
 * judged; `yield_in_build` is passed / units in the build (a unit that could not be read counts).
 */
export function buildStatsCsv(build: BuildSummary | null): string {
  const header = ['frequency_hz', 'quantity', 'metric', 'count', 'mean', 'std', 'min', 'max', 'yield', 'lower_limit', 'upper_limit', 'cpk',
    'passed', 'judged', 'in_build', 'yield_in_build'];
  const rows: CsvCell[][] = (build?.stats ?? []).map((s) => {
    const v = s.valueKind === 'fraction' ? 'fraction' : 'dB';
    return [
      r(s.frequencyHz, 'hz'), s.quantity, s.metric, s.count, r(s.mean, v), r(s.std, v), r(s.min, v), r(s.max, v), r(s.yield, 'fraction'),
      r(s.lowerLimit, v), r(s.upperLimit, v), r(s.cpk, 'cpk'),
      s.passedCount ?? null, s.judged ?? null, s.inBuild ?? null, r(s.yieldInBuild, 'fraction'),
    ];
  });
  return toCsv(header, rows);
}
