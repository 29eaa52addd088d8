import { createHash } from 'node:crypto';
import type { FileHandle } from 'node:fs/promises';
import { Worker } from 'node:worker_threads';
import { compiledWorker } from '../compiledWorker.js';
import { takeEarlyThread } from '../earlyWorkers.js';
import { fastTokenize, hashRange } from './fastTokenizer.js';
import type { LayoutSink, LongPlan, PlanFacts } from './layouts/layoutTypes.js';
import { LongSink } from './layouts/longSink.js';
import type { HashReply, RangeJob, RangeReply } from './rangeWorker.js';
import type { SampleLimit } from './sampleLimit.js';
import type { TokenContext } from './textRow.js';

/**
 * Smallest data part (bytes) worth a second thread. The worker costs about 0.1 s of CPU before
 * it reads at full speed (start-up 30–40 ms, re-reading the first beam 30–40 ms, its own JIT
 * warm-up), measured on the 2-core bench machine, where the fast path reads about 7 ms/MB: a
 * two-thread read gains about 3.5 ms/MB − 70 ms of wall time, so below ~20 MB it loses, and
 * 32 MiB keeps a margin (the 64-beam 1° export, 64 MB, is read on two threads).
 */
export const PARALLEL_MIN_BYTES = 32 << 20;

/**
 * Share of the data bytes the main thread reads itself. Per-thread CPU of a two-thread read of
 * the 64-beam export at an even split (load 6–7 on 2 cores, /proc thread times; the main thread
 * then still hashed the file): main thread 200–230 ms for its half, 20 ms hashing the rest, ≤ 10 ms merging; worker 300–345 ms (start-up
 * ~35, re-reading the first beam ~35, its half, its own JIT warm-up). On a quiet machine the
 * worker also starts later in wall time (a --cpu-prof timeline: it read from ~0.15 s after the main
 * thread and finished ~0.12 s after it at 0.55), so the main thread takes more: whole CLI on that
 * export, both second threads on, 8 alternating pairs each (load 0.7–1.2): 0.62 / 0.55 = 0.96,
 * 0.68 / 0.62 = 1.03 (paired medians; this machine's runs spread ±15 %). Since the worker hashes
 * the file after its part (instead of this thread), 0.68 measured the same as 0.62 (16 pairs,
 * medians 1.002 / 1.008 s on a slow hour of this machine).
 */
export const MAIN_SHARE = 0.62;

/** Bytes searched for the newline after the split point; a longer line keeps one thread. */
const SPLIT_SEARCH = 1 << 16;

/** What the fast path needs to read one file, maybe on two threads. */
export interface FastRead {
  fh: FileHandle;
  absPath: string;
  file: string;
  size: number;
  dataStart: number;
  startLine: number;
  t: TokenContext;
  sink: LayoutSink;
  limited: SampleLimit;
  plan: PlanFacts;
  /** Dropout tokens as the job file lists them (trimmed, lower case), or null. */
  dropoutTokens: string[] | null;
  threads: number;
  minBytes: number;
  /** Share of the data bytes before the split (default MAIN_SHARE). */
  share: number;
  /** Told how the read went: 'single' (one thread), 'merged' (two), 'fallback' (two started, one finished). */
  onOutcome?: (how: 'single' | 'merged' | 'fallback', why?: string) => void;
  maxSamples: number;
  chunkBytes?: number;
  /** The worker hashes the whole file after its part (else this thread does). */
  workerHashes: boolean;
}


/** The line start nearest after the main thread's share, or null (no newline near it). */
async function findSplit(fh: FileHandle, dataStart: number, size: number, share: number): Promise<number | null> {
  const at = dataStart + Math.floor((size - dataStart) * share);
  const buf = Buffer.alloc(Math.min(SPLIT_SEARCH, size - at));
  const { bytesRead } = await fh.read(buf, 0, buf.length, at);
  const nl = buf.subarray(0, bytesRead).indexOf(10);
  if (nl < 0 || at + nl + 1 >= size) return null;
  return at + nl + 1;
}

/** A started range worker: its parts, then its hash of the whole file (null when it failed). */
interface RangeRun {
  reply: Promise<RangeReply | null>;
  sha256: Promise<string | null>;
  stop: () => Promise<number>;
}

