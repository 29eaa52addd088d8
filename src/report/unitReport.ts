import { existsSync } from 'node:fs';
import type { CheckResult, UnitResult } from '../types.js';
import { WARNINGS } from '../warnings.js';
import { regionText } from '../sphere/gridWarnings.js';
import { cdfCurve, type CdfCurve } from './cdfCurve.js';
import { colorAt, divergingAt } from './colorMap.js';
import { directionToPage, drawBoundaries, drawColorBar, drawMapFrame, mapLabel, unmeasuredSwatch, type MapBox } from './drawMap.js';
import { fmt, fmtFrequency, niceRange, pct, quantityLabel, verdictText } from './format.js';
import { addFooters, contentWidth, createDoc, ensureSpace, finish, heading, INK, keyValues, MARGIN, MUTED, note, table, type Column, type Doc } from './pdfDoc.js';
import { drawCdfPlot, drawCoveragePlot } from './plots.js';
import type { ReportSettings, UnitReportInput } from './reportTypes.js';
import { beamColor, buildUnitMaps, DELTA_OUTLINE_DB, scaleT, type UnitMaps } from './unitMaps.js';
import { drawAxes, px, py, type Axes } from './axes.js';
import { formatMetric, metricLabel, metricsOfUnit, rowKey, rowMetrics, type MetricInstance } from '../metrics/catalogue.js';
import { polarizationSection } from './polarizationSection.js';
import { jointSection } from './jointSection.js';
import { confidencePage } from './confidencePage.js';
import { cdfLimitMarks } from './cdfLimitMarks.js';
import { testInfoBlock } from './sections/testInfoBlock.js';
import { thresholdSourceText } from './thresholdText.js';

const PERCENTILE_RULE =
  'step rule: the smallest value whose solid-angle-weighted CDF over 4π reaches p; unmeasured solid angle counts as worst';

/**
 * Holes smaller than this share of 4π are folded into one count instead of being listed: 0.1 % of
 * 4π is about 12.6 msr (≈ 41 square degrees), under two cells of a 5° grid at the equator
 * (7.6 msr each), i.e. at the edge of what the grid can resolve as a region (our choice).
 */
export const SMALL_HOLE_SHARE = 0.001;

/** The holes listed (and labelled H1… on the map), and the count and share of the folded small ones. */
export function listedHoles(r: UnitResult): { listed: NonNullable<UnitResult['holes']>; small: number; smallShare: number } {
  const all = r.holes ?? [];
  const listed = all.filter((h) => h.solidAngleSr / (4 * Math.PI) >= SMALL_HOLE_SHARE);
  const rest = all.filter((h) => h.solidAngleSr / (4 * Math.PI) < SMALL_HOLE_SHARE);
  return { listed, small: rest.length, smallShare: rest.reduce((a, h) => a + h.solidAngleSr, 0) / (4 * Math.PI) };
}

export const unitLabel = (r: UnitResult) => `${r.unit}${r.frequencyHz === null ? '' : ` · ${fmtFrequency(r.frequencyHz)}`}`;

/**
 * The coverage threshold drawn as the map contour: the unit's analysis threshold (the one its holes
 * were found at, src/limits/impliedChoices.ts); for a result without one (written by an older
 * version), a coverage check's, else the first requested.
 */
export function contourThreshold(r: UnitResult): number | null {
  if (r.analysisThreshold !== undefined) return r.analysisThreshold?.value ?? null;
  const c = r.checks.find((k) => k.kind === 'min-coverage' && k.threshold !== undefined);
  return c?.threshold ?? r.tsp.coverage[0]?.threshold ?? null;
}

function checkValue(c: CheckResult, v: number | null, unit: string): string {
  if (v === null) return '—';
  return c.marginUnit === 'fraction' || c.kind === 'min-coverage' ? pct(v) : `${fmt(v)} ${unit}`;
}

function resultText(c: CheckResult): string {
  return c.status === 'pass' ? '✓ pass' : c.status === 'fail' ? '✗ FAIL' : 'not evaluable';
}

