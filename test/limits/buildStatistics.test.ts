import { describe, expect, it } from 'vitest';
import { buildStatistics } from '../../src/limits/buildStatistics.js';
import { processCapability } from '../../src/limits/processCapability.js';
import type { CheckResult, UnitResult, Verdict } from '../../src/types.js';
import { expectClose } from '../helpers/expectClose.js';

// Invented build: units A, B, C at 28 GHz and A again at 39 GHz. Expected values are worked out
// by hand in closed form (fractions below), not with the library under test.
const check = (name: string, value: number | null, limit: number, bound: 'lower' | 'upper'): CheckResult => {
  const margin = value === null ? null : bound === 'lower' ? value - limit : limit - value;
  const status = margin === null ? 'not-evaluable' : margin >= 0 ? 'pass' : 'fail';
  return { name, kind: 'min-peak', value, limit, toleranceDb: 0, effectiveLimit: limit, margin,
    pass: margin === null ? null : margin >= 0, status, bound, marginUnit: 'dB' };
};
function unit(id: string, f: number, peak: number, p50: number | null, trp: number | null, verdict: Verdict): UnitResult {
  const checks = [check('minimum peak EIRP', peak, 22.4, 'lower'), check('coverage', p50, 11.5, 'lower'), check('maximum EIRP', peak, 23, 'upper')];
  const evaluated = checks.filter((c) => c.margin !== null).sort((a, b) => (a.margin as number) - (b.margin as number));
  return {
    unit: id, frequencyHz: f, quantity: 'eirp', valueUnit: 'dBm', solidAngleSr: 4 * Math.PI,
    beams: [{ id: '0', peak: { value: peak - 1, thetaDeg: 90, phiDeg: 0 }, trpDbm: trp, bestShare: 0.5 },
      { id: '1', peak: { value: peak, thetaDeg: 90, phiDeg: 90 }, trpDbm: trp === null ? null : trp - 2, bestShare: 0.5 }],
    tsp: { peak: { value: peak, thetaDeg: 90, phiDeg: 90 }, percentiles: [{ levelPct: 50, value: p50 }],
      coverage: [{ threshold: 10, efficiency: 0.5 }], relativeCoverage: [], curve: [] },
    checks, verdict, worstCheck: { name: evaluated[0].name, margin: evaluated[0].margin as number },
    warnings: [], grid: { kind: 'regular', points: 266, thetaRangeDeg: [0, 180], phiRangeDeg: [0, 345],
      thetaStepDeg: 15, phiStepDeg: 15, fullSphere: trp !== null, solidAngleSr: 4 * Math.PI, duplicatesMerged: 0, beamsResampled: 0 },
    sources: [], limitSet: { name: 'x', source: 'invented' },
  };
}
const units = [
  unit('A', 28e9, 22.0, 11.0, 15.0, 'fail'),
  unit('B', 28e9, 23.0, null, null, 'none'),
  unit('C', 28e9, 24.5, 12.0, 16.0, 'fail'),
  unit('A', 39e9, 21.0, 10.0, 14.0, 'pass'),
];
const s = buildStatistics(units);
const row = (f: number, metric: string) => {
  const r = s.stats.find((x) => x.frequencyHz === f && x.metric === metric);
  expect(r, metric).toBeDefined();
  return r!;
};
const EPS = 1e-12; // closed-form doubles vs a two-pass sum over 3 values: a few ulp

