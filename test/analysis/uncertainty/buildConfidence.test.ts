import { describe, expect, it } from 'vitest';
import type { CheckResult, UnitResult } from '../../../src/types.js';
import { buildConfidence } from '../../../src/analysis/uncertainty/buildConfidence.js';
import { expectClose } from '../../helpers/expectClose.js';

function unit(name: string, value: number, p: number, pass: boolean): UnitResult {
  const check: CheckResult = { name: 'p50', kind: 'percentile', value, limit: 11.5, toleranceDb: 0, effectiveLimit: 12.5, margin: value - 12.5, pass,
    status: pass ? 'pass' : 'fail', bound: 'lower', levelPct: 50,
    decision: { rule: 'guarded', acceptanceLimit: 12.5, guardBandDb: 1, statement: pass ? 'pass' : 'fail', probabilityOfConformance: p, probabilityStdErr: 0.01, valueStdDev: 0.5, bias: 0 } };
  return { unit: name, frequencyHz: null, verdict: pass ? 'pass' : 'fail', checks: [check],
    confidence: { decisionRule: 'guarded', probabilityOfConformance: p, probabilityStdErr: 0.01 } } as unknown as UnitResult;
}

describe('buildConfidence', () => {
  it('expected conforming = Σ P (linearity of expectation), se = √Σ se²; Cpk against the guarded acceptance limit', () => {
    const b = buildConfidence([unit('a', 13, 0.9, true), unit('b', 12.6, 0.7, true), unit('c', 12.0, 0.4, false)])!;
    expect(b.passes).toBe(2);
    expectClose(b.expectedConforming, 2.0, 1e-12, 'sum of 0.9, 0.7, 0.4');
    expectClose(b.expectedConformingStdErr, Math.sqrt(3) * 0.01, 1e-12, 'three independent se of 0.01');
    // Cpk = (mean − L)/(3 s): mean 12.5333, s = 0.5033 (sample sd of 13, 12.6, 12.0), L = 12.5 (guarded)
    const c = b.checks[0];
    expect(c.acceptanceLimit).toBe(12.5);
    expectClose(c.cpk!, (37.6 / 3 - 12.5) / (3 * Math.sqrt(((13 - 37.6 / 3) ** 2 + (12.6 - 37.6 / 3) ** 2 + (12 - 37.6 / 3) ** 2) / 2)), 1e-12, 'Eq. C1 by hand');
  });
  it('is null when no unit carries an uncertainty', () => {
    expect(buildConfidence([{ ...unit('a', 13, 0.9, true), confidence: undefined }])).toBeNull();
  });
});
