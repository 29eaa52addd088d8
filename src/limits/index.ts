// Limits stage: limit-set files and profiles, judging metrics, build statistics.
export type { LimitSet, LimitCheck, CheckDraft, PeakCheck, PercentileCheck, CoverageCheck, BeamPeakCheck, ProfileInfo } from './limitSet.js';
export { CHECK_KINDS } from './checkKinds.js';
export { checkBound, kindAllowed, defaultCheckName } from './checkSense.js';
export { quantityUnit } from '../quantity.js';
export { validateLimitSet, validateExtraChecks, formatKeyPath, UNKNOWN_KEY, type KeyPath, type Locate } from './validateLimitSet.js';
export { parseLimitSetText } from './parseLimitSet.js';
export { loadLimitSet } from './loadLimitSet.js';
export { listProfiles } from './listProfiles.js';
export { limitTemplatesDir } from './templatesDir.js';
export { formatLimitSet, describeCheck } from './formatLimitSet.js';
export { evaluateCheck } from './evaluateCheck.js';
export { judge, type JudgeResult } from './judge.js';
export { mergeLimitSets } from './mergeLimitSets.js';
export { metricNeeds } from './metricNeeds.js';
export { frequencyInRange } from './frequencyInRange.js';
export { processCapability } from './processCapability.js';
export { buildStatistics } from './buildStatistics.js';
