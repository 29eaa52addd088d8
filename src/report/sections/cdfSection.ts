import { isLowerBetter } from '../../quantity.js';
import { fmt, quantityLabel } from '../format.js';
import { contentWidth, heading, INK, MARGIN, note, table, type Doc } from '../pdfDoc.js';
import { drawCdfPlot } from '../plots.js';
import type { UnitReportModel } from '../unitReportModel.js';

/** What the curve shows, in words: the CDF for eirp/gain, the CCDF for eis (src/quantity.ts decides which is better). */
function cdfCaption(model: UnitReportModel): string {
  const q = model.result.quantity;
  const what = isLowerBetter(q)
    ? `Drawn as the CCDF: the share of the whole sphere (4π) where the total scan pattern ${quantityLabel(q)} is above x (worse); unmeasured solid angle counts as worst (always above). A percentile p is where this curve crosses 1 − p.`
    : 'Share of the whole sphere (4π) where the total scan pattern is at or below x; unmeasured solid angle counts as worst (it starts the curve above 0).';
  return what + ' Dots: percentile read-outs (numbers = level). Dashed verticals L1…: limits as judged (tolerance applied), listed beside the plot; a diamond marks the level a percentile limit applies to.' +
    (model.beamCurves.length ? ' Faint lines: each beam alone.' : '');
}

/** The TSP's CDF (CCDF for eis) with each beam faintly behind, the percentile table and the limits beside it. */
export function cdfSection(doc: Doc, model: UnitReportModel): void {
  const r = model.result;
  const q = r.quantity;
  heading(doc, `${isLowerBetter(q) ? 'CCDF' : 'CDF'} of the total scan pattern (${quantityLabel(q)})`, 230);
  const w = contentWidth(doc);
  const box = { x: MARGIN.left + 44, y: doc.y + 6, w: w - 44 - 120, h: 190 };
  drawCdfPlot(doc, box, q, r.valueUnit, [{ curve: model.tspCurve, color: INK, width: 1.4 }], model.beamCurves, r.tsp.percentiles, model.cdfLimits);
  doc.y = box.y;
  table(doc, [{ header: 'Level', width: 44, align: 'right' }, { header: `Value (${r.valueUnit})`, width: 62, align: 'right' }],
    r.tsp.percentiles.map((p) => [`${fmt(p.levelPct, p.levelPct % 1 === 0 ? 0 : 1)} %`, fmt(p.value)]), { fontSize: 7.4, x: box.x + box.w + 12 });
  doc.font('R').fontSize(7).fillColor(INK);
  model.cdfLimits.forEach((l, k) => {
    doc.font('B').text(`L${k + 1} `, box.x + box.w + 12, doc.y, { continued: true, width: 106 }).font('R').text(`${l.label} ${r.valueUnit}`);
  });
  doc.y = Math.max(doc.y, box.y + box.h + 26);
  note(doc, cdfCaption(model));
}
