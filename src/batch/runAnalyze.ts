/**
 * `spherecov analyze`: discover → group → analyze units in parallel → write outputs.
 */
import path from 'node:path';
import { existsSync } from 'node:fs';
import { mkdir } from 'node:fs/promises';
import type { InputError, Quantity, ResultsFile, UnitNotAnalyzed, UnitResult, Warning } from '../types.js';
import type { JobSpec } from '../io/types.js';
import type { LimitSet } from '../limits/limitSet.js';
import { loadLimitSet } from '../limits/loadLimitSet.js';
import { metricLists } from '../limits/metricNeeds.js';
import { mergeLimitSets } from '../limits/mergeLimitSets.js';
import { validateExtraChecks } from '../limits/validateLimitSet.js';
import { buildStatistics } from '../limits/buildStatistics.js';
import { buildConfidence } from '../analysis/uncertainty/buildConfidence.js';
import { loadReportSettings, ReportSettingsError } from '../report/settings.js';
import { unitKey, type MapThumbnail, type ReportSettings } from '../report/reportTypes.js';
import type { CdfCurve } from '../report/cdfCurve.js';
import { DEFAULT_PERCENTILES_PCT, type AnalyzeOptions, type BatchIo } from './options.js';
import { InterruptedError, RunError, formatInputError as formatError } from './errors.js';
import { discoverInputs, groupKey, toPosix, byCodePoint, NotFileOrFolderError, type Discovery } from './discover.js';
import { OutputWriter, outputDirProblem, randomRunId } from './outputDir.js';
import { acquireLock, LockBusyError } from './lock.js';
import { TaskPool, type PoolHooks } from './pool.js';
import type { ReferencePattern, TaskInput, TaskOutput, UnitOutput } from './unitTask.js';
import { warningText } from './unitTask.js';
import { Progress } from './progress.js';
import { summaryCsv, buildStatsCsv } from './summaryCsv.js';
import { frequencyToken, uniqueStems } from './sanitize.js';
import { exitCode } from './exitCode.js';
import { checkReference } from './referenceCheck.js';
import { consoleTable } from '../report/consoleTable.js';
import { TOOL_VERSION } from './version.js';
import { crossUnitExtras } from './crossUnit.js';
import { fsReason, isFsError } from '../io/fsProblem.js';
import { injectFault } from './faults.js';
import { clipText } from '../io/inputError.js';
import pngjs from 'pngjs';

const { PNG } = pngjs;
import { readTrustedBytes, resolveNamed, TrustedFileError } from '../io/trustedFile.js';

/** "interrupted" (SIGINT, or an abort without a named signal) or "stopped by SIGTERM". */
function interruptName(signal: AbortSignal | undefined): string {
  return signal?.reason === 'SIGTERM' ? 'stopped by SIGTERM' : 'interrupted';
}
import { resolveQuantity } from '../quantity.js';

const silentIo: BatchIo = { stdout: () => undefined, stderr: () => undefined, stderrIsTTY: false };

export { unionSorted } from '../limits/metricNeeds.js';

/** Deterministic output order: unit (code point), then frequency ascending, no frequency first. */
export function compareUnits(a: UnitResult, b: UnitResult): number {
  const u = byCodePoint(a.unit, b.unit);
  if (u !== 0) return u;
  if (a.frequencyHz === b.frequencyHz) return 0;
  if (a.frequencyHz === null) return -1;
  if (b.frequencyHz === null) return 1;
  return a.frequencyHz - b.frequencyHz;
}

async function loadJob(opts: AnalyzeOptions, found: string | null): Promise<JobSpec | null> {
  const file = opts.jobFile ?? found;
  if (!file) return null;
  if (opts.jobFile && !existsSync(opts.jobFile)) throw new RunError(`--job: '${opts.jobFile}' does not exist`);
  const { loadJobFile } = await import('../io/jobFile.js');
  const { job, errors } = loadJobFile(file);
  if (errors.length > 0 || !job) {
    throw new RunError(`the job file could not be used:\n  ${errors.map(formatError).join('\n  ')}`);
  }
  return job;
}

