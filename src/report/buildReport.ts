import type { UnitResult } from '../types.js';
import type { CdfCurve } from './cdfCurve.js';
import { colorAt, colorMapLut, lutIndex } from './colorMap.js';
import { drawColorBar, drawMapFrame, type MapBox } from './drawMap.js';
import { fmt, fmtFrequency, pct, quantityLabel, verdictText } from './format.js';
import { insideEllipse, OUTSIDE } from './mapRaster.js';
import { paintMapPng } from './paintMap.js';
import { addFooters, contentWidth, createDoc, ensureSpace, finish, heading, INK, keyValues, MARGIN, MUTED, note, table, type Column } from './pdfDoc.js';
import { drawCdfPlot, type CurveStyle } from './plots.js';
import { expectedConformingText } from '../analysis/uncertainty/confidenceColumns.js';
import { getKeyed, unitKey, type BuildReportInput, type MapThumbnail, type ReportSettings } from './reportTypes.js';
import { scaleT, valueScale } from './unitMaps.js';
import { cdfLimitMarks } from './unitReport.js';
import { isLowerBetter } from '../quantity.js';
import { errorLocation, errorMessage, verdictWord, worstMarginText } from './unitStatus.js';
import { formatMetric, metricLabel, statsMetricIndex } from '../metrics/catalogue.js';
import { testInfoBlock } from './sections/testInfoBlock.js';

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

const label = (u: UnitResult) => `${u.unit}${u.frequencyHz === null ? '' : ` @ ${fmtFrequency(u.frequencyHz)}`}`;


/** Below this many units a Cpk carries a small-sample caution (common process-capability practice asks for 30 or more). */
const SMALL_SAMPLE_N = 30;

/** Distinct limits over all units, for drawing once on the overlaid CDFs. */
function distinctLimits(units: UnitResult[]) {
  const seen = new Map<string, ReturnType<typeof cdfLimitMarks>[number]>();
  for (const u of units) for (const l of cdfLimitMarks(u.checks)) seen.set(`${l.label}|${l.levelPct ?? ''}`, l);
  return [...seen.values()];
}

/**
 * The build summary PDF: all units with verdicts and worst margins, per-metric statistics
 * (mean, σ, min, max, yield, Cpk), overlaid TSP CDFs with the limits, and a strip of TSP maps on
 * one colour scale. Deterministic for a fixed settings.creationDate (or generatedAt).
 */
