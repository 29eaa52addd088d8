import { fmt, niceRange, stepDigits } from './format.js';
import { INK, MUTED, type Doc } from './pdfDoc.js';
import type { PageBox } from './pageBox.js';

/** A plot frame mapping data to page coordinates. */
export interface Axes extends PageBox {
  xMin: number;
  xMax: number;
  yMin: number;
  yMax: number;
}

export const px = (a: Axes, v: number) => a.x + ((v - a.xMin) / (a.xMax - a.xMin)) * a.w;
export const py = (a: Axes, v: number) => a.y + a.h - ((v - a.yMin) / (a.yMax - a.yMin)) * a.h;

/** Frame, light grid, ticks and axis titles. `yFormat` prints y tick labels. */
export function drawAxes(
  doc: Doc,
  a: Axes,
  xTicks: number[],
  xStep: number,
  yTicks: number[],
  xTitle: string,
  yTitle: string,
  yFormat: (v: number) => string,
): void {
  doc.save().lineWidth(0.3).strokeColor('#d4d4d4');
  for (const t of xTicks) doc.moveTo(px(a, t), a.y).lineTo(px(a, t), a.y + a.h);
  for (const t of yTicks) doc.moveTo(a.x, py(a, t)).lineTo(a.x + a.w, py(a, t));
  doc.stroke().restore();
  doc.rect(a.x, a.y, a.w, a.h).lineWidth(0.6).strokeColor(INK).stroke();
  doc.font('R').fontSize(6.8).fillColor(INK);
  const xd = stepDigits(xStep);
  for (const t of xTicks) doc.text(fmt(t, xd), px(a, t) - 20, a.y + a.h + 3, { width: 40, align: 'center', lineBreak: false });
  for (const t of yTicks) doc.text(yFormat(t), a.x - 34, py(a, t) - 3, { width: 31, align: 'right', lineBreak: false });
  doc.fontSize(7.5).fillColor(MUTED);
  doc.text(xTitle, a.x, a.y + a.h + 13, { width: a.w, align: 'center', lineBreak: false });
  doc.save().rotate(-90, { origin: [a.x - 38, a.y + a.h / 2] });
  doc.text(yTitle, a.x - 38 - a.h / 2, a.y + a.h / 2 - 8, { width: a.h, align: 'center', lineBreak: false });
  doc.restore();
  doc.fillColor(INK).fontSize(9);
}

/** Clip further drawing to the plot area (pair with doc.restore()). */
export function clipTo(doc: Doc, a: Axes): void {
  doc.save();
  doc.rect(a.x, a.y, a.w, a.h).clip();
}

export { niceRange };
