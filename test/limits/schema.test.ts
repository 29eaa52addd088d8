import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseLimitSetText } from '../../src/limits/parseLimitSet.js';
import { validateExtraChecks } from '../../src/limits/validateLimitSet.js';
import { loadLimitSet } from '../../src/limits/loadLimitSet.js';
import { mergeLimitSets } from '../../src/limits/mergeLimitSets.js';
import { metricNeeds } from '../../src/limits/metricNeeds.js';
import { formatLimitSet } from '../../src/limits/formatLimitSet.js';
import { frequencyInRange } from '../../src/limits/frequencyInRange.js';
import type { InputError } from '../../src/types.js';

const GOOD = `# programme limits for an invented prototype
name: demo-programme
description: invented limits for tests
source: programme spec DEMO-7 rev B (invented)
quantity: eirp
frequencyRangeMHz: [26500, 29500]
checks:
  - kind: min-peak
    limit: 20
    toleranceDb: 1.0
  - kind: percentile
    levelPct: 50
    limit: 8
  - kind: min-coverage
    threshold: 10
    minEfficiency: 0.4
    toleranceDb: 0.5
  - kind: min-beam-peak
    limit: 15
    beams: [0, 1, "2a"]
  - kind: max-trp
    limit: 23
  - kind: max-peak
    name: EIRP ceiling
    limit: 43
`;

const msgs = (errs: InputError[]) => errs.map((e) => `${e.line ?? '-'}:${e.column ?? '-'}: ${e.message}`);

describe('limit-set files', () => {
  it('a complete YAML file parses, with default names and tolerance 0', () => {
    const { limitSet, errors } = parseLimitSetText(GOOD, 'demo.yaml');
    expect(errors).toEqual([]);
    expect(limitSet?.checks.map((c) => c.name)).toEqual(
      ['peak EIRP', 'EIRP at 50 %', 'coverage at 10 dBm', 'beam peak EIRP', 'max TRP', 'EIRP ceiling']);
    expect(limitSet?.checks[1].toleranceDb).toBe(0);
    expect(limitSet?.checks[3]).toMatchObject({ beams: ['0', '1', '2a'] });
    expect(limitSet?.frequencyRangeMHz).toEqual([26500, 29500]);
  });
  it('JSON is read by the same parser', () => {
    const json = JSON.stringify({ name: 'j', quantity: 'eis', checks: [{ kind: 'percentile', levelPct: 50, limit: -74.4 }] });
    const { limitSet, errors } = parseLimitSetText(json, 'j.json');
    expect(errors).toEqual([]);
    expect(limitSet?.checks[0]).toMatchObject({ name: 'EIS at 50 %', limit: -74.4 });
  });
  it('schema errors name the key path, what was found, what was expected, and the line', () => {
    const bad = GOOD.replace('limit: 8', "limit: 'eight'").replace('minEfficiency: 0.4', 'minEfficiency: 40')
      .replace('  - kind: max-trp', '  - kind: max-trp\n    toleranceDB: 1');
    const { limitSet, errors } = parseLimitSetText(bad, 'demo.yaml');
    expect(limitSet).toBeNull();
    expect(msgs(errors)).toEqual([
      "13:12: checks[1].limit: found 'eight', expected a number between -500 and 500 (dBm or dBi)",
      "16:20: checks[2].minEfficiency: found '40', expected a fraction of the sphere between 0 and 1 (0.5 = 50 %)",
      '22:5: checks[4].toleranceDB: found an unknown key, expected one of kind, name, toleranceDb, source, limit for kind max-trp',
    ]);
    expect(errors.every((e) => e.file === 'demo.yaml')).toBe(true);
    expect(errors[0].columnName).toBe('checks[1].limit');
  });
  it('missing and wrong top-level keys; kinds not meaningful for the quantity', () => {
    const { errors } = parseLimitSetText('quantity: eis\nchecks:\n  - kind: max-trp\n    limit: 1\n  - kind: peak\n', 'x.yaml');
    expect(errors.map((e) => e.message)).toEqual([
      'name: found nothing, expected a non-empty text',
      "checks[0].kind: found 'max-trp', expected a check kind that applies to eis (min-peak, percentile, min-coverage, min-relative-coverage, min-beam-peak)",
      "checks[1].kind: found 'peak', expected one of min-peak, percentile, min-coverage, min-relative-coverage, min-beam-peak, max-trp, max-peak, beam-correspondence, inter-band-coverage",
    ]);
    expect(parseLimitSetText('name: a\nquantity: power\nchecks: 3\n', 'y.yaml').errors.map((e) => e.message)).toEqual([
      "quantity: found 'power', expected one of eirp, eis, gain",
      "checks: found '3', expected a list of checks",
    ]);
  });
  it('duplicate check names and negative tolerance are errors', () => {
    const t = 'name: a\nquantity: eirp\nchecks:\n  - {kind: min-peak, limit: 1}\n  - {kind: min-peak, limit: 2, toleranceDb: -1}\n';
    expect(parseLimitSetText(t, 'd.yaml').errors.map((e) => e.message)).toEqual([
      "checks[1].toleranceDb: found '-1', expected a test tolerance in dB between 0 and 30",
      "checks[1].name: found 'peak EIRP', expected a name not already used by checks[0] (give one of them a name:)",
    ]);
  });
  it('YAML syntax errors become InputErrors with a position, not exceptions', () => {
    const { limitSet, errors } = parseLimitSetText('name: a\nchecks: [1, 2\n', 'broken.yaml');
    expect(limitSet).toBeNull();
    expect(errors.length).toBeGreaterThan(0);
    expect(errors[0]).toMatchObject({ file: 'broken.yaml' });
    expect(errors[0].line).toBeGreaterThan(0);
    expect(errors[0].message).toMatch(/^not a valid YAML\/JSON limit set/);
  });
});