describe('buildStatistics (hand-computed)', () => {
  it('peak at 28 GHz: mean 139/6, sample σ √(19/12) (n − 1), min, max; no limit on the raw row', () => {
    // 22.0, 23.0, 24.5: mean 69.5/3 = 139/6; squared deviations sum 19/6; /(n − 1) = 19/12.
    const r = row(28e9, 'peak');
    expect(r.count).toBe(3);
    expectClose(r.mean as number, 139 / 6, EPS, 'arithmetic mean');
    expectClose(r.std as number, Math.sqrt(19 / 12), EPS, 'sample standard deviation');
    expect([r.min, r.max, r.yield, r.cpk]).toEqual([22, 24.5, null, null]);
  });
  it('check rows: yield and one-sided Cpk with the limit as written', () => {
    const lo = row(28e9, 'check:minimum peak EIRP');
    expectClose(lo.yield as number, 2 / 3, EPS, 'A fails (22.0 < 22.4), B and C pass');
    expect([lo.lowerLimit, lo.upperLimit]).toEqual([22.4, null]);
    expectClose(lo.cpk as number, (139 / 6 - 22.4) / (3 * Math.sqrt(19 / 12)), EPS, '(mean − LSL)/(3σ) = 0.2031');
    expectClose(lo.cpk as number, 0.203095, 1e-6, 'same, as a decimal worked by hand');
    const hi = row(28e9, 'check:maximum EIRP');
    expect([hi.lowerLimit, hi.upperLimit]).toEqual([null, 23]);
    expectClose(hi.cpk as number, (23 - 139 / 6) / (3 * Math.sqrt(19 / 12)), EPS, '(USL − mean)/(3σ), negative: mean above USL');
    expectClose(hi.yield as number, 2 / 3, EPS, 'C exceeds 23 dBm');
  });
  it('a not-evaluable check counts in the yield denominator but not in the values', () => {
    const r = row(28e9, 'check:coverage');
    expect(r.count).toBe(2);
    expectClose(r.mean as number, 11.5, EPS, '(11 + 12)/2');
    expectClose(r.std as number, Math.SQRT1_2, EPS, '√(((−0.5)² + 0.5²)/1)');
    expectClose(r.yield as number, 1 / 3, EPS, 'A fails, B not evaluable, C passes');
    expect(r.cpk).toBe(0); // mean exactly on the limit
    expect(row(28e9, 'p50').count).toBe(2);
  });
  it('max TRP only from full-sphere units; worst beam peak; worst margin', () => {
    const trp = row(28e9, 'maxTrp');
    expect([trp.count, trp.min, trp.max]).toEqual([2, 15, 16]);
    expect([row(28e9, 'minBeamPeak').min, row(28e9, 'minBeamPeak').max]).toEqual([21, 23.5]);
    // worst margins: A −0.5 (coverage 11 vs 11.5), B 0 (max EIRP 23 vs 23), C −1.5 (24.5 vs 23).
    const wm = row(28e9, 'worstMargin');
    expect([wm.count, wm.min, wm.max]).toEqual([3, -1.5, 0]);
  });
  it('a single unit gives σ null and Cpk null; rows are ordered by frequency then metric', () => {
    const r = row(39e9, 'check:minimum peak EIRP');
    expect([r.count, r.std, r.cpk, r.yield]).toEqual([1, null, null, 0]);
    const at28 = s.stats.filter((x) => x.frequencyHz === 28e9).map((x) => x.metric);
    expect(at28).toEqual(['peak', 'p50', 'coverage@10', 'maxTrp', 'minBeamPeak',
      'check:minimum peak EIRP', 'check:coverage', 'check:maximum EIRP', 'worstMargin']);
    expect(s.stats.findIndex((x) => x.frequencyHz === 39e9)).toBe(at28.length);
  });
  it('distinct units: a unit failing at any frequency fails', () => {
    expect({ units: s.units, passed: s.passed, failed: s.failed, notJudged: s.notJudged })
      .toEqual({ units: 3, passed: 0, failed: 2, notJudged: 1 });
    expect(buildStatistics([])).toEqual({ units: 0, unitsInBuild: 0, passed: 0, failed: 0, notJudged: 0, errored: 0, stats: [] });
  });
  it('a unit that could not be read counts in the build as errored and lowers the yield in the build, not the yield of the judged', () => {
    const u = (name: string) => unit(name, 28e9, 23, 12, 15, 'pass'); // all three checks pass
    const err = { unit: 'E', frequencyHz: null, verdict: 'error' as const, error: { file: 'E/x.csv', line: 3, message: 'm' }, errorCount: 1, files: ['E/x.csv'] };
    const s = buildStatistics([u('A'), u('B')], [err]);
    expect({ units: s.units, unitsInBuild: s.unitsInBuild, passed: s.passed, errored: s.errored }).toEqual({ units: 2, unitsInBuild: 3, passed: 2, errored: 1 });
    const row = s.stats.find((r) => r.metric === 'check:minimum peak EIRP')!;
    // hand count: 2 passed of 2 judged; 2 passed of 3 in the build
    expect([row.yield, row.passedCount, row.judged, row.inBuild, row.yieldInBuild]).toEqual([1, 2, 2, 3, 2 / 3]);
  });
  it('processCapability: zero σ is unbounded and reported as null', () => {
    expect(processCapability(12, 0, 11.5, 'lower')).toBeNull();
    expectClose(processCapability(12, 0.5, 11.5, 'lower') as number, 1 / 3, EPS, '0.5 / 1.5');
  });
});

describe('buildStatistics keeps quantities apart', () => {
  it('EIRP and EIS results of one frequency are separate rows (a pooled mean of dBm transmit power and receive sensitivity means nothing)', () => {
    const eis = (id: string, peak: number): UnitResult => ({ ...unit(id, 28e9, peak, null, null, 'none'), quantity: 'eis', checks: [], worstCheck: null });
    const mixed = buildStatistics([unit('A', 28e9, 22.0, 11.0, 15.0, 'fail'), unit('C', 28e9, 24.5, 12.0, 16.0, 'fail'), eis('A', -90), eis('C', -94)]);
    const peaks = mixed.stats.filter((x) => x.metric === 'peak');
    expect(peaks.map((x) => [x.quantity, x.count, x.mean])).toEqual([['eirp', 2, 23.25], ['eis', 2, -92]]); // hand means: (22 + 24.5)/2, (−90 − 94)/2
    // Rows: every EIRP row of 28 GHz comes before the EIS rows (QUANTITIES order), none mixes both.
    const firstEis = mixed.stats.findIndex((x) => x.quantity === 'eis');
    expect(mixed.stats.slice(firstEis).every((x) => x.quantity === 'eis')).toBe(true);
    expect(s.stats.every((x) => x.quantity === 'eirp')).toBe(true);
  });
});