export async function renderBuildPdf(input: BuildReportInput, settings: ReportSettings): Promise<Buffer> {
  const units = input.units;
  const q = units[0]?.quantity ?? 'eirp';
  const vu = units[0]?.valueUnit ?? 'dBm';
  const doc = createDoc(settings, input.generatedAt, `${settings.title}: build summary`, `Spherical coverage of ${units.length} unit results`);
  const w = contentWidth(doc);
  doc.font('B').fontSize(16).fillColor(INK).text(settings.title, MARGIN.left, MARGIN.top, { width: w });
  if (settings.organisation) doc.font('R').fontSize(9).fillColor(MUTED).text(settings.organisation, { width: w });
  doc.moveDown(0.3).font('B').fontSize(12.5).fillColor(INK).text('Build summary');
  doc.moveDown(0.3);
  const b = input.build;
  const notAnalyzed = input.unitsNotAnalyzed ?? [];
  const inBuild = b.unitsInBuild ?? b.units;
  const errored = b.errored ?? 0;
  const judged = b.passed + b.failed;
  const share = (n: number, d: number) => (d === 0 ? `${n} of 0` : `${n} of ${d} (${fmt((100 * n) / d, 1)} %)`);
  const partial = units.filter((u) => !u.grid.fullSphere).length;
  keyValues(doc, [
    ['Units in build', `${inBuild}: ${b.units} analyzed (${units.length} unit × frequency results)` + (errored ? `, ${errored} could not be read or analyzed` : '')],
    ['Verdicts', `${b.passed} passed, ${b.failed} failed, ${b.notJudged} not judged, ${errored} error` + (partial ? `; ${partial} result(s) on a partial sphere` : '')],
    ['Passed', `${share(b.passed, inBuild)} units in the build; ${share(b.passed, judged)} units judged`],
    ...(b.confidence ? [['How sure', expectedConformingText(b.confidence)] as [string, string]] : []), // issue 17
    ['Quantity', `${quantityLabel(q)} (${vu})`],
    ['Limit set', input.limitSetName ?? 'none (not judged)'],
    ['Generated', input.generatedAt],
    ['Tool', `spherecov ${input.toolVersion}`],
  ], MARGIN.left, w, 90);
  doc.moveDown(0.4);
  testInfoBlock(doc, input.testInfo);

  heading(doc, 'Units', 40);
  const cols: Column[] = [
    { header: 'Unit', width: w - 436 }, { header: 'Frequency', width: 62 }, { header: 'Verdict', width: 62 },
    { header: 'Passed', width: 48, align: 'right' }, { header: 'Worst check', width: 106 }, { header: 'Worst margin', width: 82, align: 'right' },
    { header: 'Sphere', width: 76 },
  ];
  type Row = { unit: string; f: number | null; cells: string[]; bold: boolean };
  const rows: Row[] = units.map((u) => ({
    unit: u.unit, f: u.frequencyHz, bold: u.verdict === 'fail',
    cells: [
      u.unit, fmtFrequency(u.frequencyHz), verdictWord(u.verdict),
      `${u.checks.filter((c) => c.status === 'pass').length} / ${u.checks.length}`, u.worstCheck?.name ?? '—', worstMarginText(u),
      u.grid.fullSphere ? 'full' : `partial: ${fmt((100 * u.solidAngleSr) / (4 * Math.PI), 1)} % measured`,
    ],
  }));
  for (const e of notAnalyzed) {
    rows.push({ unit: e.unit, f: e.frequencyHz, bold: true, cells: [e.unit, e.frequencyHz === null ? '—' : fmtFrequency(e.frequencyHz), 'ERROR', '—', `not analyzed: ${errorLocation(e.error)}`, '—', '—'] });
  }
  rows.sort((a, c) => (a.unit < c.unit ? -1 : a.unit > c.unit ? 1 : (a.f ?? -1) - (c.f ?? -1)));
  table(doc, cols, rows.map((r) => r.cells), { emphasis: (k) => rows[k].bold });
  for (const e of notAnalyzed) note(doc, `${e.unit} could not be read or analyzed: ${errorLocation(e.error)}: ${errorMessage(e.error)}` + (e.errorCount > 1 ? ` (${e.errorCount} errors in its files; all in results.json).` : '.'));
  note(doc, 'Verdict: PASS every check passed; FAIL a check failed; NOT JUDGED no limit set, or a check could not be evaluated; ERROR the unit could not be read or analyzed (it counts in the build, never as passed). Worst margin: dB, or percentage points (pt) of 4π for a coverage check.');

  heading(doc, 'Statistics per metric', 40);
  const scols: Column[] = [
    { header: 'Frequency', width: 62 }, { header: 'Metric', width: w - 392 }, { header: 'n', width: 26, align: 'right' },
    { header: 'Mean', width: 50, align: 'right' }, { header: 'σ', width: 46, align: 'right' }, { header: 'Min', width: 50, align: 'right' },
    { header: 'Max', width: 50, align: 'right' }, { header: 'Yield', width: 52, align: 'right' }, { header: 'Cpk', width: 56, align: 'right' },
  ];
  const metricOf = statsMetricIndex(units);
  table(doc, scols, b.stats.map((s) => {
    const m = metricOf.get(s.metric);
    const f = (v: number | null) => (m ? formatMetric(m, v) : fmt(v));
    const spread = m ? formatMetric(m, s.std, 'spread') : fmt(s.std);
    const yieldText = s.yield === null ? '—' : s.inBuild ? `${s.passedCount}/${s.inBuild} in build` : pct(s.yield, 0);
    const cpk = s.cpk === null ? '—' : `${fmt(s.cpk)}${s.count < SMALL_SAMPLE_N ? ' *' : ''}`;
    return [fmtFrequency(s.frequencyHz), m ? metricLabel(m, vu) : s.metric, `${s.count}`, f(s.mean), spread, f(s.min), f(s.max), yieldText, cpk];
  }), { fontSize: 7.2 });
  note(doc, 'σ: sample standard deviation (n − 1). Yield: units whose check passed / units in the build (a unit that could not be read counts as not passed). ' +
    'Cpk: min(mean − lower, upper − mean) / 3σ against the same limit as the yield and the verdict: the limit relaxed by the test tolerance ("judged at" in the unit reports). ' +
    `* fewer than ${SMALL_SAMPLE_N} units: a Cpk from a small sample is uncertain — with n = 10, a computed 1.33 has a one-sided 95 % lower confidence bound near 0.8 (Bissell's approximation, from memory); read it as an indication only. ` +
    'Shares of 4π in %, spreads of shares in percentage points; other values in the unit shown.');

  // Overlaid CDFs.
  const curves: CurveStyle[] = [];
  units.forEach((u) => {
    const c = getKeyed<CdfCurve>(input.cdfs, unitKey(u.unit, u.frequencyHz, u.quantity));
    if (c) curves.push({ curve: c, color: u.verdict === 'fail' ? INK : '#8a8a96', width: u.verdict === 'fail' ? 0.9 : 0.6, dash: u.verdict === 'fail' });
  });
  if (curves.length > 0) {
    doc.addPage();
    heading(doc, isLowerBetter(q) ? 'CCDF of every unit (EIS)' : `CDF of every unit (${quantityLabel(q)})`, 250);
    const box = { x: MARGIN.left + 44, y: doc.y + 6, w: w - 44 - 120, h: 220 };
    const limits = distinctLimits(units);
    drawCdfPlot(doc, box, q, vu, curves, [], [], limits);
    doc.y = box.y;
    doc.font('R').fontSize(7).fillColor(INK);
    limits.forEach((l, k) => doc.font('B').text(`L${k + 1} `, box.x + box.w + 12, doc.y, { continued: true, width: 106 }).font('R').text(`${l.label} ${vu}`));
    doc.y = Math.max(doc.y, box.y + box.h + 26);
    note(doc, 'Each line is one unit\'s total scan pattern over 4π (unmeasured solid angle counts as worst). Grey solid: not failed; black dashed: failed. Dashed verticals L1…: limits as judged.');
  }

  // Thumbnail strip on one colour scale.
  const thumbs = units.map((u) => ({ u, t: getKeyed(input.thumbnails, unitKey(u.unit, u.frequencyHz, u.quantity)) })).filter((x) => x.t);
  if (thumbs.length > 0) {
    let lo = Infinity;
    let hi = -Infinity;
    for (const { t } of thumbs) for (const v of t!.values) if (Number.isFinite(v)) {
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
    const sc = valueScale(Number.isFinite(lo) ? lo : 0, Number.isFinite(hi) ? hi : 1, q);
    heading(doc, 'Total scan pattern of every unit (one colour scale)', 120);
    const perRow = 3;
    const gap = 12;
    const tw = (w - 60 - gap * (perRow - 1)) / perRow;
    const th = tw / 2;
    const top = doc.y;
    let y = top;
    thumbs.forEach(({ u, t }, k) => {
      const col = k % perRow;
      if (col === 0 && k > 0) y += th + 26;
      if (y + th + 24 > doc.page.height - MARGIN.bottom) {
        doc.addPage();
        y = MARGIN.top;
      }
      const box: MapBox = { x: MARGIN.left + col * (tw + gap), y: y + 12, w: tw, h: th };
      const png = thumbnailPng(t!, (v) => lutIndex(scaleT(sc, v)), colorMapLut(settings.colorMap));
      drawMapFrame(doc, box, png, t!.centerPhiDeg, false);
      doc.font(u.verdict === 'fail' ? 'B' : 'R').fontSize(7.5).fillColor(INK).text(`${label(u)} · ${verdictText(u.verdict)}`, box.x, y, { width: tw, lineBreak: false, ellipsis: true });
    });
    const barY = top + 14;
    drawColorBar(doc, MARGIN.left + w - 34, barY, Math.min(160, y + th + 12 - barY), (t) => colorAt(settings.colorMap, t), sc.ticks.map((v) => ({ t: scaleT(sc, v), value: v })), sc.step, vu);
    doc.y = Math.max(y + th + 22, barY + 170);
    ensureSpace(doc, 30);
    note(doc, 'Hammer equal-area maps (area ∝ solid angle), centre θ = 90°, top θ = 0°; hatched grey: not measured. One colour scale for all units, brightest = best.');
  }
  addFooters(doc, 'Build summary');
  return finish(doc);
}
