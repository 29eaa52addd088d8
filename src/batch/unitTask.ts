/**
 * The work for one group of files, run in a worker thread (or in-process): read the files,
 * assemble the measurements, compute and judge each one, run the per-unit analysis and render
 * the unit PDFs. Input and output are plain data (structured-clone safe).
 */
import type { AnalysisThreshold, BeamRemoval, GridSummary, InputError, LevelLimit, Measurement, Quantity, SourceFile, SphereGrid, TotalScanPattern, UnitNotAnalyzed, UnitResult, Warning } from '../types.js';
import type { JobSpec, RawBeam } from '../io/types.js';
import type { LimitSet } from '../limits/limitSet.js';
import { readExportFile } from '../io/readExportFile.js';
import { nfcIdentity } from '../io/nfcIdentity.js';
import { assembleMeasurements } from '../io/assembleMeasurements.js';
import { computeMetrics } from '../coverage/computeMetrics.js';
import { judge } from '../limits/judge.js';
import { frequencyInRange } from '../limits/frequencyInRange.js';
import { computeInsights, type InsightRequest, type Insights } from './insights.js';
import { InsightLane } from './insightLane.js';
import { referenceDeltas } from '../analysis/referenceDeltas.js';
import { tspDifference } from '../analysis/tspDifference.js';
import { crossUnitExtras } from './crossUnit.js';
import { metricsOfUnit, unitResultMetrics } from '../metrics/catalogue.js';
import type { CdfCurve } from '../report/cdfCurve.js';
import type { MapThumbnail, ReportSettings } from '../report/reportTypes.js';
import { gridSummary } from '../sphere/gridSummary.js';
import { qualityWarnings } from '../coverage/qualityWarnings.js';
import { collapseWarnings } from './collapseWarnings.js';
import { resolveUncertainty, type UncertaintySpec } from '../analysis/uncertainty/uncertaintySpec.js';
import { assessConfidence } from '../analysis/uncertainty/assessConfidence.js';
import { GRID_ADEQUACY_CALIBRATION, gridAdequacy } from '../analysis/gridAdequacy/gridAdequacy.js';
import { gridCountWarnings } from '../analysis/gridAdequacy/gridCountWarnings.js';
import { applyJointChecks, type JointMaps } from './jointChecks.js';
import { measurePlan, planPolarizations, type ComponentTsp, type EisPolarizationView, type MeasuredUnit } from './polarizationUnits.js';
import type { ViewerUnit } from '../viewer/viewerData.js';
import type { PackedBeams } from '../report/viewerPack.js';
import { analysisThreshold, impliedChoices, limitSetFor, percentileLimit } from '../limits/impliedChoices.js';

export interface TaskInput {
  /** Work-item key (folder or file-stem group). */
  key: string;
  /** Absolute paths of the files, in discovery order. */
  files: string[];
  inputRoot: string;
  job: JobSpec | null;
  quantityOverride?: Quantity;
  percentilesPct: number[];
  thresholds: number[];
  relativeDb: number[];
  limitSet: LimitSet | null;
  /** Skip the optional analysis (holes, beam removal, smallest subset): --core-only. */
  coreOnly?: boolean;
  /** Report settings for the unit PDFs; null with --no-pdf. */
  report: ReportSettings | null;
  generatedAt: string;
  toolVersion: string;
  /** Name of the reference unit, when the run has one. */
  reference?: string;
  /** The reference unit's patterns (one per frequency), for difference maps in the unit PDFs. */
  referencePatterns?: ReferencePattern[];
  /** Return this group's reference-unit patterns (the run analyzes the reference group first). */
  exportReference?: boolean;
  /** With exportReference: return every unit of the group (a golden unit's own folder). */
  exportAll?: boolean;
  /** The reference comes from its own folder: a build unit of the same name is compared too. */
  referenceExternal?: boolean;
  /** Measurement uncertainty and decision rule (job file, else limit set); null: today's shared-risk verdicts only. */
  uncertainty?: UncertaintySpec | null;
  /** Threads one file read may use (ReadContext.readThreads; analyzePlan.ts readThreads). */
  readThreads?: number;
  /** How an EIS θ/φ pair is judged (src/batch/polarizationUnits.ts); default 'each'. */
  eisPolarizations?: EisPolarizationView;
  /** Pack each unit's grid and beams for viewer.html. */
  viewer?: boolean;
  /**
   * Threads this task may use beside its own (analyzePlan.ts: readThreads − 1); ≥ 1 lets a large
   * unit's optional analysis run on a second thread (insightLane.ts). Absent: none.
   */
  spareThreads?: number;
}

