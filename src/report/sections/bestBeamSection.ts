import type { UnitResult } from '../../types.js';
import { directionToPage, drawBoundaries, drawMapFrame, mapLabel, unmeasuredSwatch, type MapBox } from '../drawMap.js';
import { pct } from '../format.js';
import { contentWidth, heading, INK, MARGIN, note, oneLine, type Doc } from '../pdfDoc.js';
import type { ReportSettings } from '../reportTypes.js';
import { beamColor, type UnitMaps } from '../unitMaps.js';
import type { UnitReportModel } from '../unitReportModel.js';
import { clearOfPhiLabels, mapBoxFor } from './mapBox.js';

const neverBest = (b: UnitResult['beams'][number] | undefined): boolean => (b?.bestShare ?? 0) === 0 || b?.neverBest === true;

/** Each labelled beam's id at its strongest point in its region, kept clear of the φ labels just below the equator. */
function regionLabels(doc: Doc, box: MapBox, model: UnitReportModel, centerPhiDeg: number): void {
  for (const l of model.beamLabels) {
    const [x, y] = directionToPage(box, l.thetaDeg, l.phiDeg, centerPhiDeg);
    mapLabel(doc, l.id, x, clearOfPhiLabels(box, y), 6);
  }
}

/** The colour key: one swatch per beam with its best share (or "never best" in bold), continuing on the next page if needed. */
function beamKey(doc: Doc, r: UnitResult): void {
  const w = contentWidth(doc);
  const perRow = r.beams.length > 32 ? 8 : 6;
  const cw = w / perRow;
  let y = doc.y;
  r.beams.forEach((b, k) => {
    const col = k % perRow;
    if (col === 0 && k > 0) y += 11;
    if (y > doc.page.height - MARGIN.bottom - 12) {
      doc.addPage();
      y = MARGIN.top;
    }
    const x = MARGIN.left + col * cw;
    doc.rect(x, y, 9, 7.5).fill(beamColor(k));
    doc.rect(x, y, 9, 7.5).lineWidth(0.3).strokeColor(INK).stroke();
    doc.font(neverBest(b) ? 'B' : 'R').fontSize(7).fillColor(INK);
    oneLine(doc, `${b.id} ${neverBest(b) ? 'never best' : pct(b.bestShare, 1)}`, x + 12, y, cw - 14);
  });
  doc.y = y + 14;
}

/** Which beam is best in each direction (colours repeat every 12 beams), labelled, with the colour key. */
export function bestBeamSection(doc: Doc, model: UnitReportModel, maps: UnitMaps, s: ReportSettings): void {
  const r = model.result;
  heading(doc, 'Best beam per direction', 300);
  const box = mapBoxFor(doc, 215);
  drawMapFrame(doc, box, maps.bestPng, s.mapCenterPhiDeg);
  drawBoundaries(doc, box, maps.bestEdges, maps.raster.width, maps.raster.height, '#2a2a2a', 0.35);
  regionLabels(doc, box, model, s.mapCenterPhiDeg);
  doc.y = box.y + box.h + 14;
  beamKey(doc, r);
  unmeasuredSwatch(doc, MARGIN.left, doc.y, 14, 8);
  doc.font('R').fontSize(7.5).text('not measured', MARGIN.left + 18, doc.y, { lineBreak: false });
  doc.y += 12;
  const never = r.beams.filter((b) => neverBest(b)).map((b) => b.id);
  note(doc, 'Colours repeat every 12 beams; labels give the beam id where that beam is strongest in its region; thin lines separate regions. ' +
    (never.length ? `Never best (no share of the total scan pattern): ${never.join(', ')}.` : 'Every beam is best somewhere.'));
}