function titleBlock(doc: Doc, input: UnitReportInput, s: ReportSettings): void {
  const r = input.result;
  const w = contentWidth(doc);
  // The batch hands the logo over as a data URL (read once, checked at the trust boundary).
  if (s.logo && (s.logo.startsWith('data:image/') || existsSync(s.logo))) {
    try {
      doc.image(s.logo, MARGIN.left + w - 90, MARGIN.top - 6, { fit: [90, 36], align: 'right' });
    } catch {
      // An unreadable logo must not cost the report; the title block still names the organisation.
    }
  }
  doc.font('B').fontSize(16).fillColor(INK).text(s.title, MARGIN.left, MARGIN.top, { width: w - 100 });
  if (s.organisation) doc.font('R').fontSize(9).fillColor(MUTED).text(s.organisation, { width: w - 100 });
  doc.moveDown(0.3);
  doc.font('B').fontSize(12.5).fillColor(INK).text(`Unit ${r.unit}`, { continued: true }).font('R').text(`   ${fmtFrequency(r.frequencyHz)} · ${quantityLabel(r.quantity)} in ${r.valueUnit}`);
  doc.moveDown(0.4);
  const y0 = doc.y;
  const half = (w - 16) / 2;
  keyValues(doc, [
    ['Unit', r.unit],
    ['Frequency', fmtFrequency(r.frequencyHz)],
    ['Quantity', `${quantityLabel(r.quantity)} (${r.valueUnit})`],
    ['Limit set', r.limitSet ? r.limitSet.name : 'none (not judged)'],
    ['Generated', input.generatedAt],
    ['Tool', `spherecov ${input.toolVersion}`],
  ], MARGIN.left, half, 74);
  const yLeft = doc.y;
  doc.y = y0;
  const g = r.grid;
  const steps = g.thetaStepDeg !== null && g.phiStepDeg !== null ? `, Δθ ${fmt(g.thetaStepDeg, 2)}° × Δφ ${fmt(g.phiStepDeg, 2)}°` : '';
  keyValues(doc, [
    ['Percentile rule', PERCENTILE_RULE],
    ['Grid', `${g.kind}, ${g.points} points${steps}`],
    ['Reference Ω', '4π sr (12.566 sr): every share is of the whole sphere'],
    ['Measured Ω', `${fmt(r.solidAngleSr, 3)} sr (${pct(r.solidAngleSr / (4 * Math.PI))} of 4π)`],
    ['Beams', `${r.beams.length}`],
  ], MARGIN.left + half + 16, half, 78);
  doc.y = Math.max(yLeft, doc.y) + 4;
  testInfoBlock(doc, input.testInfo);
}

function verdictBlock(doc: Doc, r: UnitResult): void {
  ensureSpace(doc, 60);
  const w = contentWidth(doc);
  const y = doc.y + 2;
  const fill = r.verdict === 'pass' ? '#dcebdc' : r.verdict === 'fail' ? '#f3d6d6' : '#e8e8e8';
  doc.rect(MARGIN.left, y, w, 40).fill(fill);
  doc.rect(MARGIN.left, y, 5, 40).fill(INK);
  const mark = r.verdict === 'pass' ? '✓' : r.verdict === 'fail' ? '✗' : '–';
  doc.font('B').fontSize(20).fillColor(INK).text(`${mark} ${verdictText(r.verdict)}`, MARGIN.left + 14, y + 10, { lineBreak: false });
  const passed = r.checks.filter((c) => c.status === 'pass').length;
  const failed = r.checks.filter((c) => c.status === 'fail').length;
  const open = r.checks.length - passed - failed;
  const line1 = r.checks.length === 0 ? 'No limit set: metrics reported, not judged.' : `${r.checks.length} checks: ${passed} passed, ${failed} failed, ${open} not evaluable.`;
  const worst = r.checks.find((c) => c.name === r.worstCheck?.name);
  const line2 = r.worstCheck && worst ? `Smallest margin: ${r.worstCheck.name}, ${checkValue(worst, r.worstCheck.margin, 'dB')}.` : '';
  doc.font('R').fontSize(8.6).text(line1, MARGIN.left + 190, y + 9, { width: w - 200 });
  doc.text(line2, MARGIN.left + 190, y + 21, { width: w - 200 });
  if (!r.grid.fullSphere && r.verdict !== 'none') {
    // A verdict reached without part of the sphere is never a bare pass (issue 12).
    doc.font('B').fontSize(7.6).text(`Judged on a partial sphere: ${pct(1 - r.solidAngleSr / (4 * Math.PI), 2)} of 4π unmeasured (see Data quality).`, MARGIN.left + 190, y + 31, { width: w - 200, lineBreak: false });
  }
  doc.y = y + 48;
}

function checksSection(doc: Doc, r: UnitResult): void {
  if (r.checks.length === 0) return;
  heading(doc, 'Checks', 40);
  const w = contentWidth(doc);
  const cols: Column[] = [
    { header: 'Check', width: w - 382 },
    { header: 'Value', width: 68, align: 'right' },
    { header: 'Limit', width: 62, align: 'right' },
    { header: 'Test tol.', width: 50, align: 'right' },
    { header: 'Judged at', width: 62, align: 'right' },
    { header: 'Margin', width: 72, align: 'right' },
    { header: 'Result', width: 68, align: 'center' },
  ];
  const u = r.valueUnit;
  table(doc, cols, r.checks.map((c) => [
    c.beam !== undefined ? `${c.name} (beam ${c.beam}${c.status === 'fail' ? ', failing' : ''})` : c.name,
    checkValue(c, c.value, u),
    checkValue(c, c.limit, u),
    `${fmt(c.toleranceDb)} dB`,
    checkValue(c, c.effectiveLimit, u),
    c.margin === null ? '—' : c.marginUnit === 'fraction' ? `${fmt(100 * c.margin, 1)} pt` : `${fmt(c.margin)} dB`,
    resultText(c),
  ]), { emphasis: (k) => r.checks[k].status === 'fail' });
  const notes = r.checks.filter((c) => c.note || c.source).map((c) => `${c.name}: ${[c.note, c.source].filter(Boolean).join('; ')}`);
  note(doc, 'Margin > 0: better than the limit relaxed by the test tolerance ("judged at"). Coverage margins are percentage points of 4π.' + (r.limitSet ? ` Limit set source: ${r.limitSet.source}.` : ''));
  for (const n of notes) note(doc, n);
}

