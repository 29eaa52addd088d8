import { describe, expect, it } from 'vitest';
import { evaluateCheck } from '../../src/limits/evaluateCheck.js';
import { judge } from '../../src/limits/judge.js';
import type { LimitCheck, LimitSet } from '../../src/limits/limitSet.js';
import { expectClose } from '../helpers/expectClose.js';
import { metricsFixture } from './metricsFixture.js';

// All expected numbers below are worked out by hand from metricsFixture (invented values) with
// Eq. L1–L3 of evaluateCheck.ts; margins are snapped to 1e-9, so 1e-9 is the tolerance.
const EPS = 1e-9;
const m = metricsFixture();
const ev = (c: LimitCheck, q: 'eirp' | 'eis' | 'gain' = 'eirp', full = true) => evaluateCheck(c, m, q, full);

describe('coverage margins in dB (Eq. L4) and the worst-check ranking', () => {
  it('min-coverage ≥ 50 % at 10 dBm ⇔ the 50 % level (11.0) reaches 10: margin 0.05 of 4π, 1.0 dB', () => {
    const r = ev({ kind: 'min-coverage', name: 'cov', threshold: 10, minEfficiency: 0.5, toleranceDb: 0 });
    expectClose(r.margin as number, 0.05, EPS, 'efficiency 0.55 − 0.5');
    expectClose(r.marginDb as number, 1.0, EPS, '50 % value 11.0 − threshold 10');
    expect(ev({ kind: 'min-coverage', name: 'cov', threshold: 10, minEfficiency: 0.3, toleranceDb: 0 }).marginDb).toBeNull(); // 70 % not computed
  });
  it('ranks a coverage check by its dB margin, not by its fraction', () => {
    const ls: LimitSet = { name: 'r', description: '', source: 's', quantity: 'eirp', checks: [
      { kind: 'min-coverage', name: 'cov', threshold: 10, minEfficiency: 0.5, toleranceDb: 0 }, // 0.05 of 4π = 1.0 dB
      { kind: 'min-peak', name: 'peak', limit: 22.4, toleranceDb: 0 }, // 0.6 dB
    ] };
    expect(judge(m, ls, { quantity: 'eirp', fullSphere: true }).worstCheck).toEqual({ name: 'peak', margin: 0.6, marginUnit: 'dB' });
  });
});

