/**
 * The plan of an `analyze` run: everything decided before any work starts — the input and output
 * folders, the export files and their work groups, the job file, the limit set, which metrics to
 * compute, the report settings, the reference. Every usage error of a run is found here, so a run
 * that starts never stops for a reason the user could have been told at once (exit 2, nothing
 * written). runAnalyze.ts then runs the plan.
 */
import path from 'node:path';
import { availableParallelism, cpus as cpuList } from 'node:os';
import { existsSync } from 'node:fs';
import type { JobSpec } from '../io/types.js';
import type { LimitSet } from '../limits/limitSet.js';
import { loadLimitSet } from '../limits/loadLimitSet.js';
import { metricLists } from '../limits/metricNeeds.js';
import { mergeLimitSets } from '../limits/mergeLimitSets.js';
import { validateExtraChecks } from '../limits/validateLimitSet.js';
import type { UncertaintySpec } from '../analysis/uncertainty/uncertaintySpec.js';
import { reportSettingsFromChecked, type ReportSettingsOverrides } from '../report/settings.js';
import type { ReportSettings } from '../report/reportTypes.js';
import { resolveQuantity } from '../quantity.js';
import { readTrustedBytes, resolveNamed, TrustedFileError } from '../io/trustedFile.js';
import { clipText } from '../io/inputError.js';
import { fsReason, isFsError } from '../io/fsProblem.js';
import { DEFAULT_PERCENTILES_PCT, type AnalyzeOptions } from './options.js';
import { RunError, formatInputError as formatError } from './errors.js';
import { discoverInputs, groupKey, toPosix, byCodePoint, NotFileOrFolderError, type Discovery } from './discover.js';
import { outputDirProblem } from './outputDir.js';
import { checkReference } from './referenceCheck.js';
import type { TaskInput } from './unitTask.js';
import { TOOL_VERSION } from './version.js';
import { lazyPackage } from '../lazyPackage.js';
import { coresFreeOfOthers, coreToSpare } from './pool.js';
import { cpuTimes, ownCpuMs, programStart } from '../cpuClock.js';

/** pngjs checks a report logo only (src/lazyPackage.ts). */
const pngjs = lazyPackage<typeof import('pngjs')>('pngjs');

/** What the run compares against: a unit of the build, a golden unit's own folder, or nothing. */
export interface ReferencePlan {
  /** As given (--reference, else the job file's reference); undefined without one. */
  given: string | undefined;
  /**
   * The reference unit's name: a unit of the build; the name as given when only the files'
   * contents can name it (checked after reading); undefined for a folder until it is measured.
   */
  unit: string | undefined;
  /** A golden unit's own folder (--reference <folder>) and its export files, else null. */
  folder: { dir: string; root: string; files: string[] } | null;
  /** The name matched no work group: the run says so after reading when no unit has it (exit 2). */
  afterReading: boolean;
}

/** The output files and how they look. */
export interface OutputPlan {
  outDir: string;
  generatedAt: string;
  pdf: boolean;
  /** viewer.html goes with the reports: --no-pdf stays "JSON and CSV only, for speed" (CONTRACT.md). */
  viewer: boolean;
  pageSize: 'a4' | 'letter';
  /** Report settings (job file's `report`, page size, logo as a data URL); null with --no-pdf. */
  report: ReportSettings | null;
}

/** The metrics every unit computes: the settings joined with what the limit set needs. */
export interface MetricPlan {
  percentilesPct: number[];
  thresholds: number[];
  relativeDb: number[];
}

export interface AnalyzePlan {
  /** The options as given (messages name the input and output as the user typed them). */
  opts: AnalyzeOptions;
  /** Absolute input path (a folder or one file). */
  input: string;
  discovery: Discovery;
  job: JobSpec | null;
  limitSet: LimitSet | null;
  metrics: MetricPlan;
  /** Measurement uncertainty and decision rule: the job file's block wins over the limit set's. */
  uncertainty: UncertaintySpec | null;
  output: OutputPlan;
  reference: ReferencePlan;
  /** Work groups (unit folder or file stem) → absolute files, in discovery order. */
  groups: Map<string, string[]>;
  /** Configuration keys read in an old spelling (job file, limit set), each naming the new key. */
  configNotices: string[];
}

/**
 * Decide everything about a run before any work starts.
 * @throws RunError for every usage error (missing input, unsafe output folder, bad job file, limit
 *   set, report settings or reference, no export files).
 */
