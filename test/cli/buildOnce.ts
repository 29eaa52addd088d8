/**
 * The end-to-end tests spawn the compiled CLI (bin/spherecov.js → dist/bundle, else dist/cli).
 * `npm test` compiles and bundles first; when a test file is run alone, compile here if any
 * source is newer than dist, and bundle if the bundle was not made from this dist/, so that the
 * tests run what an installed copy runs.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll } from 'vitest';
import { bundleIsCurrent } from '../../src/cli/bundleStamp.js';

export const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');
export const BUNDLE_DIR = path.join(ROOT, 'dist', 'bundle');

function newestMtime(dir: string): number {
  let t = 0;
  for (const e of readdirSync(dir, { withFileTypes: true })) {
    const p = path.join(dir, e.name);
    t = Math.max(t, e.isDirectory() ? newestMtime(p) : statSync(p).mtimeMs);
  }
  return t;
}

export function ensureBuilt(): void {
  const main = path.join(ROOT, 'dist', 'cli', 'main.js');
  if (!existsSync(main) || statSync(main).mtimeMs < newestMtime(path.join(ROOT, 'src'))) {
    try {
      execFileSync('npx', ['tsc', '-p', 'tsconfig.json'], { cwd: ROOT, stdio: 'pipe' });
    } catch {
      // tsc emits even with type errors elsewhere in the tree; the existence check below decides.
    }
  }
  if (!existsSync(main)) throw new Error('dist/cli/main.js was not built');
  if (!bundleIsCurrent(BUNDLE_DIR)) execFileSync(process.execPath, [path.join(ROOT, 'scripts', 'bundle.mjs')], { cwd: ROOT, stdio: 'pipe' });
}

/**
 * For a test file that spawns the built CLI and writes into a scratch folder: builds first
 * (ensureBuilt), makes the folder, removes it at the end. Returns the folder's path getter.
 */
export function builtWithScratch(prefix: string): () => string {
  let dir = '';
  beforeAll(() => {
    ensureBuilt();
    dir = mkdtempSync(path.join(tmpdir(), prefix));
  }, 180_000);
  afterAll(() => rmSync(dir, { recursive: true, force: true }));
  return () => dir;
}