describe('loadLimitSet', () => {
  it('loads a shipped profile by name and a file by path', () => {
    const p = loadLimitSet('3gpp-fr2-pc3-n257');
    expect(p.errors).toEqual([]);
    expect(p.limitSet?.file).toMatch(/templates[\\/]limits[\\/]3gpp-fr2-pc3-n257\.yaml$/);
    const dir = mkdtempSync(join(tmpdir(), 'limits-'));
    writeFileSync(join(dir, 'mine.yaml'), GOOD);
    expect(loadLimitSet(join(dir, 'mine.yaml')).limitSet?.name).toBe('demo-programme');
    expect(loadLimitSet(join(dir, 'absent.yaml')).errors[0].message).toMatch(/no such file/);
  });
  it('an unknown profile name suggests close names', () => {
    const r = loadLimitSet('3gpp-fr2-pc3-n25');
    expect(r.limitSet).toBeNull();
    expect(r.errors[0].message).toMatch(/found '3gpp-fr2-pc3-n25', expected a limit-set file .* such as 3gpp-fr2-pc3-n257/);
  });
});

describe('merge, needs, listing', () => {
  const base = parseLimitSetText(GOOD, 'demo.yaml').limitSet!;
  it('mergeLimitSets replaces same-name checks in place and appends the rest', () => {
    const { checks: extra, errors } = validateExtraChecks(
      [{ kind: 'min-peak', limit: 24, toleranceDb: 1 }, { kind: 'percentile', levelPct: 20, limit: 2 }], 'job.yaml', 'eirp');
    expect(errors).toEqual([]);
    const merged = mergeLimitSets(base, extra);
    expect(merged.checks.length).toBe(base.checks.length + 1);
    expect(merged.checks[0]).toMatchObject({ name: 'peak EIRP', limit: 24 });
    expect(merged.checks.at(-1)).toMatchObject({ name: 'EIRP at 20 %' });
    expect(base.checks[0]).toMatchObject({ limit: 20 });
    expect(merged.description).toMatch(/2 programme check\(s\) added, 1 of them replacing/);
  });
  it('extra checks from a job file report their key path', () => {
    const r = validateExtraChecks([{ kind: 'max-peak', limit: 'high' }], 'job.yaml', 'eirp');
    expect(r.checks).toEqual([]);
    expect(r.errors).toEqual([{ file: 'job.yaml', columnName: 'limits.extraChecks[0].limit',
      message: "limits.extraChecks[0].limit: found 'high', expected a number between -500 and 500 (dBm or dBi)" }]);
    expect(validateExtraChecks({}, 'job.yaml', 'eirp').errors[0].message).toBe('limits.extraChecks: found a mapping, expected a list of checks');
  });
  it('metricNeeds lists percentile levels, both written and relaxed thresholds, and the level each coverage check is equivalent to', () => {
    // coverage ≥ 40 % at 10 dBm ⇔ the 60 % level reaches 10 dBm (eirp); for eis ≥ 50 % ⇔ the 50 % level (Eq. L4)
    expect(metricNeeds(base)).toEqual({ percentilesPct: [50, 60], thresholds: [9.5, 10], relativeDb: [] });
    const eis = parseLimitSetText('name: e\nquantity: eis\nchecks:\n  - {kind: min-coverage, threshold: -80, minEfficiency: 0.5, toleranceDb: 0.7}\n', 'e').limitSet!;
    expect(metricNeeds(eis)).toEqual({ percentilesPct: [50], thresholds: [-80, -79.3], relativeDb: [] });
  });
  it('formatLimitSet prints every check rule and the cautions', () => {
    const text = formatLimitSet(base);
    expect(text.split('\n')[0]).toBe('demo-programme');
    expect(text).toContain('TSP value at the 50 % CDF level ≥ 8 dBm');
    expect(text).toContain('share of 4π with TSP ≥ 10 dBm ≥ 40.0 % (threshold relaxed by the 0.5 dB test tolerance to 9.5 dBm)');
    expect(text).toContain('peak of beams 0, 1, 2a ≥ 15 dBm');
    expect(text).toContain('verified against the current release');
    expect(text).toContain('not a regulatory conformance');
  });
  it('frequencyInRange uses the inclusive MHz range', () => {
    expect(frequencyInRange(base, 28e9)).toBe(true);
    expect(frequencyInRange(base, 29.5e9)).toBe(true);
    expect(frequencyInRange(base, 39e9)).toBe(false);
    expect(frequencyInRange(base, null)).toBeNull();
  });
});
