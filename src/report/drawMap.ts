import type { Rgb } from './colorMap.js';
import type { PageBox } from './pageBox.js';
import { fmt, stepDigits } from './format.js';
import { HAMMER_HALF_HEIGHT, HAMMER_HALF_WIDTH, hammerForward, hammerForwardLonLat } from './hammerProjection.js';
import { HATCH_PERIOD_PX } from './paintMap.js';
import { INK, MUTED, type Doc } from './pdfDoc.js';

/** Page rectangle holding the map ellipse (width = 2·height). */
export type MapBox = PageBox;

export function mapToPage(box: MapBox, mx: number, my: number): [number, number] {
  return [box.x + ((mx + HAMMER_HALF_WIDTH) / (2 * HAMMER_HALF_WIDTH)) * box.w, box.y + ((HAMMER_HALF_HEIGHT - my) / (2 * HAMMER_HALF_HEIGHT)) * box.h];
}

export function directionToPage(box: MapBox, thetaDeg: number, phiDeg: number, centerPhiDeg: number): [number, number] {
  const [mx, my] = hammerForward(thetaDeg, phiDeg, centerPhiDeg);
  return mapToPage(box, mx, my);
}

function polyline(doc: Doc, box: MapBox, pts: [number, number][]): void {
  pts.forEach(([lon, lat], k) => {
    const [px, py] = mapToPage(box, ...hammerForwardLonLat(lon, lat));
    if (k === 0) doc.moveTo(px, py);
    else doc.lineTo(px, py);
  });
}

/** The raster image, graticule (θ every 30°, φ every 30°), outline and θ/φ labels. */
export function drawMapFrame(doc: Doc, box: MapBox, png: Buffer | null, centerPhiDeg: number, labels = true): void {
  if (png) doc.image(png, box.x, box.y, { width: box.w, height: box.h });
  doc.save();
  doc.lineWidth(0.35).strokeColor('#ffffff').strokeOpacity(0.55);
  for (let theta = 30; theta < 180; theta += 30) {
    const lat = 90 - theta;
    polyline(doc, box, Array.from({ length: 73 }, (_, k) => [-180 + 5 * k, lat] as [number, number]));
  }
  for (let lon = -150; lon < 180; lon += 30) polyline(doc, box, Array.from({ length: 61 }, (_, k) => [lon, -90 + 3 * k] as [number, number]));
  doc.stroke();
  doc.strokeOpacity(1);
  doc.lineWidth(0.25).strokeColor('#000000').strokeOpacity(0.35).dash(1.2, { space: 1.8 });
  for (let theta = 30; theta < 180; theta += 30) polyline(doc, box, Array.from({ length: 73 }, (_, k) => [-180 + 5 * k, 90 - theta] as [number, number]));
  for (let lon = -150; lon < 180; lon += 30) polyline(doc, box, Array.from({ length: 61 }, (_, k) => [lon, -90 + 3 * k] as [number, number]));
  doc.stroke();
  doc.undash().strokeOpacity(1);
  doc.ellipse(box.x + box.w / 2, box.y + box.h / 2, box.w / 2, box.h / 2).lineWidth(0.8).strokeColor(INK).stroke();
  doc.restore();
  if (!labels) return;
  doc.font('R').fontSize(6.5).fillColor(MUTED);
  for (let theta = 30; theta < 180; theta += 30) {
    const [px, py] = mapToPage(box, ...hammerForwardLonLat(-180, 90 - theta));
    doc.text(`θ ${theta}°`, px - 34, py - 3.5, { width: 31, align: 'right', lineBreak: false });
  }
  const [tx, ty] = mapToPage(box, 0, HAMMER_HALF_HEIGHT);
  doc.text('θ 0°', tx - 20, ty - 9, { width: 40, align: 'center', lineBreak: false });
  const [bx, by] = mapToPage(box, 0, -HAMMER_HALF_HEIGHT);
  doc.text('θ 180°', bx - 20, by + 2, { width: 40, align: 'center', lineBreak: false });
  for (let lon = -120; lon <= 180; lon += 60) {
    const phi = (((lon + centerPhiDeg) % 360) + 360) % 360;
    const [px, py] = mapToPage(box, ...hammerForwardLonLat(lon === 180 ? 179.999 : lon, 0));
    const label = `φ ${fmt(phi, 0)}°`;
    if (lon === 180) {
      doc.text(label, px + 3, py - 3.5, { lineBreak: false });
      continue;
    }
    const w = doc.widthOfString(label) + 3;
    doc.save().rect(px - w / 2, py + 1.5, w, 8).fillOpacity(0.7).fill('#ffffff').restore();
    doc.fillColor(INK).text(label, px - w / 2, py + 2.2, { width: w, align: 'center', lineBreak: false });
    doc.fillColor(MUTED);
  }
  doc.fillColor(INK);
}

