/**
 * summary.csv (one row per unit and frequency) and build-stats.csv (per frequency and metric).
 */
import type { BuildSummary, UnitNotAnalyzed, UnitResult } from '../types.js';
import { errorLocation, errorMessage } from '../report/unitStatus.js';
import { toCsv, type CsvCell } from './csv.js';
import { isBetter } from '../quantity.js';

/** Column label of a number: `-88` → `-88`, `12.5` → `12.5` (shortest round trip). */
function num(x: number): string {
  return String(x);
}

/** The beam that gives the TSP peak (the first beam whose peak equals it), else null. */
function peakBeam(u: UnitResult): UnitResult['beams'][number] | null {
  let best: UnitResult['beams'][number] | null = null;
  for (const b of u.beams) {
    const better = best === null || isBetter(u.quantity, b.peak.value, best.peak.value);
    if (better) best = b;
  }
  return best;
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
 * cells are empty). Rows are sorted by unit, then frequency. The percentile and coverage columns are the union over all units in
 * first-seen order (every unit of one run normally has the same lists); a unit without a
 * column leaves it empty. Text cells are neutralized against formula injection (csv.ts).
 */
export function summaryCsv(units: UnitResult[], notAnalyzed: UnitNotAnalyzed[] = []): string {
  const levels: number[] = [];
  const thresholds: number[] = [];
  const rel: number[] = [];
  for (const u of units) {
    for (const p of u.tsp.percentiles) if (!levels.includes(p.levelPct)) levels.push(p.levelPct);
    for (const c of u.tsp.coverage) if (!thresholds.includes(c.threshold)) thresholds.push(c.threshold);
    for (const c of u.tsp.relativeCoverage) if (!rel.includes(c.dbBelowPeak)) rel.push(c.dbBelowPeak);
  }
  const header = [
    'unit', 'frequency_hz', 'quantity', 'value_unit', 'beams', 'points', 'measured_solid_angle_sr', 'measured_fraction',
    'peak', 'peak_theta_deg', 'peak_phi_deg',
    ...levels.map((l) => `p${num(l)}`),
    ...thresholds.map((t) => `coverage_at_${num(t)}`),
    ...rel.map((d) => `coverage_within_${num(d)}db_of_peak`),
    'peak_beam', 'peak_beam_trp_dbm', 'verdict', 'checks_failed', 'checks_not_evaluable', 'worst_check', 'worst_margin', 'worst_margin_unit', 'worst_margin_db',
    'full_sphere', 'unmeasured_sr', 'missing_points', 'warnings', 'error_location', 'error_message',
  ];
  type Keyed = { unit: string; f: number | null; row: CsvCell[] };
  const keyed: Keyed[] = units.map((u) => {
    const pb = peakBeam(u);
    const row: CsvCell[] = [
      u.unit, u.frequencyHz, u.quantity, u.valueUnit, u.beams.length, u.grid.points, u.solidAngleSr, u.solidAngleSr / (4 * Math.PI),
      u.tsp.peak.value, u.tsp.peak.thetaDeg, u.tsp.peak.phiDeg,
      ...levels.map((l) => u.tsp.percentiles.find((p) => p.levelPct === l)?.value ?? null),
      ...thresholds.map((t) => u.tsp.coverage.find((c) => c.threshold === t)?.efficiency ?? null),
      ...rel.map((d) => u.tsp.relativeCoverage.find((c) => c.dbBelowPeak === d)?.efficiency ?? null),
      pb?.id ?? null, pb?.trpDbm ?? null, verdictCell(u),
      u.checks.filter((c) => c.status === 'fail').length, u.checks.filter((c) => c.status === 'not-evaluable').length,
      u.worstCheck?.name ?? null, u.worstCheck?.margin ?? null, u.worstCheck ? u.worstCheck.marginUnit ?? 'dB' : null,
      u.worstCheck ? (u.worstCheck.marginUnit === 'fraction' ? u.worstCheck.marginDb ?? null : u.worstCheck.margin) : null,
      u.grid.fullSphere ? 'yes' : 'no', u.grid.fullSphere ? 0 : 4 * Math.PI - u.solidAngleSr, u.grid.missing?.length ?? 0, u.warnings?.length ?? 0, null, null,
    ];
    return { unit: u.unit, f: u.frequencyHz, row };
  });
  const firstVerdict = header.indexOf('verdict');
  for (const e of notAnalyzed) {
    const row: CsvCell[] = header.map(() => null);
    row[0] = e.unit;
    row[1] = e.frequencyHz;
    row[firstVerdict] = 'error';
    row[header.length - 2] = errorLocation(e.error);
    row[header.length - 1] = errorMessage(e.error);
    keyed.push({ unit: e.unit, f: e.frequencyHz, row });
  }
  keyed.sort((a, b) => (a.unit < b.unit ? -1 : a.unit > b.unit ? 1 : (a.f ?? -1) - (b.f ?? -1)));
  return toCsv(header, keyed.map((k) => k.row));
}

/**
 * build-stats.csv: one row per frequency and metric of the build summary. `yield` is passed /
 * judged; `yield_in_build` is passed / units in the build (a unit that could not be read counts).
 */
export function buildStatsCsv(build: BuildSummary | null): string {
  const header = ['frequency_hz', 'metric', 'count', 'mean', 'std', 'min', 'max', 'yield', 'lower_limit', 'upper_limit', 'cpk',
    'passed', 'judged', 'in_build', 'yield_in_build'];
  const rows: CsvCell[][] = (build?.stats ?? []).map((s) => [
    s.frequencyHz, s.metric, s.count, s.mean, s.std, s.min, s.max, s.yield, s.lowerLimit, s.upperLimit, s.cpk,
    s.passedCount ?? null, s.judged ?? null, s.inBuild ?? null, s.yieldInBuild ?? null,
  ]);
  return toCsv(header, rows);
}
