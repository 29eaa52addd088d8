// The analytic phased-array measurement model: synthetic data with known answers for tests,
// the benchmark and the demo. Nothing in the analysis pipeline depends on it.
export type * from './types.js';
export { createRng, type Rng } from './prng.js';
// model
export { elementGain } from './elementPattern.js';
export { planarSubArray } from './arrayGeometry.js';
export { perturbElements, failElement } from './elementErrors.js';
export { quantizePhase, excitation, C_M_PER_S } from './steering.js';
export { scanCodebook } from './codebook.js';
export { handsetModule } from './handsetModule.js';
export { simulateBeams } from './simulateBeams.js';
export { applyMeasurementNoise } from './measurementNoise.js';
export { eisFromEirp } from './eisFromEirp.js';
// chamber grids
export { regularGrid, type PhiConvention } from './regularGrid.js';
export { fibonacciGrid } from './fibonacciGrid.js';
export { blockThetaRange } from './blockThetaRange.js';
// writers
export type * from './writers/exportTypes.js';
export { exportLines } from './writers/exportLines.js';
export { formatExport, writeExport } from './writers/writeExport.js';
export { toExportBeams } from './writers/toExportBeams.js';
