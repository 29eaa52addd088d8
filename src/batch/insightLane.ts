/**
 * The insight lane: a second thread for one large unit's optional analysis (beam removal, holes,
 * smallest subset: insights.ts) while the main thread computes the metrics, the grid adequacy
 * and the verdict. A run analyzes one group on the main thread and leaves the other cores idle
 * whenever the pool starts no worker (one group, or 'auto' before its workers pay off); the
 * optional analysis of a 64-beam 1° unit is about as long as the rest of its measuring. When the
 * run writes viewer.html, the lane then packs the unit's beams for it (viewerPack.ts packBeams)
 * while the main thread draws the unit's PDF.
 *
 * The worker is started before the group's files are read (its start-up overlaps the read) and
 * only when the task may use a spare thread (TaskInput.spareThreads, from the plan: the rule of
 * analyzePlan.ts readThreads, a core that the groups leave free and the machine had idle) and the
 * files are large (LANE_MIN_BYTES); after assembly a measurement
 * smaller than LANE_MIN_WORK is analyzed on the main thread anyway. The beams travel in shared
 * memory (one copy, or none when they already live there); the answer is plain data.
 * Same results by construction (one function, insights.ts or packBeams, on the same arrays); any failure of
 * the worker (an exception, a thread that dies or cannot start) gives `null` and the caller
 * computes on the main thread.
 */
import { Worker } from 'node:worker_threads';
import { statSync } from 'node:fs';
import { compiledWorker } from '../compiledWorker.js';
import { takeEarlyThread } from '../earlyWorkers.js';
import type { InsightRequest, Insights } from './insights.js';
import type { PackedBeams } from '../report/viewerPack.js';

/**
 * Files of a group below this size (bytes) never start the lane. The lane is decided before the
 * read, from the file sizes; a unit of LANE_MIN_WORK samples takes about 7 bytes a sample in a
 * matrix export and 15 or more in a long one, so smaller files cannot reach it.
 */
export const LANE_MIN_BYTES = 4 * 2 ** 20;

/**
 * Beams × points below which a measurement's optional analysis stays on the main thread. The
 * analysis costs about 25 ns of CPU a sample (64 beams × 64,442 points: ~100 ms), the lane a
 * fixed ~1 ms a request plus the copy to shared memory (~3 ns a sample) on the main thread and a
 * worker start-up (~30 ms of CPU, overlapping the read) on the other core: at a million samples
 * (~25 ms of analysis) the main thread already gains several times what the lane costs it.
 */
export const LANE_MIN_WORK = 1_000_000;


/** Total size of the files in bytes (unreadable ones count 0: the read reports them). */
function filesBytes(files: string[]): number {
  let total = 0;
  for (const f of files) {
    try { total += statSync(f).size; } catch { /* the read names the problem */ }
  }
  return total;
}

/** The worker's replies: the insights first, then (when asked) the viewer's packed beams. */
type Reply = { id: number; ok: boolean; insights?: Insights; message?: string } | { id: number; pack: PackedBeams | null };

/** What one request gives: the insights, and the packed beams when they were asked for (else null at once). */
export interface LaneAnswer {
  insights: Promise<Insights | null>;
  pack: Promise<PackedBeams | null>;
}

interface Pending {
  insights: ((r: Insights | null) => void) | null;
  pack: ((r: PackedBeams | null) => void) | null;
}

export class InsightLane {
  private next = 0;
  private readonly pending = new Map<number, Pending>();
  private dead = false;

  private constructor(private readonly worker: Worker) {
    worker.unref(); // an idle lane never keeps the process alive; a pending request does (request/settle)
    worker.on('message', (r: Reply) => {
      if ('pack' in r) this.settle(r.id, 'pack', r.pack);
      else this.settle(r.id, 'insights', r.ok && r.insights ? r.insights : null);
    });
    const fail = () => {
      this.dead = true;
      for (const id of [...this.pending.keys()]) {
        this.settle(id, 'insights', null);
        this.settle(id, 'pack', null);
      }
    };
    worker.on('error', fail);
    worker.on('exit', fail);
  }

  /** A lane for a task with a spare thread and large files, else null. */
  static open(spareThreads: number | undefined, files: string[]): InsightLane | null {
    if (!(spareThreads !== undefined && spareThreads >= 1)) return null;
    const script = compiledWorker(import.meta.url, 'insightWorker.js');
    if (script === null || filesBytes(files) < LANE_MIN_BYTES) return null;
    try {
      return new InsightLane(takeEarlyThread(script) ?? new Worker(script));
    } catch {
      return null;
    }
  }

  /** Whether a measurement of this size is worth sending. */
  static worthIt(q: Pick<InsightRequest, 'beams' | 'grid'>): boolean {
    return q.beams.length * q.grid.weightSr.length >= LANE_MIN_WORK;
  }

  /**
   * The insights computed on the lane's thread; null when the lane failed (compute them here).
   * With `pack`, the lane then packs the beams for viewer.html too (packBeams, the same bytes as
   * on this thread), while this thread goes on with the unit's PDF; null when that failed.
   */
  request(q: InsightRequest, opts: { pack?: boolean } = {}): LaneAnswer {
    const pack = opts.pack === true;
    if (this.dead) return { insights: Promise.resolve(null), pack: Promise.resolve(null) };
    const id = this.next++;
    const entry: Pending = { insights: null, pack: null };
    const insights = new Promise<Insights | null>((resolve) => { entry.insights = resolve; });
    const packed = pack ? new Promise<PackedBeams | null>((resolve) => { entry.pack = resolve; }) : Promise.resolve(null);
    this.pending.set(id, entry);
    this.worker.ref();
    try {
      this.worker.postMessage({ id, request: { ...q, beams: sharedBeams(q.beams) }, pack });
    } catch {
      this.settle(id, 'insights', null);
      this.settle(id, 'pack', null);
    }
    return { insights, pack: packed };
  }

  /** Stop the thread (the task is done with it). */
  close(): void {
    this.dead = true;
    void this.worker.terminate();
  }

  private settle<K extends keyof Pending>(id: number, part: K, r: Parameters<NonNullable<Pending[K]>>[0]): void {
    const entry = this.pending.get(id);
    const resolve = entry?.[part] as ((v: typeof r) => void) | null | undefined;
    if (!entry || !resolve) return;
    entry[part] = null;
    resolve(r);
    if (entry.insights === null && entry.pack === null) this.pending.delete(id);
    if (this.pending.size === 0) this.worker.unref();
  }
}

/**
 * The beams as views on shared memory, so posting them copies nothing: as they are when they
 * already live there, else copied once into one SharedArrayBuffer (values bit for bit).
 */
function sharedBeams(beams: Float64Array[]): Float64Array[] {
  if (beams.every((b) => b.buffer instanceof SharedArrayBuffer)) return beams;
  const total = beams.reduce((s, b) => s + b.length, 0);
  const sab = new SharedArrayBuffer(total * Float64Array.BYTES_PER_ELEMENT);
  let offset = 0;
  return beams.map((b) => {
    const view = new Float64Array(sab, offset * Float64Array.BYTES_PER_ELEMENT, b.length);
    view.set(b);
    offset += b.length;
    return view;
  });
}
