import { isLowerBetter } from '../../quantity.js';
import { fmtFrequencyShort, quantityLabel, verdictText } from '../format.js';
import { contentWidth, ensureSpace, heading, INK, MARGIN, note, oneLine, type Doc } from '../pdfDoc.js';
import { drawCdfPlot } from '../plots.js';
import { DISTINCT_LINE_STYLES } from '../lineStyles.js';
import type { QuantityGroup, SummaryCurve } from '../buildReportModel.js';

const LEGEND_ROW_PT = 10.5;

/** One legend entry: the row number of the units table, a sample of the line, unit · frequency, and the verdict in a right-aligned slot. */
function legendEntry(doc: Doc, c: SummaryCurve, x: number, y: number, width: number, verdictW: number): void {
  const u = c.row.result;
  const failed = u.verdict === 'fail';
  doc.font('B').fontSize(7).fillColor(INK);
  oneLine(doc, `${c.row.number}`, x, y, 13, 'right');
  doc.moveTo(x + 16, y + 3.5).lineTo(x + 35, y + 3.5);
  if (c.dash.length) doc.dash(c.dash as unknown as number, {}); // pdfkit takes an array as the whole pattern
  doc.lineWidth(failed ? 1.3 : 0.9).strokeColor(c.color).stroke().undash();
  const f = u.frequencyHz === null ? '' : ` · ${fmtFrequencyShort(u.frequencyHz)}`;
  doc.font(failed ? 'B' : 'R').fontSize(7).fillColor(INK);
  oneLine(doc, `${c.row.name}${f}`, x + 39, y, width - 39 - verdictW - 6);
  oneLine(doc, verdictText(u.verdict), x + width - verdictW - 4, y, verdictW, 'right');
}

/** The key under the plot, row by row (so a long build breaks cleanly onto the next page). */
function legend(doc: Doc, curves: SummaryCurve[]): void {
  const w = contentWidth(doc);
  const cols = curves.length > 45 ? 4 : 3;
  const cw = w / cols;
  // The verdict slot fits the longest verdict word of this key (NOT JUDGED is the longest), in bold.
  doc.font('B').fontSize(7);
  const verdictW = Math.max(...curves.map((c) => doc.widthOfString(verdictText(c.row.result.verdict)))) + 2;
  for (let k = 0; k < curves.length; k += cols) {
    ensureSpace(doc, LEGEND_ROW_PT + 2);
    const y = doc.y;
    curves.slice(k, k + cols).forEach((c, j) => legendEntry(doc, c, MARGIN.left + j * cw, y, cw, verdictW));
    doc.y = y + LEGEND_ROW_PT;
  }
  doc.y += 4;
}

/**
 * Every unit's TSP CDF (CCDF for EIS) of one quantity on one plot with their distinct limits; each
 * curve has its own colour and dash pattern, and the key below names it by its row number in the
 * units table.
 */
export function summaryCdfOverlay(doc: Doc, group: QuantityGroup): void {
  const { quantity: q, valueUnit: vu, curves, limits } = group;
  if (curves.length === 0) return;
  doc.addPage();
  heading(doc, isLowerBetter(q) ? `CCDF of every unit (${quantityLabel(q)})` : `CDF of every unit (${quantityLabel(q)})`, 250);
  const w = contentWidth(doc);
  const box = { x: MARGIN.left + 44, y: doc.y + 6, w: w - 44 - 120, h: 220 };
  drawCdfPlot(doc, box, q, vu, curves.map((c) => ({ curve: c.curve, color: c.color, dash: c.dash, width: c.row.result.verdict === 'fail' ? 1.3 : 0.9 })), [], [], limits);
  doc.y = box.y;
  doc.font('R').fontSize(7).fillColor(INK);
  limits.forEach((l, k) => doc.font('B').text(`L${k + 1} `, box.x + box.w + 12, doc.y, { continued: true, width: 106 }).font('R').text(`${l.label} ${vu}`));
  doc.y = Math.max(doc.y, box.y + box.h + 26);
  legend(doc, curves);
  note(doc, 'Each line is one unit\'s total scan pattern over 4π (unmeasured solid angle counts as worst); the number is the unit\'s row in the units table, a thicker line and bold entry a failed unit. ' +
    `Dashed verticals L1…: limits as judged.${curves.length > DISTINCT_LINE_STYLES ? ` Line styles repeat after ${DISTINCT_LINE_STYLES} units.` : ''}`);
}