function filesSection(doc: Doc, r: UnitResult): void {
  heading(doc, 'Input files', 30);
  const w = contentWidth(doc);
  table(doc, [{ header: 'File', width: w - 90 }, { header: 'sha256 (first 12)', width: 90 }], r.sources.map((f) => [f.path, f.sha256.slice(0, 12)]), { fontSize: 7.4 });
}

function mapBoxFor(doc: Doc, height: number): MapBox {
  const w = contentWidth(doc);
  const mapW = Math.min(w - 95, 2 * height);
  return { x: MARGIN.left + 34, y: doc.y + 12, w: mapW, h: mapW / 2 };
}

function tspMapSection(doc: Doc, input: UnitReportInput, maps: UnitMaps, s: ReportSettings, threshold: number | null): void {
  const r = input.result;
  heading(doc, 'Total scan pattern over the sphere', 260);
  const box = mapBoxFor(doc, 215);
  drawMapFrame(doc, box, maps.tspPng, s.mapCenterPhiDeg);
  if (maps.contour) drawBoundaries(doc, box, maps.contour, maps.raster.width, maps.raster.height, INK, 0.9, true);
  const holes = s.sections.holes ? listedHoles(r).listed : [];
  holes.forEach((h, k) => {
    const [hx, hy] = directionToPage(box, h.thetaDeg, h.phiDeg, s.mapCenterPhiDeg);
    mapLabel(doc, `H${k + 1}`, hx, hy, 6);
  });
  const [qx, qy] = directionToPage(box, r.tsp.peak.thetaDeg, r.tsp.peak.phiDeg, s.mapCenterPhiDeg);
  doc.polygon([qx, qy - 4], [qx + 3.6, qy + 2.4], [qx - 3.6, qy + 2.4]).lineWidth(0.7).fillAndStroke('#ffffff', INK);
  const sc = maps.scale;
  const marks = threshold !== null && threshold >= sc.lo && threshold <= sc.hi ? [{ t: scaleT(sc, threshold), label: 'contour' }] : [];
  drawColorBar(doc, box.x + box.w + 26, box.y + 6, box.h - 12, (t) => colorAt(s.colorMap, t), sc.ticks.map((v) => ({ t: scaleT(sc, v), value: v })), sc.step, r.valueUnit, marks);
  doc.y = box.y + box.h + 14;
  const ly = doc.y;
  unmeasuredSwatch(doc, MARGIN.left, ly, 14, 8);
  doc.font('R').fontSize(7.5).fillColor(INK).text('not measured', MARGIN.left + 18, ly, { lineBreak: false });
  doc.polygon([MARGIN.left + 86, ly + 0.5], [MARGIN.left + 90, ly + 7.5], [MARGIN.left + 82, ly + 7.5]).lineWidth(0.7).fillAndStroke('#ffffff', INK);
  doc.fillColor(INK).text(`TSP peak ${fmt(r.tsp.peak.value)} ${r.valueUnit} at θ ${fmt(r.tsp.peak.thetaDeg, 1)}°, φ ${fmt(r.tsp.peak.phiDeg, 1)}°`, MARGIN.left + 95, ly, { lineBreak: false });
  doc.y = ly + 13;
  const cmp = r.quantity === 'eis' ? 'at or below' : 'at or above';
  note(doc, `Hammer equal-area projection: area on the page is proportional to solid angle. Centre φ = ${fmt(s.mapCenterPhiDeg, 0)}°, θ = 90°; top θ = 0° (+z). ` +
    (threshold !== null ? `Black line with white edge: contour at ${fmt(threshold)} ${r.valueUnit} (inside: ${cmp}), the same threshold the coverage holes are found at (${thresholdSourceText(r.analysisThreshold)}). ` : '') +
    (holes.length ? `H1… mark the coverage holes listed below. ` : '') + 'Graticule every 30° in θ and φ. Brightest = best.');
}

