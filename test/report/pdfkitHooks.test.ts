import { describe, expect, it } from 'vitest';
import { pdfkitHookProblems } from '../../src/report/fonts.js';

// src/report/fonts.ts uses two private parts of pdfkit (its own fontkit instance, and a
// document's _font.layoutCache) to parse the report fonts once per thread and share word layouts.
// At run time both fall back silently (reports stay right, only slower); this test is where an
// upgrade of pdfkit that changes them becomes loud.
describe('private pdfkit hooks of src/report/fonts.ts', () => {
  it('all work with the installed pdfkit (the pinned version)', () => {
    const problems = pdfkitHookProblems();
    expect(problems, `pdfkit hooks changed:\n- ${problems.join('\n- ')}`).toEqual([]);
  });
});
