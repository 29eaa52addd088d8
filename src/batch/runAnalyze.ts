/**
 * `spherecov analyze`: plan, then run. The plan (analyzePlan.ts) decides everything and finds every
 * usage error before any work; the run locks the output folder, analyzes the groups in parallel
 * (the reference first), merges groups that turned out to hold one unit, assembles results.json
 * (resultsFile.ts), writes the outputs (writeOutputs.ts) and tells the user.
 */
import path from 'node:path';
import { mkdir } from 'node:fs/promises';
import type { ResultsFile } from '../types.js';
import type { AnalyzeOptions, BatchIo } from './options.js';
import { InterruptedError, RunError, formatInputError as formatError } from './errors.js';
import { byCodePoint, toPosix } from './discover.js';
import { OutputWriter, randomRunId } from './outputDir.js';
import { acquireLock, LockBusyError } from './lock.js';
import { TaskPool, type PoolHooks } from './pool.js';
import type { ReferencePattern, TaskInput, TaskOutput } from './unitTask.js';
import { Progress } from './progress.js';
import { exitCode } from './exitCode.js';
import { consoleTable } from '../report/consoleTable.js';
import { fsReason, isFsError } from '../io/fsProblem.js';
import { injectFault } from './faults.js';
import { groupTasks, planAnalyze, taskFor, type AnalyzePlan } from './analyzePlan.js';
import { assembleResults, type AssembledResults } from './resultsFile.js';
import { writeOutputs, type OutputRun } from './writeOutputs.js';

export { unionSorted } from '../limits/metricNeeds.js';
export { compareUnits } from './resultsFile.js';

const silentIo: BatchIo = { stdout: () => undefined, stderr: () => undefined, stderrIsTTY: false };

/** A run under way: the plan, the locked output folder and how far the work got. */
export interface Run extends OutputRun {
  io: BatchIo;
  pool: TaskPool;
  progress: Progress;
  tasks: TaskInput[];
  stage: 'analyzing' | 'writing';
  spooling: Promise<void>[];
  spoolError: unknown;
}

/** What the analysis gave: every group's output, and the reference as finally known. */
export interface Analyzed {
  outputs: TaskOutput[];
  /** The reference unit's name (a golden folder's unit once measured), or undefined. */
  reference: string | undefined;
  referencePatterns: ReferencePattern[] | undefined;
}

/** "interrupted" (SIGINT, or an abort without a named signal) or "stopped by SIGTERM". */
function interruptName(signal: AbortSignal | undefined): string {
  return signal?.reason === 'SIGTERM' ? 'stopped by SIGTERM' : 'interrupted';
}

const stopped = (run: Pick<Run, 'signal'>): boolean => run.signal?.aborted === true;

/**
 * Analyze a build folder (or one file) and write results.json, summary.csv, build-stats.csv and
 * the PDFs into `opts.outDir`.
 * @throws RunError when the run cannot start (missing input, bad limit set or job file, unsafe
 *   or busy output folder); InterruptedError on SIGINT.
 */
export async function runAnalyze(opts: AnalyzeOptions): Promise<{ results: ResultsFile; exitCode: 0 | 1 | 2 }> {
  // Made first: the pool reads the machine's idle CPU over the planning for --jobs auto.
  const pool = new TaskPool();
  const plan = await planAnalyze(opts);
  const tasks = groupTasks(plan);
  if (opts.signal?.aborted === true) throw new InterruptedError(`${interruptName(opts.signal)} before any output was written; the previous run's files are unchanged`);
  const { writer, release } = await openOutput(plan, opts);
  const io = opts.io ?? silentIo;
  // Configuration keys read in an old spelling: on stderr (and in results.json settings.warnings).
  if (!opts.quiet) for (const n of plan.configNotices) io.stderr(`spherecov: ${n}\n`);
  const run: Run = {
    plan, io, signal: opts.signal, writer, pool, tasks, stage: 'analyzing',
    progress: new Progress(tasks.length, io.stderrIsTTY && !opts.quiet ? io.stderr : null),
    spooled: new Map(), spooling: [], spoolError: null,
  };
  const onAbort = () => void run.pool.terminate();
  run.signal?.addEventListener('abort', onAbort);
  try {
    const analyzed = await analyzeBuild(run);
    const assembled = assembleResults(plan, analyzed);
    run.stage = 'writing';
    const written = await writeOutputs(run, assembled, analyzed.referencePatterns);
    return tellUser(run, assembled, written);
  } catch (e) {
    throw await failure(run, e);
  } finally {
    run.signal?.removeEventListener('abort', onAbort);
    release();
  }
}

