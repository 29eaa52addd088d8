// Run one workload as a child process and measure it as a whole: wall time from spawn to exit
// (Node start-up included, as a user sees it) and peak RSS reported by the child itself
// (rss-preload.mjs for node, rss-wrap.py for python), so no GNU time is needed.
import { spawn } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const benchDir = join(dirname(fileURLToPath(import.meta.url)), '..');
const preloadUrl = pathToFileURL(join(benchDir, 'rss-preload.mjs')).href;
const pyWrap = join(benchDir, 'rss-wrap.py');
const scratch = mkdtempSync(join(tmpdir(), 'spherecov-bench-rss-'));
let counter = 0;
process.on('exit', () => rmSync(scratch, { recursive: true, force: true }));

/** This process's environment with `extra` added and the variables named in `unset` removed. */
export function envWithout(unset, extra = {}) {
  const env = { ...process.env, ...extra };
  for (const name of unset) delete env[name];
  return env;
}

/**
 * Spawn `node <args>` (kind 'node') or `/usr/bin/python3 <script> <args>` (kind 'python'), with
 * `env` added to this process's environment and the variables named in `unset` removed.
 * Resolves to { wallS, maxRssKiB | null, cpuS | null, code, signal, stdout, stderr } (cpuS: user +
 * system CPU seconds of the whole child, all threads); never rejects on a
 * non-zero exit (the caller decides), rejects only when the program cannot be started.
 */
export function runMeasured(kind, args, { cwd, env, unset = [], timeoutMs = 600_000 } = {}) {
  const rssFile = join(scratch, `rss-${process.pid}-${counter++}.json`);
  const cmd = kind === 'node' ? process.execPath : '/usr/bin/python3';
  const argv = kind === 'node' ? ['--import', preloadUrl, ...args] : [pyWrap, ...args];
  return new Promise((resolvePromise, reject) => {
    const t0 = process.hrtime.bigint();
    let t1 = null;
    const child = spawn(cmd, argv, {
      cwd,
      env: envWithout(unset, { ...env, BENCH_RSS_FILE: rssFile }),
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    const out = [];
    const err = [];
    child.stdout.on('data', (c) => out.push(c));
    child.stderr.on('data', (c) => err.push(c));
    const timer = setTimeout(() => child.kill('SIGKILL'), timeoutMs);
    child.on('error', (e) => {
      clearTimeout(timer);
      reject(e);
    });
    child.on('exit', () => {
      t1 = process.hrtime.bigint();
    });
    child.on('close', (code, signal) => {
      clearTimeout(timer);
      let maxRssKiB = null;
      let cpuS = null;
      try {
        ({ maxRssKiB, cpuS = null } = JSON.parse(readFileSync(rssFile, 'utf8')));
        rmSync(rssFile, { force: true });
      } catch {
        // no file: the child died before its exit hook (crash, signal); RSS stays unknown
      }
      resolvePromise({
        wallS: Number((t1 ?? process.hrtime.bigint()) - t0) / 1e9,
        maxRssKiB,
        cpuS,
        code,
        signal,
        stdout: Buffer.concat(out).toString('utf8'),
        stderr: Buffer.concat(err).toString('utf8'),
      });
    });
  });
}

/**
 * Run several workloads `reps` times in rotating order (rep 0: a b c, rep 1: b c a, …), so slow
 * drift of the shared machine (other jobs, page cache, thermal) hits every workload alike and
 * per-rep ratios are paired. `workloads` is { name: () => Promise<result> }; resolves to
 * { name: result[] } with result i from rep i.
 */
export async function alternate(reps, workloads) {
  const names = Object.keys(workloads);
  const out = Object.fromEntries(names.map((n) => [n, []]));
  for (let r = 0; r < reps; r++) {
    for (let k = 0; k < names.length; k++) {
      const name = names[(r + k) % names.length];
      out[name][r] = await workloads[name]();
    }
  }
  return out;
}
