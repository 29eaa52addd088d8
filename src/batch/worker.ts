/**
 * Worker-thread entry: runs the tasks it is sent one after another (the pool may send the next
 * one before the current one is done) and posts each output back, transferring the PDF bytes
 * and thumbnail rasters instead of copying them. Compiled to dist/batch/worker.js; the pool runs
 * tasks in-process when it runs from TypeScript sources (vitest).
 */
import { parentPort } from 'node:worker_threads';
import { safeRunTask, type TaskInput, type TaskOutput } from './unitTask.js';

interface Request { id: number; task: TaskInput }

/** Buffers owned by the output alone (a PDF or thumbnail array that is a view on a shared pool is copied instead). */
function transferList(out: TaskOutput): ArrayBuffer[] {
  const seen = new Set<ArrayBuffer>();
  for (const u of out.units) {
    for (const v of [u.pdf, u.thumbnail?.values]) {
      if (v && v.byteOffset === 0 && v.byteLength === v.buffer.byteLength && v.buffer instanceof ArrayBuffer) seen.add(v.buffer);
    }
  }
  return [...seen];
}

let queue: Promise<void> = Promise.resolve();

parentPort?.on('message', (req: Request) => {
  // One task at a time: a second task waits instead of interleaving at the first one's awaits.
  queue = queue.then(async () => {
    try {
      const out = await safeRunTask(req.task);
      parentPort?.postMessage({ id: req.id, ok: true, out }, transferList(out));
    } catch (e) {
      const message = e instanceof Error ? e.message : String(e);
      parentPort?.postMessage({ id: req.id, ok: false, message });
    }
  });
});
