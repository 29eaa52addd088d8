/**
 * Runs tasks on the main thread and on worker threads, and returns the outputs in task order, so
 * the result never depends on how many threads ran or which finished first.
 *
 * With `jobs` = N the main thread is one of the N lanes and N − 1 workers are started (none when
 * there is only one task): a worker pays its own module loading, font parsing and JIT warm-up
 * (about as much CPU as a few units), which the main thread has already paid or pays anyway.
 * With `jobs` = 'auto' (the default) the work decides, and workers (cores − 1) start only while
 * the machine has a core to spare (coreToSpare):
 * - at once, before any task, when the tasks write PDFs and are enough that even at the cheapest
 *   PDF (PDF_TASK_MIN_MS) their work is more than WORTH_IT times a worker's start-up: the
 *   worker's start-up then overlaps the main thread's first tasks instead of following them;
 * - else after each main-thread task (from the MIN_MAIN_TASKS-th on), when the work left (tasks
 *   left × the main thread's fastest task, in CPU time) is more than WORTH_IT times a worker's
 *   start-up.
 * So a build that one thread finishes sooner never pays for workers.
 * Tasks are handed out one at a time from a shared counter (the next free lane takes the next
 * task); each worker holds up to two tasks, so it does not sit idle while the main thread is busy
 * with a task of its own and cannot answer at once.
 */
import { Worker } from 'node:worker_threads';
import { availableParallelism, cpus, loadavg } from 'node:os';
import { compiledWorker } from '../compiledWorker.js';
import { cpuTimes, type CpuTimes } from '../cpuClock.js';
import { safeRunTask, type TaskInput, type TaskOutput } from './unitTask.js';

export interface PoolHooks {
  onStart?(task: TaskInput): void;
  onDone?(task: TaskInput, out: TaskOutput): void;
  /** Checked before each task starts; true stops the run. */
  aborted?(): boolean;
}

export class TaskFailure extends Error {}


/**
 * Main-thread tasks before 'auto' judges the work left from the fastest of them. The first tasks
 * pay JIT warm-up, and their CPU time (the whole process's: V8's compiler threads included)
 * overstates a warm task: on the 20-unit bench build without PDFs the fastest of the first three
 * took 43–65 ms of CPU, of the first five 17–23 ms (5 runs, 2026-12-02). Judged after three, a
 * slower moment of this machine tipped the 20-unit build into starting a worker that could not
 * pay off (bench: default --jobs / --jobs 1 up to 1.14); after five the estimate is near a warm
 * task. A build large enough for workers starts them two tasks later, a fraction of a second.
 */
const MIN_MAIN_TASKS = 5;

/** Tasks a worker holds at once (one running, one waiting) while enough work is left. */
const WORKER_DEPTH = 2;

/**
 * CPU a worker costs to start, in ms: the CPU of its first tasks above what the warm main thread
 * spends on the same tasks (module loading, V8's optimizing compiler and GC on its background
 * threads, and with PDFs pdfkit, the fonts' tables and the first word layouts).
 * `node bench/stage-worker-start.mjs <build> pdf|plain` (the bench's pdf stage prints it): on the
 * 20-unit bench build (16 beams, 5°), 2026-12-02 at load 7 on 2 cores, 2.1 s with PDFs (8 tasks:
 * 3.1–3.4 s in the worker against 1.0–1.1 s warm) and 0.56 s without; 1.85 s and 0.55 s before.
 * So with PDFs a worker costs about 15 warm unit reports. Machine-dependent; only the order of
 * magnitude matters for the decision.
 */
const WORKER_START_MS = { plain: 550, pdf: 1850 };
/**
 * Start workers only when the work left is more than this many times their start-up cost. Why 3:
 * two busy threads each run at about 1/1.28 of one alone on this machine class (the bench's
 * machine-ceiling line, 0.64), so the work W and a start-up S on two lanes take about
 * (W + S) · 1.28 / 2; that is at most 0.85 W (15 % faster, a margin for the estimate) when W > 3 S.
 */
