/**
 * The bundled CLI (scripts/bundle.mjs → dist/bundle) against dist/cli as tsc wrote it: the same
 * outputs, every worker script at hand, and never a bundle older than the dist/ files it was made
 * from (src/cli/bundleStamp.ts decides; bin/spherecov.js follows).
 */
import { spawnSync } from 'node:child_process';
import { cpSync, existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, symlinkSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { BUNDLE_STAMP, bundleIsCurrent } from '../../src/cli/bundleStamp.js';
import { BUNDLE_DIR, ensureBuilt, ROOT } from './buildOnce.js';

const FIX = path.join(ROOT, 'fixtures', 'cli');
const DATE = '2025-03-01T09:00:00Z';
const VERSION = (JSON.parse(readFileSync(path.join(ROOT, 'package.json'), 'utf8')) as { version: string }).version;

beforeAll(() => ensureBuilt(), 180_000);

function tsFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const p = path.join(dir, e.name);
    return e.isDirectory() ? tsFiles(p) : e.name.endsWith('.ts') ? [p] : [];
  });
}

/** Every file under `dir`, relative path → contents, results.json without its generatedAt line. */
function outputs(dir: string): Map<string, Buffer | string> {
  const m = new Map<string, Buffer | string>();
  for (const f of readdirSync(dir).sort()) {
    const p = path.join(dir, f);
    m.set(f, f === 'results.json' ? readFileSync(p, 'utf8').replace(/^\s*"generatedAt": .*$/m, '') : readFileSync(p));
  }
  return m;
}

describe('dist/bundle', () => {
  it('is current after the build and holds every worker script a module asks compiledWorker for', () => {
    expect(bundleIsCurrent(BUNDLE_DIR)).toBe(true);
    const names = new Set<string>();
    for (const f of tsFiles(path.join(ROOT, 'src'))) {
      for (const m of readFileSync(f, 'utf8').matchAll(/compiledWorker\(import\.meta\.url, '([^']+)'\)/g)) names.add(m[1]);
    }
    // The task pool's, the range reader's and the insight lane's (the pattern must not go blind).
    expect([...names].sort()).toEqual(['insightWorker.js', 'rangeWorker.js', 'worker.js']);
    for (const n of names) expect(existsSync(path.join(BUNDLE_DIR, n)), n).toBe(true);
  });

  it('writes the same outputs as dist/cli, PDFs and viewer included, with the pool on two threads', () => {
    // The launcher as it was before the bundle: signal handlers, then dist/cli/main.js. A file,
    // not `node -e`: worker threads inherit the process's execArgv.
    const launcher = path.join(mkdtempSync(path.join(tmpdir(), 'spherecov-bundle-launch-')), 'unbundled.mjs');
    writeFileSync(launcher, `const s = await import(${JSON.stringify(path.join(ROOT, 'dist', 'cli', 'signals.js'))});
      s.installSignalHandlers();
      const { main } = await import(${JSON.stringify(path.join(ROOT, 'dist', 'cli', 'main.js'))});
      await main(process.argv.slice(2));\n`);
    const outs = ['bundle', 'cli'].map((tag) => mkdtempSync(path.join(tmpdir(), `spherecov-bundle-${tag}-`)));
    const args = (out: string) => ['analyze', path.join(FIX, 'pass'), '--out', out, '--limits', path.join(FIX, 'limits-fixture.yaml'), '--creation-date', DATE, '--jobs', '2'];
    expect(bundleIsCurrent(BUNDLE_DIR)).toBe(true); // so bin/spherecov.js runs the bundle
    const runs = [
      spawnSync(process.execPath, [path.join(ROOT, 'bin', 'spherecov.js'), ...args(outs[0])], { cwd: ROOT, encoding: 'utf8' }),
      spawnSync(process.execPath, [launcher, ...args(outs[1])], { cwd: ROOT, encoding: 'utf8' }),
    ];
    for (const r of runs) expect(r.status, r.stderr).toBe(0);
    expect(runs[0].stdout.replaceAll(outs[0], 'OUT')).toBe(runs[1].stdout.replaceAll(outs[1], 'OUT'));
    const [bundled, plain] = outs.map(outputs);
    expect([...bundled.keys()]).toContain('viewer.html');
    expect([...bundled.keys()].some((f) => f.endsWith('.pdf'))).toBe(true);
    expect([...bundled.keys()]).toEqual([...plain.keys()]);
    for (const [f, v] of bundled) expect(v, f).toEqual(plain.get(f));
    for (const o of [...outs, path.dirname(launcher)]) rmSync(o, { recursive: true, force: true });
  }, 120_000);
});

describe('bin/spherecov.js chooses the bundle only while it is current', () => {
  // A copy of the package with its times kept (as a copy or an unpacked tarball keeps them), in
  // which the bundled CLI is replaced by a marker: `--version` then prints 'bundle' when the
  // launcher took the bundle and the version when it fell back to dist/cli.
  let copy: string;
  const launch = () => {
    const r = spawnSync(process.execPath, [path.join(copy, 'bin', 'spherecov.js'), '--version'], { cwd: copy, encoding: 'utf8' });
    expect(r.status, r.stderr).toBe(0);
    return r.stdout.trim();
  };
  const firstInput = () => {
    const stamp = JSON.parse(readFileSync(path.join(copy, 'dist', 'bundle', BUNDLE_STAMP), 'utf8')) as { inputs: { path: string }[] };
    return path.resolve(copy, 'dist', 'bundle', stamp.inputs[0].path);
  };

  beforeAll(() => {
    copy = mkdtempSync(path.join(tmpdir(), 'spherecov-bundle-copy-'));
    for (const p of ['bin', 'dist', 'package.json']) cpSync(path.join(ROOT, p), path.join(copy, p), { recursive: true, preserveTimestamps: true });
    symlinkSync(path.join(ROOT, 'node_modules'), path.join(copy, 'node_modules'));
    const marker = path.join(copy, 'dist', 'bundle', 'main.js'); // an output, not an input: the stamp stays current
    writeFileSync(marker, "exports.startEarlyThreads = async () => {};\nexports.main = async () => { process.stdout.write('bundle\\n'); };\n");
  });

  it('takes the bundle made from the dist/ files that are there', () => {
    expect(launch()).toBe('bundle');
  });

  it('falls back to dist/cli when tsc rewrote dist/cli/main.js after the bundle, and takes it again once the time is back', () => {
    const main = path.join(copy, 'dist', 'cli', 'main.js');
    const was = statSync(main);
    utimesSync(main, new Date(), new Date(Date.now() + 2000));
    expect(launch()).toBe(VERSION);
    utimesSync(main, was.atime, was.mtime);
    expect(launch()).toBe('bundle');
  });

  it('falls back when an input changed size under its old date (a copy that kept times)', () => {
    const input = firstInput();
    const was = statSync(input);
    const text = readFileSync(input, 'utf8');
    writeFileSync(input, `${text}// changed\n`);
    utimesSync(input, was.atime, was.mtime);
    expect(launch()).toBe(VERSION);
    writeFileSync(input, text);
    utimesSync(input, was.atime, was.mtime);
    expect(launch()).toBe('bundle');
  });

  it('falls back when the stamp is missing (a bundle step that did not finish)', () => {
    rmSync(path.join(copy, 'dist', 'bundle', BUNDLE_STAMP));
    expect(launch()).toBe(VERSION);
  });
});