/** A reference unit's total scan pattern on its grid, with its result (plain data, cloneable). */
export interface ReferencePattern {
  frequencyHz: number | null;
  grid: SphereGrid;
  tsp: TotalScanPattern;
  result: UnitResult;
}

export interface UnitOutput {
  result: UnitResult;
  thumbnail: MapThumbnail | null;
  cdf: CdfCurve | null;
  pdf: Uint8Array | null;
  /** The unit packed for viewer.html (TaskInput.viewer), else absent. */
  viewer?: ViewerUnit | null;
}

export interface TaskOutput {
  key: string;
  units: UnitOutput[];
  /** Units of this group that could not be read or analyzed, each with its first error. */
  notAnalyzed: UnitNotAnalyzed[];
  errors: InputError[];
  /** Warnings that belong to a file but no measurement (e.g. a file that failed). */
  warnings: Warning[];
  /** With TaskInput.exportReference: the reference unit's patterns found in this group. */
  referencePatterns?: ReferencePattern[];
}

/** Warning as one line for results.json: `file:line: message` when the warning names a file. */
export function warningText(w: Warning): string {
  const where = w.file ? `${w.file}${w.line ? `:${w.line}` : ''}: ` : '';
  return `${where}${w.message}`;
}

/** Threshold for the hole search, removal and the map contour (limits/impliedChoices.ts). */
export function holeThreshold(ls: LimitSet | null, thresholds: number[]): number | null {
  return impliedChoices(ls, thresholds).threshold;
}

/** Percentile level used for beam removal and subset (limits/impliedChoices.ts). */
export function analysisLevel(ls: LimitSet | null): number {
  return impliedChoices(ls, []).levelPct;
}

/** What measureUnit reads of a task: the metrics asked for, the limit set, and whether to skip the optional analysis. */
export type MeasureOptions = Pick<TaskInput, 'percentilesPct' | 'thresholds' | 'relativeDb' | 'limitSet' | 'coreOnly' | 'uncertainty'>;

/** A limit set made for another frequency range or another quantity than the measurement: said in words. */
function limitSetMismatch(ls: LimitSet | null, m: Measurement): string[] {
  if (!ls) return [];
  const out: string[] = [];
  if (frequencyInRange(ls, m.frequencyHz) === false) {
    out.push(`limit set '${ls.name}' is for ${ls.frequencyRangeMHz?.join('–')} MHz but this measurement is at ${(m.frequencyHz as number) / 1e6} MHz`);
  }
  if (ls.quantity !== m.quantity) out.push(`limit set '${ls.name}' is for ${ls.quantity} but the measurement is ${m.quantity}`);
  return out;
}

/**
 * The verdict of one measurement: its checks judged, how sure the verdict is (issue 17: only with
 * an uncertainty for this quantity; else nothing changes) and its warnings as text (quality
 * warnings join the measurement's typed warnings, which results.json and the PDF both read).
 */
function verdictOf(m: Measurement, computed: ReturnType<typeof computeMetrics>, grid: GridSummary, input: MeasureOptions):
  { judged: ReturnType<typeof judge>; confidence: UnitResult['confidence']; warnings: string[] } {
  const { tsp, metrics } = computed;
  const ls = input.limitSet;
  let judged: ReturnType<typeof judge> = ls
    ? judge(metrics, ls, { quantity: m.quantity, fullSphere: grid.fullSphere })
    : { checks: [], verdict: 'none' as const, worstCheck: null };
  const known = new Set(m.warnings.map((w) => `${w.code}|${w.message}`));
  for (const w of qualityWarnings(m, metrics.beams)) if (!known.has(`${w.code}|${w.message}`)) m.warnings.push(w);
  const warnings = m.warnings.map(warningText);
  const resolved = resolveUncertainty(input.uncertainty, m.quantity, m.grid.thetaDeg.length);
  let confidence: UnitResult['confidence'];
  if (resolved) {
    const assessed = assessConfidence({ grid: m.grid, beams: m.beams, quantity: m.quantity, tsp, metrics, limitSet: ls, judged, uncertainty: resolved });
    judged = assessed.judged;
    confidence = assessed.confidence;
    warnings.push(...gridCountWarnings(grid.points, grid.kind, m.quantity, input.uncertainty?.powerClass).map(warningText));
  }
  warnings.push(...limitSetMismatch(ls, m));
  return { judged, confidence, warnings };
}

