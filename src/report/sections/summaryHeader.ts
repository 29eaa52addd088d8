import { expectedConformingText } from '../../analysis/uncertainty/confidenceColumns.js';
import { fmt, quantityLabel } from '../format.js';
import { contentWidth, INK, keyValues, MARGIN, MUTED, type Doc } from '../pdfDoc.js';
import type { BuildReportInput, ReportSettings } from '../reportTypes.js';
import type { SummaryModel } from '../buildReportModel.js';
import { testInfoBlock } from './testInfoBlock.js';

const share = (n: number, d: number) => (d === 0 ? `${n} of 0` : `${n} of ${d} (${fmt((100 * n) / d, 1)} %)`);

/**
 * Page 1 of summary.pdf: title, the build's counts with their denominators (units in the build,
 * units judged), quantity, limit set, run facts and the job file's test metadata.
 */
export function summaryHeader(doc: Doc, input: BuildReportInput, model: SummaryModel, s: ReportSettings): void {
  const w = contentWidth(doc);
  doc.font('B').fontSize(16).fillColor(INK).text(s.title, MARGIN.left, MARGIN.top, { width: w });
  if (s.organisation) doc.font('R').fontSize(9).fillColor(MUTED).text(s.organisation, { width: w });
  doc.moveDown(0.3).font('B').fontSize(12.5).fillColor(INK).text('Build summary');
  doc.moveDown(0.3);
  const b = input.build;
  const inBuild = b.unitsInBuild ?? b.units;
  const errored = b.errored ?? 0;
  const partial = input.units.filter((u) => !u.grid.fullSphere).length;
  keyValues(doc, [
    ['Units in build', `${inBuild}: ${b.units} analyzed (${input.units.length} unit × frequency results)` + (errored ? `, ${errored} could not be read or analyzed` : '')],
    ['Verdicts', `${b.passed} passed, ${b.failed} failed, ${b.notJudged} not judged, ${errored} error` + (partial ? `; ${partial} result(s) on a partial sphere` : '')],
    ['Passed', `${share(b.passed, inBuild)} units in the build; ${share(b.passed, b.passed + b.failed)} units judged`],
    ...(b.confidence ? [['How sure', expectedConformingText(b.confidence)] as [string, string]] : []), // issue 17
    ['Quantity', model.groups.map((g) => `${quantityLabel(g.quantity)} (${g.valueUnit})`).join(', ')],
    ['Limit set', input.limitSetName ?? 'none (not judged)'],
    ['Generated', input.generatedAt],
    ['Tool', `spherecov ${input.toolVersion}`],
  ], MARGIN.left, w, 90);
  doc.moveDown(0.4);
  testInfoBlock(doc, input.testInfo);
}