/** Create and lock the output folder, and open this run's writer (temporary files until the end). */
async function openOutput(plan: AnalyzePlan, opts: AnalyzeOptions): Promise<{ writer: OutputWriter; release: () => void }> {
  const { outDir } = plan.output;
  let release: () => void = () => undefined;
  try {
    await mkdir(outDir, { recursive: true });
    release = acquireLock(outDir);
    const writer = await OutputWriter.open(outDir, randomRunId(), { signal: opts.signal, stderr: (opts.io ?? silentIo).stderr });
    return { writer, release };
  } catch (e) {
    release();
    if (e instanceof LockBusyError) throw new RunError(e.message);
    throw new RunError(`cannot write to the output folder '${opts.outDir}': ${(e as Error).message}`);
  }
}

/** Progress, and PDFs moved to spool files as each task finishes: memory stays bounded by one unit's report. */
function poolHooks(run: Run): PoolHooks {
  return {
    aborted: () => stopped(run),
    onStart: (t) => run.progress.start(t.key),
    onDone: (_t, out) => {
      run.progress.finish();
      for (const u of out.units) {
        if (!u.pdf) continue;
        const bytes = u.pdf;
        u.pdf = null;
        // A failed spool (a full disk) is kept and thrown once the analysis is over, never left
        // as an unhandled rejection that would end the process mid-run.
        run.spooling.push(run.writer.spool(bytes).then((p) => void run.spooled.set(u, p), (err: unknown) => void (run.spoolError ??= err)));
      }
    },
  };
}

/**
 * Analyze every group: the reference first (a golden folder, or the reference unit's own group,
 * so the other units' PDFs can draw their difference maps; without such a group the deltas are
 * still computed afterwards, only the maps are missing), then the rest in parallel, then the
 * groups that turned out to hold one unit, again as one.
 */
async function analyzeBuild(run: Run): Promise<Analyzed> {
  const { plan, tasks } = run;
  const hooks = poolHooks(run);
  const refIndex = plan.reference.unit === undefined ? -1 : tasks.findIndex((t) => t.key === plan.reference.unit);
  const analyzed: Analyzed = { outputs: [], reference: plan.reference.unit, referencePatterns: undefined };
  if (plan.reference.folder !== null) {
    const golden = await measureReferenceFolder(run, plan.reference.folder);
    analyzed.reference = golden.unit;
    analyzed.referencePatterns = golden.patterns;
    for (const t of tasks) t.reference = golden.unit;
  } else if (refIndex >= 0) {
    const [refOut] = await run.pool.run([{ ...tasks[refIndex], exportReference: true }], 1, hooks);
    analyzed.referencePatterns = refOut.referencePatterns;
    delete refOut.referencePatterns;
    analyzed.outputs.push(refOut);
  }
  const patterns = analyzed.referencePatterns;
  const rest = tasks.filter((_t, i) => i !== refIndex).map((t) => (patterns ? { ...t, referencePatterns: patterns } : t));
  await injectFault('analysis', 'analyze', plan.input, run.signal, run.io.stderr);
  if (!stopped(run)) analyzed.outputs.push(...(await run.pool.run(rest, plan.opts.jobs ?? 'auto', hooks)));
  await Promise.all(run.spooling);
  if (run.spoolError !== null) throw run.spoolError;
  if (stopped(run)) throw new InterruptedError('stop');
  await mergeCollidingGroups(run, analyzed);
  if (stopped(run)) throw new InterruptedError('stop');
  return analyzed;
}

/**
 * Read and measure a golden unit's exports from their own folder (no PDF for it; it is not part
 * of the build's results), and return its name and patterns for the difference maps and deltas.
 * @throws RunError when the folder holds no readable unit, or more than one.
 */
async function measureReferenceFolder(run: Run, folder: { dir: string; root: string; files: string[] }): Promise<{ unit: string; patterns: ReferencePattern[] }> {
  const task: TaskInput = { ...taskFor(run.plan, 'reference', folder.files), inputRoot: folder.root, report: null, exportReference: true, exportAll: true, viewer: false };
  const [out] = await run.pool.run([task], 1);
  const units = [...new Set((out.referencePatterns ?? []).map((p) => p.result.unit))];
  if (units.length !== 1) {
    const why = out.errors.length ? ` (${formatError(out.errors[0])})` : '';
    throw new RunError(`--reference: the folder '${folder.dir}' must hold exactly one unit's exports; found ${units.length === 0 ? 'none readable' : units.join(', ')}${why}`);
  }
  return { unit: units[0], patterns: out.referencePatterns as ReferencePattern[] };
}

