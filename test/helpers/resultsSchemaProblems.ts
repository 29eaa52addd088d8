import { resultsSchema } from '../../src/config/resultsSchema.js';

/**
 * What in a results.json does not match the published schema (src/config/resultsSchema.ts), as
 * `key.path: message` lines ([] when it matches). Tests that produce the rarer parts (uncertainty,
 * polarizations, joint checks) call it so the schema cannot drift from the writer.
 */
export function resultsSchemaProblems(results: unknown): string[] {
  const r = resultsSchema().safeParse(JSON.parse(JSON.stringify(results)));
  return r.success ? [] : r.error.issues.slice(0, 10).map((i) => `${i.path.join('.')}: ${i.message}`);
}
