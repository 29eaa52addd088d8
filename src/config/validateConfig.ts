import type { z } from 'zod';
import type { InputError } from '../types.js';
import { fileKey } from './naming.js';
import { childSchema, knownKeys } from './schemaWalk.js';
import { configError, fallbackExpected, UNKNOWN_KEY, unknownKeyExpected, valueAt } from './problems.js';
import { parseConfigText, type KeyPath, type Locate } from './yamlSource.js';

/** What validating one configuration gives: the value (null on any error), the errors, the deprecation notices. */
export interface ConfigOutcome<T> {
  value: T | null;
  errors: InputError[];
  /** Keys in an old spelling that were still read; each names the new key (InputError shape, file:line:col). */
  notices: InputError[];
}

const isMapping = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/**
 * Apply the naming convention (src/config/naming.ts) to raw file data, in place: a key the schema
 * does not know whose snake_case form it knows (`toleranceDb` → `tolerance_db`) is renamed and
 * listed as deprecated; written in both spellings, it is an error.
 */
function adoptConvention(schema: z.ZodType, value: unknown, path: KeyPath, file: string, locate: Locate, out: ConfigOutcome<unknown>): void {
  if (Array.isArray(value)) {
    value.forEach((v, i) => {
      const c = childSchema(schema, i, value);
      if (c) adoptConvention(c, v, [...path, i], file, locate, out);
    });
    return;
  }
  if (!isMapping(value)) return;
  const known = knownKeys(schema, value);
  if (known) {
    const entries = Object.entries(value);
    let renamed = false;
    for (const e of entries) {
      const [k] = e;
      const fk = fileKey(k);
      if (known.includes(k) || fk === k || !known.includes(fk)) continue;
      if (fk in value) {
        out.errors.push(configError(file, locate, [...path, k], k, `only ${fk} (the same key twice, in its old and its new spelling)`, true));
        e[0] = '';
        renamed = true;
        continue;
      }
      out.notices.push(configError(file, locate, [...path, k], k,
        `${fk} (the old spelling is still read but deprecated: configuration keys are snake_case)`, true));
      e[0] = fk;
      renamed = true;
    }
    if (renamed) {
      for (const k of Object.keys(value)) delete value[k];
      for (const [k, v] of entries) if (k !== '' && !(k in value)) value[k] = v;
    }
  }
  for (const [k, v] of Object.entries(value)) {
    const c = childSchema(schema, k, value);
    if (c) adoptConvention(c, v, [...path, k], file, locate, out);
  }
}

/**
 * Validate parsed configuration data against its schema. Every problem becomes one InputError in
 * the project's grammar (`<file>:<line>:<col>: <key path>: found '<text>', expected <what>`), in
 * file order; an unknown key names the closest known key. `base` is where `data` sits in its
 * file (a job file's `checks` list is validated at ['checks']).
 *
 * Cost O(keys). Never throws on bad input.
 * @example validateConfig(limitSetSchema, { name: 'x', quantity: 'eirp', checks: [] }, 'x.yaml').errors // []
 */
export function validateConfig<S extends z.ZodType>(schema: S, data: unknown, file: string,
  locate: Locate = () => undefined, base: KeyPath = []): ConfigOutcome<z.output<S>> {
  const out: ConfigOutcome<z.output<S>> = { value: null, errors: [], notices: [] };
  const local: Locate = (p, atKey) => locate([...base, ...p], atKey);
  adoptConvention(schema, data, [], file, local, out as ConfigOutcome<unknown>);
  const at = (p: KeyPath) => [...base, ...p];
  const parsed = schema.safeParse(data, { error: (iss) => fallbackExpected(iss) });
  if (!parsed.success) {
    for (const iss of parsed.error.issues) {
      const p = iss.path as KeyPath;
      if (iss.code === 'unrecognized_keys') {
        const known = knownKeys(schemaAt(schema, data, p), valueAt(data, p)) ?? [];
        for (const k of iss.keys) out.errors.push(configError(file, locate, at([...p, k]), UNKNOWN_KEY, unknownKeyExpected(k, known)));
      } else if (iss.code === 'invalid_key') {
        // A mapping whose keys are the user's (test_info): the key itself is what is wrong.
        out.errors.push(configError(file, locate, at(p), p[p.length - 1], iss.message, true));
      } else {
        // A cross-field rule may say what it found in words (`'28 GHz' twice`) instead of the value.
        const params = iss.code === 'custom' ? (iss.params as { found?: unknown } | undefined) : undefined;
        const found = params && 'found' in params ? params.found : valueAt(data, p);
        out.errors.push(configError(file, locate, at(p), found, iss.message, params && 'atKey' in params ? true : false));
      }
    }
  }
  out.errors.sort((a, b) => (a.line ?? 0) - (b.line ?? 0) || (a.column ?? 0) - (b.column ?? 0));
  if (out.errors.length === 0 && parsed.success) out.value = parsed.data;
  return out;
}

function schemaAt(schema: z.ZodType, data: unknown, path: KeyPath): z.ZodType {
  let s: z.ZodType | null = schema;
  let v = data;
  for (const k of path) {
    s = s ? childSchema(s, k, v) : null;
    v = valueAt(v, [k]);
  }
  return s ?? schema;
}

/**
 * Parse and validate the text of a configuration file in one step (the YAML position mapper of
 * yamlSource.ts, then validateConfig). An empty file is `emptyAs` (null: an error from the schema).
 */
export function loadConfigText<S extends z.ZodType>(schema: S, text: string, file: string, emptyAs?: unknown): ConfigOutcome<z.output<S>> {
  const { source, errors } = parseConfigText(text, file);
  if (!source) return { value: null, errors, notices: [] };
  const data = (source.data === null || source.data === undefined) && emptyAs !== undefined ? emptyAs : source.data;
  return validateConfig(schema, data, file, source.locate);
}
