import type { AnalysisThreshold } from '../types.js';

const SOURCE: Record<AnalysisThreshold['source'], string> = {
  'min-coverage-check': "the limit set's coverage threshold as written",
  'percentile-check': "the limit set's percentile limit as written",
  requested: 'the first requested coverage threshold',
};

/**
 * Where a unit's analysis threshold comes from and whether a test tolerance relaxes it, in words,
 * read from the value results.json records (so the caption cannot say something else).
 * @example thresholdSourceText({ value: 8, source: 'requested', toleranceApplied: false }) // 'the first requested coverage threshold; no test tolerance applied'
 */
export function thresholdSourceText(t: AnalysisThreshold | null | undefined): string {
  if (!t) return 'no threshold recorded for this result';
  return `${SOURCE[t.source]}; ${t.toleranceApplied ? 'relaxed by the test tolerance' : 'no test tolerance applied'}`;
}
