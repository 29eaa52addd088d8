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
frequency_range_mhz: [26500, 29500]
checks:
  - kind: min-peak
    limit: 20
    tolerance_db: 1.0
  - kind: percentile
    level_pct: 50
    limit: 8
  - kind: min-coverage
    threshold: 10
    min_efficiency: 0.4
    tolerance_db: 0.5
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
    const json = JSON.stringify({ name: 'j', quantity: 'eis', checks: [{ kind: 'percentile', level_pct: 50, limit: -74.4 }] });
    const { limitSet, errors, notices } = parseLimitSetText(json, 'j.json');
    expect(errors).toEqual([]);
    expect(notices).toEqual([]);
    expect(limitSet?.checks[0]).toMatchObject({ name: 'EIS at 50 %', limit: -74.4 });
  });
  it('schema errors name the key path, what was found, what was expected, and file:line:col, in file order', () => {
    const bad = GOOD.replace('limit: 8', "limit: 'eight'").replace('min_efficiency: 0.4', 'min_efficiency: 40')
      .replace('  - kind: max-trp', '  - kind: max-trp\n    tolerance: 1');
    const { limitSet, errors } = parseLimitSetText(bad, 'demo.yaml');
    expect(limitSet).toBeNull();
    expect(errors.map((e) => e.message)).toEqual([
      "demo.yaml:13:12: checks[1].limit: found 'eight', expected a number between -500 and 500 (dBm or dBi)",
      "demo.yaml:16:21: checks[2].min_efficiency: found '40', expected a fraction of the sphere between 0 and 1 (0.5 = 50 %)",
      'demo.yaml:22:5: checks[4].tolerance: found an unknown key, expected tolerance_db (the closest known key; known here: kind, name, tolerance_db, source, limit)',
    ]);
    expect(errors.every((e) => e.file === 'demo.yaml')).toBe(true);
    expect(errors[0]).toMatchObject({ line: 13, column: 12, columnName: 'checks[1].limit' });
  });
  it('an unknown top-level key names the closest known key', () => {
    const { errors } = parseLimitSetText('name: a\nquantity: eirp\nchecks: []\nfrequency_range: [1, 2]\n', 'u.yaml');
    expect(errors.map((e) => e.message)).toEqual([
      'u.yaml:4:1: frequency_range: found an unknown key, expected frequency_range_mhz (the closest known key; known here: name, description, source, quantity, band, frequency_range_mhz, checks, uncertainty)',
    ]);
  });
  it('keys in the old camelCase spelling still work, each with a deprecation notice naming the new key', () => {
    const old = GOOD.replace('frequency_range_mhz:', 'frequencyRangeMHz:').replace('tolerance_db: 1.0', 'toleranceDb: 1.0').replace('level_pct: 50', 'levelPct: 50');
    const r = parseLimitSetText(old, 'old.yaml');
    expect(r.errors).toEqual([]);
    expect(r.limitSet).toEqual(parseLimitSetText(GOOD, 'demo.yaml').limitSet);
    expect(r.notices.map((e) => e.message)).toEqual([
      "old.yaml:6:1: frequencyRangeMHz: found 'frequencyRangeMHz', expected frequency_range_mhz (the old spelling is still read but deprecated: configuration keys are snake_case)",
      "old.yaml:10:5: checks[0].toleranceDb: found 'toleranceDb', expected tolerance_db (the old spelling is still read but deprecated: configuration keys are snake_case)",
      "old.yaml:12:5: checks[1].levelPct: found 'levelPct', expected level_pct (the old spelling is still read but deprecated: configuration keys are snake_case)",
    ]);
    const both = parseLimitSetText('name: a\nquantity: eirp\nchecks:\n  - {kind: min-peak, limit: 1, tolerance_db: 1, toleranceDb: 2}\n', 'b.yaml');
    expect(both.errors.map((e) => e.message)).toEqual([
      "b.yaml:4:49: checks[0].toleranceDb: found 'toleranceDb', expected only tolerance_db (the same key twice, in its old and its new spelling)",
    ]);
  });
  it('missing and wrong top-level keys; kinds not meaningful for the quantity', () => {
    const { errors } = parseLimitSetText('quantity: eis\nchecks:\n  - kind: max-trp\n    limit: 1\n  - kind: peak\n', 'x.yaml');
    expect(errors.map((e) => e.message)).toEqual([
      'x.yaml:1:1: name: found nothing, expected a non-empty text',
      "x.yaml:5:11: checks[1].kind: found 'peak', expected one of min-peak, percentile, min-coverage, min-relative-coverage, min-beam-peak, max-trp, max-peak, beam-correspondence, inter-band-coverage",
    ]);
    // The quantity rule needs a valid set: it is reported once the shape is right.
    expect(parseLimitSetText('name: a\nquantity: eis\nchecks:\n  - kind: max-trp\n    limit: 1\n', 'x.yaml').errors.map((e) => e.message)).toEqual([
      "x.yaml:4:11: checks[0].kind: found 'max-trp', expected a check kind that applies to eis (min-peak, percentile, min-coverage, min-relative-coverage, min-beam-peak)",
    ]);
    expect(parseLimitSetText('name: a\nquantity: power\nchecks: 3\n', 'y.yaml').errors.map((e) => e.message)).toEqual([
      "y.yaml:2:11: quantity: found 'power', expected one of eirp, eis, gain",
      "y.yaml:3:9: checks: found '3', expected a list of checks",
    ]);
  });
  it('duplicate check names and negative tolerance are errors', () => {
    const t = 'name: a\nquantity: eirp\nchecks:\n  - {kind: min-peak, limit: 1}\n  - {kind: min-peak, limit: 2, tolerance_db: -1}\n';
    expect(parseLimitSetText(t, 'd.yaml').errors.map((e) => e.message)).toEqual([
      "d.yaml:5:5: checks[1].name: found 'peak EIRP', expected a name not already used by checks[0] (give one of them a name:)",
      "d.yaml:5:46: checks[1].tolerance_db: found '-1', expected a test tolerance in dB between 0 and 30",
    ]);
  });
  it('YAML syntax errors become InputErrors with a position, not exceptions', () => {
    const { limitSet, errors } = parseLimitSetText('name: a\nchecks: [1, 2\n', 'broken.yaml');
    expect(limitSet).toBeNull();
    expect(errors.length).toBeGreaterThan(0);
    expect(errors[0]).toMatchObject({ file: 'broken.yaml' });
    expect(errors[0].line).toBeGreaterThan(0);
    expect(errors[0].message).toMatch(/^broken\.yaml:3:1: syntax: found '', expected valid YAML \(/);
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
      [{ kind: 'min-peak', limit: 24, tolerance_db: 1 }, { kind: 'percentile', level_pct: 20, limit: 2 }], 'job.yaml', 'eirp');
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
    expect(r.errors).toEqual([{ file: 'job.yaml', columnName: 'checks[0].limit',
      message: "job.yaml: checks[0].limit: found 'high', expected a number between -500 and 500 (dBm or dBi)" }]);
    expect(validateExtraChecks({}, 'job.yaml', 'eirp').errors[0].message).toBe('job.yaml: checks: found a mapping, expected a list of checks');
    // The quantity is known only once the limit set is: max-peak means nothing for EIS.
    expect(validateExtraChecks([{ kind: 'max-peak', limit: 1 }], 'job.yaml', 'eis').errors[0].message).toMatch(/^job\.yaml: checks\[0\]\.kind: found 'max-peak', expected a check kind that applies to eis/);
  });
  it('metricNeeds lists percentile levels, both written and relaxed thresholds, and the level each coverage check is equivalent to', () => {
    // coverage ≥ 40 % at 10 dBm ⇔ the 60 % level reaches 10 dBm (eirp); for eis ≥ 50 % ⇔ the 50 % level (Eq. L4)
    expect(metricNeeds(base)).toEqual({ percentilesPct: [50, 60], thresholds: [9.5, 10], relativeDb: [] });
    const eis = parseLimitSetText('name: e\nquantity: eis\nchecks:\n  - {kind: min-coverage, threshold: -80, min_efficiency: 0.5, tolerance_db: 0.7}\n', 'e').limitSet!;
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
