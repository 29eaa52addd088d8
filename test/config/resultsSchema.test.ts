import { readdirSync, readFileSync, existsSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { resultsSchemaProblems } from '../helpers/resultsSchemaProblems.js';

const GOLDEN = path.resolve(__dirname, '../golden');

describe('results.json schema (src/config/resultsSchema.ts) matches what analyze writes', () => {
  const cases = readdirSync(GOLDEN).filter((d) => existsSync(path.join(GOLDEN, d, 'results.json')));
  it('there are golden builds to check (the demo among them)', () => {
    expect(cases).toContain('demo');
    expect(cases.length).toBeGreaterThanOrEqual(5);
  });
  it.each(cases)('golden %s/results.json', (c) => {
    const results = JSON.parse(readFileSync(path.join(GOLDEN, c, 'results.json'), 'utf8'));
    expect(resultsSchemaProblems(results)).toEqual([]);
  });
  it('a field the schema does not know is reported (the schema is strict, so it cannot drift silently)', () => {
    const results = JSON.parse(readFileSync(path.join(GOLDEN, 'demo', 'results.json'), 'utf8'));
    results.units[0].newField = 1;
    results.units[0].tsp.peak.value = 'high';
    expect(resultsSchemaProblems(results)).toEqual([
      'units.0.tsp.peak.value: Invalid input: expected number, received string',
      'units.0: Unrecognized key: "newField"',
    ]);
  });
});
