import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadJobFile } from '../../src/io/jobFile.js';
import { parseLimitSetText } from '../../src/limits/parseLimitSet.js';
import { loadReportSettings, ReportSettingsError } from '../../src/report/settings.js';
import { fileKey, internalKey } from '../../src/config/naming.js';
import { unknownKeyExpected } from '../../src/config/problems.js';

/** One configuration error path for every kind: `<file>:<line>:<col>: <key>: found '<text>', expected <what>`. */
function jobFile(text: string): ReturnType<typeof loadJobFile> {
  const dir = mkdtempSync(path.join(tmpdir(), 'spherecov-config-'));
  const f = path.join(dir, 'spherecov.yaml');
  writeFileSync(f, text);
  return loadJobFile(f);
}

describe('naming convention', () => {
  it('file keys are snake_case; code keeps camelCase; the two map both ways', () => {
    for (const [code, file] of [['toleranceDb', 'tolerance_db'], ['levelPct', 'level_pct'], ['frequencyRangeMHz', 'frequency_range_mhz'],
      ['mapCenterPhiDeg', 'map_center_phi_deg'], ['coverageThresholds', 'coverage_thresholds'], ['inputFiles', 'input_files']]) {
      expect(fileKey(code)).toBe(file);
      expect(internalKey(file)).toBe(code);
    }
  });
  it('an unknown key names the closest known key when one is close, else lists the keys', () => {
    expect(unknownKeyExpected('toleranse_db', ['kind', 'tolerance_db'])).toBe('tolerance_db (the closest known key; known here: kind, tolerance_db)');
    expect(unknownKeyExpected('colour_map', ['title', 'color_map'])).toBe('color_map (the closest known key; known here: title, color_map)');
    expect(unknownKeyExpected('xyz', ['title', 'logo'])).toBe('one of the keys known here: title, logo (the closest is logo)');
  });
});

