import { atOrBetterText } from '../../quantity.js';
import { colorAt } from '../colorMap.js';
import { directionToPage, drawBoundaries, drawColorBar, drawMapFrame, mapLabel, unmeasuredSwatch, type MapBox } from '../drawMap.js';
import { fmt } from '../format.js';
import { heading, INK, MARGIN, note, type Doc } from '../pdfDoc.js';
import type { ReportSettings } from '../reportTypes.js';
import { thresholdSourceText } from '../thresholdText.js';
import type { UnitMaps } from '../unitMaps.js';
import { scaleT } from '../valueScale.js';
import type { UnitReportModel } from '../unitReportModel.js';
import { clearOfPhiLabels, mapBoxFor } from './mapBox.js';

/** The TSP peak's marker (a white triangle). */
function peakMarker(doc: Doc, x: number, y: number): void {
  doc.polygon([x, y - 4], [x + 3.6, y + 2.4], [x - 3.6, y + 2.4]).lineWidth(0.7).fillAndStroke('#ffffff', INK);
}

/** The map's colour bar, with the contour threshold marked when it is on the scale. */
function tspColorBar(doc: Doc, box: MapBox, maps: UnitMaps, s: ReportSettings, threshold: number | null, unit: string): void {
  const sc = maps.scale;
  const marks = threshold !== null && threshold >= sc.lo && threshold <= sc.hi ? [{ t: scaleT(sc, threshold), label: 'contour' }] : [];
  drawColorBar(doc, box.x + box.w + 26, box.y + 6, box.h - 12, (t) => colorAt(s.colorMap, t), sc.ticks.map((v) => ({ t: scaleT(sc, v), value: v })), sc.step, unit, marks);
}

/**
 * The total scan pattern on an equal-area map with the contour at the analysis threshold, the
 * listed holes (H1…) and the peak; the caption states the threshold and where it comes from, read
 * from the unit's recorded analysisThreshold.
 */
export function tspMapSection(doc: Doc, model: UnitReportModel, maps: UnitMaps, s: ReportSettings): void {
  const { result: r, threshold } = model;
  heading(doc, 'Total scan pattern over the sphere', 260);
  const box = mapBoxFor(doc, 215);
  drawMapFrame(doc, box, maps.tspPng, s.mapCenterPhiDeg);
  if (maps.contour) drawBoundaries(doc, box, maps.contour, maps.raster.width, maps.raster.height, INK, 0.9, true);
  const holes = s.sections.holes ? model.holes.listed : [];
  holes.forEach((h, k) => {
    const [x, y] = directionToPage(box, h.thetaDeg, h.phiDeg, s.mapCenterPhiDeg);
    mapLabel(doc, `H${k + 1}`, x, clearOfPhiLabels(box, y), 6);
  });
  peakMarker(doc, ...directionToPage(box, r.tsp.peak.thetaDeg, r.tsp.peak.phiDeg, s.mapCenterPhiDeg));
  tspColorBar(doc, box, maps, s, threshold, r.valueUnit);
  doc.y = box.y + box.h + 14;
  const ly = doc.y;
  unmeasuredSwatch(doc, MARGIN.left, ly, 14, 8);
  doc.font('R').fontSize(7.5).fillColor(INK).text('not measured', MARGIN.left + 18, ly, { lineBreak: false });
  peakMarker(doc, MARGIN.left + 86, ly + 4);
  doc.fillColor(INK).text(`TSP peak ${fmt(r.tsp.peak.value)} ${r.valueUnit} at θ ${fmt(r.tsp.peak.thetaDeg, 1)}°, φ ${fmt(r.tsp.peak.phiDeg, 1)}°`, MARGIN.left + 95, ly, { lineBreak: false });
  doc.y = ly + 13;
  note(doc, `Hammer equal-area projection: area on the page is proportional to solid angle. Centre φ = ${fmt(s.mapCenterPhiDeg, 0)}°, θ = 90°; top θ = 0° (+z). ` +
    (threshold !== null ? `Black line with white edge: contour at ${fmt(threshold)} ${r.valueUnit} (inside: ${atOrBetterText(r.quantity).words}), the same threshold the coverage holes are found at (${thresholdSourceText(r.analysisThreshold)}). ` : '') +
    (holes.length ? 'H1… mark the coverage holes listed below. ' : '') + 'Graticule every 30° in θ and φ. Brightest = best.');
}
