import { readFileSync } from 'node:fs';
import type { ReportSections, ReportSettings } from './reportTypes.js';
import { reportSettingsSchema } from '../config/reportSettingsSchema.js';
import { loadConfigText, validateConfig } from '../config/validateConfig.js';
import { fileKeys, internalKey } from '../config/naming.js';

/** A report setting with a wrong type or value; the message names the key and what was expected. */
export class ReportSettingsError extends Error {
  override name = 'ReportSettingsError';
}

export type ReportSettingsOverrides = Partial<Omit<ReportSettings, 'sections'>> & { sections?: Partial<ReportSections> };

// templates/ sits two levels above both src/report/ and dist/report/.
const DEFAULT_PATH = new URL('../../templates/report/default.yaml', import.meta.url);

let defaults: ReportSettings | null = null;

/** The shipped defaults, validated by the same schema as a job file's `report:` block. */
function defaultSettings(): ReportSettings {
  if (defaults) return defaults;
  const { value, errors } = loadConfigText(reportSettingsSchema(), readFileSync(DEFAULT_PATH, 'utf8'), 'templates/report/default.yaml');
  if (!value) throw new ReportSettingsError(errors.map((e) => e.message).join('; '));
  defaults = value as ReportSettings;
  return defaults;
}

/**
 * Report settings: templates/report/default.yaml, then the overrides (a job file's `report:`
 * block, already validated with file:line:column when the job file was loaded, or settings given
 * in code) key by key; `sections` merges per section. Overrides given in code are checked by the
 * same schema (src/config/reportSettingsSchema.ts), without a position.
 * @throws ReportSettingsError when a value has the wrong type or an unknown choice.
 */
export function loadReportSettings(overrides: ReportSettingsOverrides = {}): ReportSettings {
  const base = defaultSettings();
  const creation = (overrides.creationDate as unknown) instanceof Date ? (overrides.creationDate as unknown as Date).toISOString() : overrides.creationDate;
  const given = Object.fromEntries(Object.entries({ ...overrides, creationDate: creation }).filter(([, v]) => v !== undefined));
  const { value, errors } = validateConfig(reportSettingsSchema(), fileKeys(given), 'report settings');
  // Settings given in code are named in code's spelling (pageSize), as the caller wrote them.
  const inCode = (m: string, key = '') => m.replace(`${key}:`, `${key.split('.').map(internalKey).join('.')}:`);
  if (!value) throw new ReportSettingsError(errors.map((e) => inCode(e.message, e.columnName)).join('; '));
  return { ...base, ...value, sections: { ...base.sections, ...(value.sections ?? {}) } } as ReportSettings;
}