function cdfSection(doc: Doc, input: UnitReportInput, s: ReportSettings, tspCurve: CdfCurve): void {
  const r = input.result;
  heading(doc, r.quantity === 'eis' ? 'CCDF of the total scan pattern (EIS)' : `CDF of the total scan pattern (${quantityLabel(r.quantity)})`, 230);
  const w = contentWidth(doc);
  const box = { x: MARGIN.left + 44, y: doc.y + 6, w: w - 44 - 120, h: 190 };
  let faint: CdfCurve[] = [];
  if (s.sections.beamCdfs) faint = input.beamCdfs?.map((b) => b.curve) ?? input.measurement.beams.map((b) => cdfCurve(b.values, input.measurement.grid.weightSr, r.quantity, 200));
  drawCdfPlot(doc, box, r.quantity, r.valueUnit, [{ curve: tspCurve, color: INK, width: 1.4 }], faint, r.tsp.percentiles, cdfLimitMarks(r.checks));
  doc.y = box.y;
  table(doc, [{ header: 'Level', width: 44, align: 'right' }, { header: `Value (${r.valueUnit})`, width: 62, align: 'right' }],
    r.tsp.percentiles.map((p) => [`${fmt(p.levelPct, p.levelPct % 1 === 0 ? 0 : 1)} %`, fmt(p.value)]), { fontSize: 7.4, x: box.x + box.w + 12 });
  const limits = cdfLimitMarks(r.checks);
  doc.font('R').fontSize(7).fillColor(INK);
  limits.forEach((l, k) => {
    doc.font('B').text(`L${k + 1} `, box.x + box.w + 12, doc.y, { continued: true, width: 106 }).font('R').text(`${l.label} ${r.valueUnit}`);
  });
  doc.y = Math.max(doc.y, box.y + box.h + 26);
  note(doc, (r.quantity === 'eis'
    ? 'Drawn as the CCDF: the share of the whole sphere (4π) where the total scan pattern EIS is above x (worse); unmeasured solid angle counts as worst (always above). A percentile p is where this curve crosses 1 − p.'
    : 'Share of the whole sphere (4π) where the total scan pattern is at or below x; unmeasured solid angle counts as worst (it starts the curve above 0).') +
    ' Dots: percentile read-outs (numbers = level). Dashed verticals L1…: limits as judged (tolerance applied), listed beside the plot; a diamond marks the level a percentile limit applies to.' +
    (faint.length ? ' Faint lines: each beam alone.' : ''));
}

function bestBeamSection(doc: Doc, input: UnitReportInput, maps: UnitMaps, s: ReportSettings): void {
  const { result: r, measurement: m, tsp } = input;
  heading(doc, 'Best beam per direction', 300);
  const box = mapBoxFor(doc, 215);
  drawMapFrame(doc, box, maps.bestPng, s.mapCenterPhiDeg);
  drawBoundaries(doc, box, maps.bestEdges, maps.raster.width, maps.raster.height, '#2a2a2a', 0.35);
  // Label each beam's region at the point where that beam is strongest within it.
  const bestAt = new Int32Array(m.beams.length).fill(-1);
  for (let i = 0; i < tsp.bestBeam.length; i++) {
    const b = tsp.bestBeam[i];
    if (b < 0) continue;
    const j = bestAt[b];
    const v = m.beams[b].values[i];
    if (j < 0 || (r.quantity === 'eis' ? v < m.beams[b].values[j] : v > m.beams[b].values[j])) bestAt[b] = i;
  }
  m.beams.forEach((b, k) => {
    const share = r.beams[k]?.bestShare ?? 0;
    if (bestAt[k] < 0 || share < 0.004) return;
    const [x, y0] = directionToPage(box, m.grid.thetaDeg[bestAt[k]], m.grid.phiDeg[bestAt[k]], s.mapCenterPhiDeg);
    // Keep clear of the φ labels that sit just below the equator.
    const eq = box.y + box.h / 2 + 6;
    const y = Math.abs(y0 - eq) < 9 ? (y0 < eq ? eq - 9 : eq + 9) : y0;
    mapLabel(doc, b.id, x, y, 6);
  });
  doc.y = box.y + box.h + 14;
  const w = contentWidth(doc);
  const perRow = m.beams.length > 32 ? 8 : 6;
  const cw = w / perRow;
  let y = doc.y;
  m.beams.forEach((b, k) => {
    const col = k % perRow;
    if (col === 0 && k > 0) y += 11;
    if (y > doc.page.height - MARGIN.bottom - 12) {
      doc.addPage();
      y = MARGIN.top;
    }
    const x = MARGIN.left + col * cw;
    const never = (r.beams[k]?.bestShare ?? 0) === 0 || r.beams[k]?.neverBest === true;
    doc.rect(x, y, 9, 7.5).fill(beamColor(k));
    doc.rect(x, y, 9, 7.5).lineWidth(0.3).strokeColor(INK).stroke();
    doc.font(never ? 'B' : 'R').fontSize(7).fillColor(INK).text(`${b.id} ${never ? 'never best' : pct(r.beams[k]?.bestShare, 1)}`, x + 12, y, { width: cw - 14, lineBreak: false, ellipsis: true });
  });
  doc.y = y + 14;
  const never = r.beams.filter((b) => b.bestShare === 0 || b.neverBest === true).map((b) => b.id);
  unmeasuredSwatch(doc, MARGIN.left, doc.y, 14, 8);
  doc.font('R').fontSize(7.5).text('not measured', MARGIN.left + 18, doc.y, { lineBreak: false });
  doc.y += 12;
  note(doc, `Colours repeat every 12 beams; labels give the beam id where that beam is strongest in its region; thin lines separate regions. ` +
    (never.length ? `Never best (no share of the total scan pattern): ${never.join(', ')}.` : 'Every beam is best somewhere.'));
}

