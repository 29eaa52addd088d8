import { atOrBetterText, betterByDb } from '../../quantity.js';
import { fmt, pct } from '../format.js';
import { contentWidth, heading, MARGIN, note, table, type Doc } from '../pdfDoc.js';
import { drawCoveragePlot } from '../plots.js';
import type { UnitReportModel } from '../unitReportModel.js';

/** Coverage efficiency against the threshold, with the requested thresholds (absolute and relative to the peak) marked and listed. */
export function coverageSection(doc: Doc, model: UnitReportModel): void {
  const r = model.result;
  const peak = r.tsp.peak.value;
  heading(doc, 'Coverage efficiency versus threshold', 230);
  const w = contentWidth(doc);
  const box = { x: MARGIN.left + 44, y: doc.y + 26, w: w - 44 - 160, h: 170 };
  drawCoveragePlot(doc, box, r.quantity, r.valueUnit, model.coverageCurve, peak, [...r.tsp.coverage, ...r.tsp.relativeCoverage]);
  doc.y = box.y - 20;
  const rows = [
    // dB from the peak: how much worse the threshold is than the TSP's best value.
    ...r.tsp.coverage.map((c) => [fmt(c.threshold), fmt(betterByDb(r.quantity, peak, c.threshold), 1), pct(c.efficiency)]),
    ...r.tsp.relativeCoverage.map((c) => [fmt(c.threshold), fmt(c.dbBelowPeak, 1), pct(c.efficiency)]),
  ];
  table(doc, [{ header: `t (${r.valueUnit})`, width: 46, align: 'right' }, { header: 'from peak', width: 54, align: 'right' }, { header: 'share', width: 44, align: 'right' }], rows, { fontSize: 7.2, x: box.x + box.w + 12 });
  doc.y = Math.max(doc.y, box.y + box.h + 28);
  note(doc, `Share of 4π where the total scan pattern is ${atOrBetterText(r.quantity).words} the threshold. Squares: the thresholds requested (absolute, and relative to the peak ${fmt(peak)} ${r.valueUnit}), listed in the table.`);
}