/** Groups whose files named the same (unit, frequency, quantity) are one unit: analyze their files again, together. */
async function mergeCollidingGroups(run: Run, analyzed: Analyzed): Promise<void> {
  const { outputs } = analyzed;
  for (const comp of collidingGroups(outputs)) {
    const files = comp.flatMap((k) => run.plan.groups.get(k) as string[]).sort((a, b) => byCodePoint(toPosix(a), toPosix(b)));
    const task = { ...taskFor(run.plan, comp.join('+'), files, analyzed.reference), referencePatterns: analyzed.referencePatterns };
    const [merged] = await run.pool.run([task], 1);
    for (let i = outputs.length - 1; i >= 0; i--) if (comp.includes(outputs[i].key)) outputs.splice(i, 1);
    outputs.push(merged);
  }
}

/** Union-find over group keys that produced the same (unit, frequency): those groups are one unit's files. */
function collidingGroups(outputs: TaskOutput[]): string[][] {
  const owner = new Map<string, string>();
  const parent = new Map<string, string>();
  const find = (k: string): string => {
    let r = k;
    while (parent.get(r) !== r) r = parent.get(r) as string;
    return r;
  };
  for (const o of outputs) parent.set(o.key, o.key);
  for (const o of outputs) {
    for (const u of o.units) {
      const id = JSON.stringify([u.result.unit, u.result.frequencyHz, u.result.quantity]);
      const prev = owner.get(id);
      if (prev === undefined) owner.set(id, o.key);
      else parent.set(find(o.key), find(prev));
    }
  }
  const comps = new Map<string, string[]>();
  for (const o of outputs) {
    const r = find(o.key);
    comps.set(r, [...(comps.get(r) ?? []), o.key]);
  }
  return [...comps.values()].filter((c) => c.length > 1);
}

/** Errors to stderr, the verdict table (or results.json with --json) to stdout, and the exit code. */
function tellUser(run: Run, assembled: AssembledResults, written: { files: string[]; json: string }): { results: ResultsFile; exitCode: 0 | 1 | 2 } {
  const { opts, reference } = run.plan;
  const { results, referenceProblem } = assembled;
  const { files, json } = written;
  run.progress.clear();
  for (const e of results.errors) run.io.stderr(`spherecov: ${formatError(e)}\n`);
  // A --reference that only the files' contents could name, and they did not: a usage error.
  const referenceMissing = reference.afterReading && referenceProblem !== null;
  if (referenceMissing) run.io.stderr(`spherecov: ${referenceProblem}\n`);
  if (opts.json) run.io.stdout(json);
  else if (!opts.quiet) run.io.stdout(consoleTable(results, files, opts.outDir));
  return { results, exitCode: referenceMissing ? 2 : exitCode(results, opts.failOn ?? []) };
}

/**
 * The error a failed run throws, once its temporary files are removed: how far an interrupted run
 * got, or which output could not be written and what was already replaced.
 */
async function failure(run: Run, e: unknown): Promise<unknown> {
  const { writer, stage } = run;
  const shownOut = run.plan.opts.outDir;
  run.progress.clear();
  await writer.removeTemps();
  if (stopped(run)) {
    const how = stage === 'analyzing'
      ? `interrupted while analyzing: ${run.progress.count} of ${run.tasks.length} group(s) done; no outputs were written, the previous run's files are unchanged`
      : `interrupted while writing: ${writer.files.length} file(s) replaced (${writer.files.join(', ')}); run again to complete`;
    return new InterruptedError(`${interruptName(run.signal)} ${how.replace(/^interrupted /, '')}`);
  }
  if (isFsError(e)) {
    const where = e.path ? ` ('${path.basename(e.path)}')` : '';
    const done = writer.files.length > 0
      ? `${writer.files.length} file(s) were replaced (${writer.files.join(', ')}) and results.json was not written`
      : stage === 'writing' ? "no output was replaced" : "no outputs were written, the previous run's files are unchanged";
    return new RunError(`could not write to the output folder '${shownOut}'${where}: ${fsReason(e)}; ${done}; temporary files were removed. Free space or fix the folder and run again`);
  }
  return e;
}
