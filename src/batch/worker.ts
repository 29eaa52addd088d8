/**
 * Worker-thread entry: runs one task per message and posts the output back, transferring the
 * PDF bytes instead of copying them. Compiled to dist/batch/worker.js; the pool falls back to
 * running tasks in-process when it runs from TypeScript sources (vitest).
 */
import { parentPort } from 'node:worker_threads';
import { safeRunTask, type TaskInput } from './unitTask.js';

interface Request { id: number; task: TaskInput }

parentPort?.on('message', async (req: Request) => {
  try {
    const out = await safeRunTask(req.task);
    const transfer = out.units.flatMap((u) => (u.pdf ? [u.pdf.buffer as ArrayBuffer] : []));
    parentPort?.postMessage({ id: req.id, ok: true, out }, transfer);
  } catch (e) {
    const message = e instanceof Error ? e.message : String(e);
    parentPort?.postMessage({ id: req.id, ok: false, message });
  }
});
