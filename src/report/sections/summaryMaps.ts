import { colorAt, colorMapLut, lutIndex } from '../colorMap.js';
import { drawColorBar, drawMapFrame, type MapBox } from '../drawMap.js';
import { fmtFrequencyShort, verdictText } from '../format.js';
import { insideEllipse, OUTSIDE } from '../mapRaster.js';
import { paintMapPng } from '../paintMap.js';
import { contentWidth, ensureSpace, heading, INK, MARGIN, note, oneLine, type Doc } from '../pdfDoc.js';
import type { MapThumbnail, ReportSettings } from '../reportTypes.js';
import { scaleT, type ValueScale } from '../valueScale.js';
import type { QuantityGroup } from '../buildReportModel.js';
import { quantityLabel } from '../../quantity.js';

/** A thumbnail's pixels painted with one colour scale (each pixel is its own "point"). */
function thumbnailPng(t: MapThumbnail, entry: (v: number) => number, table: Uint8Array): Buffer {
  const { width, height, values } = t;
  const point = new Int32Array(width * height);
  const colors = new Int16Array(width * height);
  for (let k = 0; k < point.length; k++) {
    point[k] = insideEllipse(k % width, Math.floor(k / width), width, height) ? k : OUTSIDE;
    colors[k] = Number.isFinite(values[k]) ? entry(values[k]) : -1;
  }
  return paintMapPng(width, height, point, colors, table);
}

const PER_ROW = 3;
const GAP = 12;

/**
 * Every unit's TSP map of one quantity, three a row, on one colour scale; each titled with its row
 * number, unit, frequency and verdict. `mixed`: the build has other quantities (named in the heading).
 */
export function summaryMaps(doc: Doc, group: QuantityGroup, s: ReportSettings, mixed: boolean): void {
  const sc = group.thumbnailScale;
  if (!sc || group.thumbnails.length === 0) return;
  heading(doc, `Total scan pattern of every unit (${mixed ? `${quantityLabel(group.quantity)}, ` : ''}one colour scale)`, 120);
  const w = contentWidth(doc);
  const tw = (w - 60 - GAP * (PER_ROW - 1)) / PER_ROW;
  const th = tw / 2;
  const top = doc.y;
  let y = top;
  const lut = colorMapLut(s.colorMap);
  group.thumbnails.forEach(({ row, thumbnail: t }, k) => {
    const col = k % PER_ROW;
    if (col === 0 && k > 0) y += th + 26;
    if (y + th + 24 > doc.page.height - MARGIN.bottom) {
      doc.addPage();
      y = MARGIN.top;
    }
    const box: MapBox = { x: MARGIN.left + col * (tw + GAP), y: y + 12, w: tw, h: th };
    drawMapFrame(doc, box, thumbnailPng(t, (v) => lutIndex(scaleT(sc, v)), lut), t.centerPhiDeg, false);
    const u = row.result;
    const f = u.frequencyHz === null ? '' : ` @ ${fmtFrequencyShort(u.frequencyHz)}`;
    doc.font(u.verdict === 'fail' ? 'B' : 'R').fontSize(7.5).fillColor(INK);
    oneLine(doc, `${row.number}  ${u.unit}${f} · ${verdictText(u.verdict)}`, box.x, y, tw); // the heading names the quantity
  });
  const barH = Math.min(160, y + th + 12 - (top + 14));
  colorBar(doc, sc, s, top + 14, barH, group.valueUnit);
  doc.y = Math.max(y + th + 22, top + 14 + barH + 12);
  ensureSpace(doc, 30);
  note(doc, 'Hammer equal-area maps (area ∝ solid angle), centre θ = 90°, top θ = 0°; hatched grey: not measured. One colour scale for all units, brightest = best. The number is the row in the units table.');
}

function colorBar(doc: Doc, sc: ValueScale, s: ReportSettings, y: number, h: number, unit: string): void {
  drawColorBar(doc, MARGIN.left + contentWidth(doc) - 34, y, h, (t) => colorAt(s.colorMap, t), sc.ticks.map((v) => ({ t: scaleT(sc, v), value: v })), sc.step, unit);
}