function coverageSection(doc: Doc, input: UnitReportInput, tspCurve: CdfCurve): void {
  const r = input.result;
  heading(doc, 'Coverage efficiency versus threshold', 230);
  let curve = r.tsp.curve;
  if (curve.length < 2) {
    // Derived from the TSP CDF when the analysis did not keep the curve.
    const eis = r.quantity === 'eis';
    curve = Array.from(tspCurve.values, (v, k) => ({ threshold: v, efficiency: eis ? tspCurve.fractions[k] : 1 - (k === 0 ? tspCurve.startFraction : tspCurve.fractions[k - 1]) }));
  }
  const w = contentWidth(doc);
  const box = { x: MARGIN.left + 44, y: doc.y + 26, w: w - 44 - 160, h: 170 };
  const marks = [...r.tsp.coverage, ...r.tsp.relativeCoverage];
  drawCoveragePlot(doc, box, r.quantity, r.valueUnit, curve, r.tsp.peak.value, marks);
  doc.y = box.y - 20;
  const rows = [
    ...r.tsp.coverage.map((c) => [`${fmt(c.threshold)}`, fmt(r.quantity === 'eis' ? c.threshold - r.tsp.peak.value : r.tsp.peak.value - c.threshold, 1), pct(c.efficiency)]),
    ...r.tsp.relativeCoverage.map((c) => [`${fmt(c.threshold)}`, fmt(c.dbBelowPeak, 1), pct(c.efficiency)]),
  ];
  const tableX = box.x + box.w + 12;
  table(doc, [{ header: `t (${r.valueUnit})`, width: 46, align: 'right' }, { header: 'from peak', width: 54, align: 'right' }, { header: 'share', width: 44, align: 'right' }], rows, { fontSize: 7.2, x: tableX });
  doc.y = Math.max(doc.y, box.y + box.h + 28);
  note(doc, `Share of 4π where the total scan pattern is ${r.quantity === 'eis' ? 'at or below' : 'at or above'} the threshold. Squares: the thresholds requested (absolute, and relative to the peak ${fmt(r.tsp.peak.value)} ${r.valueUnit}), listed in the table.`);
}

function beamsSection(doc: Doc, r: UnitResult): void {
  heading(doc, 'Beams', 40);
  const w = contentWidth(doc);
  const hasRemoval = r.beams.some((b) => b.removal);
  const cols: Column[] = [
    { header: 'Beam', width: hasRemoval ? w - 420 : w - 316 },
    { header: `Peak (${r.valueUnit})`, width: 62, align: 'right' },
    { header: 'θ', width: 40, align: 'right' },
    { header: 'φ', width: 40, align: 'right' },
    { header: 'TRP (dBm)', width: 58, align: 'right' },
    { header: 'Best share', width: 56, align: 'right' },
    { header: 'Note', width: 60 },
  ];
  if (hasRemoval) cols.push({ header: 'Δ pct dB', width: 58, align: 'right' }, { header: 'Δ cov pt', width: 46, align: 'right' });
  table(doc, cols, r.beams.map((b) => {
    const failing = r.checks.filter((c) => c.beam === b.id && c.status === 'fail').map((c) => `fails ${c.name}`);
    const row = [b.id, fmt(b.peak.value), `${fmt(b.peak.thetaDeg, 1)}°`, `${fmt(b.peak.phiDeg, 1)}°`, fmt(b.trpDbm), pct(b.bestShare), [...failing, b.bestShare === 0 || b.neverBest ? 'never best' : ''].filter(Boolean).join('; ')];
    if (hasRemoval) row.push(fmt(b.removal?.percentileLossDb), b.removal?.coverageLoss == null ? '—' : fmt(100 * b.removal.coverageLoss, 1));
    return row;
  }), { fontSize: 7.4, emphasis: (k) => r.beams[k].bestShare === 0 || r.checks.some((c) => c.beam === r.beams[k].id && c.status === 'fail') });
  const trpNote = r.grid.fullSphere ? 'TRP from the solid-angle-weighted power mean over 4π.' : 'TRP is not reported: the grid does not cover the full sphere.';
  note(doc, `Peak: the beam's best value and its direction. Best share: fraction of 4π where the beam is the best one. ${trpNote}` +
    (hasRemoval ? ' Δ pct / Δ cov: how much the judged percentile (dB) and the coverage share (percentage points) drop if that beam is taken out of the codebook.' : ''));
  if (r.subset) note(doc, `Smallest subset keeping the ${fmt(r.subset.levelPct, 0)} % value within ${fmt(r.subset.toleranceDb, 1)} dB: ${r.subset.beams.length} beams (${r.subset.beams.join(', ')}).`);
}

