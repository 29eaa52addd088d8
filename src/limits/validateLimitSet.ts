import type { InputError, Quantity } from '../types.js';
import type { LimitCheck, LimitSet } from './limitSet.js';
import { checkListProblems, checkListSchema, limitSetSchema, toLimitChecks, type ParsedCheck } from '../config/limitSetSchema.js';
import { validateConfig } from '../config/validateConfig.js';
import { configError } from '../config/problems.js';
import type { KeyPath, Locate } from '../config/yamlSource.js';

export { formatKeyPath, UNKNOWN_KEY } from '../config/problems.js';
export type { KeyPath, Locate } from '../config/yamlSource.js';

/**
 * Validate a parsed limit set (YAML/JSON data → LimitSet) against the one limit-set schema
 * (src/config/limitSetSchema.ts). Strict: unknown keys are errors naming the closest known key,
 * because a misspelt `tolerance_db` silently ignored would change a verdict. Every error is in
 * the project's grammar: `<file>:<line>:<col>: checks[2].limit: found 'abc', expected a number …`.
 * Keys in the old camelCase spelling are read with a deprecation notice each (`notices`).
 *
 * Cost O(keys). Never throws on bad input; returns errors instead.
 * @example validateLimitSet({ name: 'x', quantity: 'eirp', checks: [] }, 'x.yaml').errors // []
 */
export function validateLimitSet(raw: unknown, file: string, locate: Locate = () => undefined):
  { limitSet: LimitSet | null; errors: InputError[]; notices: InputError[] } {
  const { value, errors, notices } = validateConfig(limitSetSchema(), raw, file, locate);
  return { limitSet: value, errors, notices };
}

/**
 * Validate a job file's extra (programme) checks for mergeLimitSets: the same check schema as a
 * limit set, and the same rules once the quantity is known (the checks join the limit set's).
 * `basePath` is where the list sits in the job file, for the error key paths.
 * @example validateExtraChecks([{ kind: 'min-peak', limit: 24 }], 'job.yaml', 'eirp').errors // []
 */
export function validateExtraChecks(raw: unknown, file: string, quantity: Quantity,
  basePath: KeyPath = ['checks'], locate: Locate = () => undefined): { checks: LimitCheck[]; errors: InputError[]; notices: InputError[] } {
  const { value, errors, notices } = validateConfig(checkListSchema(), raw, file, locate, basePath);
  if (!value) return { checks: [], errors, notices };
  const problems = checkListProblems(value as ParsedCheck[], quantity, basePath)
    .map((p) => configError(file, locate, p.path, p.found, p.expected));
  return problems.length ? { checks: [], errors: problems, notices } : { checks: toLimitChecks(value as ParsedCheck[], quantity), errors: [], notices };
}