/** What measureUnit computes before the optional analysis: metrics, verdict, grid summary and adequacy. */
interface MeasuredCore {
  computed: ReturnType<typeof computeMetrics>;
  grid: GridSummary;
  verdict: ReturnType<typeof verdictOf>;
  gridAdequacy: UnitResult['gridAdequacy'];
}

/**
 * What the limit set implies for this measurement's analysis, decided once (limits/impliedChoices.ts):
 * the CDF level of removal and subset, the analysis threshold as results.json records it, and the
 * percentile requirement behind coverageAtLevelLimit. Values come only from a limit set of the
 * measurement's own quantity (limitSetFor).
 */
interface UnitChoices {
  levelPct: number;
  threshold: AnalysisThreshold | null;
  levelLimit: LevelLimit | null;
}

function unitChoices(m: Measurement, input: MeasureOptions): UnitChoices {
  const own = limitSetFor(input.limitSet, m.quantity);
  return { levelPct: analysisLevel(input.limitSet), threshold: analysisThreshold(own, input.thresholds), levelLimit: percentileLimit(own) };
}

function measureCore(m: Measurement, input: MeasureOptions, choices: UnitChoices): MeasuredCore {
  const computed = computeMetrics(m, {
    percentilesPct: input.percentilesPct,
    thresholds: input.thresholds,
    relativeDb: input.relativeDb,
    levelLimit: choices.levelLimit,
  });
  const grid = gridSummary(m);
  const verdict = verdictOf(m, computed, grid, input);
  const adequacy = input.coreOnly !== true ? gridAdequacy(m.grid, computed.tsp.values, m.quantity, input.percentilesPct, input.thresholds, GRID_ADEQUACY_CALIBRATION, computed.cdf) : null;
  return { computed, grid, verdict, gridAdequacy: adequacy };
}

/** The optional analysis' inputs: the level and threshold the limit set implies (limits/impliedChoices.ts); null with --core-only. */
function insightRequest(m: Measurement, input: MeasureOptions, choices: UnitChoices): InsightRequest | null {
  if (input.coreOnly === true) return null;
  return {
    grid: m.grid, beams: m.beams.map((b) => b.values), ids: m.beams.map((b) => b.id), quantity: m.quantity,
    levelPct: choices.levelPct, threshold: choices.threshold?.value ?? null,
  };
}

/** The unit result, in results.json's key order. */
function unitResult(m: Measurement, input: MeasureOptions, choices: UnitChoices, core: MeasuredCore, insights: Insights | null): UnitResult {
  const { judged, confidence, warnings } = core.verdict;
  const ls = input.limitSet;
  const removal: (BeamRemoval | undefined)[] = insights ? insights.removal : m.beams.map(() => undefined);
  return {
    unit: m.unit,
    frequencyHz: m.frequencyHz,
    quantity: m.quantity,
    valueUnit: m.valueUnit,
    ...unitResultMetrics(core.computed.metrics, removal),
    checks: judged.checks,
    verdict: judged.verdict,
    worstCheck: judged.worstCheck,
    warnings,
    grid: core.grid,
    sources: m.sources,
    limitSet: ls ? { name: ls.name, source: ls.source } : null,
    analysisThreshold: choices.threshold,
    holes: insights ? insights.holes : [],
    subset: insights ? insights.subset : null,
    gridAdequacy: core.gridAdequacy,
    ...(confidence ? { confidence } : {}),
  };
}

/** Analyze one measurement (already assembled): metrics, verdict and the per-unit analysis, on this thread. */
export function measureUnit(m: Measurement, input: MeasureOptions): { result: UnitResult; tsp: TotalScanPattern } {
  const choices = unitChoices(m, input);
  const request = insightRequest(m, input, choices);
  const core = measureCore(m, input, choices);
  const insights = request ? computeInsights(request, core.computed.tsp) : null;
  return { result: unitResult(m, input, choices, core, insights), tsp: core.computed.tsp };
}

/**
 * measureUnit with the optional analysis on the insight lane (when there is one and the unit is
 * large enough) while this thread measures the rest; the same result (computeInsights either
 * way), computed here when the lane fails.
 */
