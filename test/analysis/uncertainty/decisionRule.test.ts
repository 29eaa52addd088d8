import { describe, expect, it } from 'vitest';
import { decideCoverage, decideValue, nonBinary } from '../../../src/analysis/uncertainty/decisionRule.js';

const base = { toleranceDb: 0.5, guardBandDb: 1, expandedDb: 1 };

describe('decision rules on constructed margins', () => {
  it('shared-risk: the limit relaxed by the test tolerance, at it passes (3GPP TS 38.101-2 §4.1)', () => {
    expect(decideValue(11.0, 11.5, 'lower', { ...base, rule: 'shared-risk' })).toEqual({ acceptanceLimit: 11, margin: 0, pass: true, statement: 'pass' });
    expect(decideValue(10.9, 11.5, 'lower', { ...base, rule: 'shared-risk' }).pass).toBe(false);
    expect(decideValue(23.5, 23, 'upper', { ...base, rule: 'shared-risk' }).pass).toBe(true);
  });
  it('guarded: exactly at the limit fails, inside the guard band fails, at limit + w passes (ILAC-G8 §4.2.2)', () => {
    const g = { ...base, rule: 'guarded' as const };
    expect(decideValue(11.5, 11.5, 'lower', g).pass).toBe(false);
    expect(decideValue(12.2, 11.5, 'lower', g)).toMatchObject({ acceptanceLimit: 12.5, pass: false });
    expect(decideValue(12.5, 11.5, 'lower', g)).toMatchObject({ acceptanceLimit: 12.5, margin: 0, pass: true });
    expect(decideValue(22.1, 23, 'upper', g).pass).toBe(false); // EIS/upper bound: must be ≤ 23 − 1
    expect(decideValue(22, 23, 'upper', g).pass).toBe(true);
  });
  it('non-binary zones (ILAC-G8 §4.2.3) with U = 1 dB', () => {
    const nb = { ...base, rule: 'non-binary' as const };
    expect(decideValue(12.5, 11.5, 'lower', nb).statement).toBe('pass');
    expect(decideValue(11.5, 11.5, 'lower', nb).statement).toBe('conditional pass');
    expect(decideValue(11.0, 11.5, 'lower', nb).statement).toBe('conditional fail');
    expect(decideValue(10.5, 11.5, 'lower', nb).statement).toBe('fail');
    expect(decideValue(11.0, 11.5, 'lower', nb).pass).toBe(false);
    expect(decideValue(11.5, 11.5, 'lower', nb).pass).toBe(true);
    expect(nonBinary(-0.999, 1)).toBe('conditional fail');
  });
  it('coverage checks move the threshold: guarded reads the efficiency at t + w (eirp), t − w (eis)', () => {
    // A step pattern: 60 % of the sphere at or above 10 dBm, 40 % above 11 dBm.
    const eff = (t: number): number => (t <= 10 ? 0.6 : t <= 11 ? 0.4 : 0.1);
    const g = { ...base, rule: 'guarded' as const };
    expect(decideCoverage(eff, 10, 0.5, 1, g)).toMatchObject({ threshold: 11, value: 0.4, pass: false });
    expect(decideCoverage(eff, 9, 0.5, 1, g)).toMatchObject({ threshold: 10, value: 0.6, pass: true });
    expect(decideCoverage(eff, 10, 0.5, 1, { ...base, rule: 'shared-risk' })).toMatchObject({ threshold: 9.5, pass: true });
    expect(decideCoverage(eff, 10, 0.5, 1, { ...base, rule: 'non-binary' }).statement).toBe('conditional pass');
    const effEis = (t: number): number => (t >= -80 ? 0.6 : 0.3);
    expect(decideCoverage(effEis, -80, 0.5, -1, g)).toMatchObject({ threshold: -81, value: 0.3, pass: false });
  });
});
