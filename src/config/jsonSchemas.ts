import type { z } from 'zod';
import { zod } from './zod.js';
import { jobFileSchema } from './jobFileSchema.js';
import { limitSetSchema } from './limitSetSchema.js';
import { resultsSchema } from './resultsSchema.js';

/**
 * The JSON Schemas shipped in the package's `schemas/` folder, generated from the same zod
 * definitions the tool validates with (so an editor completes and checks exactly what the tool
 * accepts). Configuration files are described as written (`io: 'input'`: before defaults and
 * conversions); results.json as written by analyze. Cross-key rules (a kind that must suit the
 * quantity, unique check names, u_r ≤ U/1.96 …) are not expressible here and stay the tool's.
 * Regenerate with `npm run schemas:update`; test/config/jsonSchemas.test.ts fails when the
 * shipped files are out of date.
 */
export function publishedSchemas(): Record<string, Record<string, unknown>> {
  const make = (schema: z.ZodType, io: 'input' | 'output', title: string, description: string) => ({
    ...zod().toJSONSchema(schema, { io, target: 'draft-2020-12' }),
    title,
    description,
  });
  return {
    'job-file.schema.json': make(jobFileSchema(), 'input', 'spherecov job file',
      'spherecov.yaml / spherecov.json in an input folder (or --job): column mapping, identity patterns, calibration, limits, checks, report settings, uncertainty. Every key is optional; keys are snake_case.'),
    'limit-set.schema.json': make(limitSetSchema(), 'input', 'spherecov limit set',
      'A limit-set file (--limits, or limits: in a job file): a named list of checks for one quantity. Keys are snake_case.'),
    'results.schema.json': make(resultsSchema(), 'output', 'spherecov results.json',
      'results.json written by spherecov analyze (schemaVersion 1).'),
  };
}

/** A schema file's text as shipped (two-space JSON, final newline). */
export function schemaFileText(schema: Record<string, unknown>): string {
  return `${JSON.stringify(schema, null, 2)}\n`;
}
