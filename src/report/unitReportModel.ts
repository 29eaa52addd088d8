import type { CoveragePoint, UnitResult, Warning } from '../types.js';
import { bestRegionPeaks } from '../coverage/bestRegionPeaks.js';
import { coverageCurve } from '../coverage/coverageCurve.js';
import { weightedCdf } from '../coverage/weightedCdf.js';
import { foldSmallHoles, type FoldedHoles } from '../analysis/foldSmallHoles.js';
import { impliedLevelPct } from '../limits/impliedChoices.js';
import { metricsOfUnit, rowKey, rowMetrics, type MetricInstance } from '../metrics/catalogue.js';
import { cdfCurve, type CdfCurve } from './cdfCurve.js';
import { cdfLimitMarks } from './cdfLimitMarks.js';
import type { LimitMark } from './plots.js';
import type { ReportSettings, UnitReportInput } from './reportTypes.js';
import { buildUnitMaps, type UnitMaps } from './unitMaps.js';

/** A beam's label on the best-beam map: its id where it is strongest in its own region. */
export interface BeamLabel {
  id: string;
  thetaDeg: number;
  phiDeg: number;
}

/** The metric rows of the frequency trend: the table's metrics and the few drawn as lines. */
export interface TrendModel {
  rows: { metric: MetricInstance; key: string }[];
  lines: { metric: MetricInstance; key: string }[];
}

/** Everything a unit report draws, computed once before any section renders. */
export interface UnitReportModel {
  result: UnitResult;
  /** The map contour's threshold: the unit's analysis threshold (the holes' one). */
  threshold: number | null;
  maps: UnitMaps | null;
  tspCurve: CdfCurve;
  /** Each beam alone, drawn faintly behind the TSP (empty when that section part is off). */
  beamCurves: CdfCurve[];
  coverageCurve: CoveragePoint[];
  cdfLimits: LimitMark[];
  beamLabels: BeamLabel[];
  holes: FoldedHoles;
  trend: TrendModel | null;
  /** The measurement's typed warnings (with their catalogue text in the report). */
  typedWarnings: Warning[];
}

/** Below this share of 4π a beam's region is too small to carry a readable label (about 50 square degrees). */
const MIN_LABELLED_SHARE = 0.004;

/**
 * The map contour's threshold: the unit's analysis threshold (the one its holes were found at,
 * src/limits/impliedChoices.ts); for a result without one (written by an older version), a
 * coverage check's, else the first requested.
 */
export function contourThreshold(r: UnitResult): number | null {
  if (r.analysisThreshold !== undefined) return r.analysisThreshold?.value ?? null;
  const c = r.checks.find((k) => k.kind === 'min-coverage' && k.threshold !== undefined);
  return c?.threshold ?? r.tsp.coverage[0]?.threshold ?? null;
}

/** The coverage curve the analysis kept, else (a result made without it) the same curve from the TSP. */
function coverageCurveOf(input: UnitReportInput): CoveragePoint[] {
  const r = input.result;
  if (r.tsp.curve.length >= 2) return r.tsp.curve;
  const keep = Array.from(input.tsp.values.keys()).filter((i) => Number.isFinite(input.tsp.values[i]));
  const cdf = weightedCdf(keep.map((i) => input.tsp.values[i]), keep.map((i) => input.measurement.grid.weightSr[i]));
  return coverageCurve(cdf, r.quantity);
}

/** Labels of the beams whose best region is large enough to carry one. */
function beamLabels(input: UnitReportInput): BeamLabel[] {
  const { measurement: m, tsp, result: r } = input;
  const at = bestRegionPeaks(m.beams.map((b) => b.values), tsp.bestBeam, r.quantity);
  return m.beams.flatMap((b, k) => (at[k] < 0 || (r.beams[k]?.bestShare ?? 0) < MIN_LABELLED_SHARE
    ? []
    : [{ id: b.id, thetaDeg: m.grid.thetaDeg[at[k]], phiDeg: m.grid.phiDeg[at[k]] }]));
}

/** The trend's metric rows, and as lines the peak, the judged level and the largest beam TRP. */
function trendModel(r: UnitResult): TrendModel | null {
  const trend = r.frequencyTrend;
  if (!trend || trend.length === 0) return null;
  const inTrend = new Set(trend.flatMap((t) => Object.keys(t)));
  const rows = rowMetrics(metricsOfUnit(r)).filter(({ key }) => inTrend.has(key));
  const drawn: MetricInstance[] = [{ family: 'peak' }, { family: 'percentile', param: impliedLevelPct(r.checks) }, { family: 'trpMax' }];
  return { rows, lines: rows.filter(({ metric }) => drawn.some((l) => rowKey(l) === rowKey(metric))) };
}

/**
 * The unit report's model: maps (rasterized once), the TSP and beam CDF curves, the coverage
 * curve, the limits on the CDF axis, the beam labels, the holes folded by size, the trend rows.
 * Pure apart from the shared raster cache behind buildUnitMaps.
 */
export function buildUnitReportModel(input: UnitReportInput, s: ReportSettings): UnitReportModel {
  const r = input.result;
  const sec = s.sections;
  const threshold = contourThreshold(r);
  const needMaps = sec.tspMap || sec.bestBeamMap || (sec.reference && !!input.referenceDelta);
  const maps = needMaps
    ? buildUnitMaps(input.measurement, input.tsp, { widthPx: s.mapWidthPx, centerPhiDeg: s.mapCenterPhiDeg, colorMap: s.colorMap, threshold, delta: sec.reference ? input.referenceDelta : undefined })
    : null;
  const weights = input.measurement.grid.weightSr;
  const beamCurves = !sec.beamCdfs ? [] : input.beamCdfs?.map((b) => b.curve) ?? input.measurement.beams.map((b) => cdfCurve(b.values, weights, r.quantity, 200));
  return {
    result: r, threshold, maps, beamCurves,
    tspCurve: input.tspCdf ?? cdfCurve(input.tsp.values, weights, r.quantity),
    coverageCurve: sec.coverage ? coverageCurveOf(input) : [],
    cdfLimits: cdfLimitMarks(r.checks),
    beamLabels: sec.bestBeamMap ? beamLabels(input) : [],
    holes: foldSmallHoles(r.holes ?? []),
    trend: trendModel(r),
    typedWarnings: input.measurement.warnings,
  };
}
