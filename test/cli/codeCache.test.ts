import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { BUNDLE_DIR, builtWithScratch, ROOT } from './buildOnce.js';

// The bundle's files load with V8's code cache (src/cli/codeCache.ts, written by the warm-up runs
// of scripts/bundle.mjs); a cache that does not belong to the source beside it is never used.

const LOADER = path.join(ROOT, 'dist', 'cli', 'codeCache.js');
const scratch = builtWithScratch('spherecov-code-cache-');

/** Load `file` through the loader in a fresh process; its `value` export and how the cache was used. */
function load(file: string, env: Record<string, string> = {}): { value: unknown; use: string } {
  const code = `import { loadWithCodeCache, codeCacheUse } from ${JSON.stringify(LOADER)};
    const m = loadWithCodeCache(${JSON.stringify(file)});
    process.stdout.write(JSON.stringify({ value: m.value, use: codeCacheUse().get(${JSON.stringify(path.basename(file))}) }));`;
  const r = spawnSync(process.execPath, ['--input-type=module', '-e', code], { encoding: 'utf8', env: { ...process.env, ...env } });
  expect(r.status, r.stderr).toBe(0);
  return JSON.parse(r.stdout) as { value: unknown; use: string };
}

describe('code cache (src/cli/codeCache.ts)', () => {
  it('the bundle\'s entries have caches made from their code files, and a fresh process uses them', () => {
    // The CLI and the task pool's worker always (their warm-up runs do not depend on the machine's
    // load); the reading thread and the insight lane when the bundle step found a core free.
    for (const name of ['main', 'worker', 'rangeWorker', 'insightWorker']) {
      const code = path.join(BUNDLE_DIR, `${name}.code.js`);
      if (!existsSync(`${code}.cache`) && (name === 'rangeWorker' || name === 'insightWorker')) {
        console.warn(`${name}.code.js has no cache (the bundle step ran on a busy machine)`);
        continue;
      }
      const cache = readFileSync(`${code}.cache`);
      expect(cache.subarray(0, 32).equals(createHash('sha256').update(readFileSync(code)).digest()), name).toBe(true);
      expect(cache.length, name).toBeGreaterThan(10_000);
    }
    // The CLI's file, as bin/spherecov.js loads it (a worker file would start its work on load).
    const r = spawnSync(process.execPath, ['-e', `const c = require(${JSON.stringify(path.join(BUNDLE_DIR, 'codeCache.js'))});
      const cli = require(${JSON.stringify(path.join(BUNDLE_DIR, 'main.js'))});
      process.stdout.write(c.codeCacheUse().get('main.code.js') + ' ' + typeof cli.main);`], { encoding: 'utf8' });
    expect(r.stdout).toBe('used function');
  });

  it('writes a cache in a warm-up run, uses it after, and refuses it for another source of the same length', () => {
    const file = path.join(scratch(), 'value.cjs');
    writeFileSync(file, 'exports.value = [1, 2, 3].map((x) => x * 10);\n');
    expect(load(file)).toEqual({ value: [10, 20, 30], use: 'none' });
    load(file, { SPHERECOV_CODE_CACHE_WRITE: '1' });
    expect(existsSync(`${file}.cache`)).toBe(true);
    expect(load(file)).toEqual({ value: [10, 20, 30], use: 'used' });
    // Same length, other code: V8 alone would take the old bytecode (it checks the length only;
    // measured on Node 20: a cache of `return 1` ran for `return 2`); the hash turns it down.
    writeFileSync(file, 'exports.value = [1, 2, 3].map((x) => x * 20);\n');
    expect(load(file)).toEqual({ value: [20, 40, 60], use: 'rejected' });
    // A damaged cache file is refused too.
    writeFileSync(`${file}.cache`, Buffer.alloc(100, 7));
    expect(load(file)).toEqual({ value: [20, 40, 60], use: 'rejected' });
  });
});
