import type { PercentileValue, Quantity, CoveragePoint } from '../types.js';
import { clipTo, drawAxes, px, py, type Axes } from './axes.js';
import type { PageBox } from './pageBox.js';
import type { CdfCurve } from './cdfCurve.js';
import { fmt, niceRange, quantityLabel } from './format.js';
import { INK, MUTED, type Doc } from './pdfDoc.js';
import { atOrBetterText, isLowerBetter, worsenedBy } from '../quantity.js';


/** A limit drawn on the CDF: a vertical line at `value`, and a marker at its level when it has one. */
export interface LimitMark {
  label: string;
  value: number;
  levelPct?: number;
}

export interface CurveStyle {
  curve: CdfCurve;
  color: string;
  width: number;
  /** true: a plain dash; a pattern (on, off … points; [] solid) for curves told apart by style. */
  dash?: boolean | number[];
  label?: string;
}

/** y of a CDF point as drawn: the CDF for eirp/gain, the CCDF (1 − F) for eis. */
const drawnY = (q: Quantity, f: number) => (isLowerBetter(q) ? 1 - f : f);

function stepPath(doc: Doc, a: Axes, c: CdfCurve, q: Quantity): void {
  const n = c.values.length;
  if (n === 0) return;
  let y = drawnY(q, isLowerBetter(q) ? 0 : c.startFraction);
  doc.moveTo(a.x, py(a, y));
  for (let k = 0; k < n; k++) {
    const x = px(a, c.values[k]);
    doc.lineTo(x, py(a, y));
    y = drawnY(q, c.fractions[k]);
    doc.lineTo(x, py(a, y));
  }
  doc.lineTo(a.x + a.w, py(a, y));
}

/** The y-axis title saying exactly what is drawn. */
export function cdfAxisTitle(q: Quantity): string {
  return isLowerBetter(q) ? 'share of 4π with EIS above x (CCDF)' : `share of 4π with ${quantityLabel(q)} at or below x (CDF)`;
}

/**
 * The x range of a CDF plot: the main curves' values and the limits within half the data span of
 * them. A limit far from the data (a maximum EIRP of 43 dBm beside a 25 dBm pattern) would squash
 * the curve, so it is marked at the edge instead (drawLimitMarks).
 */
function cdfXRange(curves: CurveStyle[], limits: LimitMark[]): ReturnType<typeof niceRange> {
  let lo = Infinity;
  let hi = -Infinity;
  for (const c of curves.map((s) => s.curve)) {
    if (c.values.length === 0) continue;
    lo = Math.min(lo, c.values[0]);
    hi = Math.max(hi, c.values[c.values.length - 1]);
  }
  if (!Number.isFinite(lo)) {
    lo = 0;
    hi = 1;
  }
  const reach = 0.5 * Math.max(hi - lo, 1);
  for (const l of limits) {
    if (l.value < lo - reach || l.value > hi + reach) continue;
    lo = Math.min(lo, l.value);
    hi = Math.max(hi, l.value);
  }
  return niceRange(lo, hi, 8);
}

/** A small tag on a white ground (limit names on the plot). */
function tag(doc: Doc, text: string, x: number, y: number, alignRightAt?: number): void {
  doc.font('B').fontSize(6.2);
  const w = doc.widthOfString(text) + 3;
  const lx = alignRightAt !== undefined ? alignRightAt - w : x;
  doc.save().rect(lx, y - 1, w, 8).fillOpacity(0.85).fill('#ffffff').restore();
  doc.fillColor(INK).text(text, lx + 1.5, y, { lineBreak: false });
}

/** Limits: dashed vertical at the judged limit, a diamond at (limit, level) where the curve must pass, tags L1…. */
function drawLimitMarks(doc: Doc, a: Axes, q: Quantity, limits: LimitMark[]): void {
  limits.forEach((l, k) => {
    if (l.value < a.xMin || l.value > a.xMax) {
      // Off scale: its tag at the edge it lies beyond, with an arrow.
      const right = l.value > a.xMax;
      const ly = a.y + a.h - 12 - 9 * (k % 3);
      if (right) tag(doc, `L${k + 1} ${fmt(l.value, 1)} →`, 0, ly, a.x + a.w - 2);
      else tag(doc, `← L${k + 1} ${fmt(l.value, 1)}`, a.x + 2, ly);
      return;
    }
    const x = px(a, l.value);
    doc.moveTo(x, a.y).lineTo(x, a.y + a.h).dash(4, { space: 2 }).lineWidth(0.8).strokeColor(INK).stroke().undash();
    if (l.levelPct !== undefined) {
      const y = py(a, drawnY(q, l.levelPct / 100));
      doc.polygon([x, y - 3.5], [x + 3.5, y], [x, y + 3.5], [x - 3.5, y]).lineWidth(0.8).fillAndStroke('#ffffff', INK);
    }
    doc.font('B').fontSize(6.2);
    const w = doc.widthOfString(`L${k + 1}`) + 3;
    const ly = a.y + 3 + 9 * (k % 3);
    if (x + w + 4 > a.x + a.w) tag(doc, `L${k + 1}`, 0, ly, x - 2);
    else tag(doc, `L${k + 1}`, x + 2, ly);
  });
}