/** Start the worker on [split, end). */
function startWorker(script: string, job: RangeJob): RangeRun {
  const early = takeEarlyThread(script);
  const w = early ?? new Worker(script, { workerData: job });
  if (early !== null) early.postMessage(job);
  let toReply: (m: RangeReply | null) => void = () => {};
  let toHash: (sha: string | null) => void = () => {};
  const reply = new Promise<RangeReply | null>((resolve) => (toReply = resolve));
  const sha256 = new Promise<string | null>((resolve) => (toHash = resolve));
  const gone = (): void => {
    toReply(null);
    toHash(null);
  };
  w.on('message', (m: RangeReply | HashReply) => ('sha256' in m ? toHash(m.sha256) : toReply(m)));
  w.once('error', gone);
  w.once('exit', gone);
  return { reply, sha256, stop: () => w.terminate() };
}

/** SHA-256 (hex) of [0, end of file), read on this thread. */
async function hashHere(fh: FileHandle, chunkBytes?: number): Promise<string> {
  const hash = createHash('sha256');
  await hashRange(fh, 0, Infinity, hash, chunkBytes);
  return hash.digest('hex');
}

/**
 * Read the data rows of one file on the fast path, on two threads when that pays: a long-layout
 * file of at least `minBytes` of data, `threads` ≥ 2, and the compiled worker at hand. The main
 * thread reads [data start, split); the worker (rangeWorker.ts) reads [split, end) into its own
 * groups, which the main sink then takes over (LongSink.absorb: a beam cut by the split is
 * continued sample by sample, new beams are taken as they are, group order stays first
 * appearance, lines are offset), and then hashes the whole file while the main thread merges.
 * On anything unusual (an error or quote in either part, the worker giving up, the sample limit)
 * the main thread simply reads on from the split itself, which is exactly the single pass, and
 * hashes the file itself. 'quote': restart on the general path; else the file's SHA-256 (hex).
 */
export async function readFast(r: FastRead): Promise<{ sha256: string } | 'quote'> {
  const whole = { readFrom: 0, parseFrom: r.dataStart, end: Infinity };
  const script = r.threads >= 2 && r.size - r.dataStart >= r.minBytes && r.plan.layout === 'long' && !(r.plan as LongPlan).pairValues
    && r.sink instanceof LongSink ? compiledWorker(import.meta.url, 'rangeWorker.js') : null;
  const split = script === null ? null : await findSplit(r.fh, r.dataStart, r.size, r.share);
  if (script === null || split === null || !(r.sink instanceof LongSink)) {
    r.onOutcome?.('single');
    const hash = createHash('sha256');
    const end = await fastTokenize(r.fh, whole, r.startLine, r.t, hash, r.chunkBytes);
    return end.outcome === 'quote' ? 'quote' : { sha256: hash.digest('hex') };
  }
  const sink = r.sink;
  const worker = startWorker(script, {
    path: r.absPath, file: r.file, plan: r.plan as LongPlan, delimiter: r.t.delimiter, decimalComma: r.t.decimalComma,
    dropoutTokens: r.dropoutTokens, dataStart: r.dataStart, firstLine: r.startLine, split, maxSamples: r.maxSamples, chunkBytes: r.chunkBytes,
    sharedValues: r.threads > 1, hash: r.workerHashes,
  });
  try {
    const first = await fastTokenize(r.fh, { readFrom: 0, parseFrom: r.dataStart, end: split }, r.startLine, r.t, null, r.chunkBytes);
    if (first.outcome === 'quote') {
      r.onOutcome?.('fallback', 'quote');
      return 'quote';
    }
    const reply = r.t.errors.count === 0 ? await worker.reply : null;
    if (reply !== null && reply.ok && r.limited.fits(reply.samples) && sink.absorb(reply.parts, first.line)) {
      r.limited.add(reply.samples);
      r.onOutcome?.('merged');
      return { sha256: (r.workerHashes ? await worker.sha256 : null) ?? (await hashHere(r.fh, r.chunkBytes)) };
    }
    r.onOutcome?.('fallback', reply === null ? (r.t.errors.count > 0 ? 'errors before the split' : 'worker failed') : reply.ok ? 'not absorbed' : reply.why);
    const rest = await fastTokenize(r.fh, { readFrom: split, parseFrom: split, end: Infinity }, first.line, r.t, null, r.chunkBytes);
    return rest.outcome === 'quote' ? 'quote' : { sha256: await hashHere(r.fh, r.chunkBytes) };
  } finally {
    await worker.stop();
  }
}