describe('evaluateCheck, one check kind at a time (eirp)', () => {
  it('min-peak: peak 23.0 vs limit 22.4 with 0.5 dB tolerance → effective 21.9, margin 1.1', () => {
    const r = ev({ kind: 'min-peak', name: 'p', limit: 22.4, toleranceDb: 0.5 });
    expectClose(r.effectiveLimit, 21.9, EPS, 'limit − tol');
    expectClose(r.margin as number, 1.1, EPS, 'value − effective');
    expect(r).toMatchObject({ value: 23, limit: 22.4, toleranceDb: 0.5, pass: true, status: 'pass', bound: 'lower', marginUnit: 'dB' });
  });
  it('min-peak fails by 0.5 dB without tolerance and passes exactly at the relaxed limit', () => {
    expect(ev({ kind: 'min-peak', name: 'p', limit: 23.5, toleranceDb: 0 })).toMatchObject({ margin: -0.5, pass: false, status: 'fail' });
    // 23.5 − 0.5 = 23.0 = value: at the limit passes (margin 0, not −1e-15 float noise).
    expect(ev({ kind: 'min-peak', name: 'p', limit: 23.5, toleranceDb: 0.5 })).toMatchObject({ margin: 0, pass: true });
  });
  it('max-peak: 23.0 vs 22.0 + 0.3 tol → effective 22.3, margin −0.7, fail', () => {
    const r = ev({ kind: 'max-peak', name: 'x', limit: 22, toleranceDb: 0.3 });
    expectClose(r.effectiveLimit, 22.3, EPS, 'limit + tol for a maximum');
    expectClose(r.margin as number, -0.7, EPS, 'effective − value');
    expect(r).toMatchObject({ pass: false, status: 'fail', bound: 'upper' });
  });
  it('percentile: value 11.0 at 50 % vs 11.5 with 1 dB tol → effective 10.5, margin 0.5', () => {
    const r = ev({ kind: 'percentile', name: 'c', levelPct: 50, limit: 11.5, toleranceDb: 1 });
    expectClose(r.margin as number, 0.5, EPS, 'value − (limit − tol)');
    expect(r).toMatchObject({ value: 11, levelPct: 50, effectiveLimit: 10.5, pass: true });
    expect(ev({ kind: 'percentile', name: 'c', levelPct: 50, limit: 11.5, toleranceDb: 0 })).toMatchObject({ margin: -0.5, pass: false });
  });
  it('min-coverage: threshold 10 relaxed by 1.5 dB to 8.5 → efficiency 0.62 vs 0.6, margin 0.02 (fraction)', () => {
    const r = ev({ kind: 'min-coverage', name: 'cov', threshold: 10, minEfficiency: 0.6, toleranceDb: 1.5 });
    expectClose(r.margin as number, 0.02, EPS, 'efficiency − minEfficiency');
    expect(r).toMatchObject({ value: 0.62, threshold: 8.5, limit: 0.6, effectiveLimit: 0.6, marginUnit: 'fraction', pass: true });
    // Without tolerance the written threshold 10 is used: 0.55 < 0.6.
    const strict = ev({ kind: 'min-coverage', name: 'cov', threshold: 10, minEfficiency: 0.6, toleranceDb: 0 });
    expectClose(strict.margin as number, -0.05, EPS, '0.55 − 0.6');
    expect(strict.pass).toBe(false);
  });
  it('min-coverage falls back to the coverage curve when the threshold is only there', () => {
    expect(ev({ kind: 'min-coverage', name: 'c', threshold: 10, minEfficiency: 0.5, toleranceDb: 1 }))
      .toMatchObject({ threshold: 9, value: 0.6, status: 'pass' });
  });
  it('min-beam-peak: worst beam 21.5 (beam 0) vs 21.0 + tol 0.2 → margin 0.7; listed beams only', () => {
    const r = ev({ kind: 'min-beam-peak', name: 'b', limit: 21, toleranceDb: 0.2 });
    expectClose(r.margin as number, 0.7, EPS, '21.5 − 20.8');
    expect(r).toMatchObject({ beam: '0', value: 21.5, pass: true });
    const listed = ev({ kind: 'min-beam-peak', name: 'b', limit: 22.5, toleranceDb: 0, beams: ['1', '2'] });
    expect(listed).toMatchObject({ beam: '1', value: 22, margin: -0.5, pass: false });
  });
  it('max-trp: largest beam TRP 13.5 dBm (beam 1) vs 13 + 0.25 tol → margin −0.25, fail', () => {
    const r = ev({ kind: 'max-trp', name: 't', limit: 13, toleranceDb: 0.25 });
    expect(r).toMatchObject({ value: 13.5, beam: '1', effectiveLimit: 13.25, margin: -0.25, pass: false, status: 'fail' });
  });
});

describe('EIS (smaller is better)', () => {
  const mEis = metricsFixture({
    peak: { value: -86.0, thetaDeg: 30, phiDeg: 0 },
    percentiles: [{ levelPct: 50, value: -75.0 }],
    coverage: [{ threshold: -74, efficiency: 0.7 }],
  });
  const evE = (c: LimitCheck) => evaluateCheck(c, mEis, 'eis', true);
  it('min-peak on eis = best EIS ≤ REFSENS: −86.0 vs −85.3 + 0.4 tol → effective −84.9, margin 1.1', () => {
    const r = evE({ kind: 'min-peak', name: 'REFSENS', limit: -85.3, toleranceDb: 0.4 });
    expectClose(r.effectiveLimit, -84.9, EPS, 'limit + tol: relaxed upward for an upper bound');
    expectClose(r.margin as number, 1.1, EPS, 'effective − value');
    expect(r).toMatchObject({ bound: 'upper', pass: true });
    expect(evE({ kind: 'min-peak', name: 'R', limit: -86.5, toleranceDb: 0 })).toMatchObject({ margin: -0.5, pass: false });
  });
  it('percentile on eis: −75.0 at 50 % ≤ −74.4 → margin 0.6', () => {
    const r = evE({ kind: 'percentile', name: 'sc', levelPct: 50, limit: -74.4, toleranceDb: 0 });
    expectClose(r.margin as number, 0.6, EPS, '−74.4 − (−75.0)');
    expect(r.pass).toBe(true);
  });
  it('min-coverage on eis relaxes the threshold upward: −75 + 1 = −74', () => {
    expect(evE({ kind: 'min-coverage', name: 'c', threshold: -75, minEfficiency: 0.65, toleranceDb: 1 }))
      .toMatchObject({ threshold: -74, value: 0.7, status: 'pass' });
  });
  it('min-beam-peak on eis judges the highest (worst) beam peak', () => {
    const mb = metricsFixture({ beams: [
      { id: 'a', peak: { value: -84, thetaDeg: 0, phiDeg: 0 }, trpDbm: null, bestShare: 0.5 },
      { id: 'b', peak: { value: -80, thetaDeg: 0, phiDeg: 0 }, trpDbm: null, bestShare: 0.5 }] });
    expect(evaluateCheck({ kind: 'min-beam-peak', name: 'b', limit: -82, toleranceDb: 0 }, mb, 'eis', true))
      .toMatchObject({ beam: 'b', value: -80, margin: -2, pass: false });
  });
});

