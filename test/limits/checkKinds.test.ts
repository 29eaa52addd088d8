import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { CHECK_KIND_DEFS, CHECK_KINDS } from '../../src/limits/checkKinds.js';
import { evaluateCheck } from '../../src/limits/evaluateCheck.js';
import { describeCheck } from '../../src/limits/formatLimitSet.js';
import { metricNeeds } from '../../src/limits/metricNeeds.js';
import { parseLimitSetText } from '../../src/limits/parseLimitSet.js';
import type { ResultsFile } from '../../src/types.js';
import { ensureBuilt, ROOT } from '../cli/buildOnce.js';
import { metricsFixture } from './metricsFixture.js';

describe('check-kind registry', () => {
  it('every kind carries every part (the mapped type enforces it at compile time; this checks the values)', () => {
    expect(CHECK_KINDS).toEqual(['min-peak', 'percentile', 'min-coverage', 'min-relative-coverage', 'min-beam-peak', 'max-trp', 'max-peak', 'beam-correspondence', 'inter-band-coverage']);
    for (const k of CHECK_KINDS) {
      const d = CHECK_KIND_DEFS[k];
      for (const part of ['appliesTo', 'bound', 'limitOf', 'needs', 'evaluate', 'describe', 'defaultName'] as const) {
        expect(typeof d[part], `${k}.${part}`).toBe('function');
      }
      expect(['dB', 'fraction']).toContain(d.marginUnit);
      expect(Object.keys(d.fields()).length, k).toBeGreaterThan(0);
      for (const key of Object.keys(d.fields())) expect(key, `${k}: file keys are snake_case`).toMatch(/^[a-z][a-z0-9_]*$/);
    }
  });
});

// Hand-worked from metricsFixture (invented numbers): peak 23.0 dBm; the window d dB below the
// peak holds the relative coverage listed here. Margins are snapped to 1e-9.
describe('min-relative-coverage: coverage within d dB of the TSP peak ≥ e', () => {
  const m = metricsFixture({ relativeCoverage: [{ threshold: 20, efficiency: 0.3, dbBelowPeak: 3 }, { threshold: 19, efficiency: 0.36, dbBelowPeak: 4 }] });
  it('judges the efficiency in the window; the tolerance widens the window', () => {
    const c = { kind: 'min-relative-coverage' as const, name: 'r', dbBelowPeak: 3, minEfficiency: 0.25, toleranceDb: 0 };
    expect(evaluateCheck(c, m, 'eirp', true)).toMatchObject({ value: 0.3, limit: 0.25, margin: 0.05, pass: true, marginUnit: 'fraction', bound: 'lower', threshold: 20 });
    expect(evaluateCheck({ ...c, minEfficiency: 0.33 }, m, 'eirp', true)).toMatchObject({ margin: -0.03, pass: false, status: 'fail' });
    expect(evaluateCheck({ ...c, minEfficiency: 0.33, toleranceDb: 1 }, m, 'eirp', true)).toMatchObject({ value: 0.36, margin: 0.03, pass: true, threshold: 19 });
    expect(evaluateCheck({ ...c, dbBelowPeak: 6 }, m, 'eirp', true)).toMatchObject({ status: 'not-evaluable', note: 'coverage within 6 dB of the peak was not computed' });
  });
  it('needs the window as written and widened, reads in words, validates its keys', () => {
    const ls = parseLimitSetText('name: r\nquantity: eis\nchecks:\n  - { kind: min-relative-coverage, db_below_peak: 3, min_efficiency: 0.5, tolerance_db: 0.5 }\n', 'r.yaml');
    expect(ls.errors).toEqual([]);
    const set = ls.limitSet!;
    expect(set.checks[0].name).toBe('coverage within 3 dB of peak');
    expect(metricNeeds(set)).toEqual({ percentilesPct: [], thresholds: [], relativeDb: [3, 3.5] });
    expect(describeCheck(set.checks[0], set)).toBe('share of 4π with TSP within 3 dB of the best (lowest) EIS ≥ 50.0 % (test tolerance 0.5 dB)');
    const bad = parseLimitSetText('name: r\nquantity: eirp\nchecks:\n  - { kind: min-relative-coverage, db_below_peak: -1, min_efficiency: 2, limit: 3 }\n', 'r.yaml');
    expect(bad.errors.map((e) => e.message.replace(/^r\.yaml:\d+:\d+: /, ''))).toEqual([
      "checks[0].db_below_peak: found '-1', expected dB below the TSP peak between 0 and 100 (3 = within 3 dB of the best value)",
      "checks[0].min_efficiency: found '2', expected a fraction of the sphere between 0 and 1 (0.5 = 50 %)",
      'checks[0].limit: found an unknown key, expected one of the keys known here: kind, name, tolerance_db, source, db_below_peak, min_efficiency (the closest is kind)',
    ]);
  });
  beforeAll(() => ensureBuilt(), 180_000);
  it('end to end: a limit file with the kind makes the batch compute the window and judge it', () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'spherecov-relcov-'));
    const limits = path.join(dir, 'rel.yaml');
    writeFileSync(limits, 'name: rel\nquantity: eirp\nsource: invented for a test\nchecks:\n  - { kind: min-relative-coverage, db_below_peak: 10, min_efficiency: 0.2 }\n');
    const out = path.join(dir, 'out');
    const r = spawnSync(process.execPath, [path.join(ROOT, 'bin', 'spherecov.js'), 'analyze', path.join(ROOT, 'fixtures', 'cli', 'pass'), '--out', out,
      '--limits', limits, '--no-pdf', '--quiet'], { encoding: 'utf8' });
    expect(r.status, r.stderr).toBe(0);
    const res = JSON.parse(readFileSync(path.join(out, 'results.json'), 'utf8')) as ResultsFile;
    for (const u of res.units) {
      const rel = u.tsp.relativeCoverage.find((c) => c.dbBelowPeak === 10);
      expect(rel, u.unit).toBeDefined(); // computed because the check needs it, no --relative-db given
      const check = u.checks.find((c) => c.kind === 'min-relative-coverage')!;
      expect(check.value).toBe(rel!.efficiency);
      expect(check.status).toBe(rel!.efficiency >= 0.2 ? 'pass' : 'fail');
      expect(check.threshold).toBeCloseTo(u.tsp.peak.value - 10, 9); // eirp: peak − d
    }
    expect(readFileSync(path.join(out, 'summary.csv'), 'utf8').split('\n')[0]).toContain('coverage_within_10db_of_peak');
  }, 120_000);
});
