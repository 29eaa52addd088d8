import type { UnitResult } from '../../types.js';
import { formatMetric, metricLabel } from '../../metrics/catalogue.js';
import { drawAxes, px, py, type Axes } from '../axes.js';
import { fmt, fmtFrequency, niceRange } from '../format.js';
import { contentWidth, heading, INK, MARGIN, note, type Doc } from '../pdfDoc.js';
import { table } from '../pdfDoc.js';
import type { TrendModel, UnitReportModel } from '../unitReportModel.js';

type Trend = NonNullable<UnitResult['frequencyTrend']>;
const DASHES = [[], [4, 2], [1.2, 1.6]];

/** Stroke the current path in the i-th line style. */
function strokeStyled(doc: Doc, i: number): void {
  const d = DASHES[i % DASHES.length];
  if (d.length) doc.dash(d[0], { space: d[1] });
  doc.lineWidth(1.1).strokeColor(INK).stroke().undash();
}

/** The trend's drawn metrics against frequency, one line each (markers at the measured frequencies), keyed on the right. */
function trendPlot(doc: Doc, trend: Trend, lines: TrendModel['lines'], unit: string): void {
  const vals = trend.flatMap((t) => lines.map((l) => t[l.key] as number | null)).filter((v): v is number => v !== null);
  if (vals.length === 0 || trend.length < 2) return;
  const fs = trend.map((t) => t.frequencyHz / 1e9);
  const xr = niceRange(Math.min(...fs), Math.max(...fs), 6);
  const yr = niceRange(Math.min(...vals), Math.max(...vals), 6);
  const box = { x: MARGIN.left + 44, y: doc.y + 4, w: contentWidth(doc) - 200, h: 130 };
  const a: Axes = { ...box, xMin: xr.lo, xMax: xr.hi, yMin: yr.lo, yMax: yr.hi };
  drawAxes(doc, a, xr.ticks, xr.step, yr.ticks, 'frequency (GHz)', unit, (v) => fmt(v, 1));
  lines.forEach((l, i) => {
    const pts = trend.map((t) => [px(a, t.frequencyHz / 1e9), t[l.key] as number | null] as const).filter((p): p is readonly [number, number] => p[1] !== null);
    pts.forEach(([x, v], j) => (j === 0 ? doc.moveTo(x, py(a, v)) : doc.lineTo(x, py(a, v))));
    strokeStyled(doc, i);
    for (const [x, v] of pts) doc.circle(x, py(a, v), 1.8).fill(INK);
    const ly = box.y + 8 + i * 14;
    const lx = box.x + box.w + 14;
    doc.moveTo(lx, ly + 3).lineTo(lx + 22, ly + 3);
    strokeStyled(doc, i);
    doc.font('R').fontSize(7.2).fillColor(INK).text(metricLabel(l.metric, unit), lx + 26, ly, { width: 120, lineBreak: false });
  });
  doc.y = box.y + box.h + 28;
  doc.fontSize(9);
}

/** Beam pointing across the band: the largest drift and the beams over the flag angle. */
function driftNote(doc: Doc, r: UnitResult): void {
  const drift = r.pointingDrift;
  if (!drift || drift.length === 0) return;
  const worst = drift.reduce((a, b) => (b.driftDeg > a.driftDeg ? b : a));
  const flagged = drift.filter((d) => d.flagged);
  note(doc, `Beam pointing across the band (main-lobe centroid within 3 dB of each beam's peak, compared between frequencies): ` +
    `largest drift ${fmt(worst.driftDeg, 1)}° (beam ${worst.beam}); ` +
    (flagged.length ? `drifting more than the flag angle: ${flagged.map((d) => `${d.beam} (${fmt(d.driftDeg, 1)}°)`).join(', ')}.` : 'no beam drifts more than the flag angle (5°).'));
}

/** Metrics versus frequency: a plot of the main ones, the table of all, and the pointing drift. */
export function trendSection(doc: Doc, model: UnitReportModel): void {
  const r = model.result;
  const trend = r.frequencyTrend;
  if (!trend || !model.trend) return;
  heading(doc, 'Metrics versus frequency', 200);
  trendPlot(doc, trend, model.trend.lines, r.valueUnit);
  const w = contentWidth(doc);
  const fw = Math.min(80, (w - 190) / trend.length);
  table(doc, [{ header: 'Metric', width: w - fw * trend.length }, ...trend.map((t) => ({ header: fmtFrequency(t.frequencyHz), width: fw, align: 'right' as const }))],
    model.trend.rows.map(({ metric, key }) => [metricLabel(metric, r.valueUnit), ...trend.map((t) => formatMetric(metric, t[key] as number | null))]), { fontSize: 7.2 });
  driftNote(doc, r);
}