function holesSection(doc: Doc, r: UnitResult, threshold: number | null): void {
  if (!r.holes) return;
  const { listed: holes, small, smallShare } = listedHoles(r);
  heading(doc, 'Coverage holes', 40);
  const at = threshold === null ? '' : ` (${fmt(threshold)} ${r.valueUnit}, the map's contour)`;
  const folded = small > 0 ? ` ${small} smaller hole${small === 1 ? '' : 's'} (each under ${fmt(100 * SMALL_HOLE_SHARE, 1)} % of 4π, about two cells of a 5° grid) together cover ${pct(smallShare, 3)} of 4π and are not listed.` : '';
  if (holes.length === 0) {
    note(doc, (small > 0 ? `No hole of ${fmt(100 * SMALL_HOLE_SHARE, 1)} % of 4π or more is worse than the coverage threshold${at}.` : `No direction is worse than the coverage threshold${at}.`) + folded);
    return;
  }
  const w = contentWidth(doc);
  table(doc, [
    { header: 'Hole', width: 36 }, { header: 'Solid angle (sr)', width: 80, align: 'right' }, { header: 'Share of 4π', width: 70, align: 'right' },
    { header: 'Centre θ', width: 56, align: 'right' }, { header: 'Centre φ', width: 56, align: 'right' },
    { header: `Worst (${r.valueUnit})`, width: 70, align: 'right' }, { header: 'Best beam (mean over hole)', width: w - 368 },
  ], holes.map((h, k) => [`H${k + 1}`, fmt(h.solidAngleSr, 4), pct(h.solidAngleSr / (4 * Math.PI), 2), `${fmt(h.thetaDeg, 1)}°`, `${fmt(h.phiDeg, 1)}°`, fmt(h.worst), h.nearestBeam]), { fontSize: 7.4 });
  note(doc, `Connected regions where the total scan pattern is worse than the coverage threshold${at}, largest first; marked H1… on the map above. Best beam: the beam with the best solid-angle-weighted mean over the hole (the one that comes closest to filling all of it).` + folded);
}

function referenceSection(doc: Doc, input: UnitReportInput, maps: UnitMaps, s: ReportSettings): void {
  const ref = input.result.reference;
  if (!ref) return;
  heading(doc, `Difference from the reference unit ${ref.unit}`, maps.deltaPng ? 300 : 60);
  if (maps.deltaPng) {
    const box = mapBoxFor(doc, 200);
    drawMapFrame(doc, box, maps.deltaPng, s.mapCenterPhiDeg);
    drawBoundaries(doc, box, maps.deltaEdges, maps.raster.width, maps.raster.height, '#444444', 0.5);
    const d = maps.deltaMaxDb;
    drawColorBar(doc, box.x + box.w + 26, box.y + 6, box.h - 12, divergingAt, [-d, -d / 2, 0, d / 2, d].map((v) => ({ t: 0.5 + v / (2 * d), value: v })), d / 2, 'Δ dB');
    doc.y = box.y + box.h + 14;
    note(doc, `This unit's total scan pattern minus the reference's, per direction (same projection). ${input.result.quantity === 'eis' ? 'For EIS a negative difference is better.' : 'Positive: this unit is stronger.'} Outlined: directions where the difference exceeds ±${DELTA_OUTLINE_DB} dB (about the repeatability of an over-the-air measurement).`);
  }
  const entries = rowMetrics(metricsOfUnit(input.result)).filter(({ key }) => key in ref.deltas)
    .map(({ metric, key }) => [metricLabel(metric, input.result.valueUnit), formatMetric(metric, ref.deltas[key], 'delta')]);
  pairedTable(doc, entries, ['Metric', 'Δ (this − reference)']);
}

/** A list of (name, value) pairs set in three side-by-side column pairs to save space. */
function pairedTable(doc: Doc, entries: string[][], headers: [string, string]): void {
  const per = 3;
  const w = contentWidth(doc);
  const cols: Column[] = [];
  for (let k = 0; k < per; k++) cols.push({ header: headers[0], width: w / per - 62 }, { header: 'Δ', width: 62, align: 'right' });
  const rows: string[][] = [];
  const n = Math.ceil(entries.length / per);
  for (let r = 0; r < n; r++) rows.push([0, 1, 2].flatMap((k) => entries[r + k * n] ?? ['', '']));
  table(doc, cols, rows, { fontSize: 7.2 });
}

