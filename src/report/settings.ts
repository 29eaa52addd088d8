import { readFileSync } from 'node:fs';
import { yamlPackage } from '../io/yamlToJs.js';
import { clipText } from '../io/inputError.js';
import type { ReportSections, ReportSettings } from './reportTypes.js';

/** A report setting with a wrong type or value; the message names the key and what was expected. */
export class ReportSettingsError extends Error {
  override name = 'ReportSettingsError';
}

export type ReportSettingsOverrides = Partial<Omit<ReportSettings, 'sections'>> & { sections?: Partial<ReportSections> };

// templates/ sits two levels above both src/report/ and dist/report/.
const DEFAULT_PATH = new URL('../../templates/report/default.yaml', import.meta.url);

const fail = (key: string, found: unknown, expected: string): never => {
  throw new ReportSettingsError(`report settings: ${key}: found '${clipText(String(found))}', expected ${expected}`);
};

function checkSettings(s: ReportSettings): ReportSettings {
  if (typeof s.title !== 'string') fail('title', s.title, 'a text');
  if (typeof s.organisation !== 'string') fail('organisation', s.organisation, 'a text');
  if (s.logo !== null && typeof s.logo !== 'string') fail('logo', s.logo, 'a file path or null');
  if (s.pageSize !== 'A4' && s.pageSize !== 'Letter') fail('pageSize', s.pageSize, 'A4 or Letter');
  if (s.colorMap !== 'lumen' && s.colorMap !== 'grey') fail('colorMap', s.colorMap, 'lumen or grey');
  if (!Number.isFinite(s.mapCenterPhiDeg)) fail('mapCenterPhiDeg', s.mapCenterPhiDeg, 'a number of degrees');
  if (!Number.isInteger(s.mapWidthPx) || s.mapWidthPx < 100 || s.mapWidthPx > 4000)
    fail('mapWidthPx', s.mapWidthPx, 'an integer from 100 to 4000');
  if (s.creationDate !== null && Number.isNaN(Date.parse(String(s.creationDate))))
    fail('creationDate', s.creationDate, 'an ISO 8601 date or null');
  for (const [k, v] of Object.entries(s.sections)) if (typeof v !== 'boolean') fail(`sections.${k}`, v, 'true or false');
  return s;
}

/**
 * Report settings: templates/report/default.yaml, then the overrides (e.g. the job file's
 * `report:` block) key by key; `sections` merges per section.
 * @throws ReportSettingsError when a value has the wrong type or an unknown choice.
 */
export function loadReportSettings(overrides: ReportSettingsOverrides = {}): ReportSettings {
  const base = yamlPackage().parse(readFileSync(DEFAULT_PATH, 'utf8')) as ReportSettings;
  const known = new Set(Object.keys(base));
  for (const k of Object.keys(overrides)) if (!known.has(k)) fail(k, k, `one of ${[...known].join(', ')}`);
  const creation = overrides.creationDate ?? base.creationDate;
  return checkSettings({
    ...base,
    ...overrides,
    creationDate: (creation as unknown) instanceof Date ? (creation as unknown as Date).toISOString() : creation,
    sections: { ...base.sections, ...(overrides.sections ?? {}) },
  });
}
