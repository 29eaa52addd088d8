#!/usr/bin/env node
// Bundles the compiled CLI (dist/cli/main.js), its signal handlers and the three worker entries
// into dist/bundle/ with esbuild, after `tsc`: start-up loads a few dozen files instead of ~170
// modules, in every process and worker thread. dist/bundle sits at the depth of dist/<dir>/, so
// the modules' `new URL('../../templates/…', import.meta.url)` and the workers found beside the
// calling module (src/compiledWorker.ts) resolve as they do from dist/<dir>/. Code splitting keeps
// one copy of each shared module (signals.js is an entry and main's own instance) and keeps the
// lazy `await import()`s lazy (a chunk each). Packages stay external (they load lazily already).
// The stamp written last (src/cli/bundleStamp.ts) lets bin/spherecov.js ignore a bundle older
// than the tsc output it was made from.
import { build } from 'esbuild';
import { existsSync, renameSync, rmSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const dist = path.join(root, 'dist');
const bundleDir = path.join(dist, 'bundle');
// Entry name = file name in dist/bundle: the worker names are the ones their callers pass to
// compiledWorker() (test/cli/bundle.test.ts checks that every one is here).
const ENTRIES = {
  main: 'cli/main.js',
  signals: 'cli/signals.js',
  earlyThreads: 'earlyThreads.js',
  worker: 'batch/worker.js',
  rangeWorker: 'io/rangeWorker.js',
  insightWorker: 'batch/insightWorker.js',
};

if (!existsSync(path.join(dist, 'cli', 'bundleStamp.js'))) {
  process.stderr.write('bundle: dist/ is not built; run `tsc -p tsconfig.json` first\n');
  process.exit(1);
}
const { writeBundleStamp } = await import(new URL('../dist/cli/bundleStamp.js', import.meta.url).href);

// Built beside dist/bundle and swapped in whole, so a run never sees half a bundle.
const tmpDir = `${bundleDir}.${process.pid}.tmp`;
rmSync(tmpDir, { recursive: true, force: true });
const startedMs = Date.now();
const out = await build({
  entryPoints: Object.fromEntries(Object.entries(ENTRIES).map(([name, p]) => [name, path.join(dist, p)])),
  outdir: tmpDir,
  entryNames: '[name]',
  bundle: true,
  splitting: true,
  format: 'esm',
  platform: 'node',
  target: 'node20',
  packages: 'external',
  // Chained to tsc's maps, so --enable-source-maps points into src/*.ts.
  sourcemap: 'linked',
  metafile: true,
  absWorkingDir: root,
  logLevel: 'warning',
});
const inputs = Object.keys(out.metafile.inputs).map((p) => path.resolve(root, p));
writeBundleStamp(tmpDir, inputs, startedMs);

const oldDir = `${bundleDir}.${process.pid}.old`;
if (existsSync(bundleDir)) renameSync(bundleDir, oldDir);
try {
  renameSync(tmpDir, bundleDir);
} catch (e) {
  // Another bundle step swapped its own in meanwhile (made from the same dist/): keep that one.
  if (!existsSync(bundleDir)) throw e;
  rmSync(tmpDir, { recursive: true, force: true });
}
rmSync(oldDir, { recursive: true, force: true });
