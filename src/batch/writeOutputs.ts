/**
 * Writing a run's outputs into the locked output folder, through the run's writer (temporary file
 * + rename): the unit PDFs (spooled while the analysis ran), summary.pdf, summary.csv,
 * build-stats.csv, viewer.html, and results.json last, so its presence marks a finished run.
 */
import type { UnitResult } from '../types.js';
import { buildStatistics } from '../limits/buildStatistics.js';
import { unitKey, type MapThumbnail, type ReportSettings } from '../report/reportTypes.js';
import type { CdfCurve } from '../report/cdfCurve.js';
import { InterruptedError } from './errors.js';
import type { ReferencePattern, UnitOutput } from './unitTask.js';
import { summaryCsv, buildStatsCsv } from './summaryCsv.js';
import { frequencyToken, uniqueStems } from './sanitize.js';
import { TOOL_VERSION } from './version.js';
import type { AssembledResults } from './resultsFile.js';
import type { OutputWriter } from './outputDir.js';
import type { AnalyzePlan } from './analyzePlan.js';

/** What writing needs of a run: its plan, its writer, its stop signal and the PDFs spooled meanwhile. */
export interface OutputRun {
  plan: AnalyzePlan;
  writer: OutputWriter;
  signal: AbortSignal | undefined;
  /** Unit PDFs already spooled to temporary files as their tasks finished. */
  spooled: Map<UnitOutput, string>;
}

/**
 * Write every output; results.json last.
 * @returns the files written, in the order the console names them (results.json, the CSVs, the
 *   PDFs, viewer.html), and the text of results.json (for --json)
 */
export async function writeOutputs(run: OutputRun, assembled: AssembledResults, referencePatterns: ReferencePattern[] | undefined): Promise<{ files: string[]; json: string }> {
  const { results } = assembled;
  const { output, limitSet, metrics } = run.plan;
  const write = async (name: string, data: string | Uint8Array): Promise<void> => {
    if (run.signal?.aborted === true) throw new InterruptedError('stop');
    await run.writer.write(name, data);
  };
  // No results.json while files are being replaced: a run killed here cannot look finished.
  await run.writer.discard('results.json');
  const pdfNames = output.pdf ? await writeUnitPdfs(run, assembled.unitOutputs, write) : [];
  if (output.pdf) await write('summary.pdf', await summaryPdf(run, assembled));
  await write('summary.csv', summaryCsv(results.units, results.unitsNotAnalyzed));
  await write('build-stats.csv', buildStatsCsv(results.build));
  if (output.viewer) {
    const { renderViewerHtml } = await import('../report/viewerHtml.js');
    const { analysisLevel, holeThreshold } = await import('./unitTask.js');
    await write('viewer.html', await renderViewerHtml({
      results, packed: assembled.unitOutputs.map((u) => u.viewer ?? null), limitSet,
      removalLevelPct: analysisLevel(limitSet), holeThreshold: holeThreshold(limitSet, metrics.thresholds),
      colorMap: output.report?.colorMap ?? 'lumen', mapCenterPhiDeg: output.report?.mapCenterPhiDeg ?? 0,
      golden: run.plan.reference.folder !== null ? referencePatterns : undefined,
    }));
  }
  const json = JSON.stringify(results, null, 2) + '\n';
  // results.json last: its presence (with this run's generatedAt) marks a finished run.
  await write('results.json', json);
  await run.writer.finish();
  const files = ['results.json', 'summary.csv', 'build-stats.csv', ...(output.pdf ? ['summary.pdf', ...pdfNames] : []), ...(output.viewer ? ['viewer.html'] : [])];
  return { files, json };
}

/** File stem of each unit's PDF: unit, frequency, and the quantity of a receive report whose unit was also measured transmitting. */
export function pdfStems(units: UnitResult[]): string[] {
  // A unit measured both ways (EIRP and EIS at one frequency) gets the quantity in its receive report's name.
  const twin = (u: UnitResult): boolean => units.some((v) => v !== u && v.unit === u.unit && v.frequencyHz === u.frequencyHz && v.quantity !== u.quantity);
  return uniqueStems(units.map((u) => `${u.frequencyHz === null ? u.unit : `${u.unit}_${frequencyToken(u.frequencyHz)}`}${twin(u) && u.quantity !== 'eirp' ? `_${u.quantity}` : ''}`));
}

/** The unit PDFs: spooled ones renamed into place, the rest written. */
async function writeUnitPdfs(run: OutputRun, unitOutputs: UnitOutput[], write: (name: string, data: Uint8Array) => Promise<void>): Promise<string[]> {
  const stems = pdfStems(unitOutputs.map((u) => u.result));
  const names: string[] = [];
  for (let i = 0; i < unitOutputs.length; i++) {
    const file = run.spooled.get(unitOutputs[i]);
    if (run.signal?.aborted === true) throw new InterruptedError('stop');
    const bytes = unitOutputs[i].pdf;
    if (file) await run.writer.commit(file, `${stems[i]}.pdf`);
    else if (bytes) await write(`${stems[i]}.pdf`, bytes);
    if (file || bytes) names.push(`${stems[i]}.pdf`);
  }
  return names;
}

/** The build summary PDF: every unit's verdict, map thumbnail and CDF. */
async function summaryPdf(run: OutputRun, assembled: AssembledResults): Promise<Uint8Array> {
  const { results, unitOutputs } = assembled;
  const thumbnails: Record<string, MapThumbnail> = {};
  const cdfs: Record<string, CdfCurve> = {};
  for (const u of unitOutputs) {
    const k = unitKey(u.result.unit, u.result.frequencyHz, u.result.quantity);
    if (u.thumbnail) thumbnails[k] = u.thumbnail;
    if (u.cdf) cdfs[k] = u.cdf;
  }
  const { renderBuildPdf } = await import('../report/buildReport.js');
  return renderBuildPdf(
    {
      units: results.units,
      unitsNotAnalyzed: results.unitsNotAnalyzed,
      thumbnails,
      cdfs,
      build: results.build ?? buildStatistics([]),
      generatedAt: results.generatedAt,
      toolVersion: TOOL_VERSION,
      limitSetName: run.plan.limitSet?.name ?? null,
      testInfo: run.plan.job?.testInfo,
    },
    run.plan.output.report as ReportSettings,
  );
}