/** Percentile read-outs: dots on the TSP curve, numbered by level (labels that would collide are skipped). */
function drawPercentileDots(doc: Doc, a: Axes, q: Quantity, percentiles: PercentileValue[]): void {
  let lastX = -Infinity;
  let lastY = -Infinity;
  for (const p of percentiles) {
    if (p.value === null) continue;
    const x = px(a, p.value);
    const y = py(a, drawnY(q, p.levelPct / 100));
    doc.circle(x, y, 1.7).fill(INK);
    if (Math.abs(y - lastY) > 7 || Math.abs(x - lastX) > 18) {
      doc.font('R').fontSize(5.8).fillColor(MUTED).text(`${fmt(p.levelPct, 0)}`, x + 2.5, y - 7, { lineBreak: false });
      lastX = x;
      lastY = y;
    }
  }
}

/** One curve in its style: `dash` true is the plain dash, an array a dash pattern ([] solid). */
function strokeCurve(doc: Doc, a: Axes, q: Quantity, s: CurveStyle): void {
  stepPath(doc, a, s.curve, q);
  const pattern = Array.isArray(s.dash) ? s.dash : s.dash ? [2.5, 1.5] : [];
  // pdfkit takes an array as the whole pattern (its typings only name the number form).
  if (pattern.length) doc.dash(pattern as unknown as number, {});
  doc.lineWidth(s.width).strokeColor(s.color).stroke();
  doc.undash();
}

/**
 * Solid-angle-weighted CDF plot (CCDF for eis) of one or more curves, faint curves behind, limit
 * lines and percentile read-outs.
 */
export function drawCdfPlot(
  doc: Doc,
  box: PageBox,
  q: Quantity,
  unit: string,
  curves: CurveStyle[],
  faint: CdfCurve[],
  percentiles: PercentileValue[],
  limits: LimitMark[],
): void {
  const xr = cdfXRange(curves, limits);
  const a: Axes = { ...box, xMin: xr.lo, xMax: xr.hi, yMin: 0, yMax: 1 };
  drawAxes(doc, a, xr.ticks, xr.step, [0, 0.2, 0.4, 0.6, 0.8, 1], `${quantityLabel(q)} x (${unit})`, cdfAxisTitle(q), (v) => `${fmt(100 * v, 0)} %`);
  clipTo(doc, a);
  doc.lineWidth(0.35).strokeColor('#b8b8c4');
  for (const c of faint) stepPath(doc, a, c, q);
  if (faint.length) doc.stroke();
  for (const s of curves) strokeCurve(doc, a, q, s);
  drawLimitMarks(doc, a, q, limits);
  drawPercentileDots(doc, a, q, percentiles);
  doc.restore();
  doc.fillColor(INK).font('R').fontSize(9);
}

/**
 * Coverage efficiency versus absolute threshold (bottom axis) and dB from the TSP peak (top axis).
 * Markers at the requested thresholds.
 */
export function drawCoveragePlot(doc: Doc, box: PageBox, q: Quantity, unit: string, curve: CoveragePoint[], peak: number, marks: CoveragePoint[]): void {
  // x range: where the curve changes (0.1 % … 99.9 %), one point beyond, plus the marks.
  let first = curve.findIndex((c) => c.efficiency > 0.001 && c.efficiency < 0.999);
  let last = curve.length - 1 - [...curve].reverse().findIndex((c) => c.efficiency > 0.001 && c.efficiency < 0.999);
  if (first < 0) {
    first = 0;
    last = curve.length - 1;
  }
  const xs = curve.slice(Math.max(0, first - 1), Math.min(curve.length, last + 2)).map((c) => c.threshold);
  const xr = niceRange(Math.min(...xs, ...marks.map((m) => m.threshold)), Math.max(...xs, ...marks.map((m) => m.threshold)), 8);
  const a: Axes = { ...box, xMin: xr.lo, xMax: xr.hi, yMin: 0, yMax: 1 };
  const cmp = atOrBetterText(q).symbol;
  drawAxes(doc, a, xr.ticks, xr.step, [0, 0.2, 0.4, 0.6, 0.8, 1], `threshold t (${unit})`, `share of 4π with ${quantityLabel(q)} ${cmp} t`, (v) => `${fmt(100 * v, 0)} %`);
  // Top axis: distance from the peak in dB.
  const rel = niceRange(0, Math.abs(xr.hi - xr.lo), 7);
  doc.font('R').fontSize(6.5).fillColor(MUTED);
  for (const d of rel.ticks) {
    const t = worsenedBy(q, peak, d);
    if (t < xr.lo - 1e-9 || t > xr.hi + 1e-9) continue;
    const x = px(a, t);
    doc.moveTo(x, a.y).lineTo(x, a.y - 2.5).lineWidth(0.5).strokeColor(INK).stroke();
    doc.text(fmt(d, 0), x - 15, a.y - 10, { width: 30, align: 'center', lineBreak: false });
  }
  doc.text(isLowerBetter(q) ? 'dB above the best (lowest) EIS' : 'dB below the TSP peak', a.x, a.y - 20, { width: a.w, align: 'center', lineBreak: false });
  clipTo(doc, a);
  curve.forEach((c, k) => (k === 0 ? doc.moveTo(px(a, c.threshold), py(a, c.efficiency)) : doc.lineTo(px(a, c.threshold), py(a, c.efficiency))));
  doc.lineWidth(1.3).strokeColor(INK).stroke();
  for (const m of marks) {
    const x = px(a, m.threshold);
    const y = py(a, m.efficiency);
    doc.rect(x - 2, y - 2, 4, 4).lineWidth(0.7).fillAndStroke('#ffffff', INK);
  }
  doc.restore();
  doc.fillColor(INK).fontSize(9);
}
