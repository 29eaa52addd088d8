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
 *
 * Loads only the reader's own small modules (no package): it starts in tens of milliseconds.
 */
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
}

/** The worker's answer: its groups (lines counted from 0 at the split), or why it gave up. */
export type RangeReply =
  | { ok: true; parts: LongParts; samples: number }
  | { ok: false; why: string };

function tokenContext(job: RangeJob, keys: KeyTable, errors: ErrorList, sink: RowSink): TokenContext {
  const f = job.plan.fields;
  return {
    file: job.file, fields: f, delimiter: job.delimiter, decimalComma: job.decimalComma, errors, keys, sink,
    nums: new Float64Array(Math.max(1, f.numCount)), keyIds: new Int32Array(Math.max(1, f.keyCount)),
    dropoutTokens: job.dropoutTokens === null ? null : new Set(job.dropoutTokens),
  };
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
  const run = (job: RangeJob): void => {
    readRange(job).then(
      (reply) => port.postMessage(reply, replyBuffers(reply)),
      (e: unknown) => port.postMessage({ ok: false, why: e instanceof Error ? e.message : String(e) } satisfies RangeReply),
    );
  };
  // The job comes with the worker (workerData), or later by message when the worker was started
  // early (src/earlyThreads.ts).
  if (workerData !== null && typeof workerData === 'object' && 'split' in workerData) run(workerData as RangeJob);
  else port.once('message', run);
}