export async function planAnalyze(opts: AnalyzeOptions): Promise<AnalyzePlan> {
  const input = path.resolve(opts.input);
  if (!existsSync(input)) throw new RunError(`the input '${opts.input}' does not exist; give a folder of exports or one file`);
  const outDir = path.resolve(opts.outDir);
  const problem = await outputDirProblem(input, outDir, opts.force === true);
  if (problem) throw new RunError(problem);
  const discovery = await discover(input, opts.input, [outDir]);
  const configNotices: string[] = [];
  const job = await loadJob(opts, discovery.jobFile, configNotices);
  const limitSet = planLimits(opts, job, configNotices);
  const metrics = metricLists({
    percentilesPct: opts.percentilesPct ?? job?.percentiles ?? DEFAULT_PERCENTILES_PCT,
    thresholds: opts.thresholds ?? job?.coverageThresholds,
    relativeDb: opts.relativeDb,
  }, limitSet);
  const output = planOutput(opts, outDir, job);
  requireExports(discovery, opts.input);
  const groups = groupFiles(discovery, job);
  const reference = await planReference(opts, input, outDir, groups, discovery, job);
  const uncertainty = job?.uncertainty ?? limitSet?.uncertainty ?? null;
  return { opts, input, discovery, job, limitSet, metrics, uncertainty, output, reference, groups, configNotices };
}

/**
 * The work item of one group of files, with everything a unit task needs from the plan.
 * `reference` is the plan's, or the golden unit's name once its folder is measured.
 */
export function taskFor(plan: AnalyzePlan, key: string, files: string[], reference = plan.reference.unit): TaskInput {
  const { opts, metrics } = plan;
  const threads = readThreads(opts.jobs ?? 'auto', plan.groups.size);
  return {
    key, files, inputRoot: plan.discovery.root, job: plan.job, quantityOverride: opts.quantity, ...metrics,
    limitSet: plan.limitSet, report: plan.output.report, generatedAt: plan.output.generatedAt, toolVersion: TOOL_VERSION,
    reference, referenceExternal: plan.reference.folder !== null, viewer: plan.output.viewer,
    ...(opts.coreOnly ? { coreOnly: true } : {}),
    uncertainty: plan.uncertainty,
    eisPolarizations: opts.eisPolarizations ?? 'each',
    // One rule for both: a core the groups and the machine leave idle serves the read, then the insight lane.
    readThreads: threads,
    spareThreads: threads - 1,
  };
}

/**
 * Threads one file read may use (src/io/readInParallel.ts): 2 while the groups leave a core
 * free (fewer groups than cores, e.g. one large export) and other processes left a core to spare
 * since the program started (programStart, src/cpuClock.ts; coresFreeOfOthers, judged by the pool's coreToSpare), else 1, so the reader never competes
 * with the task pool's own lanes or other processes: on a busy 2-core machine (load 6) a second
 * reading thread cost 0.15–0.25 s more CPU and made the read slower; always 1 with --jobs 1.
 */
export function readThreads(jobs: number | 'auto', groups: number, freeCores = coresFreeOfOthers(programStart.cpu, cpuTimes(), programStart.ownMs, ownCpuMs(), cpuList().length)): number {
  const cores = jobs === 'auto' ? availableParallelism() : Math.min(Math.floor(jobs) || 1, availableParallelism());
  return cores >= 2 && groups < cores && coreToSpare(freeCores) ? 2 : 1;
}

/** One task per work group, in code-point order of the group keys. */
export function groupTasks(plan: AnalyzePlan): TaskInput[] {
  return [...plan.groups.keys()].sort(byCodePoint).map((k) => taskFor(plan, k, plan.groups.get(k) as string[]));
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

/** The job file: --job, else the input folder's own; the parser loads only when there is one. */
async function loadJob(opts: AnalyzeOptions, found: string | null, notices: string[]): Promise<JobSpec | null> {
  const file = opts.jobFile ?? found;
  if (!file) return null;
  if (opts.jobFile && !existsSync(opts.jobFile)) throw new RunError(`--job: '${opts.jobFile}' does not exist`);
  const { loadJobFile } = await import('../io/jobFile.js');
  const { job, errors, notices: old } = loadJobFile(file);
  notices.push(...old.map(formatError));
  if (errors.length > 0 || !job) {
    throw new RunError(`the job file could not be used:\n  ${errors.map(formatError).join('\n  ')}`);
  }
  return job;
}

/**
 * The limit set of the run: --limits (else the job file's `limits`), plus the job file's own
 * `checks` (validated, merged by name; a job with checks but no limit set judges those alone).
 * A limit-set path in the job file is relative to the job file, one on the command line to the
 * working directory: the verdict never depends on where the command is run from.
 */
function planLimits(opts: AnalyzeOptions, job: JobSpec | null, notices: string[]): LimitSet | null {
  const fromJob = opts.limits === undefined;
  const name = opts.limits ?? job?.limits;
  let base: LimitSet | null = null;
  if (name) {
    const { limitSet, errors, notices: old } = loadLimitSet(name, fromJob && job ? path.dirname(job.source) : process.cwd());
    notices.push(...old.map(formatError));
    if (!limitSet) throw new RunError(`${fromJob ? "the job file's limits" : '--limits'}: ${errors.map(formatError).join('; ')}`);
    base = limitSet;
  }
  if (!job?.checks || job.checks.length === 0) return base;
  const q = base?.quantity ?? resolveQuantity({ option: opts.quantity, job: job.quantity }).quantity; // checks join the limit set's quantity
  const { checks, errors } = validateExtraChecks(job.checks, job.source, q, ['checks']);
  if (errors.length > 0) throw new RunError(`the job file's checks could not be used:\n  ${errors.map(formatError).join('\n  ')}`);
  base ??= { name: 'job-file checks', description: '', source: job.source, quantity: q, checks: [] };
  return mergeLimitSets(base, checks);
}

/** Output folder, timestamp, which files are written, and the report settings (checked now, with the logo read once). */
function planOutput(opts: AnalyzeOptions, outDir: string, job: JobSpec | null): OutputPlan {
  const generatedAt = opts.creationDate ?? new Date().toISOString();
  const pdf = opts.pdf !== false;
  const pageSize = opts.pageSize ?? 'a4';
  let report: ReportSettings | null = null;
  if (pdf) {
    // The job file's block was validated when the job file was read, the page size and date are
    // built here: merged without loading the settings schema (reportSettingsFromChecked).
    report = reportSettingsFromChecked({
      ...((job?.report ?? {}) as ReportSettingsOverrides),
      pageSize: pageSize === 'letter' ? 'Letter' : 'A4',
      creationDate: generatedAt,
    });
    if (report.logo) report = { ...report, logo: logoDataUrl(report.logo, job ? path.dirname(job.source) : process.cwd()) };
  }
  return { outDir, generatedAt, pdf, viewer: opts.viewer ?? pdf, pageSize, report };
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
      pngjs().PNG.sync.read(bytes);
    } catch (e) {
      throw new RunError(`the job file's report.logo: '${clipText(ref)}' is a damaged PNG image (${clipText((e as Error).message)})`);
    }
  }
  return `data:image/${png ? 'png' : 'jpeg'};base64,${bytes.toString('base64')}`;
}

