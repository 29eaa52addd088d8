#!/usr/bin/env node
// Bundles the compiled CLI and the three worker entries into dist/bundle/ with esbuild, after
// `tsc`, as CommonJS, one file each (<name>.code.js): start-up loads one file instead of ~170
// modules, in every process and worker thread. Each entry <name>.js is a two-line file that runs
// its code file through src/cli/codeCache.ts (bundled as codeCache.js) with V8's code cache,
// written beside it by warm-up runs at the end of this step (warmUp). dist/bundle
// sits at the depth of dist/<dir>/, and `import.meta.url` becomes each code file's own URL, so the
// modules' `new URL('../../templates/…', import.meta.url)` and the workers found beside the
// calling module (src/compiledWorker.ts) resolve as they do from dist/<dir>/. Lazy `await
// import()`s of our own modules become lazily evaluated parts of the same file. Packages stay
// external but for BUNDLED_PACKAGES. The stamp written before the warm-up
// (src/cli/bundleStamp.ts) lets bin/spherecov.js ignore a bundle older than the tsc output it was
// made from.
import { spawnSync } from 'node:child_process';
import { build } from 'esbuild';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { generate as generateExport } from '../bench/gen.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const dist = path.join(root, 'dist');
const bundleDir = path.join(dist, 'bundle');
// Entry name = file name in dist/bundle: the worker names are the ones their callers pass to
// compiledWorker() (test/cli/bundle.test.ts checks that every one is here).
const ENTRIES = {
  main: 'cli/bundleEntry.js',
  worker: 'batch/worker.js',
  rangeWorker: 'io/rangeWorker.js',
  insightWorker: 'batch/insightWorker.js',
};
/**
 * Packages bundled in (and so covered by the code cache): the two the CLI imports at start-up,
 * plain JavaScript that reads no files of its own. Every other package stays external: it loads
 * lazily already (src/lazyPackage.ts), or reads data files beside itself (pdfkit, fontkit).
 */
const BUNDLED_PACKAGES = ['commander', 'simple-statistics'];
const pkg = JSON.parse(readFileSync(path.join(root, 'package.json'), 'utf8'));
const EXTERNAL = Object.keys({ ...pkg.dependencies, ...pkg.devDependencies }).filter((p) => !BUNDLED_PACKAGES.includes(p));
/** `import.meta.url` in the CommonJS output: the code file's own URL. */
const MODULE_URL = '__spherecovModuleUrl';

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
  entryPoints: {
    ...Object.fromEntries(Object.entries(ENTRIES).map(([name, p]) => [`${name}.code`, path.join(dist, p)])),
    codeCache: path.join(dist, 'cli', 'codeCache.js'),
  },
  outdir: tmpDir,
  entryNames: '[name]',
  bundle: true,
  format: 'cjs',
  platform: 'node',
  target: 'node20',
  external: EXTERNAL,
  define: { 'import.meta.url': MODULE_URL },
  banner: { js: `const ${MODULE_URL} = require('node:url').pathToFileURL(__filename).href;` },
  // Chained to tsc's maps (src/*.ts positions for a debugger reading the bundle).
  sourcemap: 'linked',
  metafile: true,
  absWorkingDir: root,
  logLevel: 'warning',
});
writeFileSync(path.join(tmpDir, 'package.json'), '{ "type": "commonjs" }\n');
for (const name of Object.keys(ENTRIES)) {
  writeFileSync(path.join(tmpDir, `${name}.js`), `// Written by scripts/bundle.mjs: ${name}.code.js with V8's code cache (src/cli/codeCache.ts).
module.exports = require('./codeCache.js').loadWithCodeCache(require('node:path').join(__dirname, '${name}.code.js'));\n`);
}
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

await warmUp();

/**
 * The code caches, written by runs with SPHERECOV_CODE_CACHE_WRITE=1 (each thread writes the
 * caches of the files it loaded): first a build of four small units on two threads (the task
 * pool's worker), then one analyze as a user runs it (unit PDF, summary PDF, viewer.html) on a
 * generated long export of 40 beams on a 1° grid (~40 MB: above the sizes at which the second
 * reading thread and the insight lane start), whose main-thread cache is the one kept. A failure
 * leaves no cache, never a broken bundle; a file without one compiles as usual.
 */
async function warmUp() {
  const work = mkdtempSync(path.join(tmpdir(), 'spherecov-warm-up-'));
  try {
    // The benchmark's export generator (bench/gen.mjs): steered beams, two-decimal values.
    for (let u = 1; u <= 4; u++) {
      mkdirSync(path.join(work, 'build', `U-${u}`), { recursive: true });
      await generateExport(path.join(work, 'build', `U-${u}`, 'beams.csv'), { beams: 16, step: 5, seed: u });
    }
    await generateExport(path.join(work, 'large.csv'), { beams: 40, step: 1, seed: 7 });
    const run = (args) => {
      // A run that hangs (a bug in the program being bundled) must not hang the build: killed after 2 min.
      const r = spawnSync(process.execPath, [path.join(root, 'bin', 'spherecov.js'), 'analyze', ...args, '--out', path.join(work, 'out'), '--force'], {
        cwd: root, encoding: 'utf8', env: { ...process.env, SPHERECOV_CODE_CACHE_WRITE: '1' }, timeout: 120_000, killSignal: 'SIGKILL',
      });
      if (r.status !== 0) process.stderr.write(`bundle: a warm-up run failed (${r.status === null ? `killed: ${r.signal}` : `exit ${r.status}`}); the bundle may run without some code caches\n${r.stderr}`);
    };
    run([path.join(work, 'build'), '--jobs', '2']);
    // The second reading thread and the insight lane start only when other processes leave a core
    // free (src/batch/analyzePlan.ts readThreads): on a busy machine, try again a little later.
    const laneCachesWritten = () => ['rangeWorker', 'insightWorker'].every((n) => existsSync(path.join(bundleDir, `${n}.code.js.cache`)));
    for (let attempt = 1; ; attempt++) {
      run([path.join(work, 'large.csv')]);
      if (laneCachesWritten()) break;
      if (attempt === 3) {
        process.stderr.write('bundle: the machine stayed busy; the reading thread and the insight lane run without code caches\n');
        break;
      }
      await new Promise((resolve) => setTimeout(resolve, 1000));
    }
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
}
