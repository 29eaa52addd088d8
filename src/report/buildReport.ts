import { addFooters, createDoc, finish } from './pdfDoc.js';
import type { BuildReportInput, ReportSettings } from './reportTypes.js';
import { buildSummaryModel } from './buildReportModel.js';
import { summaryHeader } from './sections/summaryHeader.js';
import { summaryUnits } from './sections/summaryUnits.js';
import { summaryStatistics } from './sections/summaryStatistics.js';
import { summaryCdfOverlay } from './sections/summaryCdfOverlay.js';
import { summaryMaps } from './sections/summaryMaps.js';

/**
 * The build summary PDF: all units (numbered) with verdicts and worst margins, per-metric
 * statistics (mean, σ, min, max, yield, Cpk), overlaid TSP CDFs with the limits and a key to the
 * units table, and a strip of TSP maps on one colour scale. Everything drawn is computed first
 * (buildSummaryModel); the sections only lay it out. Deterministic for a fixed
 * settings.creationDate (or generatedAt).
 */
export async function renderBuildPdf(input: BuildReportInput, settings: ReportSettings): Promise<Buffer> {
  const model = buildSummaryModel(input);
  const doc = createDoc(settings, input.generatedAt, `${settings.title}: build summary`, `Spherical coverage of ${input.units.length} unit results`);
  summaryHeader(doc, input, model, settings);
  summaryUnits(doc, model.rows);
  summaryStatistics(doc, input.build, input.units);
  for (const g of model.groups) summaryCdfOverlay(doc, g);
  for (const g of model.groups) summaryMaps(doc, g, settings, model.groups.length > 1);
  addFooters(doc, 'Build summary');
  return finish(doc);
}