async function measureUnitOnLanes(m: Measurement, input: MeasureOptions & Pick<TaskInput, 'report' | 'viewer'>, lane: InsightLane | null): Promise<{ result: UnitResult; tsp: TotalScanPattern }> {
  const choices = unitChoices(m, input);
  const request = insightRequest(m, input, choices);
  const sent = lane && request && InsightLane.worthIt(request) ? lane.request(request, { pack: input.viewer === true }) : null;
  // The lane packs the beams for viewer.html after the insights, while this thread draws the PDF.
  if (sent && input.viewer) lanePacks.set(m, sent.pack);
  const core = measureCore(m, input, choices);
  // Waiting for the lane, this thread would idle: the report modules (pdfkit and its fonts, about
  // 0.1 s) load meanwhile, when the unit's PDF will need them anyway.
  if (sent && input.report) void reportModules().catch(() => undefined);
  const insights = request ? ((sent ? await sent.insights : null) ?? computeInsights(request, core.computed.tsp)) : null;
  return { result: unitResult(m, input, choices, core, insights), tsp: core.computed.tsp };
}

/** Beams packed for viewer.html on the insight lane (measureUnitOnLanes), by measurement; null: pack them here. */
const lanePacks = new WeakMap<Measurement, Promise<PackedBeams | null>>();

let reportModulesLoading: Promise<[typeof import('../report/unitReport.js'), typeof import('../report/thumbnail.js'), typeof import('../report/cdfCurve.js')]> | null = null;

/**
 * The report modules (pdfkit, fonts), loaded once per thread and only when PDFs are wanted, so
 * --no-pdf stays lean: on the first unit's PDF (renderUnit), or earlier while this thread waits
 * for the insight lane (measureUnitOnLanes).
 */
function reportModules(): NonNullable<typeof reportModulesLoading> {
  return (reportModulesLoading ??= Promise.all([
    import('../report/unitReport.js'),
    import('../report/thumbnail.js'),
    import('../report/cdfCurve.js'),
  ]));
}

/** The report outputs of one measured unit: PDF, summary thumbnail and CDF curve (none with --no-pdf). */
export async function renderUnit(
  m: Measurement,
  result: UnitResult,
  tsp: TotalScanPattern,
  input: TaskInput,
  referenceDelta?: Float64Array,
  componentTsps?: ComponentTsp[],
  jointMaps?: JointMaps,
): Promise<UnitOutput> {
  if (!input.report) return { result, thumbnail: null, cdf: null, pdf: null };
  const [{ renderUnitPdf }, { unitMapThumbnail }, { cdfCurve }] = await reportModules();
  // One CDF curve per unit serves its PDF and the build summary's overlay.
  const cdf = cdfCurve(tsp.values, m.grid.weightSr, m.quantity);
  const buf = await renderUnitPdf(
    {
      result, measurement: m, tsp, generatedAt: input.generatedAt, toolVersion: input.toolVersion, referenceDelta, tspCdf: cdf,
      polarizationCdfs: componentTsps?.map((c) => ({ name: c.name, curve: cdfCurve(c.values, c.weightSr, m.quantity) })),
      testInfo: input.job?.testInfo,
      jointMaps,
    },
    input.report,
  );
  return {
    result,
    thumbnail: unitMapThumbnail(m, tsp, undefined, input.report.mapCenterPhiDeg),
    cdf,
    pdf: new Uint8Array(buf.buffer, buf.byteOffset, buf.byteLength),
  };
}

/** What reading a group's files gave. */
interface GroupRead {
  /** Beams of the units that every file read cleanly (none when a file gave no rows at all). */
  usable: RawBeam[];
  sources: SourceFile[];
  errors: InputError[];
  fileWarnings: Map<string, Warning[]>;
  /** Every unit named by any row of this group (readable or not), with its files. */
  seen: Map<string, Set<string>>;
  /** Each unit's name (NFC) → its spellings as written. */
  spellings: Map<string, Set<string>>;
}

/**
 * Read every file of a group. A file with errors fails its unit only: units named in its rows are
 * not analyzed (a unit judged on the beams that happened to be readable would look worse or
 * better than it is); a file that gave no rows at all fails the whole group (its unit is unknown,
 * and the group is a unit folder or one file stem).
 */
