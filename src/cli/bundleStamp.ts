/**
 * Which build of the CLI bin/spherecov.js loads. scripts/bundle.mjs bundles the tsc output
 * (the CLI with its signal handlers, and the three worker entries) with esbuild into
 * dist/bundle/: one CommonJS file each instead of ~170 modules, loaded with V8's code cache
 * (codeCache.ts), which is most of a process's or a worker thread's start-up. The bundle is used
 * only while it was made from the dist/ files that are there now; after a bare `tsc` (or
 * `tsc --watch` rewriting one file) the launcher runs dist/cli as tsc wrote it, so a developer
 * never runs a stale bundle.
 *
 * Node's built-ins only: bin/spherecov.js imports this before anything else.
 */
import { readFileSync, statSync, utimesSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

/** The stamp file, written last into dist/bundle/ by scripts/bundle.mjs. */
export const BUNDLE_STAMP = 'stamp.json';

/** Every dist/ module the bundle was made from: its path relative to dist/bundle/ and its size. */
interface BundleStamp { inputs: { path: string; size: number }[] }

/**
 * Record the bundle's inputs (absolute paths) in `bundleDir`/stamp.json, dated `startedMs`, when
 * the bundler began reading them: an input rewritten while it ran is newer than the stamp.
 */
export function writeBundleStamp(bundleDir: string, inputs: readonly string[], startedMs: number): void {
  const stamp: BundleStamp = {
    inputs: inputs.map((p) => ({ path: path.relative(bundleDir, p), size: statSync(p).size })),
  };
  const file = path.join(bundleDir, BUNDLE_STAMP);
  writeFileSync(file, `${JSON.stringify(stamp)}\n`);
  utimesSync(file, startedMs / 1000, startedMs / 1000);
}

/**
 * True when the bundle in `bundleDir` was made from the dist/ files that are there now: every
 * input still exists, has its recorded size and is not newer than the stamp. The time rule, not
 * an exact recorded mtime, so that a packed-and-installed copy (npm sets every file to one date)
 * still uses its bundle; the size check catches a copy that kept an old date. Cost: one stat a
 * module, about 4 ms for ~230 modules on a busy 2-core machine (the bundle saves ~100 ms).
 */
export function bundleIsCurrent(bundleDir: string): boolean {
  try {
    const stampPath = path.join(bundleDir, BUNDLE_STAMP);
    const madeMs = statSync(stampPath).mtimeMs;
    const stamp = JSON.parse(readFileSync(stampPath, 'utf8')) as BundleStamp;
    if (!Array.isArray(stamp.inputs) || stamp.inputs.length === 0) return false;
    // A plain loop and string paths (the system resolves '..'): this runs cold, in the interpreter,
    // where path.resolve and every() cost about as much as the ~230 stats.
    const prefix = bundleDir + path.sep;
    for (const i of stamp.inputs) {
      const st = statSync(prefix + i.path);
      if (st.size !== i.size || st.mtimeMs > madeMs) return false;
    }
    return true;
  } catch {
    return false; // no bundle, a half-written one, or an input gone
  }
}

/**
 * What the launcher loads: `bundle`, the bundled CLI (dist/bundle/main.js, CommonJS, required:
 * it installs the interrupt handlers as it loads and exports startEarlyThreads and main) when it
 * is current, else null; and the unbundled modules of dist/cli and dist/ as tsc wrote them (the
 * signal-handler module, the early-threads module, the CLI), loaded one after the other.
 */
export function cliModules(): { bundle: string | null; signals: string; early: string; main: string } {
  const bundle = new URL('../bundle/', import.meta.url);
  const current = bundleIsCurrent(fileURLToPath(bundle));
  return {
    bundle: current ? fileURLToPath(new URL('main.js', bundle)) : null,
    signals: new URL('signals.js', import.meta.url).href,
    early: new URL('../earlyThreads.js', import.meta.url).href,
    main: new URL('main.js', import.meta.url).href,
  };
}