function trendSection(doc: Doc, r: UnitResult): void {
  const trend = r.frequencyTrend;
  if (!trend || trend.length === 0) return;
  heading(doc, 'Metrics versus frequency', 200);
  const inTrend = new Set(trend.flatMap((t) => Object.keys(t)));
  const metrics = rowMetrics(metricsOfUnit(r)).filter(({ key }) => inTrend.has(key));
  const judged = r.checks.find((c) => c.kind === 'percentile') as (CheckResult & { levelPct?: number }) | undefined;
  const lines: MetricInstance[] = [{ family: 'peak' }, { family: 'percentile', param: judged?.levelPct ?? 50 }, { family: 'trpMax' }];
  trendPlot(doc, trend, metrics.filter(({ metric }) => lines.some((l) => rowKey(l) === rowKey(metric))), r.valueUnit);
  const w = contentWidth(doc);
  const fw = Math.min(80, (w - 190) / trend.length);
  table(doc, [{ header: 'Metric', width: w - fw * trend.length }, ...trend.map((t) => ({ header: fmtFrequency(t.frequencyHz), width: fw, align: 'right' as const }))],
    metrics.map(({ metric, key }) => [metricLabel(metric, r.valueUnit), ...trend.map((t) => formatMetric(metric, t[key] as number | null))]), { fontSize: 7.2 });
  const drift = r.pointingDrift;
  if (drift && drift.length > 0) {
    const worst = drift.reduce((a, b) => (b.driftDeg > a.driftDeg ? b : a));
    const flagged = drift.filter((d) => d.flagged);
    note(doc, `Beam pointing across the band (main-lobe centroid within 3 dB of each beam's peak, compared between frequencies): ` +
      `largest drift ${fmt(worst.driftDeg, 1)}° (beam ${worst.beam}); ` +
      (flagged.length ? `drifting more than the flag angle: ${flagged.map((d) => `${d.beam} (${fmt(d.driftDeg, 1)}°)`).join(', ')}.` : 'no beam drifts more than the flag angle (5°).'));
  }
}

/** Selected metrics against frequency, one line each (markers at the measured frequencies). */
function trendPlot(doc: Doc, trend: NonNullable<UnitResult['frequencyTrend']>, metrics: { metric: MetricInstance; key: string }[], unit: string): void {
  const keys = metrics.map((m) => m.key);
  const vals = trend.flatMap((t) => keys.map((k) => t[k] as number | null)).filter((v): v is number => v !== null);
  if (vals.length === 0 || trend.length < 2) return;
  const fs = trend.map((t) => t.frequencyHz / 1e9);
  const xr = niceRange(Math.min(...fs), Math.max(...fs), 6);
  const yr = niceRange(Math.min(...vals), Math.max(...vals), 6);
  const box = { x: MARGIN.left + 44, y: doc.y + 4, w: contentWidth(doc) - 200, h: 130 };
  const a: Axes = { ...box, xMin: xr.lo, xMax: xr.hi, yMin: yr.lo, yMax: yr.hi };
  drawAxes(doc, a, xr.ticks, xr.step, yr.ticks, 'frequency (GHz)', unit.startsWith('dB') ? `${unit}` : unit, (v) => fmt(v, 1));
  const dashes = [[], [4, 2], [1.2, 1.6]];
  keys.forEach((k, i) => {
    const pts = trend.map((t) => [px(a, t.frequencyHz / 1e9), t[k] as number | null] as const).filter((p) => p[1] !== null);
    pts.forEach(([x, v], j) => (j === 0 ? doc.moveTo(x, py(a, v as number)) : doc.lineTo(x, py(a, v as number))));
    const d = dashes[i % dashes.length];
    if (d.length) doc.dash(d[0], { space: d[1] });
    doc.lineWidth(1.1).strokeColor(INK).stroke().undash();
    for (const [x, v] of pts) doc.circle(x, py(a, v as number), 1.8).fill(INK);
    const ly = box.y + 8 + i * 14;
    const lx = box.x + box.w + 14;
    doc.moveTo(lx, ly + 3).lineTo(lx + 22, ly + 3);
    if (d.length) doc.dash(d[0], { space: d[1] });
    doc.lineWidth(1.1).strokeColor(INK).stroke().undash();
    doc.font('R').fontSize(7.2).fillColor(INK).text(metricLabel(metrics[i].metric, unit), lx + 26, ly, { width: 120, lineBreak: false });
  });
  doc.y = box.y + box.h + 28;
  doc.fontSize(9);
}

