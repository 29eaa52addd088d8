/**
 * Golden outputs: results.json, summary.csv and build-stats.csv of the demo build and of the
 * fixture builds, byte for byte (after normalizing the run time stamp and tool version only, see
 * cases.mjs). A refactor must leave them identical; a deliberate change of results regenerates
 * them with `npm run golden:update` and says why in its commit message.
 */
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { ensureBuilt } from '../cli/buildOnce.js';
// @ts-expect-error plain ES module shared with scripts/golden-update.mjs
import { CASES, GOLDEN_DIR, OUTPUT_FILES, runCase } from './cases.mjs';

interface GoldenCase { name: string }

describe('golden outputs (npm run golden:update regenerates them)', () => {
  beforeAll(() => ensureBuilt(), 180_000);
  for (const c of CASES as GoldenCase[]) {
    it(`${c.name}: exit code and output files are byte-identical to test/golden/${c.name}/`, () => {
      const dir = path.join(GOLDEN_DIR as string, c.name);
      const got = runCase(c) as { code: number; stderr: string; files: Record<string, string | null> };
      expect(`${got.code}\n`, got.stderr).toBe(readFileSync(path.join(dir, 'exit-code'), 'utf8'));
      for (const f of OUTPUT_FILES as string[]) {
        const p = path.join(dir, f);
        const want = existsSync(p) ? readFileSync(p, 'utf8') : null;
        // Compare line lists first so a failure shows the changed lines, then the exact bytes.
        expect(got.files[f]?.split('\n') ?? null, `${c.name}/${f}`).toEqual(want?.split('\n') ?? null);
        expect(got.files[f], `${c.name}/${f}`).toBe(want);
      }
    }, 120_000);
  }
});
