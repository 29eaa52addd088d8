import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { FIXTURES, readAll } from './readHelpers.js';

const BAD = path.join(FIXTURES, 'bad');
const expected = JSON.parse(readFileSync(path.join(BAD, 'expected.json'), 'utf8')) as Record<string, { errors: string[]; warnings: string[] }>;
/** Warnings every path-identified test file carries; the table lists only the ones under test. */
const ROUTINE = ['identity-from-path', 'frequency-missing', 'column-ignored'];

describe('bad inputs give their exact error (table in fixtures/bad/expected.json)', () => {
  for (const [entry, want] of Object.entries(expected)) {
    for (const parser of ['fast', 'general'] as const) {
      it(`${entry} (${parser} path)`, async () => {
        const got = await readAll(path.join(BAD, entry), parser);
        const errors = [...got.jobErrors, ...got.files.flatMap((f) => f.errors), ...got.errors];
        expect(errors.map((e) => e.message)).toEqual(want.errors);
        const warnings = [...got.files.flatMap((f) => f.warnings), ...got.warnings].filter((w) => !ROUTINE.includes(w.code));
        expect(warnings.map((w) => `${w.code}: ${w.file}: ${w.message}`)).toEqual(want.warnings);
        for (const e of errors) {
          // grammar: <file>:<line>:<col>: <column name>: found …, expected …
          expect(e.message).toMatch(/^[^:]+:\d+:\d+: [^:]+: found .+, expected .+/);
          expect(e.message.startsWith(`${e.file}:${e.line}:${e.column}: `)).toBe(true);
        }
        // A bad file fails its unit only: a file with errors gives no beams.
        for (const f of got.files) if (f.errors.length) expect(f.beams).toEqual([]);
      });
    }
  }
  it('covers every failure kind of the issue', () => {
    expect(Object.keys(expected).sort()).toEqual([
      'binary.csv', 'calibration_range', 'conflicting_quantities.csv', 'duplicate_direction.csv', 'empty.csv', 'empty_cell.csv',
      'infinity_value.csv', 'job_schema', 'missing_header.csv', 'nan_value.csv', 'non_numeric.csv', 'only_header.csv',
      'other_grid_refused', 'other_grid_resampled', 'phi_range.csv', 'power_without_calibration.csv', 'theta_range.csv',
      'too_few_fields.csv', 'unknown_layout.csv',
    ]);
  });
});
