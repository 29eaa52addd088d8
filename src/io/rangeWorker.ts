/**
 * The second thread of a parallel read (readInParallel.ts): reads the rows of one long-layout
 * file from a split point (a line start) to the end with the same fast path and the same sink
 * code as the main thread, and hands back its groups' arrays (transferred, not copied).
 *
 * Its groups must follow the same template as a single pass would (the file's first group's
 * directions), so it first reads the file's first group again, up to the row where the second
 * group starts; that group must end before the split. Anything unusual (an error, a dropout, a
 * quote, the first group not ending before the split) ends it with `ok: false`, and the main
 * thread reads that part itself, so results and errors are those of one pass by construction.
 * After an ok answer it hashes the whole file for the main thread (HashReply).
 *
 * Loads only the reader's own small modules (no package): it starts in tens of milliseconds.
 */
import { createHash } from 'node:crypto';
import { closeSync, openSync, readSync } from 'node:fs';
import { open } from 'node:fs/promises';
import { parentPort, workerData } from 'node:worker_threads';
import { fastTokenize } from './fastTokenizer.js';
import { ErrorList } from './inputError.js';
import { KeyTable } from './keyTable.js';
import { DropoutLog } from './layouts/dropoutLog.js';
import type { LongPlan } from './layouts/layoutTypes.js';
import { LongSink, type LongParts } from './layouts/longSink.js';
import type { RowLocator, RowSink } from './rowSink.js';
import { SampleLimit } from './sampleLimit.js';
import type { TokenContext } from './textRow.js';

/** Bytes a read of hashFile takes. */
const HASH_CHUNK = 4 << 20;

/** What the main thread tells the worker (structured clone). */
export interface RangeJob {
  path: string;
  /** The file as errors name it (only used for messages that end the worker's part anyway). */
  file: string;
  plan: LongPlan;
  delimiter: string;
  decimalComma: boolean;
  dropoutTokens: string[] | null;
  /** First data byte and its line number. */
  dataStart: number;
  firstLine: number;
  /** Where the worker's part starts (a line start). */
  split: number;
  maxSamples: number;
  chunkBytes?: number;
  /** Values in shared memory, as the main thread's sink keeps them (SinkContext.sharedValues). */
  sharedValues: boolean;
  /** After an ok part, also hash the whole file (HashReply). */
  hash: boolean;
}

/** The worker's answer: its groups (lines counted from 0 at the split), or why it gave up. */
export type RangeReply =
  | { ok: true; parts: LongParts; samples: number }
  | { ok: false; why: string };

/**
 * The worker's second message, after an ok RangeReply: the SHA-256 (hex) of the whole file, read
 * again from its first byte, or null when that read failed (the main thread then hashes it).
 */
export interface HashReply {
  sha256: string | null;
}

function tokenContext(job: RangeJob, keys: KeyTable, errors: ErrorList, sink: RowSink): TokenContext {
  const f = job.plan.fields;
  return {
    file: job.file, fields: f, delimiter: job.delimiter, decimalComma: job.decimalComma, errors, keys, sink,
    nums: new Float64Array(Math.max(1, f.numCount)), keyIds: new Int32Array(Math.max(1, f.keyCount)),
    dropoutTokens: job.dropoutTokens === null ? null : new Set(job.dropoutTokens),
  };
}

/**
 * SHA-256 (hex) of the whole file at `path`, read with blocking reads: this thread has nothing
 * else to do, and 64 asynchronous 1 MiB reads cost more in thread hops than the hashing saves.
 */
function hashFile(path: string): string {
  const fd = openSync(path, 'r');
  try {
    const hash = createHash('sha256');
    const buf = Buffer.allocUnsafe(HASH_CHUNK);
    for (let n; (n = readSync(fd, buf, 0, HASH_CHUNK, null)) > 0;) hash.update(buf.subarray(0, n));
    return hash.digest('hex');
  } finally {
    closeSync(fd);
  }
}

/** Read the worker's part of the file. */
export async function readRange(job: RangeJob): Promise<RangeReply> {
  const fh = await open(job.path, 'r');
  try {
    const keys = new KeyTable(job.plan.fields.keyCount);
    // The file's first group, read again: the template later groups follow.
    const preErrors = new ErrorList(job.file);
    const pre = new LongSink(job.plan, job.file, preErrors, keys, new DropoutLog());
    const halt = { now: false };
    const untilSecond: RowSink = {
      row(line: number, nums: Float64Array, keyIds: Int32Array, loc: RowLocator): void {
        pre.row(line, nums, keyIds, loc);
        if (pre.groupCount > 1) halt.now = true;
      },
    };
    const tPre = { ...tokenContext(job, keys, preErrors, untilSecond), halt };
    const first = await fastTokenize(fh, { readFrom: job.dataStart, parseFrom: job.dataStart, end: job.split }, job.firstLine, tPre, null, job.chunkBytes);
    const template = pre.firstGroup();
    if (first.outcome !== 'halt' || preErrors.count > 0 || template === null) return { ok: false, why: 'the first group does not end before the split' };

    const errors = new ErrorList(job.file);
    const dropouts = new DropoutLog();
    const sink = new LongSink(job.plan, job.file, errors, keys, dropouts, job.sharedValues);
    sink.followTemplate(template);
    const limited = new SampleLimit(sink, 1, job.maxSamples, job.file, errors);
    const t = tokenContext(job, keys, errors, limited);
    const rest = await fastTokenize(fh, { readFrom: job.split, parseFrom: job.split, end: Infinity }, 0, t, null, job.chunkBytes);
    if (rest.outcome !== 'done') return { ok: false, why: `the fast path stopped (${rest.outcome})` };
    if (errors.count > 0 || dropouts.count > 0) return { ok: false, why: 'errors or dropouts in the second part' };
    return { ok: true, parts: sink.parts(), samples: limited.count };
  } finally {
    await fh.close();
  }
}

/** The buffers of a reply, each once (a transfer list must not repeat one). */
export function replyBuffers(reply: RangeReply): ArrayBuffer[] {
  if (!reply.ok) return [];
  const out = new Set<ArrayBuffer>();
  const add = (a: Float64Array | null): void => {
    if (a !== null && a.buffer instanceof ArrayBuffer) out.add(a.buffer);
  };
  for (const g of reply.parts.groups) {
    add(g.acc.values);
    add(g.acc.thetaDeg);
    add(g.acc.phiDeg);
  }
  add(reply.parts.templateTheta);
  add(reply.parts.templatePhi);
  return [...out];
}

if (parentPort !== null) {
  const port = parentPort;
  // The parts go first, so the main thread merges them while this thread hashes the file: the
  // hash is then off the main thread's path (issue 18).
  const run = async (job: RangeJob): Promise<void> => {
    const reply = await readRange(job).catch((e: unknown): RangeReply => ({ ok: false, why: e instanceof Error ? e.message : String(e) }));
    port.postMessage(reply, replyBuffers(reply));
    if (!reply.ok || !job.hash) return;
    let sha256: string | null = null;
    try {
      sha256 = hashFile(job.path);
    } catch {
      // The main thread hashes the file itself.
    }
    port.postMessage({ sha256 } satisfies HashReply);
  };
  // The job comes with the worker (workerData), or later by message when the worker was started
  // early (src/earlyThreads.ts).
  if (workerData !== null && typeof workerData === 'object' && 'split' in workerData) void run(workerData as RangeJob);
  else port.once('message', (job: RangeJob) => void run(job));
}