describe('not evaluable is never a pass', () => {
  const expectNE = (r: ReturnType<typeof evaluateCheck>, note: RegExp) => {
    expect(r.status).toBe('not-evaluable');
    expect(r.pass).toBeNull();
    expect(r.margin).toBeNull();
    expect(r.note).toMatch(note);
  };
  it('TRP on a partial sphere (flag or null trpDbm)', () => {
    expectNE(ev({ kind: 'max-trp', name: 't', limit: 30, toleranceDb: 0 }, 'eirp', false), /full-sphere/);
    const partial = metricsFixture({ beams: metricsFixture().beams.map((b) => ({ ...b, trpDbm: null })) });
    expectNE(evaluateCheck({ kind: 'max-trp', name: 't', limit: 30, toleranceDb: 0 }, partial, 'eirp', true), /full-sphere/);
  });
  it('a percentile in the unmeasured part of the sphere, or a level not computed', () => {
    expectNE(ev({ kind: 'percentile', name: 'c', levelPct: 85, limit: 0, toleranceDb: 0 }), /unmeasured/);
    expectNE(ev({ kind: 'percentile', name: 'c', levelPct: 60, limit: 0, toleranceDb: 0 }), /not computed/);
  });
  it('a coverage threshold not computed, a listed beam missing', () => {
    expectNE(ev({ kind: 'min-coverage', name: 'c', threshold: 12, minEfficiency: 0.1, toleranceDb: 0 }), /not computed/);
    expectNE(ev({ kind: 'min-beam-peak', name: 'b', limit: 0, toleranceDb: 0, beams: ['0', '7'] }), /beam 7/);
  });
  it('a quantity mismatch between the limit set and the measurement', () => {
    expectNE(evaluateCheck({ kind: 'min-peak', name: 'p', limit: 0, toleranceDb: 0 }, m, 'gain', true, 'eirp'), /for eirp/);
  });
});

describe('judge: verdict and worst check', () => {
  const ls = (checks: LimitCheck[]): LimitSet => ({ name: 't', description: '', source: 's', quantity: 'eirp', checks });
  const ctx = { quantity: 'eirp' as const, fullSphere: true };
  const peakOk: LimitCheck = { kind: 'min-peak', name: 'peak', limit: 22, toleranceDb: 0 };          // margin 1
  const pctOk: LimitCheck = { kind: 'percentile', name: 'p50', levelPct: 50, limit: 10.8, toleranceDb: 0 }; // margin 0.2
  const pctNE: LimitCheck = { kind: 'percentile', name: 'p85', levelPct: 85, limit: 0, toleranceDb: 0 };
  const trpBad: LimitCheck = { kind: 'max-trp', name: 'trp', limit: 13, toleranceDb: 0 };            // margin −0.5
  it('pass only when every check evaluated and passed; worst = smallest margin', () => {
    const r = judge(m, ls([peakOk, pctOk]), ctx);
    expect(r.verdict).toBe('pass');
    expect(r.worstCheck?.name).toBe('p50');
    expectClose(r.worstCheck?.margin as number, 0.2, EPS, '11.0 − 10.8');
  });
  it('none when a check is not evaluable and none failed; none with no checks', () => {
    expect(judge(m, ls([peakOk, pctNE]), ctx).verdict).toBe('none');
    expect(judge(m, ls([]), ctx)).toEqual({ checks: [], verdict: 'none', worstCheck: null });
  });
  it('fail when any check fails, even beside a not-evaluable one; worst is the failed check', () => {
    const r = judge(m, ls([pctNE, peakOk, trpBad]), ctx);
    expect(r.verdict).toBe('fail');
    expect(r.worstCheck).toEqual({ name: 'trp', margin: -0.5, marginUnit: 'dB' });
    expect(r.checks.map((c) => c.status)).toEqual(['not-evaluable', 'pass', 'fail']);
  });
  it('a limit set for another quantity judges nothing', () => {
    const r = judge(m, ls([peakOk]), { quantity: 'eis', fullSphere: true });
    expect(r.verdict).toBe('none');
    expect(r.checks[0].status).toBe('not-evaluable');
  });
});
