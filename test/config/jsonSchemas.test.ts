import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { publishedSchemas, schemaFileText } from '../../src/config/jsonSchemas.js';

const ROOT = path.resolve(__dirname, '../..');

describe('published JSON Schemas (schemas/)', () => {
  const schemas = publishedSchemas();
  it.each(Object.keys(schemas))('schemas/%s is current (regenerate with `npm run schemas:update`)', (name) => {
    const shipped = readFileSync(path.join(ROOT, 'schemas', name), 'utf8');
    expect(shipped, `schemas/${name} is out of date: run npm run schemas:update`).toBe(schemaFileText(schemas[name]));
  });
  it('the folder ships with the package', () => {
    const pkg = JSON.parse(readFileSync(path.join(ROOT, 'package.json'), 'utf8')) as { files: string[]; scripts: Record<string, string> };
    expect(pkg.files).toContain('schemas');
    expect(pkg.scripts['schemas:update']).toMatch(/schemas-update\.mjs/);
  });
  it('the job-file schema carries the keys the tool accepts, the limit-set schema every check kind', () => {
    const job = schemas['job-file.schema.json'] as { properties: Record<string, unknown>; additionalProperties: boolean };
    for (const k of ['columns', 'identity', 'quantity', 'value_unit', 'angles', 'frequency_unit', 'header_line', 'dropout_tokens', 'merge_rule',
      'calibration', 'limits', 'checks', 'percentiles', 'coverage_thresholds', 'report', 'reference', 'uncertainty']) {
      expect(Object.keys(job.properties), k).toContain(k);
    }
    expect(job.additionalProperties).toBe(false);
    const text = JSON.stringify(schemas['limit-set.schema.json']);
    for (const kind of ['min-peak', 'percentile', 'min-coverage', 'min-relative-coverage', 'min-beam-peak', 'max-trp', 'max-peak',
      'beam-correspondence', 'inter-band-coverage']) expect(text).toContain(`"const":"${kind}"`);
    expect(text).toContain('"tolerance_db"');
    expect(text).not.toMatch(/"[a-z]+[A-Z][A-Za-z]*":\{/); // no camelCase key anywhere in a configuration schema
  });
});
