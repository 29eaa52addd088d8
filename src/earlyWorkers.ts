/**
 * The worker threads started early (src/earlyThreads.ts), held until the code that would start
 * such a worker takes one: the range reader (src/io/readInParallel.ts) and the insight lane
 * (src/batch/insightLane.ts). Node's built-ins only, so that those modules and the starter
 * share it without an import cycle.
 */
import type { Worker } from 'node:worker_threads';

interface Early { worker: Worker; dead: boolean }
const held = new Map<string, Early>();

/**
 * Hold `worker` (started on `script` without a job) for the next takeEarlyThread(script); it is
 * unreferenced until taken, so an untaken one never keeps the process alive.
 */
export function offerEarlyThread(script: string, worker: Worker): void {
  const e: Early = { worker, dead: false };
  worker.unref();
  worker.once('error', () => { e.dead = true; });
  worker.once('exit', () => { e.dead = true; });
  void held.get(script)?.worker.terminate();
  held.set(script, e);
}

/** Whether a worker on `script` is held. */
export function hasEarlyThread(script: string): boolean {
  return held.has(script);
}

/** The early worker running `script` (an absolute path, as compiledWorker gives it), once; null when there is none or it died. */
export function takeEarlyThread(script: string): Worker | null {
  const e = held.get(script);
  if (e === undefined) return null;
  held.delete(script);
  if (e.dead) return null;
  e.worker.ref();
  return e.worker;
}
