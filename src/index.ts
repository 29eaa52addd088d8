/**
 * spherecov as a library. Start with `analyzeBeams` (beams in memory → the per-unit result that
 * results.json carries) and `unitReportPdf` (→ the unit PDF); the stages below are exported for
 * other pipelines, in pipeline order: read → normalize → combine and measure → deeper analysis
 * → judge → report → the whole batch run.
 */
export type * from './types.js';
export { WARNINGS, warning } from './warnings.js';

// library: data in memory → the UnitResult the CLI writes → the unit PDF
export { analyzeBeams, BeamsInputError } from './library/analyzeBeams.js';
export type { BeamsInput, SampleDirections, UnitAnalysis } from './library/analyzeBeams.js';
export { unitReportPdf } from './library/unitReportPdf.js';
export type { UnitReportOptions } from './library/unitReportPdf.js';

// read: chamber exports (one LayoutReader per layout), job file, inspect, raw beams → Measurements
export { LAYOUTS } from './io/layouts/registry.js';
export type { LayoutReader, PlannedLayout, LayoutSink } from './io/layouts/layoutTypes.js';
export {
  readExportFile, assembleMeasurements, MAX_RESAMPLE_DISTANCE_DEG, loadJobFile, findJobFile, JOB_FILE_NAMES,
  inspectInput, formatInspect, findExportFiles, calibrationOffsetDb, pathIdentity,
} from './io/index.js';
export type {
  ReadContext, FileReadResult, RawBeam, FileInfo, JobSpec, InspectReport, InspectOptions, CalibrationPoint, ColumnRole,
} from './io/index.js';

// normalize: units, directions, sphere grids and weights, the Measurement factory
export { dbToLinear, linearToDb, powerSumDb, powerSumDbArrays, mwToDbm, wToDbm } from './units.js';
export { neumaierSum } from './sphere/neumaierSum.js';
export { azElToThetaPhi, normalizePhiDeg, unitVector, angularDistanceDeg } from './sphere/direction.js';
export { sphericalTriangleArea } from './sphere/sphericalTriangleArea.js';
export { detectRegularLayout, seamGap } from './sphere/regularLayout.js';
export { regularWeights } from './sphere/regularWeights.js';
export { clippedCellArea } from './sphere/clippedCellArea.js';
export { voronoiWeights } from './sphere/voronoiWeights.js';
export type { VoronoiWeights } from './sphere/voronoiWeights.js';
export { buildSphereGrid } from './sphere/buildGrid.js';
export type { GridBuild } from './sphere/buildGrid.js';
export { mergeSamples } from './sphere/mergeSamples.js';
export type { MergedValues } from './sphere/mergeSamples.js';
export { nearestPointFinder } from './sphere/nearestPoint.js';
export type { NearestFinder } from './sphere/nearestPoint.js';
export { resampleBeam } from './sphere/resample.js';
export type { ResampledBeam } from './sphere/resample.js';
export { isFullSphere, FULL_SPHERE_REL_TOL } from './sphere/isFullSphere.js';
export { createMeasurement, MeasurementError } from './measurement.js';
export type { MeasurementInput } from './measurement.js';

// combine + measure: total scan pattern and coverage metrics
export { totalScanPattern } from './coverage/totalScanPattern.js';
export { weightedCdf } from './coverage/weightedCdf.js';
export type { WeightedCdf } from './coverage/weightedCdf.js';
export { sphereNormSr } from './coverage/sphereNormSr.js';
export { percentile } from './coverage/percentile.js';
export { coverageEfficiency, coverageAt, relativeCoverage } from './coverage/coverageEfficiency.js';
export { coverageCurve, MAX_CURVE_POINTS } from './coverage/coverageCurve.js';
export { beamTrpDbm } from './coverage/trp.js';
export { bestShares } from './coverage/bestShares.js';
export { beamPeak } from './coverage/beamPeak.js';
export { computeMetrics } from './coverage/computeMetrics.js';
export type { MetricOptions } from './coverage/computeMetrics.js';

// deeper analysis: holes, beam value, reference unit, frequency trend
export { gridNeighbors } from './sphere/neighbors.js';
export type { GridAdjacency } from './sphere/neighbors.js';
export {
  findHoles, findHolesWithLabels, createPercentileSelector, beamRemoval, greedySubset, metricRow,
  referenceDeltas, tspDifference, frequencyTrend, pointingDrift,
} from './analysis/index.js';
export type { FrequencyTrendRow, BeamDrift } from './analysis/index.js';

// judge: limit sets, profiles, verdicts, build statistics
export {
  loadLimitSet, parseLimitSetText, listProfiles, formatLimitSet, validateLimitSet, validateExtraChecks,
  judge, evaluateCheck, mergeLimitSets, metricNeeds, frequencyInRange, buildStatistics,
} from './limits/index.js';
export type { LimitSet, LimitCheck, ProfileInfo, JudgeResult } from './limits/index.js';

// report: unit and build PDFs, settings, thumbnails, the equal-area projection
export {
  renderUnitPdf, renderBuildPdf, unitMapThumbnail, cdfCurve, loadReportSettings, ReportSettingsError, unitKey,
  hammerForward, hammerInverse, contourThreshold, CAUTION,
} from './report/index.js';
export type { BuildReportInput, MapThumbnail, ReportSettings, ReportSections, UnitReportInput, CdfCurve } from './report/index.js';

// batch: the whole analyze run (discover → analyze units in parallel → write outputs)
export { runAnalyze } from './batch/runAnalyze.js';
export type { AnalyzeOptions, BatchIo } from './batch/options.js';
export { DEFAULT_PERCENTILES_PCT } from './batch/options.js';
export { exitCode } from './batch/exitCode.js';
export { RunError, InterruptedError } from './batch/errors.js';
export { neutralizeCell } from './batch/csv.js';
export { sanitizeStem } from './batch/sanitize.js';
