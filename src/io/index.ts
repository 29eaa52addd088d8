// Readers: chamber exports → raw beams → Measurements; job file; inspect.
export { readExportFile } from './readExportFile.js';
export { assembleMeasurements, MAX_RESAMPLE_DISTANCE_DEG, type AssembleOptions } from './assembleMeasurements.js';
export { loadJobFile } from './jobFile.js';
export { findJobFile, JOB_FILE_NAMES } from './findJobFile.js';
export { inspectInput, formatInspect, type InspectOptions } from './inspectInput.js';
export { findExportFiles } from './findExportFiles.js';
export { calibrationOffsetDb } from './calibrationOffset.js';
export { pathIdentity } from './pathIdentity.js';
export type * from './types.js';
