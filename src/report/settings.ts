import type { ReportSections, ReportSettings } from './reportTypes.js';
import { reportSettingsSchema } from '../config/reportSettingsSchema.js';
import { validateConfig } from '../config/validateConfig.js';
import { fileKeys, internalKey } from '../config/naming.js';

/** A report setting with a wrong type or value; the message names the key and what was expected. */
export class ReportSettingsError extends Error {
  override name = 'ReportSettingsError';
}

export type ReportSettingsOverrides = Partial<Omit<ReportSettings, 'sections'>> & { sections?: Partial<ReportSections> };

/**
 * The shipped report settings. templates/report/default.yaml shows the same settings with a
 * comment on each key, for users who copy them into a job file's `report:` block;
 * test/report/settings.test.ts parses and validates that file and holds it equal to this.
 * A constant rather than the file read at run time: reading it took the yaml package and the
 * schema (zod) into every run that writes PDFs, about 0.1 s of start-up before the first file
 * was read (profile of one analyze, 2026-12-02), while a run without a job file needs neither.
 */
export const DEFAULT_REPORT_SETTINGS: Readonly<ReportSettings> = Object.freeze({
  title: 'Spherical coverage report',
  organisation: '',
  logo: null,
  pageSize: 'A4',
  colorMap: 'lumen',
  mapCenterPhiDeg: 0,
  mapWidthPx: 800,
  creationDate: null,
  sections: Object.freeze({
    checks: true,
    inputFiles: true,
    cdf: true,
    beamCdfs: true,
    tspMap: true,
    bestBeamMap: true,
    coverage: true,
    beams: true,
    quality: true,
    holes: true,
    reference: true,
    frequencyTrend: true,
  }),
});

/**
 * Report settings from overrides that were checked already: a job file's `report:` block
 * (validated by the same schema when the job file was read), values the caller built as
 * ReportSettings types them (the CLI's page size, a parsed creation date), or loadReportSettings'
 * validated value. The defaults with them on top key by key (`sections` section by section;
 * undefined keys ignored), without loading the schema.
 */
export function reportSettingsFromChecked(overrides: ReportSettingsOverrides): ReportSettings {
  const given = Object.fromEntries(Object.entries(overrides).filter(([, v]) => v !== undefined)) as ReportSettingsOverrides;
  const base = DEFAULT_REPORT_SETTINGS;
  return { ...base, ...given, sections: { ...base.sections, ...(given.sections ?? {}) } } as ReportSettings;
}

/**
 * Report settings: the defaults (DEFAULT_REPORT_SETTINGS), then the overrides (a job file's `report:`
 * block, already validated with file:line:column when the job file was loaded, or settings given
 * in code) key by key; `sections` merges per section. Overrides given in code are checked by the
 * same schema (src/config/reportSettingsSchema.ts), without a position.
 * @throws ReportSettingsError when a value has the wrong type or an unknown choice.
 */
export function loadReportSettings(overrides: ReportSettingsOverrides = {}): ReportSettings {
  const creation = (overrides.creationDate as unknown) instanceof Date ? (overrides.creationDate as unknown as Date).toISOString() : overrides.creationDate;
  const given = Object.fromEntries(Object.entries({ ...overrides, creationDate: creation }).filter(([, v]) => v !== undefined));
  const { value, errors } = validateConfig(reportSettingsSchema(), fileKeys(given), 'report settings');
  // Settings given in code are named in code's spelling (pageSize), as the caller wrote them.
  const inCode = (m: string, key = '') => m.replace(`${key}:`, `${key.split('.').map(internalKey).join('.')}:`);
  if (!value) throw new ReportSettingsError(errors.map((e) => inCode(e.message, e.columnName)).join('; '));
  return reportSettingsFromChecked(value as ReportSettingsOverrides);
}