async function readGroup(input: TaskInput): Promise<GroupRead> {
  const read: GroupRead = { usable: [], sources: [], errors: [], fileWarnings: new Map(), seen: new Map(), spellings: new Map() };
  const beams: RawBeam[] = [];
  const failedUnits = new Set<string>();
  let groupFailed = false;
  const ctx = { inputRoot: input.inputRoot, job: input.job ?? undefined, quantityOverride: input.quantityOverride, readThreads: input.readThreads };
  for (const f of input.files) {
    const r = await readExportFile(f, ctx);
    nfcIdentity(r.beams, read.spellings); // the spellings as written go to results.json (unitAsWritten)
    read.sources.push({ path: r.file, sha256: r.sha256 });
    read.errors.push(...r.errors);
    read.fileWarnings.set(r.file, r.warnings);
    for (const b of r.beams) read.seen.set(b.unit, (read.seen.get(b.unit) ?? new Set()).add(r.file));
    if (r.errors.length > 0) {
      if (r.beams.length === 0) groupFailed = true;
      for (const b of r.beams) failedUnits.add(b.unit);
      continue;
    }
    beams.push(...r.beams);
  }
  read.usable = groupFailed ? [] : beams.filter((b) => !failedUnits.has(b.unit));
  return read;
}

/** A measurement with the warnings of its own files added (each once). */
function withFileWarnings(m: Measurement, read: GroupRead): Measurement {
  const own = new Set(read.usable.filter((b) => b.unit === m.unit && b.frequencyHz === m.frequencyHz).map((b) => b.file));
  const extra = [...own].sort().flatMap((f) => read.fileWarnings.get(f) ?? []);
  const known = new Set(m.warnings.map(warningText));
  return { ...m, warnings: collapseWarnings([...m.warnings, ...extra.filter((w) => !known.has(warningText(w)))]) };
}

/**
 * The outputs of one measured unit: its spellings as written, its deltas and difference map
 * against the reference at its frequency, its PDF and its viewer data.
 */
async function unitOutput(mu: MeasuredUnit, input: TaskInput, read: GroupRead, jointMaps: JointMaps | undefined): Promise<UnitOutput> {
  const { m, result, tsp, componentTsps } = mu;
  const written = [...(read.spellings.get(result.unit) ?? [])].sort();
  if (written.some((w) => w !== result.unit)) result.unitAsWritten = written;
  const self = m.unit === input.reference && !input.referenceExternal;
  const ref = self ? undefined : input.referencePatterns?.find((p) => p.frequencyHz === m.frequencyHz);
  let delta: Float64Array | undefined;
  if (ref && input.reference !== undefined && ref.result.quantity === result.quantity) {
    result.reference = { unit: input.reference, deltas: referenceDeltas(metricsOfUnit(result), metricsOfUnit(ref.result)) };
    delta = tspDifference(m.grid, tsp, ref.grid, ref.tsp);
  }
  const out = await renderUnit(m, result, tsp, input, delta, componentTsps, jointMaps);
  if (input.viewer) {
    const { packViewerUnit } = await import('../report/viewerPack.js');
    const lanePack = lanePacks.get(m);
    out.viewer = packViewerUnit(m, result, `${m.unit}@${m.frequencyHz ?? '-'}`, (lanePack ? await lanePack : null) ?? undefined);
  }
  return out;
}

/** Read, assemble and analyze every measurement of one group of files (readGroup says which units fail). */
export async function runTask(input: TaskInput): Promise<TaskOutput> {
  // Started before the read, so that the lane's start-up overlaps it.
  const lane = input.coreOnly ? null : InsightLane.open(input.spareThreads, input.files);
  try {
    return await analyzeGroup(input, lane);
  } finally {
    lane?.close();
  }
}

