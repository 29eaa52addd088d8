import { describe, expect, it } from 'vitest';
import type { CoverageMetrics, SphereGrid } from '../../../src/types.js';
import type { LimitSet } from '../../../src/limits/limitSet.js';
import { judge } from '../../../src/limits/judge.js';
import { assessConfidence } from '../../../src/analysis/uncertainty/assessConfidence.js';
import { K95, resolveUncertainty, type UncertaintySpec } from '../../../src/analysis/uncertainty/uncertaintySpec.js';
import { normalCdf } from '../../../src/analysis/uncertainty/normalCdf.js';
import { totalScanPattern } from '../../../src/coverage/totalScanPattern.js';
import { expectClose } from '../../helpers/expectClose.js';

/** A uniform pattern: every direction at `value` dBm on n equal cells (a full sphere). */
function unit(value: number, n = 64) {
  const grid: SphereGrid = { kind: 'scattered', thetaDeg: new Float64Array(n), phiDeg: new Float64Array(n),
    weightSr: new Float64Array(n).fill((4 * Math.PI) / n), solidAngleSr: 4 * Math.PI, regular: null };
  const beams = [{ id: '0', values: new Float64Array(n).fill(value) }];
  const tsp = totalScanPattern(beams.map((b) => b.values), 'eirp');
  const peak = { value, thetaDeg: 0, phiDeg: 0 };
  const metrics: CoverageMetrics = { peak, percentiles: [{ levelPct: 50, value }], coverage: [], relativeCoverage: [], curve: [],
    solidAngleSr: 4 * Math.PI, beams: [{ id: '0', peak, trpDbm: value, bestShare: 1 }] };
  return { grid, beams, tsp, metrics };
}

const limits = (toleranceDb: number): LimitSet => ({ name: 't', description: '', source: 'test', quantity: 'eirp',
  checks: [{ kind: 'percentile', name: 'p50', levelPct: 50, limit: 11.5, toleranceDb }] });

function assess(measured: number, toleranceDb: number, spec: UncertaintySpec) {
  const u = unit(measured);
  const ls = limits(toleranceDb);
  const judged = judge(u.metrics, ls, { quantity: 'eirp', fullSphere: true });
  return assessConfidence({ ...u, quantity: 'eirp', limitSet: ls, judged, uncertainty: resolveUncertainty(spec, 'eirp')! });
}

describe('assessConfidence: the issue check values (normal model, u_r = 0)', () => {
  const U = 2;
  const spec = (rule: UncertaintySpec['decisionRule'], draws = 40000): UncertaintySpec =>
    ({ decisionRule: rule, draws, seed: 11, quantities: { eirp: { expandedDb: U, perDirectionDb: 0 } } });
  // By the symmetry of the normal model, a unit measured at the test limit L − TT is truly
  // conforming with the probability that a unit truly at L fails the test: Φ(−TT/u_c).
  it('TT = 0.65·U: a unit at the test limit conforms with probability 10.1 % (R5-193262, derived)', () => {
    const TT = 0.65 * U;
    const r = assess(11.5 - TT, TT, spec('shared-risk'));
    const p = r.judged.checks[0].decision!.probabilityOfConformance!;
    expect(r.judged.checks[0].pass).toBe(true); // shared-risk: at the test limit passes, as today
    expectClose(p, normalCdf(-TT / (U / K95)), 0.006, 'binomial se √(0.1·0.9/40000) = 0.0015; 4σ');
    expectClose(p, 0.101, 0.007, 'the published 10.1 %');
  });
  it('TT = 0.4·U: 21.7 %', () => {
    const TT = 0.4 * U;
    const p = assess(11.5 - TT, TT, spec('shared-risk')).judged.checks[0].decision!.probabilityOfConformance!;
    expectClose(p, 0.217, 0.009, 'binomial se 0.002; 4σ plus the rounding of the published value');
  });
  it('guarded with w = U: a unit at the acceptance limit has a false-accept risk of 2.5 % (ILAC-G8 §4.2.2)', () => {
    const r = assess(11.5 + U, 0, spec('guarded'));
    const c = r.judged.checks[0];
    expect(c.pass).toBe(true);
    expect(c.effectiveLimit).toBe(13.5);
    expectClose(1 - c.decision!.probabilityOfConformance!, 0.025, 0.004, 'binomial se 0.0008; 4σ');
    expect(assess(11.5 + U - 0.01, 0, spec('guarded', 200)).judged.checks[0].pass).toBe(false);
  });
  it('guarded re-judges the verdict; shared-risk leaves today\'s verdict unchanged', () => {
    expect(assess(12.0, 0, spec('guarded', 200)).judged.verdict).toBe('fail');
    expect(assess(12.0, 0, spec('shared-risk', 200)).judged.verdict).toBe('pass');
    const nb = assess(12.0, 0, spec('non-binary', 200));
    expect(nb.judged.verdict).toBe('pass');
    expect(nb.confidence.statement).toBe('conditional pass');
    expect(nb.judged.checks[0].decision!.statement).toBe('conditional pass');
  });
  it('the unit probability and its binomial standard error are reported', () => {
    const r = assess(11.5, 0, spec('shared-risk', 1000));
    expectClose(r.confidence.probabilityOfConformance!, 0.5, 0.064, 'P = 0.5 exactly at the limit; se 0.016; 4σ');
    expectClose(r.confidence.probabilityStdErr!, Math.sqrt(0.25 / 1000), 0.001, 'binomial se at p ≈ 0.5');
  });
});
