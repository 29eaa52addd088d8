import { describe, expect, it } from 'vitest';
import { analyzeBeams } from '../../src/library/analyzeBeams.js';
import type { LimitSet } from '../../src/limits/limitSet.js';
import { percentileLimit } from '../../src/limits/impliedChoices.js';
import { coverageMetricValues, csvColumn, metricLabel, metricRow, metricsOfUnit, statsKey } from '../../src/metrics/catalogue.js';
import type { Quantity } from '../../src/types.js';
import { expectClose } from '../helpers/expectClose.js';

/*
 * Closed form: a cosⁿ pattern on the upper hemisphere, P + 10·n·log10(cos θ) dBm, far below
 * (−200 dBm) elsewhere. Its coverage efficiency at a value t is the cap where cosⁿθ ≥
 * 10^((t − P)/10), θ ≤ α with cos α = 10^((t − P)/(10n)): 2π(1 − cos α)/4π = (1 − cos α)/2
 * (cap area 2π(1 − cos α), any calculus text). On a regular 1° grid with α on a row boundary
 * (α = 60.5°, halfway between the rows 60° and 61°) the covered rows are exactly 0°…60°, and
 * their cells end at 60.5°: the grid's cap then equals the analytic cap up to rounding (the
 * solid-angle weights of a regular grid are exact cells, Ω = Δφ(cos θ₁ − cos θ₂)), so the
 * tolerance is rounding only (1e-12 on a sum of 65 k weights ~ 1e-4 sr each).
 */
const RAD = Math.PI / 180;
const N = 4;
const P_DBM = 20;
const ALPHA_DEG = 60.5;
const LIMIT_DBM = P_DBM + 10 * N * Math.log10(Math.cos(ALPHA_DEG * RAD)); // ≈ 8.86 dBm
const CAP = (1 - Math.cos(ALPHA_DEG * RAD)) / 2; // ≈ 0.2538

function sphere1deg(): { thetaDeg: number[]; phiDeg: number[] } {
  const thetaDeg: number[] = [], phiDeg: number[] = [];
  for (let t = 0; t <= 180; t++) for (let p = 0; p < 360; p++) { thetaDeg.push(t); phiDeg.push(p); }
  return { thetaDeg, phiDeg };
}
const dirs = sphere1deg();
const cosN = dirs.thetaDeg.map((t) => (t < 90 ? P_DBM + 10 * N * Math.log10(Math.cos(t * RAD)) : -200));

function limits(quantity: Quantity, levelPct: number, limit: number): LimitSet {
  return { name: 'closed-form', quantity, checks: [{ kind: 'percentile', name: `level ${levelPct}`, levelPct, limit, toleranceDb: 0.5 }] } as LimitSet;
}

describe('coverage efficiency at the limit set\'s percentile level (catalogue metric coverageAtLevelLimit)', () => {
  it('eirp: the cosⁿ cap (1 − cos α)/2 at the percentile check\'s limit as written (no tolerance)', () => {
    const { result } = analyzeBeams({ directions: dirs, beams: [{ id: '0', values: cosN }], limits: limits('eirp', 80, LIMIT_DBM), coreOnly: true });
    const got = result.tsp.coverageAtLevelLimit!;
    expect(got.levelPct).toBe(80);
    expect(got.threshold).toBe(LIMIT_DBM); // as written: the 0.5 dB tolerance only relaxes the verdict
    expectClose(got.efficiency, CAP, 1e-12, 'cap area 2π(1 − cos α)/4π, α on a row boundary (derived above)');
  });

  it('eis (lower is better, src/quantity.ts): the mirrored pattern −cosⁿ gives the same cap at −limit', () => {
    // EIS = −EIRP (a receiver mirror): x ≤ −t exactly where EIRP ≥ t, so the covered cap is the same.
    const { result } = analyzeBeams({ quantity: 'eis', directions: dirs, beams: [{ id: '0', values: cosN.map((v) => -v) }], limits: limits('eis', 20, -LIMIT_DBM), coreOnly: true });
    expectClose(result.tsp.coverageAtLevelLimit!.efficiency, CAP, 1e-12, 'same cap, mirrored (derived above)');
  });

  it('agrees with the percentile check it is read beside: the check passes exactly when the share reaches 1 − level', () => {
    // P_L ≥ t (eirp) ⇔ at most L % of 4π lies below t ⇔ coverage at t ≥ 1 − L/100; the cap is 25.4 %,
    // so a 70 % level (needs 30 %) fails and an 80 % level (needs 20 %) passes.
    for (const [levelPct, pass] of [[70, false], [80, true]] as const) {
      const ls = { ...limits('eirp', levelPct, LIMIT_DBM) };
      ls.checks = ls.checks.map((c) => ({ ...c, toleranceDb: 0 }));
      const { result } = analyzeBeams({ directions: dirs, beams: [{ id: '0', values: cosN }], limits: ls, coreOnly: true });
      expect(result.checks[0].pass).toBe(pass);
      expect(result.tsp.coverageAtLevelLimit!.efficiency >= 1 - levelPct / 100).toBe(pass);
    }
  });

  it('is absent without a percentile check, and every output names it through the catalogue', () => {
    const none = analyzeBeams({ directions: dirs, beams: [{ id: '0', values: cosN }], coreOnly: true }).result;
    expect(none.tsp.coverageAtLevelLimit).toBeUndefined();
    expect(percentileLimit(null)).toBeNull();
    const { result } = analyzeBeams({ directions: dirs, beams: [{ id: '0', values: cosN }], limits: limits('eirp', 80, LIMIT_DBM), coreOnly: true });
    const mv = coverageMetricValues(metricsOfUnit(result), 'eirp').find((v) => v.metric.family === 'coverageAtLevelLimit')!;
    expect(mv.value).toBe(result.tsp.coverageAtLevelLimit!.efficiency);
    expect(metricRow(metricsOfUnit(result))['coverageAtLevelLimit@p80']).toBe(mv.value);
    expect(csvColumn(mv.metric)).toBe('coverage_at_p80_limit');
    expect(statsKey(mv.metric)).toBe('coverageAtLevelLimit@p80');
    expect(metricLabel(mv.metric, 'dBm')).toBe('coverage at the 80 %-tile limit');
  });
});
