/**
 * Loads the bundle's CommonJS files (dist/bundle/*.code.js, scripts/bundle.mjs) with V8's code
 * cache: the bytecode of every function a typical run compiled, saved by the bundle step's
 * warm-up run beside each file (`<file>.cache`). A process or worker thread then skips compiling
 * those functions when they first run (the 64-beam export's analyze: ~5 % less wall time, 14
 * alternating pairs). Without a cache, or with one V8 rejects (another Node version or flags),
 * the file compiles as usual; the results never depend on it.
 *
 * A cache file is `sha256(source) ‖ V8's data`: V8 itself only checks the source's length, so
 * the hash keeps a cache from ever meeting a different source of the same length.
 *
 * Node's built-ins only: bundled on its own into dist/bundle/codeCache.js, which the bundle's
 * small entry files require.
 */
import { createHash } from 'node:crypto';
import { readFileSync, renameSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import vm from 'node:vm';
import { isMainThread, parentPort } from 'node:worker_threads';

/** Set to 1 in the bundle step's warm-up run: each loaded file's cache is written after its work. */
export const CODE_CACHE_WRITE_ENV = 'SPHERECOV_CODE_CACHE_WRITE';

/** How a file was loaded: with its cache, without one, or with one V8 or the hash turned down. */
export type CacheUse = 'used' | 'none' | 'rejected';

const HASH_BYTES = 32;
const loaded: { script: vm.Script; cacheFile: string; hash: Buffer }[] = [];
const uses = new Map<string, CacheUse>();

/** How each file this thread loaded used its cache, by file name (tests, benchmark). */
export function codeCacheUse(): ReadonlyMap<string, CacheUse> {
  return uses;
}

/**
 * Run the CommonJS file `file` (an absolute path) as `require` would, compiled with the cache
 * beside it when there is a valid one, and return its exports.
 */
export function loadWithCodeCache(file: string): unknown {
  const source = readFileSync(file);
  const hash = createHash('sha256').update(source).digest();
  const cacheFile = `${file}.cache`;
  let cachedData: Buffer | undefined;
  let use: CacheUse = 'none';
  try {
    const bytes = readFileSync(cacheFile);
    if (bytes.length > HASH_BYTES && bytes.subarray(0, HASH_BYTES).equals(hash)) cachedData = bytes.subarray(HASH_BYTES);
    else use = 'rejected';
  } catch {
    // No cache: compile as usual.
  }
  // The wrapper on the source's first line keeps its line numbers (stack traces, source maps).
  const script = new vm.Script(`(function (exports, require, module, __filename, __dirname) {${source.toString('utf8')}\n})`, {
    filename: file,
    cachedData,
    importModuleDynamically: vm.constants.USE_MAIN_CONTEXT_DEFAULT_LOADER,
  });
  if (cachedData !== undefined) use = script.cachedDataRejected === true ? 'rejected' : 'used';
  uses.set(path.basename(file), use);
  loaded.push({ script, cacheFile, hash });
  const mod = { exports: {} as unknown };
  const run = script.runInThisContext() as (e: unknown, r: NodeJS.Require, m: { exports: unknown }, f: string, d: string) => void;
  run.call(mod.exports, mod.exports, createRequire(file), mod, file, path.dirname(file));
  return mod.exports;
}

/** Write the cache of every file this thread loaded (each through a temporary file and a rename). */
function writeCaches(): void {
  for (const l of loaded) {
    const tmp = `${l.cacheFile}.${process.pid}.${Math.random().toString(36).slice(2)}.tmp`;
    try {
      writeFileSync(tmp, Buffer.concat([l.hash, l.script.createCachedData()]));
      renameSync(tmp, l.cacheFile);
    } catch {
      // A cache is an optimization: a file that cannot be written is simply not there.
    }
  }
}

// The warm-up run: the main thread writes at exit; a worker thread (which is terminated, not
// exited, often as soon as its answer arrives) before each message it posts, that is after each
// piece of its work.
if (process.env[CODE_CACHE_WRITE_ENV] === '1') {
  if (isMainThread) process.on('exit', writeCaches);
  else if (parentPort !== null) {
    const port = parentPort;
    const post = port.postMessage.bind(port);
    port.postMessage = (...args: Parameters<typeof post>): void => {
      writeCaches();
      post(...args);
    };
  }
}
