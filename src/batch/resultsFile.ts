/**
 * results.json of a run, assembled from the groups' outputs: units in a deterministic order, the
 * units not analyzed, every input error, the cross-unit extras (reference deltas, frequency
 * trend), the build statistics and the run's settings.
 */
import path from 'node:path';
import type { InputError, ResultsFile, UnitNotAnalyzed, UnitResult } from '../types.js';
import { buildStatistics } from '../limits/buildStatistics.js';
import { buildConfidence } from '../analysis/uncertainty/buildConfidence.js';
import { byCodePoint, toPosix } from './discover.js';
import { warningText, type TaskOutput, type UnitOutput } from './unitTask.js';
import { crossUnitExtras } from './crossUnit.js';
import { TOOL_VERSION } from './version.js';
import type { AnalyzePlan } from './analyzePlan.js';

/** The results of a run, with the unit outputs (PDFs, thumbnails, viewer data) in the same order as results.units. */
export interface AssembledResults {
  results: ResultsFile;
  unitOutputs: UnitOutput[];
  /** The reference named no analyzed unit (a plain-words problem), else null. */
  referenceProblem: string | null;
}

/** Deterministic output order: unit (code point), then frequency ascending, no frequency first. */
export function compareUnits(a: UnitResult, b: UnitResult): number {
  const u = byCodePoint(a.unit, b.unit);
  if (u !== 0) return u;
  if (a.frequencyHz === b.frequencyHz) return 0;
  if (a.frequencyHz === null) return -1;
  if (b.frequencyHz === null) return 1;
  return a.frequencyHz - b.frequencyHz;
}

/** Every group's output joined into results.json (the reference as finally known: a golden folder's unit once measured). */
export function assembleResults(plan: AnalyzePlan, analyzed: { outputs: TaskOutput[]; reference: string | undefined }): AssembledResults {
  const { outputs, reference } = analyzed;
  const unitOutputs = outputs.flatMap((o) => o.units).sort((a, b) => compareUnits(a.result, b.result));
  const units = unitOutputs.map((u) => u.result);
  const notAnalyzed: UnitNotAnalyzed[] = outputs.flatMap((o) => o.notAnalyzed ?? []);
  notAnalyzed.sort((a, b) => byCodePoint(a.unit, b.unit) || (a.frequencyHz ?? -1) - (b.frequencyHz ?? -1));
  const errors: InputError[] = [...plan.discovery.problems, ...outputs.flatMap((o) => o.errors)];
  errors.sort((a, b) => byCodePoint(a.file, b.file) || (a.line ?? 0) - (b.line ?? 0) || (a.column ?? 0) - (b.column ?? 0));
  const referenceProblem = crossUnitExtras(units, reference, plan.reference.folder !== null);
  const build = units.length + notAnalyzed.length > 0 ? buildStatistics(units, notAnalyzed) : null;
  const sure = buildConfidence(units); // issue 17: only when the units carry a measurement uncertainty
  if (build && sure) build.confidence = sure;
  const warnings = [...plan.configNotices, ...outputs.flatMap((o) => o.warnings).map(warningText), ...(referenceProblem ? [referenceProblem] : [])];
  const results: ResultsFile = {
    schemaVersion: 1,
    tool: { name: 'spherecov', version: TOOL_VERSION },
    generatedAt: plan.output.generatedAt,
    testInfo: plan.job?.testInfo ?? null,
    settings: runSettings(plan, reference, warnings),
    units,
    unitsNotAnalyzed: notAnalyzed,
    build,
    errors,
  };
  return { results, unitOutputs, referenceProblem };
}

/** results.json `settings`: what the run was asked, and what it decided (limit set, reference, skipped links). */
function runSettings(plan: AnalyzePlan, reference: string | undefined, warnings: string[]): ResultsFile['settings'] {
  const { opts, metrics, limitSet, job, uncertainty, output } = plan;
  return {
    input: toPosix(path.basename(plan.input)),
    percentilesPct: metrics.percentilesPct,
    coverageThresholds: metrics.thresholds,
    relativeDb: metrics.relativeDb,
    limits: limitSet ? { name: limitSet.name, source: limitSet.source } : null,
    quantityOverride: opts.quantity ?? null,
    eisPolarizations: opts.eisPolarizations ?? 'each',
    jobFile: job ? path.basename(job.source) : null,
    reference: reference ?? null,
    ...(uncertainty ? { uncertainty } : {}),
    referenceFolder: plan.reference.folder === null ? null : toPosix(plan.reference.given as string),
    pdf: output.pdf,
    pageSize: output.pageSize,
    skippedLinks: plan.discovery.skippedLinks.map(toPosix),
    warnings,
  };
}