/**
 * Discovery with its failures in the user's words: an input that is a pipe or a device, or a
 * folder that cannot be listed at all, stops the run (exit 2); unreadable entries inside it are
 * collected in `problems` and the rest is analyzed.
 * @throws RunError
 */
async function discover(abs: string, shown: string, exclude: string[]): Promise<Discovery> {
  try {
    return await discoverInputs(abs, exclude);
  } catch (e) {
    if (e instanceof NotFileOrFolderError) throw new RunError(e.message);
    if (isFsError(e)) throw new RunError(`cannot read the input '${shown}': ${fsReason(e)}`);
    throw e;
  }
}

/**
 * The report logo named by the job file, read once across the trust boundary (a regular PNG or
 * JPEG file of at most 4 MiB, relative to the job file) and handed to the report renderers as a
 * data URL, so no renderer opens a path from the job file itself.
 * @throws RunError naming the file and the reason
 */
function logoDataUrl(ref: string, baseDir: string): string {
  let bytes: Buffer;
  try {
    bytes = readTrustedBytes(resolveNamed(ref, baseDir), 'logo', ref);
  } catch (e) {
    if (e instanceof TrustedFileError) throw new RunError(`the job file's report.logo: ${e.message}`);
    throw e;
  }
  const png = bytes.subarray(0, 8).equals(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]));
  const jpeg = bytes[0] === 0xff && bytes[1] === 0xd8 && bytes[2] === 0xff;
  if (!png && !jpeg) throw new RunError(`the job file's report.logo: '${clipText(ref)}' is neither a PNG nor a JPEG image (the report can embed only those)`);
  if (png) {
    // Decoded once here: a damaged PNG would otherwise fail inside the PDF writer's inflate,
    // asynchronously, where no report can catch it.
    try {
      PNG.sync.read(bytes);
    } catch (e) {
      throw new RunError(`the job file's report.logo: '${clipText(ref)}' is a damaged PNG image (${clipText((e as Error).message)})`);
    }
  }
  return `data:image/${png ? 'png' : 'jpeg'};base64,${bytes.toString('base64')}`;
}

/**
 * The limit set of the run: --limits (else the job file's `limits`), plus the job file's own
 * `checks` (validated, merged by name; a job with checks but no limit set judges those alone).
 */
