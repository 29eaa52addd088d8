/**
 * Runs tasks on worker threads (or in-process) and returns the outputs in task order, so the
 * result never depends on how many workers ran or which finished first.
 */
import { Worker } from 'node:worker_threads';
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { safeRunTask, type TaskInput, type TaskOutput } from './unitTask.js';

export interface PoolHooks {
  onStart?(task: TaskInput): void;
  onDone?(task: TaskInput, out: TaskOutput): void;
  /** Checked before each task starts; true stops the run. */
  aborted?(): boolean;
}

export class TaskFailure extends Error {}

/** The compiled worker beside this module, or null when running from .ts sources. */
function workerPath(): string | null {
  const url = new URL('./worker.js', import.meta.url);
  if (!import.meta.url.endsWith('.js')) return null;
  const p = fileURLToPath(url);
  return existsSync(p) ? p : null;
}

export class TaskPool {
  private workers: Worker[] = [];

  /** Stop every worker now (SIGINT). */
  async terminate(): Promise<void> {
    const ws = this.workers;
    this.workers = [];
    await Promise.all(ws.map((w) => w.terminate()));
  }

  /** Run all tasks with up to `jobs` in parallel; outputs in the order of `tasks`. */
  async run(tasks: TaskInput[], jobs: number, hooks: PoolHooks = {}): Promise<TaskOutput[]> {
    const script = workerPath();
    const n = Math.max(1, Math.min(jobs, tasks.length));
    if (n === 1 || script === null) return this.runInProcess(tasks, hooks);
    const outputs: TaskOutput[] = new Array(tasks.length);
    let next = 0;
    const lane = async (worker: Worker): Promise<void> => {
      for (;;) {
        if (hooks.aborted?.() || next >= tasks.length) return;
        const i = next++;
        hooks.onStart?.(tasks[i]);
        outputs[i] = await this.send(worker, i, tasks[i]);
        hooks.onDone?.(tasks[i], outputs[i]);
      }
    };
    this.workers = Array.from({ length: n }, () => new Worker(script));
    try {
      await Promise.all(this.workers.map(lane));
    } finally {
      await this.terminate();
    }
    return outputs;
  }

  private async runInProcess(tasks: TaskInput[], hooks: PoolHooks): Promise<TaskOutput[]> {
    const outputs: TaskOutput[] = [];
    for (const t of tasks) {
      if (hooks.aborted?.()) break;
      hooks.onStart?.(t);
      const out = await safeRunTask(t);
      outputs.push(out);
      hooks.onDone?.(t, out);
    }
    return outputs;
  }

  private send(worker: Worker, id: number, task: TaskInput): Promise<TaskOutput> {
    return new Promise((resolve, reject) => {
      const cleanup = () => {
        worker.off('message', onMessage);
        worker.off('error', onError);
        worker.off('exit', onExit);
      };
      const onMessage = (msg: { id: number; ok: boolean; out?: TaskOutput; message?: string }) => {
        if (msg.id !== id) return;
        cleanup();
        if (msg.ok && msg.out) resolve(msg.out);
        else reject(new TaskFailure(`analysis of '${task.key}' failed: ${msg.message ?? 'unknown error'}`));
      };
      const onError = (e: Error) => {
        cleanup();
        reject(new TaskFailure(`analysis of '${task.key}' failed: ${e.message}`));
      };
      const onExit = (code: number) => {
        cleanup();
        reject(new TaskFailure(`worker for '${task.key}' stopped (exit ${code})`));
      };
      worker.on('message', onMessage);
      worker.on('error', onError);
      worker.on('exit', onExit);
      worker.postMessage({ id, task });
    });
  }
}
