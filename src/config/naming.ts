/**
 * The one naming convention of every configuration file (job file, limit sets, report settings):
 * keys are snake_case (`tolerance_db`, `level_pct`, `page_size`), as job files always were. Code
 * and results.json keep camelCase; this module is the one place that maps between the two.
 *
 * Keys in the old camelCase spelling of limit files (`toleranceDb`) still work, with a
 * deprecation notice naming the new key (src/config/adoptConvention.ts).
 */

/** Internal names whose snake_case form does not camelize back to them. */
const INTERNAL_EXCEPTIONS: Record<string, string> = { frequency_range_mhz: 'frequencyRangeMHz' };

/**
 * The file (snake_case) spelling of a camelCase name.
 * @example fileKey('frequencyRangeMHz') // 'frequency_range_mhz'
 */
export function fileKey(name: string): string {
  const exception = Object.keys(INTERNAL_EXCEPTIONS).find((k) => INTERNAL_EXCEPTIONS[k] === name);
  if (exception) return exception;
  return name.replace(/([a-z0-9])([A-Z])/g, '$1_$2').replace(/([A-Z])([A-Z][a-z])/g, '$1_$2').toLowerCase();
}

/**
 * The code (camelCase) spelling of a file key.
 * @example internalKey('tolerance_db') // 'toleranceDb'
 */
export function internalKey(key: string): string {
  return INTERNAL_EXCEPTIONS[key] ?? key.replace(/_([a-z0-9])/g, (_m, c: string) => c.toUpperCase());
}

function isMapping(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

/** A copy of validated file data with every key in code spelling (for sets whose keys are all names, never data). */
export function camelizeKeys<T>(value: unknown): T {
  if (Array.isArray(value)) return value.map((v) => camelizeKeys(v)) as T;
  if (!isMapping(value)) return value as T;
  return Object.fromEntries(Object.entries(value).map(([k, v]) => [internalKey(k), camelizeKeys(v)])) as T;
}

/** A copy of in-memory settings with every key in file spelling (so code-built settings meet the file schema). */
export function fileKeys(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(fileKeys);
  if (!isMapping(value)) return value;
  return Object.fromEntries(Object.entries(value).map(([k, v]) => [fileKey(k), fileKeys(v)]));
}
