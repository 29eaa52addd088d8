#!/usr/bin/env node
// Worker start-up stage: what a worker thread costs before it is as fast as the main thread, the
// figure behind WORKER_START_MS in src/batch/pool.ts (--jobs auto weighs it against the work).
//   node bench/stage-worker-start.mjs BUILD_DIR MODE(pdf|plain) [TASKS]
// Plans the build as `analyze` does, runs its first TASKS groups (default 8) once in-process to
// warm this thread (the main thread of a run pays that anyway), then three times alternately in a
// fresh worker (started, fed one task at a time, terminated; this thread idles meanwhile, so the
// process's CPU time is the worker's and V8's background threads') and again in-process, warm.
// Start-up = CPU(worker) − CPU(warm, in-process), median of the 3 pairs, in seconds.
import { Worker } from 'node:worker_threads';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { tmpdir } from 'node:os';
import { stageMain } from './lib/emit.mjs';
import { repoDir } from './lib/resolve.mjs';
import { median } from './lib/stats.mjs';

const cpuMs = () => {
  const c = process.cpuUsage();
  return (c.user + c.system) / 1000;
};

await stageMain(async () => {
  const dir = resolve(process.argv[2]);
  const pdf = process.argv[3] !== 'plain';
  const n = Number(process.argv[4] ?? 8);
  const dist = (p) => pathToFileURL(join(repoDir, 'dist', p)).href;
  const { planAnalyze, groupTasks } = await import(dist('batch/analyzePlan.js'));
  const { safeRunTask } = await import(dist('batch/unitTask.js'));
  const plan = await planAnalyze({ input: dir, outDir: join(tmpdir(), 'spherecov-bench-worker-start'), percentilesPct: [0, 10, 50, 90, 100], thresholds: [10, 20, 25], pdf, force: true });
  const tasks = groupTasks(plan).slice(0, n);
  // The worker the CLI starts: the bundle's while it is current (src/cli/bundleStamp.ts).
  const { bundleIsCurrent } = await import(dist('cli/bundleStamp.js'));
  const bundled = bundleIsCurrent(join(repoDir, 'dist', 'bundle'));
  const workerFile = bundled ? join(repoDir, 'dist', 'bundle', 'worker.js') : join(repoDir, 'dist', 'batch', 'worker.js');
  const inProcess = async () => {
    const c0 = cpuMs();
    for (const t of tasks) await safeRunTask(t);
    return cpuMs() - c0;
  };
  const inWorker = async () => {
    const c0 = cpuMs();
    const w = new Worker(workerFile);
    for (let i = 0; i < tasks.length; i++) {
      await new Promise((res, rej) => {
        w.once('message', (m) => (m.ok ? res() : rej(new Error(m.message))));
        w.postMessage({ id: i, task: tasks[i] });
      });
    }
    await w.terminate();
    return cpuMs() - c0;
  };
  // Not counted: loads and compiles the task modules and warms this thread.
  await inProcess();
  const pairs = [];
  for (let r = 0; r < 3; r++) {
    const w = await inWorker();
    const m = await inProcess();
    pairs.push({ workerMs: w, warmMs: m });
  }
  // The worker's extra CPU over a warm main thread on the same tasks.
  return { mode: pdf ? 'pdf' : 'plain', worker: bundled ? 'dist/bundle' : 'dist/batch', tasks: tasks.length, startS: median(pairs.map((p) => p.workerMs - p.warmMs)) / 1000, pairs };
});
