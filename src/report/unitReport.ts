import type { UnitResult } from '../types.js';
import { fmtFrequency } from './format.js';
import { addFooters, createDoc, finish, type Doc } from './pdfDoc.js';
import type { ReportSettings, UnitReportInput } from './reportTypes.js';
import { buildUnitReportModel, type UnitReportModel } from './unitReportModel.js';
import { titleBlock } from './sections/titleBlock.js';
import { verdictBlock } from './sections/verdictBlock.js';
import { checksSection } from './sections/checksSection.js';
import { filesSection } from './sections/filesSection.js';
import { tspMapSection } from './sections/tspMapSection.js';
import { cdfSection } from './sections/cdfSection.js';
import { bestBeamSection } from './sections/bestBeamSection.js';
import { coverageSection } from './sections/coverageSection.js';
import { beamsSection } from './sections/beamsSection.js';
import { holesSection } from './sections/holesSection.js';
import { referenceSection } from './sections/referenceSection.js';
import { trendSection } from './sections/trendSection.js';
import { qualitySection } from './sections/qualitySection.js';
import { polarizationSection } from './polarizationSection.js';
import { jointSection } from './jointSection.js';
import { confidencePage } from './confidencePage.js';

export { contourThreshold } from './unitReportModel.js';

export const unitLabel = (r: UnitResult) => `${r.unit}${r.frequencyHz === null ? '' : ` · ${fmtFrequency(r.frequencyHz)}`}`;

/** Pages 1–3: the verdict first, then the maps, the CDF, the coverage curve and the parts only some units have. */
function mainPages(doc: Doc, input: UnitReportInput, model: UnitReportModel, s: ReportSettings): void {
  const r = model.result;
  const sec = s.sections;
  titleBlock(doc, input, s);
  verdictBlock(doc, r);
  if (sec.checks) checksSection(doc, r);
  if (sec.inputFiles) filesSection(doc, r);
  if (sec.tspMap && model.maps) {
    doc.addPage();
    tspMapSection(doc, model, model.maps, s);
  }
  if (sec.cdf) cdfSection(doc, model);
  if (sec.bestBeamMap && model.maps) {
    doc.addPage();
    bestBeamSection(doc, model, model.maps, s);
  }
  if (sec.coverage) coverageSection(doc, model);
  if (r.polarizations?.length) polarizationSection(doc, { ...input, tspCdf: model.tspCurve });
  if (r.beamCorrespondence || r.interBand) jointSection(doc, input, s);
  if (r.confidence || r.gridAdequacy) {
    doc.addPage();
    confidencePage(doc, r, model.tspCurve); // "How sure is this verdict" (src/report/confidencePage.ts)
  }
}

/** The last pages: beams, holes, the reference difference, the frequency trend and data quality. */
function detailPages(doc: Doc, model: UnitReportModel, s: ReportSettings): void {
  const sec = s.sections;
  doc.addPage();
  if (sec.beams) beamsSection(doc, model.result);
  if (sec.holes) holesSection(doc, model);
  if (sec.reference && model.maps) referenceSection(doc, model, model.maps, s);
  if (sec.frequencyTrend) trendSection(doc, model);
  if (sec.quality) qualitySection(doc, model.result, model.typedWarnings);
}

/**
 * One unit's PDF: verdict and checks first, then the sphere maps, CDF, coverage curve, beams,
 * optional analysis (holes, reference, frequency trend) and data quality; footer on every page.
 * Everything drawn is computed first (buildUnitReportModel: maps, curves, labels, folded holes,
 * trend rows); the sections in src/report/sections/ only lay the finished numbers out.
 * Deterministic for a fixed settings.creationDate (or generatedAt).
 */
export async function renderUnitPdf(input: UnitReportInput, settings: ReportSettings): Promise<Buffer> {
  const r = input.result;
  const model = buildUnitReportModel(input, settings);
  const doc = createDoc(settings, input.generatedAt, `${settings.title}: ${r.unit}`, `Spherical coverage of ${unitLabel(r)}`);
  mainPages(doc, input, model, settings);
  detailPages(doc, model, settings);
  addFooters(doc, `Unit ${unitLabel(r)}`);
  return finish(doc);
}