function loadLimits(name: string | undefined, baseDir: string, fromJob: boolean, job: JobSpec | null, quantity: Quantity | undefined): LimitSet | null {
  let base: LimitSet | null = null;
  if (name) {
    const { limitSet, errors } = loadLimitSet(name, baseDir);
    if (!limitSet) throw new RunError(`${fromJob ? "the job file's limits" : '--limits'}: ${errors.map(formatError).join('; ')}`);
    base = limitSet;
  }
  if (!job?.checks || job.checks.length === 0) return base;
  const q = base?.quantity ?? resolveQuantity({ option: quantity, job: job.quantity }).quantity; // checks join the limit set's quantity
  const { checks, errors } = validateExtraChecks(job.checks, job.source, q, ['checks']);
  if (errors.length > 0) throw new RunError(`the job file's checks could not be used:\n  ${errors.map(formatError).join('\n  ')}`);
  base ??= { name: 'job-file checks', description: '', source: job.source, quantity: q, checks: [] };
  return mergeLimitSets(base, checks);
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

/**
 * Read and measure a golden unit's exports from their own folder (no PDF for it; it is not part
 * of the build's results), and return its name and patterns for the difference maps and deltas.
 * @throws RunError when the folder holds no readable unit, or more than one.
 */
async function loadReferenceFolder(
  dir: string,
  outDir: string,
  makeTask: (key: string, files: string[]) => TaskInput,
  pool: TaskPool,
): Promise<{ unit: string; patterns: ReferencePattern[] }> {
  const found = await discover(dir, dir, [outDir]);
  if (found.problems.length > 0) throw new RunError(`--reference: ${formatError(found.problems[0])}`);
  if (found.files.length === 0) throw new RunError(`--reference: no export files (.csv, .tsv, .txt) in the folder '${dir}'`);
  const task: TaskInput = { ...makeTask('reference', found.files), inputRoot: found.root, report: null, exportReference: true, exportAll: true, viewer: false };
  const [out] = await pool.run([task], 1);
  const units = [...new Set((out.referencePatterns ?? []).map((p) => p.result.unit))];
  if (units.length !== 1) {
    const why = out.errors.length ? ` (${formatError(out.errors[0])})` : '';
    throw new RunError(`--reference: the folder '${dir}' must hold exactly one unit's exports; found ${units.length === 0 ? 'none readable' : units.join(', ')}${why}`);
  }
  return { unit: units[0], patterns: out.referencePatterns as ReferencePattern[] };
}

/**
 * Analyze a build folder (or one file) and write results.json, summary.csv, build-stats.csv and
 * the PDFs into `opts.outDir`.
 * @throws RunError when the run cannot start (missing input, bad limit set or job file, unsafe
 *   or busy output folder); InterruptedError on SIGINT.
 */
export async function runAnalyze(opts: AnalyzeOptions): Promise<{ results: ResultsFile; exitCode: 0 | 1 | 2 }> {
  const io = opts.io ?? silentIo;
  const input = path.resolve(opts.input);
  if (!existsSync(input)) throw new RunError(`the input '${opts.input}' does not exist; give a folder of exports or one file`);
  const outDir = path.resolve(opts.outDir);
  const problem = await outputDirProblem(input, outDir, opts.force === true);
  if (problem) throw new RunError(problem);

  const discovery = await discover(input, opts.input, [outDir]);
  const job = await loadJob(opts, discovery.jobFile);
  // A limit-set path in the job file is relative to the job file, one on the command line to the
  // working directory: the verdict never depends on where the command is run from.
  const limitsBase = opts.limits === undefined && job ? path.dirname(job.source) : process.cwd();
  const limitSet = loadLimits(opts.limits ?? job?.limits, limitsBase, opts.limits === undefined, job, opts.quantity);
  const { percentilesPct, thresholds, relativeDb } = metricLists({
    percentilesPct: opts.percentilesPct ?? job?.percentiles ?? DEFAULT_PERCENTILES_PCT,
    thresholds: opts.thresholds ?? job?.coverageThresholds,
    relativeDb: opts.relativeDb,
  }, limitSet);
  // Measurement uncertainty and decision rule: the job file's block wins over the limit set's.
  const uncertainty = job?.uncertainty ?? limitSet?.uncertainty ?? null;
  // --reference names a unit of this build, or a folder of a golden unit's exports measured
  // elsewhere (resolved once the build's groups are known, below).
  const referenceArg = opts.reference ?? job?.reference;
  let referenceDir: string | null = null;
  let reference = referenceArg;
  const generatedAt = opts.creationDate ?? new Date().toISOString();
  const pdf = opts.pdf !== false;
  // viewer.html goes with the reports: --no-pdf stays "JSON and CSV only, for speed" (CONTRACT.md).
  const viewer = opts.viewer ?? pdf;
  const pageSize = opts.pageSize ?? 'a4';
  const jobs = opts.jobs ?? 'auto';
  let report: ReportSettings | null = null;
  if (pdf) {
    try {
      report = loadReportSettings({
        ...((job?.report ?? {}) as Record<string, unknown>),
        pageSize: pageSize === 'letter' ? 'Letter' : 'A4',
        creationDate: generatedAt,
      });
    } catch (e) {
      if (e instanceof ReportSettingsError) throw new RunError(e.message);
      throw e;
    }
    if (report.logo) report = { ...report, logo: logoDataUrl(report.logo, job ? path.dirname(job.source) : process.cwd()) };
  }
  if (discovery.files.length === 0 && discovery.problems.length > 0) {
    throw new RunError(`no readable export files in '${opts.input}':\n  ${discovery.problems.map(formatError).join('\n  ')}`);
  }
  if (discovery.files.length === 0) {
    throw new RunError(`no export files (.csv, .tsv, .txt) found in '${opts.input}'`);
  }

  const groups = new Map<string, string[]>();
  for (const f of discovery.files) {
    const k = groupKey(toPosix(path.relative(discovery.root, f)), job ?? undefined, path.basename(discovery.root));
    groups.set(k, [...(groups.get(k) ?? []), f]);
  }
  const makeTask = (key: string, files: string[]): TaskInput => ({
    key, files, inputRoot: discovery.root, job, quantityOverride: opts.quantity, percentilesPct, thresholds, relativeDb,
    limitSet, report, generatedAt, toolVersion: TOOL_VERSION, reference, referenceExternal: referenceDir !== null, viewer,
    ...(opts.coreOnly ? { coreOnly: true } : {}),
    uncertainty,
    eisPolarizations: opts.eisPolarizations ?? 'each',
  });
  let referenceAfterReading = false;
  if (referenceArg !== undefined) {
    let named;
    try {
      named = checkReference(referenceArg, input, new Set(groups.keys()), discovery.files, job);
    } catch (e) {
      throw new RunError((e as Error).message);
    }
    if (named.kind === 'folder' && opts.reference === undefined) {
      // A job file travels with an input folder someone else prepared: it may name a unit of
      // the build, never make the run read a folder outside what the user named.
      throw new RunError(`the job file's reference: '${clipText(referenceArg)}' is not a unit of this build; a job file may name only a unit of the build. A golden unit measured elsewhere is given on the command line: --reference <folder>`);
    }
    if (named.kind === 'folder') {
      referenceDir = named.dir;
      reference = undefined;
    } else if (named.kind === 'unit') reference = named.unit;
    else referenceAfterReading = true;
  }
  const tasks = [...groups.keys()].sort(byCodePoint).map((k) => makeTask(k, groups.get(k) as string[]));

  const signal = opts.signal;
  const stopped = (): boolean => signal?.aborted === true;
  if (stopped()) throw new InterruptedError(`${interruptName(signal)} before any output was written; the previous run's files are unchanged`);

  let writer: OutputWriter;
  let release: () => void = () => undefined;
  try {
    await mkdir(outDir, { recursive: true });
    release = acquireLock(outDir);
    writer = await OutputWriter.open(outDir, randomRunId(), { signal, stderr: io.stderr });
  } catch (e) {
    release();
    if (e instanceof LockBusyError) throw new RunError(e.message);
    throw new RunError(`cannot write to the output folder '${opts.outDir}': ${(e as Error).message}`);
  }

  const progress = new Progress(tasks.length, io.stderrIsTTY && !opts.quiet ? io.stderr : null);
  const pool = new TaskPool();
  let stage = 'analyzing';
  const spooled = new Map<UnitOutput, string>();
  const spooling: Promise<void>[] = [];
  let spoolError: unknown = null;
  const onAbort = () => void pool.terminate();
  signal?.addEventListener('abort', onAbort);
  try {
    const hooks: PoolHooks = {
      aborted: stopped,
      onStart: (t) => progress.start(t.key),
      onDone: (_t, out) => {
        progress.finish();
        // PDFs go to spool files as they arrive: memory stays bounded by one unit's report.
        for (const u of out.units) {
          if (!u.pdf) continue;
          const bytes = u.pdf;
          u.pdf = null;
          // A failed spool (a full disk) is kept and thrown once the analysis is over, never left
          // as an unhandled rejection that would end the process mid-run.
          spooling.push(writer.spool(bytes).then((p) => void spooled.set(u, p), (err: unknown) => void (spoolError ??= err)));
        }
      },
    };
    // The reference unit's group (a folder or file stem named like the unit) runs first, so the
    // other units' PDFs can draw their difference maps; without such a group the deltas are
    // still computed below, only the maps are missing.
    const refIndex = reference === undefined ? -1 : tasks.findIndex((t) => t.key === reference);
    const outputs: TaskOutput[] = [];
    let referencePatterns: ReferencePattern[] | undefined;
    if (referenceDir !== null) {
      const golden = await loadReferenceFolder(referenceDir, outDir, makeTask, pool);
      reference = golden.unit;
      referencePatterns = golden.patterns;
      for (const t of tasks) t.reference = reference;
    } else if (refIndex >= 0) {
      const [refOut] = await pool.run([{ ...tasks[refIndex], exportReference: true }], 1, hooks);
      referencePatterns = refOut.referencePatterns;
      delete refOut.referencePatterns;
      outputs.push(refOut);
    }
    const rest = tasks.filter((_t, i) => i !== refIndex).map((t) => (referencePatterns ? { ...t, referencePatterns } : t));
    await injectFault('analysis', 'analyze', input, signal, io.stderr);
    if (!stopped()) outputs.push(...(await pool.run(rest, jobs, hooks)));
    await Promise.all(spooling);
    if (spoolError !== null) throw spoolError;
    if (stopped()) throw new InterruptedError('stop');
    for (const comp of collidingGroups(outputs)) {
      const files = comp.flatMap((k) => groups.get(k) as string[]).sort((a, b) => byCodePoint(toPosix(a), toPosix(b)));
      const [merged] = await pool.run([{ ...makeTask(comp.join('+'), files), referencePatterns }], 1);
      for (let i = outputs.length - 1; i >= 0; i--) if (comp.includes(outputs[i].key)) outputs.splice(i, 1);
      outputs.push(merged);
    }
    if (stopped()) throw new InterruptedError('stop');

    const unitOutputs: UnitOutput[] = outputs.flatMap((o) => o.units).sort((a, b) => compareUnits(a.result, b.result));
    const units = unitOutputs.map((u) => u.result);
    const notAnalyzed: UnitNotAnalyzed[] = outputs.flatMap((o) => o.notAnalyzed ?? []);
    notAnalyzed.sort((a, b) => byCodePoint(a.unit, b.unit) || (a.frequencyHz ?? -1) - (b.frequencyHz ?? -1));
    const errors: InputError[] = [...discovery.problems, ...outputs.flatMap((o) => o.errors)];
    errors.sort((a, b) => byCodePoint(a.file, b.file) || (a.line ?? 0) - (b.line ?? 0) || (a.column ?? 0) - (b.column ?? 0));
    const looseWarnings: Warning[] = outputs.flatMap((o) => o.warnings);
    const referenceProblem = crossUnitExtras(units, reference, referenceDir !== null);
    const build = units.length + notAnalyzed.length > 0 ? buildStatistics(units, notAnalyzed) : null;
    const sure = buildConfidence(units); // issue 17: only when the units carry a measurement uncertainty
    if (build && sure) build.confidence = sure;

    const results: ResultsFile = {
      schemaVersion: 1,
      tool: { name: 'spherecov', version: TOOL_VERSION },
      generatedAt,
      testInfo: job?.testInfo ?? null,
      settings: {
        input: toPosix(path.basename(input)),
        percentilesPct,
        coverageThresholds: thresholds,
        relativeDb,
        limits: limitSet ? { name: limitSet.name, source: limitSet.source } : null,
        quantityOverride: opts.quantity ?? null,
        eisPolarizations: opts.eisPolarizations ?? 'each',
        jobFile: job ? path.basename(job.source) : null,
        reference: reference ?? null,
        ...(uncertainty ? { uncertainty } : {}),
        referenceFolder: referenceDir === null ? null : toPosix(referenceArg as string),
        pdf,
        pageSize,
        skippedLinks: discovery.skippedLinks.map(toPosix),
        warnings: [...looseWarnings.map(warningText), ...(referenceProblem ? [referenceProblem] : [])],
      },
      units,
      unitsNotAnalyzed: notAnalyzed,
      build,
      errors,
    };

    stage = 'writing';
    const write = async (name: string, data: string | Uint8Array): Promise<void> => {
      if (stopped()) throw new InterruptedError('stop');
      await writer.write(name, data);
    };
    // No results.json while files are being replaced: a run killed here cannot look finished.
    await writer.discard('results.json');
    const pdfNames: string[] = [];
    if (pdf) {
      // A unit measured both ways (EIRP and EIS at one frequency) gets the quantity in its receive report's name.
      const twin = (u: UnitResult): boolean => units.some((v) => v !== u && v.unit === u.unit && v.frequencyHz === u.frequencyHz && v.quantity !== u.quantity);
      const stems = uniqueStems(units.map((u) => `${u.frequencyHz === null ? u.unit : `${u.unit}_${frequencyToken(u.frequencyHz)}`}${twin(u) && u.quantity !== 'eirp' ? `_${u.quantity}` : ''}`));
      for (let i = 0; i < unitOutputs.length; i++) {
        const file = spooled.get(unitOutputs[i]);
        if (stopped()) throw new InterruptedError('stop');
        const bytes = unitOutputs[i].pdf;
        if (file) await writer.commit(file, `${stems[i]}.pdf`);
        else if (bytes) await write(`${stems[i]}.pdf`, bytes);
        if (file || bytes) pdfNames.push(`${stems[i]}.pdf`);
      }
      const thumbnails: Record<string, MapThumbnail> = {};
      const cdfs: Record<string, CdfCurve> = {};
      for (const u of unitOutputs) {
        const k = unitKey(u.result.unit, u.result.frequencyHz, u.result.quantity);
        if (u.thumbnail) thumbnails[k] = u.thumbnail;
        if (u.cdf) cdfs[k] = u.cdf;
      }
      const { renderBuildPdf } = await import('../report/buildReport.js');
      const summaryPdf = await renderBuildPdf(
        {
          units,
          unitsNotAnalyzed: notAnalyzed,
          thumbnails,
          cdfs,
          build: build ?? buildStatistics([]),
          generatedAt,
          toolVersion: TOOL_VERSION,
          limitSetName: limitSet?.name ?? null,
          testInfo: job?.testInfo,
        },
        report as ReportSettings,
      );
      await write('summary.pdf', summaryPdf);
    }
    await write('summary.csv', summaryCsv(units, notAnalyzed));
    await write('build-stats.csv', buildStatsCsv(build));
    if (viewer) {
      const { renderViewerHtml } = await import('../report/viewerHtml.js');
      const { analysisLevel, holeThreshold } = await import('./unitTask.js');
      await write('viewer.html', await renderViewerHtml({
        results, packed: unitOutputs.map((u) => u.viewer ?? null), limitSet,
        removalLevelPct: analysisLevel(limitSet), holeThreshold: holeThreshold(limitSet, thresholds),
        colorMap: report?.colorMap ?? 'lumen', mapCenterPhiDeg: report?.mapCenterPhiDeg ?? 0,
        golden: referenceDir !== null ? referencePatterns : undefined,
      }));
    }
    const json = JSON.stringify(results, null, 2) + '\n';
    // results.json last: its presence (with this run's generatedAt) marks a finished run.
    await write('results.json', json);
    await writer.finish();

    progress.clear();
    for (const e of errors) io.stderr(`spherecov: ${formatError(e)}\n`);
    // A --reference that only the files' contents could name, and they did not: a usage error.
    const referenceMissing = referenceAfterReading && referenceProblem !== null;
    if (referenceMissing) io.stderr(`spherecov: ${referenceProblem}\n`);
    if (opts.json) io.stdout(json);
    else if (!opts.quiet) {
      const written = ['results.json', 'summary.csv', 'build-stats.csv', ...(pdf ? ['summary.pdf', ...pdfNames] : [])];
      io.stdout(consoleTable(results, written, opts.outDir));
    }
    return { results, exitCode: referenceMissing ? 2 : exitCode(results, opts.failOn ?? []) };
  } catch (e) {
    progress.clear();
    await writer.removeTemps();
    if (stopped()) {
      const how = stage === 'analyzing'
        ? `interrupted while analyzing: ${progress.count} of ${tasks.length} group(s) done; no outputs were written, the previous run's files are unchanged`
        : `interrupted while writing: ${writer.files.length} file(s) replaced (${writer.files.join(', ')}); run again to complete`;
      throw new InterruptedError(`${interruptName(signal)} ${how.replace(/^interrupted /, '')}`);
    }
    if (isFsError(e)) {
      const where = e.path ? ` ('${path.basename(e.path)}')` : '';
      const done = writer.files.length > 0
        ? `${writer.files.length} file(s) were replaced (${writer.files.join(', ')}) and results.json was not written`
        : stage === 'writing' ? "no output was replaced" : "no outputs were written, the previous run's files are unchanged";
      throw new RunError(`could not write to the output folder '${opts.outDir}'${where}: ${fsReason(e)}; ${done}; temporary files were removed. Free space or fix the folder and run again`);
    }
    throw e;
  } finally {
    signal?.removeEventListener('abort', onAbort);
    release();
  }
}