/** Region boundary runs from classBoundaries (pixel units), as vector lines over the map. */
export function drawBoundaries(doc: Doc, box: MapBox, seg: number[], rasterW: number, rasterH: number, color: string, width: number, halo = false): void {
  if (seg.length === 0) return;
  const sx = box.w / rasterW;
  const sy = box.h / rasterH;
  const path = () => {
    for (let k = 0; k < seg.length; k += 4) {
      doc.moveTo(box.x + seg[k] * sx, box.y + seg[k + 1] * sy).lineTo(box.x + seg[k + 2] * sx, box.y + seg[k + 3] * sy);
    }
  };
  doc.save().lineCap('square');
  if (halo) {
    path();
    doc.lineWidth(width + 1.2).strokeColor('#ffffff').stroke();
  }
  path();
  doc.lineWidth(width).strokeColor(color).stroke();
  doc.restore();
}

/** A text label with a white backing box, centred on (x, y). */
export function mapLabel(doc: Doc, text: string, x: number, y: number, size = 6.5, bold = true): void {
  doc.font(bold ? 'B' : 'R').fontSize(size);
  const w = doc.widthOfString(text) + 3;
  doc.save().rect(x - w / 2, y - size / 2 - 1.5, w, size + 3).fillOpacity(0.8).fill('#ffffff').restore();
  doc.fillColor(INK).text(text, x - w / 2, y - size / 2 - 0.5, { width: w, align: 'center', lineBreak: false });
  doc.font('R');
}

/**
 * Vertical colour bar: `colorAt(t)` for t = 0 (bottom) … 1 (top), value labels from the
 * mapping `valueAt(t)`, unit on top; `marks` are labelled lines across the bar.
 */
export function drawColorBar(
  doc: Doc,
  x: number,
  y: number,
  h: number,
  colorAt: (t: number) => Rgb,
  ticks: { t: number; value: number }[],
  step: number,
  unit: string,
  marks: { t: number; label: string }[] = [],
): void {
  const w = 10;
  const n = 96;
  for (let k = 0; k < n; k++) {
    const [r, g, b] = colorAt((k + 0.5) / n);
    doc.rect(x, y + h - ((k + 1) * h) / n, w, h / n + 0.3).fill([r, g, b]);
  }
  doc.rect(x, y, w, h).lineWidth(0.5).strokeColor(INK).stroke();
  doc.font('R').fontSize(6.8).fillColor(INK);
  const digits = stepDigits(step);
  for (const tk of ticks) {
    const ty = y + h - tk.t * h;
    doc.moveTo(x + w, ty).lineTo(x + w + 2.5, ty).lineWidth(0.5).stroke();
    doc.text(fmt(tk.value, digits), x + w + 4, ty - 3, { lineBreak: false });
  }
  doc.font('B').text(unit, x - 6, y - 11, { width: 40, lineBreak: false });
  for (const m of marks) {
    const my = y + h - m.t * h;
    doc.moveTo(x - 3, my).lineTo(x + w + 3, my).lineWidth(1.6).strokeColor('#ffffff').stroke();
    doc.moveTo(x - 3, my).lineTo(x + w + 3, my).lineWidth(0.8).strokeColor(INK).stroke();
    doc.font('R').fontSize(6).text(m.label, x - 28, my - 3, { width: 24, align: 'right', lineBreak: false });
  }
  doc.font('R').fontSize(9);
}

/** Legend swatch for unmeasured directions: grey with the same hatching as the raster. */
export function unmeasuredSwatch(doc: Doc, x: number, y: number, w: number, h: number): void {
  doc.save();
  doc.rect(x, y, w, h).fill('#e2e2e2');
  doc.rect(x, y, w, h).clip();
  const step = HATCH_PERIOD_PX * 0.5;
  for (let d = -h; d < w; d += step) doc.moveTo(x + d, y + h).lineTo(x + d + h, y);
  doc.lineWidth(0.7).strokeColor('#969696').stroke();
  doc.restore();
  doc.rect(x, y, w, h).lineWidth(0.4).strokeColor(INK).stroke();
}