function qualitySection(doc: Doc, input: UnitReportInput): void {
  const r = input.result;
  const g = r.grid;
  heading(doc, 'Data quality', 110);
  const w = contentWidth(doc);
  keyValues(doc, [
    ['Grid kind', g.kind === 'regular' ? 'regular (constant θ/φ steps; exact cell weights)' : 'scattered (spherical Voronoi cell weights)'],
    ['Points', `${g.points}`],
    ['θ range / step', `${fmt(g.thetaRangeDeg[0], 1)}° … ${fmt(g.thetaRangeDeg[1], 1)}° / ${g.thetaStepDeg === null ? 'non-uniform' : `${fmt(g.thetaStepDeg, 2)}°`}`],
    ['φ range / step', `${fmt(g.phiRangeDeg[0], 1)}° … ${fmt(g.phiRangeDeg[1], 1)}° / ${g.phiStepDeg === null ? 'non-uniform' : `${fmt(g.phiStepDeg, 2)}°`}`],
    ['Measured Ω', `${fmt(r.solidAngleSr, 4)} sr of 4π = 12.5664 sr (${pct(r.solidAngleSr / (4 * Math.PI), 2)}); ${g.fullSphere ? 'full sphere' : 'partial sphere: the rest counts as not covered'}`],
    ...(g.unmeasured?.length ? g.unmeasured.map((u, k): [string, string] => [`Unmeasured ${k + 1}`, regionText(u)]) : []),
    ...(g.missing?.length ? [['Missing samples', `${g.missing.length}, absorbed by neighbouring cells (${g.missing.slice(0, 6).map((p) => `θ ${p.thetaDeg}° φ ${p.phiDeg}°`).join(', ')}${g.missing.length > 6 ? ', …' : ''})`] as [string, string]] : []),
    ['Samples merged', `${g.duplicatesMerged} per beam (φ seam, poles, repeated rows: coincident directions counted once)`],
    ['Beams resampled', `${g.beamsResampled}`],
    ['Warnings', r.warnings.length === 0 && input.measurement.warnings.length === 0 ? 'none' : `${Math.max(r.warnings.length, input.measurement.warnings.length)}`],
  ], MARGIN.left, w, 100);
  const typed = input.measurement.warnings;
  if (typed.length > 0) {
    doc.moveDown(0.3);
    for (const wg of typed) {
      ensureSpace(doc, 22);
      const info = WARNINGS[wg.code];
      doc.font('B').fontSize(7.8).fillColor(INK).text(`• ${info?.title ?? wg.code}: `, MARGIN.left, doc.y, { continued: true, width: w })
        .font('R').text(`${wg.message}${wg.file ? ` (${wg.file}${wg.line ? `:${wg.line}` : ''})` : ''}. ${info?.remedy ?? ''}`);
    }
  } else {
    for (const text of r.warnings) {
      ensureSpace(doc, 12);
      doc.font('R').fontSize(7.8).fillColor(INK).text(`• ${text}`, MARGIN.left, doc.y, { width: w });
    }
  }
  doc.fontSize(9);
}

/**
 * One unit's PDF: verdict and checks first, then the sphere maps, CDF, coverage curve, beams,
 * optional analysis (holes, reference, frequency trend) and data quality; footer on every page.
 * Deterministic for a fixed settings.creationDate (or generatedAt).
 */
export async function renderUnitPdf(input: UnitReportInput, settings: ReportSettings): Promise<Buffer> {
  const r = input.result;
  const sec = settings.sections;
  const doc = createDoc(settings, input.generatedAt, `${settings.title}: ${r.unit}`, `Spherical coverage of ${unitLabel(r)}`);
  const threshold = contourThreshold(r);
  const needMaps = sec.tspMap || sec.bestBeamMap || (sec.reference && !!input.referenceDelta);
  const maps = needMaps
    ? buildUnitMaps(input.measurement, input.tsp, { widthPx: settings.mapWidthPx, centerPhiDeg: settings.mapCenterPhiDeg, colorMap: settings.colorMap, threshold, delta: sec.reference ? input.referenceDelta : undefined })
    : null;
  const tspCurve = input.tspCdf ?? cdfCurve(input.tsp.values, input.measurement.grid.weightSr, r.quantity);

  titleBlock(doc, input, settings);
  verdictBlock(doc, r);
  if (sec.checks) checksSection(doc, r);
  if (sec.inputFiles) filesSection(doc, r);
  if (sec.tspMap && maps) {
    doc.addPage();
    tspMapSection(doc, input, maps, settings, threshold);
  }
  if (sec.cdf) cdfSection(doc, input, settings, tspCurve);
  if (sec.bestBeamMap && maps) {
    doc.addPage();
    bestBeamSection(doc, input, maps, settings);
  }
  if (sec.coverage) coverageSection(doc, input, tspCurve);
  if (r.polarizations?.length) polarizationSection(doc, { ...input, tspCdf: tspCurve });
  if (r.beamCorrespondence || r.interBand) jointSection(doc, input, settings);
  if (r.confidence || r.gridAdequacy) {
    doc.addPage();
    confidencePage(doc, r, tspCurve); // "How sure is this verdict" (src/report/confidencePage.ts)
  }
  doc.addPage();
  if (sec.beams) beamsSection(doc, r);
  if (sec.holes) holesSection(doc, r, threshold);
  if (sec.reference && maps) referenceSection(doc, input, maps, settings);
  if (sec.frequencyTrend) trendSection(doc, r);
  if (sec.quality) qualitySection(doc, input);
  addFooters(doc, `Unit ${unitLabel(r)}`);
  return finish(doc);
}