describe('job file', () => {
  it('a wrong value: file:line:col, key path, found, expected', () => {
    expect(jobFile('quantity: eirp\nheader_line: 0\nmerge_rule: newest\n').errors.map((e) => e.message)).toEqual([
      "spherecov.yaml:2:14: header_line: found '0', expected a line number (1 or more)",
      "spherecov.yaml:3:13: merge_rule: found 'newest', expected one of power-average, first, last, refuse",
    ]);
  });
  it('an unknown key names the closest known key', () => {
    const { errors } = jobFile('quantity: eirp\ndropout_token: [OVLD]\n');
    expect(errors).toHaveLength(1);
    expect(errors[0]).toMatchObject({ file: 'spherecov.yaml', line: 2, column: 1, columnName: 'dropout_token' });
    expect(errors[0].message).toMatch(/^spherecov\.yaml:2:1: dropout_token: found an unknown key, expected dropout_tokens \(the closest known key; known here: columns, /);
  });
  it('a key in the old spelling is read, with a deprecation notice naming the new key', () => {
    const { job, errors, notices } = jobFile('coverageThresholds: [8, 14]\nreport: { pageSize: Letter, sections: { tspMap: false } }\n');
    expect(errors).toEqual([]);
    expect(job).toMatchObject({ coverageThresholds: [8, 14], report: { pageSize: 'Letter', sections: { tspMap: false } } });
    expect(notices.map((e) => e.message)).toEqual([
      "spherecov.yaml:1:1: coverageThresholds: found 'coverageThresholds', expected coverage_thresholds (the old spelling is still read but deprecated: configuration keys are snake_case)",
      "spherecov.yaml:2:11: report.pageSize: found 'pageSize', expected page_size (the old spelling is still read but deprecated: configuration keys are snake_case)",
      "spherecov.yaml:2:41: report.sections.tspMap: found 'tspMap', expected tsp_map (the old spelling is still read but deprecated: configuration keys are snake_case)",
    ]);
  });
  it('checks in a job file are located too (same check schema as a limit set)', () => {
    expect(jobFile('checks:\n  - { kind: min-coverage, threshold: 8, min_efficiency: 55 }\n').errors.map((e) => e.message)).toEqual([
      "spherecov.yaml:2:57: checks[0].min_efficiency: found '55', expected a fraction of the sphere between 0 and 1 (0.5 = 50 %)",
    ]);
  });
});

describe('report settings', () => {
  it("a job file's report block is checked where it is written (file:line:col), not when the PDF is drawn", () => {
    const { errors } = jobFile('quantity: eirp\nreport:\n  title: Build 3\n  page_size: A3\n  map_width_px: 50\n  sections: { holes: maybe }\n');
    expect(errors.map((e) => e.message)).toEqual([
      "spherecov.yaml:4:14: report.page_size: found 'A3', expected A4 or Letter",
      "spherecov.yaml:5:17: report.map_width_px: found '50', expected an integer from 100 to 4000",
      "spherecov.yaml:6:22: report.sections.holes: found 'maybe', expected true or false",
    ]);
    expect(jobFile('report:\n  colour_map: grey\n').errors.map((e) => e.message)).toEqual([
      'spherecov.yaml:2:3: report.colour_map: found an unknown key, expected color_map (the closest known key; known here: title, organisation, logo, page_size, color_map, map_center_phi_deg, map_width_px, creation_date, sections)',
    ]);
  });
  it('settings given in code go through the same schema and are named in code spelling', () => {
    expect(loadReportSettings({ title: 'X', sections: { holes: false } })).toMatchObject({ title: 'X', pageSize: 'A4', sections: { holes: false, cdf: true } });
    expect(() => loadReportSettings({ mapWidthPx: 12 })).toThrow(new ReportSettingsError("report settings: mapWidthPx: found '12', expected an integer from 100 to 4000"));
  });
});

describe('limit set', () => {
  it('the shipped profiles and the old spelling give the same limit set', () => {
    const snake = 'name: p\nquantity: eirp\nfrequency_range_mhz: [24250, 27500]\nchecks:\n  - { kind: min-coverage, threshold: 8, min_efficiency: 0.5, tolerance_db: 1 }\n';
    const camel = 'name: p\nquantity: eirp\nfrequencyRangeMHz: [24250, 27500]\nchecks:\n  - { kind: min-coverage, threshold: 8, minEfficiency: 0.5, toleranceDb: 1 }\n';
    const a = parseLimitSetText(snake, 'a.yaml');
    const b = parseLimitSetText(camel, 'b.yaml');
    expect(a.errors).toEqual([]);
    expect(a.notices).toEqual([]);
    expect(b.limitSet).toEqual(a.limitSet);
    expect(b.notices.map((n) => n.columnName)).toEqual(['frequencyRangeMHz', 'checks[0].minEfficiency', 'checks[0].toleranceDb']);
  });
});

describe('deprecation notices reach the user', () => {
  it('an old-spelling limit file: the run goes on, the notice is on stderr and in results.json settings.warnings', async () => {
    const { runAnalyze } = await import('../../src/batch/runAnalyze.js');
    const dir = mkdtempSync(path.join(tmpdir(), 'spherecov-old-limits-'));
    const limits = path.join(dir, 'old.yaml');
    writeFileSync(limits, 'name: old\nquantity: eirp\nchecks:\n  - { kind: percentile, levelPct: 50, limit: -50 }\n');
    const stderr: string[] = [];
    const { results } = await runAnalyze({
      input: path.resolve(__dirname, '../../fixtures/cli/pass'), outDir: path.join(dir, 'out'), limits, pdf: false, jobs: 1,
      io: { stdout: () => undefined, stderr: (s: string) => void stderr.push(s), stderrIsTTY: false },
    });
    const notice = `${limits}:4:25: checks[0].levelPct: found 'levelPct', expected level_pct (the old spelling is still read but deprecated: configuration keys are snake_case)`;
    expect(results.units.length).toBeGreaterThan(0);
    expect(results.units[0].checks[0]).toMatchObject({ kind: 'percentile', levelPct: 50, limit: -50 });
    expect(results.settings.warnings).toEqual([notice]);
    expect(stderr.join('')).toContain(`spherecov: ${notice}\n`);
  });
});