const WORTH_IT = 3;
/** 'auto': workers pay off when the work left (tasks × a warm task's time) outweighs WORTH_IT × their start-up. */
export function workersPayOff(tasksLeft: number, meanTaskMs: number, startMs: number): boolean {
  return tasksLeft * meanTaskMs > WORTH_IT * startMs;
}

/**
 * The least CPU a task that writes a unit PDF costs a warm thread, in ms: the PDF alone, at its
 * steady state on the bench build (16 beams on a 5° grid: renderUnitPdf 0.13 s on a quiet 2-core
 * machine; larger units cost more). So tasks × this is a floor on a build's work before any task
 * has run.
 */
const PDF_TASK_MIN_MS = 130;
/** The shortest window (wall ms, on every core) over which the machine's idle CPU is trusted. */
const IDLE_WINDOW_MS = 100;

/** The machine's recent load, read at the decision before any task (1-minute load average, run queue). */
export interface MachineLoad {
  /** Idle cores since the run began (cpuIdleCores), or null when too little time passed to tell. */
  idleCores: number | null;
  /** The 1-minute load average (os.loadavg()[0]). */
  loadAvg1: number;
  cores: number;
}

/**
 * 'auto' before any task has run: start the workers at once when every task writes a PDF, the
 * tasks are enough that even at PDF_TASK_MIN_MS their work pays the start-up (workersPayOff), and
 * the machine has a core to spare by two readings: the idle CPU since the run began (the planning,
 * a fraction of a second: alone it can catch a gap in a neighbour's bursts) and the 1-minute load
 * average at most cores − 0.5 (a minute of history; it lags, but here a lag only defers the
 * decision to the main thread's first tasks, where workersPayOff and coreToSpare decide again).
 * Why both: at load 5–8 on 2 cores (neighbours' test suites, in bursts) a 100-unit build whose
 * worker started on the planning's reading alone took 1.20 of --jobs 1 (bench build100, 2
 * repetitions, 12.3 s and 13.3 s of CPU); a load average of 5–8 reads as no spare core here.
 */
export function workersPayOffAtStart(tasks: number, pdf: boolean, startMs: number, load: MachineLoad): boolean {
  const spare = load.idleCores !== null && coreToSpare(load.idleCores) && load.loadAvg1 <= load.cores - 0.5;
  return pdf && spare && workersPayOff(tasks, PDF_TASK_MIN_MS, startMs);
}

/**
 * Run one task on this thread and measure its CPU time (the process's, which is this thread's
 * while no worker runs). CPU time, like WORKER_START_MS: on a machine busy with other work a
 * task's wall time grows several-fold (we get a share of a core) while a worker's start-up grows
 * alike, so wall time would start workers that cannot pay off (a 20-unit build without PDFs
 * took 1.36× `--jobs 1` at load 10 on 2 cores).
 */
async function taskWithCpu(task: TaskInput): Promise<{ out: TaskOutput; cpuMs: number }> {
  const c0 = process.cpuUsage();
  const out = await safeRunTask(task);
  const c = process.cpuUsage(c0);
  return { out, cpuMs: (c.user + c.system) / 1000 };
}

/**
 * 'auto' starts workers only while the machine has a core to spare: `idleCores` is the idle CPU
 * of the whole machine, in cores, measured over the main thread's first tasks (cpuIdleCores). At
 * least half a core idle means a worker gets a core to run on; with every core kept busy by other
 * processes a worker only adds its start-up (20-unit build with PDFs at load 11 on 2 cores:
 * 8.5–9.0 s of CPU and 21–23 s wall with a worker, 4.7–5.8 s and 12–16 s with --jobs 1).
 * Measured over the same window rather than read from the 1-minute load average, which lags by
 * a minute: right after another heavy job it kept a quiet machine's builds on one thread
 * (bench, build with PDFs: 1.00 of --jobs 1 instead of 0.89).
 */
export function coreToSpare(idleCores: number): boolean {
  return idleCores >= 0.5;
}

/**
 * Idle cores between two readings: idle share of all CPU time × core count (2 cores, one busy
 * with this run and the other idle → 1). No time passed (or a platform reporting none) → the
 * core count minus the one this run uses, so that such a platform behaves as before.
 */
