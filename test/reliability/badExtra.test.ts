/**
 * Issue 8, property 6 (additions): failure kinds not in fixtures/bad/ (the readers' corpus),
 * one file each with its exact expected message in fixtures/bad-extra/expected.json, on both
 * parser paths. Entries marked `knownBug` describe the wanted message for a defect not fixed
 * yet; they run as expected failures so the table turns red only once the fix lands.
 */
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { FIXTURES, readAll } from '../io/readHelpers.js';

const DIR = path.join(FIXTURES, 'bad-extra');
const expected = JSON.parse(readFileSync(path.join(DIR, 'expected.json'), 'utf8')) as Record<string, { errors: string[]; knownBug?: string }>;

describe('extra bad inputs give their exact error (fixtures/bad-extra/expected.json)', () => {
  for (const [entry, want] of Object.entries(expected)) {
    for (const parser of ['fast', 'general'] as const) {
      const test = want.knownBug ? it.fails : it;
      test(`${entry} (${parser} path)${want.knownBug ? ` [known bug: ${want.knownBug}]` : ''}`, async () => {
        const got = await readAll(path.join(DIR, entry), parser);
        const errors = [...got.jobErrors, ...got.files.flatMap((f) => f.errors), ...got.errors];
        expect(errors.map((e) => e.message)).toEqual(want.errors);
        for (const e of errors) expect(e.message.startsWith(`${e.file}:${e.line}:${e.column}: `)).toBe(true);
        for (const f of got.files) if (f.errors.length) expect(f.beams).toEqual([]);
        expect(got.measurements).toEqual([]);
      });
    }
  }
  it('every fixture file has a table entry and the other way round', () => {
    expect(readdirSync(DIR).filter((f) => f !== 'expected.json').sort()).toEqual(Object.keys(expected).sort());
  });
});
