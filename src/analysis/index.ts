// Deeper analysis (issue 9): holes, beam value, reference unit, frequency trend. Re-exports only.
export { findHoles, findHolesWithLabels } from './findHoles.js';
export { createPercentileSelector } from './percentileSelector.js';
export { beamRemoval } from './beamRemoval.js';
export { greedySubset } from './greedySubset.js';
export { metricRow } from './metricRow.js';
export { referenceDeltas } from './referenceDeltas.js';
export { tspDifference } from './tspDifference.js';
export { frequencyTrend, type FrequencyTrendRow } from './frequencyTrend.js';
export { pointingDrift, type BeamDrift } from './pointingDrift.js';