export function cpuIdleCores(from: CpuTimes, to: CpuTimes, cores: number): number {
  const total = to.totalMs - from.totalMs;
  if (!(total > 0)) return Math.max(0, cores - 1);
  return ((to.idleMs - from.idleMs) / total) * cores;
}

/**
 * Cores other processes left free between two readings: the idle cores plus the cores this
 * process itself kept busy, less the one its main thread needs. Unlike cpuIdleCores alone, the
 * run's own start-up does not count against it (module compilation and V8's background threads
 * keep the second core partly busy while the main thread works): on the quiet 2-core bench
 * machine the two-thread read and the insight lane, judged on idle CPU alone, stayed off in all
 * 3 bench runs and in 5 of 20 hand runs of the 64-beam export. No time passed → as cpuIdleCores.
 * @example coresFreeOfOthers(a, b, 0, 260, 2) // 200 ms window, 0.7 core idle, 1.3 our own → 1.0
 */
export function coresFreeOfOthers(from: CpuTimes, to: CpuTimes, ownFromMs: number, ownToMs: number, cores: number): number {
  const total = to.totalMs - from.totalMs;
  if (!(total > 0)) return Math.max(0, cores - 1);
  const ownCores = (ownToMs - ownFromMs) / (total / cores);
  return cpuIdleCores(from, to, cores) + ownCores - 1;
}

/** `--jobs`: a fixed number of lanes, or 'auto' (up to the machine's cores, decided from the work). */
export type Jobs = number | 'auto';

interface Reply { id: number; ok: boolean; out?: TaskOutput; message?: string }

export class TaskPool {
  private workers: Worker[] = [];
  /** CPU times of the machine when the pool was made (the run's start): the window for 'auto' at once. */
  private readonly cpuAtCreate = cpuTimes();

  /** Stop every worker now (SIGINT). */
  async terminate(): Promise<void> {
    const ws = this.workers;
    this.workers = [];
    await Promise.all(ws.map((w) => w.terminate()));
  }

  /** Run all tasks with up to `jobs` in parallel (main thread included); outputs in the order of `tasks`. */
  async run(tasks: TaskInput[], jobs: Jobs, hooks: PoolHooks = {}): Promise<TaskOutput[]> {
    const script = compiledWorker(import.meta.url, 'worker.js');
    const auto = jobs === 'auto';
    const wanted = auto ? availableParallelism() : Math.floor(jobs) || 1;
    const lanes = Math.max(1, Math.min(wanted, tasks.length));
    if (lanes === 1 || script === null) return this.runInProcess(tasks, hooks);
    const q = new TaskQueue(tasks, hooks, lanes);
    const workerLanes: Promise<void>[] = [];
    const startWorkers = () => {
      this.workers = Array.from({ length: lanes - 1 }, () => new Worker(script));
      workerLanes.push(...this.workers.map((w) => workerLane(w, q)));
    };
    const pdf = tasks[0].report !== null;
    const startMs = pdf ? WORKER_START_MS.pdf : WORKER_START_MS.plain;
    const cpuAtStart = cpuTimes();
    // 'auto': after each main-thread task, is the work left worth the workers' start-up?
    const afterMainTask = (fastestMs: number, mainDone: number) => {
      if (auto && this.workers.length === 0 && !q.stopped() && mainDone >= MIN_MAIN_TASKS &&
        workersPayOff(q.left(), fastestMs, startMs) && coreToSpare(cpuIdleCores(cpuAtStart, cpuTimes(), cpus().length))) startWorkers();
    };
    if (!auto || workersPayOffAtStart(tasks.length, pdf, startMs, this.machineLoad())) startWorkers();
    try {
      const main = await Promise.allSettled([mainLane(q, afterMainTask)]);
      // The main lane is done taking tasks, so no worker starts after this point.
      const settled = [...main, ...(await Promise.allSettled(workerLanes))];
      const rejected = settled.find((s): s is PromiseRejectedResult => s.status === 'rejected');
      if (rejected) throw rejected.reason;
    } finally {
      await this.terminate();
    }
    return q.outputs;
  }

