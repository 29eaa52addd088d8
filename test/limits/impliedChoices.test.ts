import { describe, expect, it } from 'vitest';
import { analysisThreshold, impliedChoices, impliedLevelPct } from '../../src/limits/impliedChoices.js';
import type { LimitCheck } from '../../src/limits/limitSet.js';

const cov: LimitCheck = { kind: 'min-coverage', name: 'c', threshold: 8, minEfficiency: 0.5, toleranceDb: 1 };
const pct: LimitCheck = { kind: 'percentile', name: 'p', levelPct: 20, limit: 11.5, toleranceDb: 0 };

describe('limit-implied choices: one threshold and one level for holes, contour, removal, subset', () => {
  it('takes the coverage threshold as written (not tolerance-relaxed), else the percentile limit, else the first requested', () => {
    expect(impliedChoices({ checks: [pct, cov] }, [3])).toEqual({ threshold: 8, levelPct: 20 });
    expect(impliedChoices({ checks: [pct] }, [3])).toEqual({ threshold: 11.5, levelPct: 20 });
    expect(impliedChoices(null, [3, 4])).toEqual({ threshold: 3, levelPct: 50 });
    expect(impliedChoices({ checks: [] }, [])).toEqual({ threshold: null, levelPct: 50 });
  });

  it('analysisThreshold says where the threshold comes from and that no tolerance relaxes it (cov has toleranceDb 1)', () => {
    expect(analysisThreshold({ checks: [pct, cov] }, [3])).toEqual({ value: 8, source: 'min-coverage-check', toleranceApplied: false });
    expect(analysisThreshold({ checks: [pct] }, [3])).toEqual({ value: 11.5, source: 'percentile-check', toleranceApplied: false });
    expect(analysisThreshold(null, [3, 4])).toEqual({ value: 3, source: 'requested', toleranceApplied: false });
    expect(analysisThreshold({ checks: [] }, [])).toBeNull();
  });
});

describe('impliedLevelPct: the same level from judged checks (the report) as from the limit set (the batch)', () => {
  it('first percentile check, else 50 %', () => {
    expect(impliedLevelPct([cov, pct])).toBe(impliedChoices({ checks: [cov, pct] }, []).levelPct);
    expect(impliedLevelPct([cov, pct])).toBe(20);
    expect(impliedLevelPct([{ kind: 'min-coverage' }])).toBe(50);
  });
});
