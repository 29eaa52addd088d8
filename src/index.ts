// Public library entry: re-exports grouped by pipeline stage (filled in as stages land).
export type * from './types.js';
export { WARNINGS, warning } from './warnings.js';

// judge: limit sets, profiles, verdicts, build statistics
export {
  loadLimitSet, parseLimitSetText, listProfiles, formatLimitSet, validateLimitSet, validateExtraChecks,
  judge, evaluateCheck, mergeLimitSets, metricNeeds, frequencyInRange, buildStatistics,
} from './limits/index.js';
export type { LimitSet, LimitCheck, ProfileInfo, JudgeResult } from './limits/index.js';