  /** Idle cores since the pool was made (null when too little time passed to tell, IDLE_WINDOW_MS) and the load average. */
  private machineLoad(): MachineLoad {
    const now = cpuTimes();
    const cores = cpus().length;
    const enough = now.totalMs - this.cpuAtCreate.totalMs >= IDLE_WINDOW_MS * cores;
    return { idleCores: enough ? cpuIdleCores(this.cpuAtCreate, now, cores) : null, loadAvg1: loadavg()[0], cores };
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
}

/** The tasks of one run: hands out indices in order, keeps outputs in task order, and stops handing out after a failure or an abort. */
class TaskQueue {
  readonly outputs: TaskOutput[];
  private next = 0;
  private failed = false;
  constructor(readonly tasks: TaskInput[], readonly hooks: PoolHooks, readonly lanes: number) {
    this.outputs = new Array(tasks.length);
  }
  stopped(): boolean {
    return this.failed || this.hooks.aborted?.() === true;
  }
  take(): number | null {
    return this.stopped() || this.next >= this.tasks.length ? null : this.next++;
  }
  /** Tasks not yet handed out. */
  left(): number {
    return this.tasks.length - this.next;
  }
  finish(i: number, out: TaskOutput): void {
    this.outputs[i] = out;
    this.hooks.onDone?.(this.tasks[i], out);
  }
  fail(): void {
    this.failed = true;
  }
}

/**
 * The main thread's lane. `afterTask` gets the fastest task's CPU time so far (taskWithCpu) and
 * how many tasks this lane finished: the first ones also pay JIT warm-up, 2–4× a warm task on the
 * bench build, which would overstate the work left, so the decision to start workers waits
 * (MIN_MAIN_TASKS).
 */
async function mainLane(q: TaskQueue, afterTask: (fastestMs: number, done: number) => void): Promise<void> {
  let fastestMs = Infinity, done = 0;
  for (let i = q.take(); i !== null; i = q.take()) {
    q.hooks.onStart?.(q.tasks[i]);
    const { out, cpuMs } = await taskWithCpu(q.tasks[i]);
    q.finish(i, out);
    fastestMs = Math.min(fastestMs, cpuMs);
    afterTask(fastestMs, ++done);
  }
}

/** One worker's lane: keeps the worker fed from the queue until it is empty; rejects (and stops the queue) on a failed task or a dead worker. */
function workerLane(worker: Worker, q: TaskQueue): Promise<void> {
  return new Promise((resolve, reject) => {
    const held = new Map<number, TaskInput>();
    const detach = () => {
      worker.off('message', onMessage);
      worker.off('error', onError);
      worker.off('exit', onExit);
    };
    const fail = (e: TaskFailure) => {
      q.fail();
      detach();
      reject(e);
    };
    const refill = () => {
      // Hold two tasks while the others can still be shared out, one near the end, so the
      // last tasks are not queued behind each other on one worker while another lane idles.
      const depth = q.left() > q.lanes ? WORKER_DEPTH : 1;
      while (held.size < depth) {
        const i = q.take();
        if (i === null) break;
        held.set(i, q.tasks[i]);
        q.hooks.onStart?.(q.tasks[i]);
        worker.postMessage({ id: i, task: q.tasks[i] });
      }
      if (held.size === 0) {
        detach();
        resolve();
      }
    };
    const onMessage = (msg: Reply) => {
      const task = held.get(msg.id);
      if (!task) return;
      held.delete(msg.id);
      if (!msg.ok || !msg.out) return fail(new TaskFailure(`analysis of '${task.key}' failed: ${msg.message ?? 'unknown error'}`));
      q.finish(msg.id, msg.out);
      refill();
    };
    const first = () => [...held.values()][0]?.key ?? '(no task)';
    const onError = (e: Error) => fail(new TaskFailure(`analysis of '${first()}' failed: ${e.message}`));
    const onExit = (code: number) => fail(new TaskFailure(`worker for '${first()}' stopped (exit ${code})`));
    worker.on('message', onMessage);
    worker.on('error', onError);
    worker.on('exit', onExit);
    refill();
  });
}
