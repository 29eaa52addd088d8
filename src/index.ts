// Public library entry: re-exports grouped by pipeline stage (filled in as stages land).
export type * from './types.js';
export { WARNINGS, warning } from './warnings.js';

// judge: limit sets, profiles, verdicts, build statistics
export {
  loadLimitSet, parseLimitSetText, listProfiles, formatLimitSet, validateLimitSet, validateExtraChecks,
  judge, evaluateCheck, mergeLimitSets, metricNeeds, frequencyInRange, buildStatistics,
} from './limits/index.js';
export type { LimitSet, LimitCheck, ProfileInfo, JudgeResult } from './limits/index.js';

// read + normalize: chamber exports, job file, inspect
export {
  readExportFile, assembleMeasurements, MAX_RESAMPLE_DISTANCE_DEG, loadJobFile, findJobFile, JOB_FILE_NAMES,
  inspectInput, formatInspect, findExportFiles, calibrationOffsetDb, pathIdentity,
} from './io/index.js';
export type {
  ReadContext, FileReadResult, RawBeam, FileInfo, JobSpec, InspectReport, InspectOptions, CalibrationPoint, ColumnRole,
} from './io/index.js';

// deeper analysis (issue 9): holes, beam value, reference unit, frequency trend
export { gridNeighbors } from './sphere/neighbors.js';
export type { GridAdjacency } from './sphere/neighbors.js';
export {
  findHoles, findHolesWithLabels, createPercentileSelector, beamRemoval, greedySubset, metricRow,
  referenceDeltas, tspDifference, frequencyTrend, pointingDrift,
} from './analysis/index.js';
export type { FrequencyTrendRow, BeamDrift } from './analysis/index.js';
