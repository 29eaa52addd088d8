import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { DEFAULT_REPORT_SETTINGS, loadReportSettings, reportSettingsFromChecked, ReportSettingsError } from '../../src/report/settings.js';
import { reportSettingsSchema } from '../../src/config/reportSettingsSchema.js';
import { loadConfigText } from '../../src/config/validateConfig.js';

const ROOT = path.resolve(import.meta.dirname, '../..');

describe('report settings', () => {
  it('templates/report/default.yaml, parsed and validated by the schema, equals DEFAULT_REPORT_SETTINGS', () => {
    // The shipped file users copy from and the constant the runs use must say the same.
    const file = path.join(ROOT, 'templates', 'report', 'default.yaml');
    const { value, errors } = loadConfigText(reportSettingsSchema(), readFileSync(file, 'utf8'), 'templates/report/default.yaml');
    expect(errors).toEqual([]);
    expect(value).toEqual(DEFAULT_REPORT_SETTINGS);
  });

  it('checked overrides merge as loadReportSettings merges them (key by key, sections by section)', () => {
    const cases = [
      {},
      { pageSize: 'Letter' as const, creationDate: '2026-12-02T10:00:00.000Z' },
      { title: 'Build 7 coverage', sections: { beams: false, holes: false } },
      { logo: null, colorMap: 'grey' as const, mapWidthPx: 400, mapCenterPhiDeg: 90 },
    ];
    for (const c of cases) expect(reportSettingsFromChecked(c)).toEqual(loadReportSettings(c));
    const s = reportSettingsFromChecked({ sections: { beams: false } });
    expect(s.sections.beams).toBe(false);
    expect(s.sections.cdf).toBe(true);
    expect(s.title).toBe('Spherical coverage report');
  });

  it('the defaults cannot be changed by a caller', () => {
    const s = reportSettingsFromChecked({});
    s.sections.beams = false;
    s.title = 'changed';
    expect(DEFAULT_REPORT_SETTINGS.sections.beams).toBe(true);
    expect(reportSettingsFromChecked({}).title).toBe('Spherical coverage report');
    expect(() => { (DEFAULT_REPORT_SETTINGS as { title: string }).title = 'x'; }).toThrow(TypeError);
  });

  it('settings given in code are still checked by the schema', () => {
    expect(() => loadReportSettings({ pageSize: 'A3' as never })).toThrow(ReportSettingsError);
    expect(() => loadReportSettings({ mapWidthPx: 5 })).toThrow(/mapWidthPx/);
  });
});
