import path from 'node:path';
import type { InputError } from '../types.js';
import { readTrustedText, TrustedFileError } from './trustedFile.js';
import type { JobSpec } from './types.js';
import { jobFileSchema } from '../config/jobFileSchema.js';
import { validateConfig } from '../config/validateConfig.js';
import { parseConfigText } from '../config/yamlSource.js';


/**
 * Load and validate a job file (YAML or JSON) against the one job-file schema
 * (src/config/jobFileSchema.ts). Never throws: a missing file, a syntax error or a schema
 * violation comes back as errors naming the key path and position, e.g.
 * `spherecov.yaml:9:7: calibration.table[3].offset_db: found 'x', expected a finite offset …`.
 * Keys in an old spelling (`coverageThresholds`, `pageSize` in `report:`) are read with a
 * deprecation notice each (`notices`, same grammar). The checks are validated for their shape
 * here and judged for the quantity once the limit set is known (validateExtraChecks).
 */
export function loadJobFile(filePath: string): { job: JobSpec | null; errors: InputError[]; notices: InputError[] } {
  const file = path.basename(filePath);
  let text: string;
  try {
    text = readTrustedText(filePath, 'job file', file);
  } catch (e) {
    if (e instanceof TrustedFileError) return { job: null, errors: [{ file, message: e.message }], notices: [] };
    throw e;
  }
  const parsed = parseConfigText(text, file);
  if (!parsed.source) return { job: null, errors: parsed.errors, notices: [] };
  const { source } = parsed;
  const data = source.data ?? {};
  // test_info values are kept as written (a plain `chamber: 007` is the text '007', not 7).
  const info = (data as { test_info?: unknown }).test_info;
  if (info !== null && typeof info === 'object' && !Array.isArray(info)) {
    for (const k of Object.keys(info)) {
      const t = source.scalarText(['test_info', k]);
      if (t !== undefined) (info as Record<string, unknown>)[k] = t;
    }
  }
  const { value, errors, notices } = validateConfig(jobFileSchema(), data, file, source.locate);
  if (!value) return { job: null, errors, notices };
  return { job: { source: path.resolve(filePath), ...value }, errors: [], notices };
}