/** A run needs at least one export file; unreadable entries alone are listed. */
function requireExports(discovery: Discovery, shown: string): void {
  if (discovery.files.length > 0) return;
  if (discovery.problems.length > 0) {
    throw new RunError(`no readable export files in '${shown}':\n  ${discovery.problems.map(formatError).join('\n  ')}`);
  }
  throw new RunError(`no export files (.csv, .tsv, .txt) found in '${shown}'`);
}

/** Work groups by the unit each file's path names (discover.ts groupKey), files in discovery order. */
function groupFiles(discovery: Discovery, job: JobSpec | null): Map<string, string[]> {
  const groups = new Map<string, string[]>();
  for (const f of discovery.files) {
    const k = groupKey(toPosix(path.relative(discovery.root, f)), job ?? undefined, path.basename(discovery.root));
    groups.set(k, [...(groups.get(k) ?? []), f]);
  }
  return groups;
}

/**
 * What --reference (or the job file's reference) names: a unit of the build, a golden unit's own
 * folder, or a name only the files' contents can confirm (referenceCheck.ts).
 * @throws RunError when it names nothing, when the job file names a folder, or when the folder
 *   holds no readable export file
 */
async function planReference(opts: AnalyzeOptions, input: string, outDir: string, groups: Map<string, string[]>, discovery: Discovery, job: JobSpec | null): Promise<ReferencePlan> {
  const given = opts.reference ?? job?.reference;
  const plan: ReferencePlan = { given, unit: given, folder: null, afterReading: false };
  if (given === undefined) return plan;
  let named;
  try {
    named = checkReference(given, input, new Set(groups.keys()), discovery.files, job);
  } catch (e) {
    throw new RunError((e as Error).message);
  }
  if (named.kind === 'folder' && opts.reference === undefined) {
    // A job file travels with an input folder someone else prepared: it may name a unit of
    // the build, never make the run read a folder outside what the user named.
    throw new RunError(`the job file's reference: '${clipText(given)}' is not a unit of this build; a job file may name only a unit of the build. A golden unit measured elsewhere is given on the command line: --reference <folder>`);
  }
  if (named.kind === 'folder') return { ...plan, unit: undefined, folder: await goldenFolder(named.dir, outDir) };
  if (named.kind === 'unit') return { ...plan, unit: named.unit };
  return { ...plan, afterReading: true };
}

/**
 * The export files of a golden unit's own folder (that it holds exactly one unit is known only
 * once they are read: the run checks it).
 * @throws RunError when the folder has unreadable entries or no export file
 */
async function goldenFolder(dir: string, outDir: string): Promise<{ dir: string; root: string; files: string[] }> {
  const found = await discover(dir, dir, [outDir]);
  if (found.problems.length > 0) throw new RunError(`--reference: ${formatError(found.problems[0])}`);
  if (found.files.length === 0) throw new RunError(`--reference: no export files (.csv, .tsv, .txt) in the folder '${dir}'`);
  return { dir, root: found.root, files: found.files };
}