async function analyzeGroup(input: TaskInput, lane: InsightLane | null): Promise<TaskOutput> {
  const read = await readGroup(input);
  const { usable, errors } = read;
  const assembled = assembleMeasurements(usable, read.sources, { consumeRaw: true, mergeRule: input.job?.mergeRule });
  errors.push(...assembled.errors);
  // θ/φ pairs: the total (EIRP) or each polarization (EIS) carries the verdict.
  const planned = planPolarizations(assembled.measurements, input.eisPolarizations ?? 'each');
  errors.push(...planned.errors);
  const own = (m: Measurement): Measurement => withFileWarnings(m, read);
  const measured: MeasuredUnit[] = [];
  for (const p of planned.plans) {
    measured.push(await measurePlan(
      { ...p, main: own(p.main), components: p.rule === 'each' ? p.components.map(own) : p.components },
      input, (m) => measureUnitOnLanes(m, input, lane)));
  }
  // Extras across this group's own frequencies and against the reference, before the PDFs are drawn.
  // Checks joining two measurements of a unit (transmit + receive, two bands) once all are measured.
  const jointMaps = applyJointChecks(measured, input.limitSet);
  crossUnitExtras(measured.map((u) => u.result), undefined);
  const units: UnitOutput[] = [];
  for (const mu of measured) units.push(await unitOutput(mu, input, read, jointMaps.get(mu)));
  const referencePatterns = input.exportReference
    ? measured.filter((u) => input.exportAll || u.m.unit === input.reference).map((u) => ({ frequencyHz: u.m.frequencyHz, grid: u.m.grid, tsp: u.tsp, result: u.result }))
    : undefined;
  const leftover = [...read.fileWarnings.entries()].filter(([f]) => !usable.some((b) => b.file === f)).flatMap(([, w]) => w);
  const notAnalyzed = unitsNotAnalyzed(input.key, read.sources.map((s) => s.path), read.seen, usable, measured.map((u) => u.m), errors);
  return { key: input.key, units, notAnalyzed, errors, warnings: [...leftover, ...assembled.warnings], referencePatterns };
}

/**
 * The units of a group that produced no result, each with its first error: a unit named in the
 * rows of an unreadable file, a unit read but not assembled at a frequency, and — when no file
 * of the group named any unit — the group itself (a unit folder or file stem is its unit name).
 * The first error is the first (file, line) among the errors of the unit's own files, else the
 * group's first error.
 */
export function unitsNotAnalyzed(
  key: string,
  groupFiles: string[],
  seen: Map<string, Set<string>>,
  usable: RawBeam[],
  measured: Measurement[],
  errors: InputError[],
): UnitNotAnalyzed[] {
  if (errors.length === 0) return [];
  const sorted = [...errors].sort((a, b) => (a.file < b.file ? -1 : a.file > b.file ? 1 : (a.line ?? 0) - (b.line ?? 0)));
  const entry = (unit: string, frequencyHz: number | null, files: string[]): UnitNotAnalyzed => {
    const own = sorted.filter((e) => files.includes(e.file));
    const first = own[0] ?? sorted[0];
    return {
      unit, frequencyHz, verdict: 'error',
      error: { file: first.file, ...(first.line !== undefined ? { line: first.line } : {}), ...(first.column !== undefined ? { column: first.column } : {}), message: first.message },
      errorCount: own.length || sorted.length,
      files: [...files].sort(),
    };
  };
  const out: UnitNotAnalyzed[] = [];
  const analyzed = new Set(measured.map((m) => `${m.unit}\u0000${m.frequencyHz}`));
  const analyzedUnits = new Set(measured.map((m) => m.unit));
  if (seen.size === 0) return [entry(key, null, groupFiles)];
  // A file that named no unit (it failed before its first row) belongs to every unit of the group.
  const named = new Set([...seen.values()].flatMap((f) => [...f]));
  const orphans = groupFiles.filter((f) => !named.has(f));
  for (const [unit, files] of seen) {
    const parts = usable.filter((b) => b.unit === unit);
    if (parts.length === 0) {
      if (!analyzedUnits.has(unit)) out.push(entry(unit, null, [...files, ...orphans]));
      continue;
    }
    // Read, but some frequency could not be assembled (e.g. a beam on a grid too far away).
    const freqs = [...new Set(parts.map((b) => b.frequencyHz))];
    for (const f of freqs) {
      if (analyzed.has(`${unit}\u0000${f}`)) continue;
      out.push(entry(unit, f, [...new Set(parts.filter((b) => b.frequencyHz === f).map((b) => b.file))]));
    }
  }
  return out;
}

/**
 * runTask that never rejects: an unexpected exception (a defect, not an input problem) fails
 * this group only and is reported as an error entry, so the rest of the build is still written.
 */
export async function safeRunTask(input: TaskInput): Promise<TaskOutput> {
  try {
    return await runTask(input);
  } catch (e) {
    const message = e instanceof Error ? e.message : String(e);
    const error = { file: input.key, message: `could not analyze this group (internal error: ${message})` };
    return { key: input.key, units: [], notAnalyzed: [{ unit: input.key, frequencyHz: null, verdict: 'error', error, errorCount: 1, files: [] }], errors: [error], warnings: [] };
  }
}
