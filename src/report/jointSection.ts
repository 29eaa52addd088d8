/**
 * Report section for checks that join two measurements of a unit (src/batch/jointChecks.ts):
 * the CDF of ΔEIRP_BC over the judged region (beam correspondence) and the map of the joint
 * region of two bands (inter-band coverage). Data: UnitResult.beamCorrespondence / interBand and
 * UnitReportInput.jointMaps.
 */
import { clipTo, drawAxes, px, py, type Axes } from './axes.js';
import { drawMapFrame } from './drawMap.js';
import { fmt, niceRange, pct } from './format.js';
import { colorTable, paintMapPng } from './paintMap.js';
import { contentWidth, heading, INK, MARGIN, note, type Doc } from './pdfDoc.js';
import { cachedRaster } from './rasterCache.js';
import type { ReportSettings, UnitReportInput } from './reportTypes.js';

/** Neither, first band only, second band only, both (reads apart in grey print too). */
const JOINT_COLORS = [[236, 236, 236], [150, 190, 230], [235, 190, 130], [35, 110, 60]] as const;

function beamCorrespondenceSection(doc: Doc, input: UnitReportInput): void {
  const bc = input.result.beamCorrespondence;
  if (!bc) return;
  const check = input.result.checks.find((c) => c.kind === 'beam-correspondence');
  heading(doc, 'Beam correspondence (ΔEIRP_BC)', 230);
  note(doc, `ΔEIRP_BC = EIRP2 − EIRP1 per direction: EIRP2 the best EIRP over the beams (the total scan pattern), EIRP1 the EIRP of the beam `
    + `with the best ${bc.rxChoiceBasis === 'combined-sensitivity' ? 'combined sensitivity of the θ/φ EIS pair' : 'EIS'} there (the beam chosen from the receive side). `
    + `Judged over the upper ${bc.topSharePct} % of EIRP2 by solid angle (${fmt(bc.regionSr, 3)} sr, EIRP2 ≥ ${fmt(bc.regionFloorDbm)} dBm), `
    + `read at the ${bc.levelPct} % level: ${fmt(bc.valueDb)} dB${check ? ` against ${fmt(check.effectiveLimit)} dB (${check.status === 'pass' ? 'pass' : check.status === 'fail' ? 'FAIL' : 'not evaluable'})` : ''}. `
    + `The receive choice differs from the best transmit beam on ${pct(bc.otherBeamShareOfRegion)} of the region. 3GPP TS 38.101-2 §6.6.4; verify against the current release.`);
  const xs = bc.cdf.valuesDb;
  const hi = Math.max(xs[xs.length - 1] ?? 1, check?.effectiveLimit ?? 0, 1);
  const xr = niceRange(0, hi, 8);
  const w = contentWidth(doc);
  const a: Axes = { x: MARGIN.left + 44, y: doc.y + 6, w: w - 60, h: 150, xMin: xr.lo, xMax: xr.hi, yMin: 0, yMax: 1 };
  drawAxes(doc, a, xr.ticks, xr.step, [0, 0.2, 0.4, 0.6, 0.8, 1], 'ΔEIRP_BC x (dB)', 'share of the region with ΔEIRP_BC ≤ x', (v) => `${fmt(100 * v, 0)} %`);
  clipTo(doc, a);
  doc.moveTo(a.x, py(a, 0));
  xs.forEach((x, k) => { doc.lineTo(px(a, x), py(a, k === 0 ? 0 : bc.cdf.fractions[k - 1])).lineTo(px(a, x), py(a, bc.cdf.fractions[k])); });
  doc.lineTo(a.x + a.w, py(a, 1)).lineWidth(1.4).strokeColor(INK).stroke();
  if (check) {
    const x = px(a, check.effectiveLimit);
    doc.moveTo(x, a.y).lineTo(x, a.y + a.h).dash(4, { space: 2 }).lineWidth(0.8).strokeColor(INK).stroke().undash();
    const y = py(a, bc.levelPct / 100);
    doc.polygon([x, y - 3.5], [x + 3.5, y], [x, y + 3.5], [x - 3.5, y]).lineWidth(0.8).fillAndStroke('#ffffff', INK);
  }
  doc.restore();
  doc.y = a.y + a.h + 26;
  note(doc, `Dashed line: the maximum as judged (tolerance applied); the diamond marks the ${bc.levelPct} % level where the curve must already have reached it.`);
}

function interBandSection(doc: Doc, input: UnitReportInput, s: ReportSettings): void {
  const ib = input.result.interBand;
  if (!ib) return;
  heading(doc, 'Inter-band coverage: joint region of the two bands', 280);
  const [a, b] = ib.bands;
  note(doc, `Per band the region where the total scan pattern reaches the band's spherical-coverage level − ΔT_IB,S,n: ${a.name} at ${fmt(a.frequencyHz / 1e9, 3)} GHz ≥ ${fmt(a.levelDbm)} dBm `
    + `(${pct(a.share)} of 4π), ${b.name} at ${fmt(b.frequencyHz / 1e9, 3)} GHz ≥ ${fmt(b.levelDbm)} dBm (${pct(b.share)}). Both hold on ${pct(ib.jointShare)} of 4π; required ${pct(ib.requiredShare)}. `
    + `3GPP TS 38.101-2 §6.2A.1; verify against the current release.${ib.resampled ? ' The other band\'s pattern was resampled onto this grid.' : ''}`);
  const maps = input.jointMaps?.interBand;
  if (!maps) return;
  const w = contentWidth(doc);
  const mapW = Math.min(w - 95, 2 * 200);
  const box = { x: MARGIN.left + 34, y: doc.y + 12, w: mapW, h: mapW / 2 };
  const raster = cachedRaster(input.measurement.grid, s.mapWidthPx, s.mapCenterPhiDeg);
  const cls = new Int16Array(maps.inA.length);
  for (let i = 0; i < cls.length; i++) cls[i] = (maps.inA[i] ? 1 : 0) + (maps.inB[i] ? 2 : 0);
  const png = paintMapPng(raster.width, raster.height, raster.point, cls, colorTable(JOINT_COLORS));
  drawMapFrame(doc, box, png, s.mapCenterPhiDeg);
  const labels = ['neither', `${maps.names[0]} only`, `${maps.names[1]} only`, 'both (joint region)'];
  let ly = box.y + 4;
  labels.forEach((t, k) => {
    const lx = box.x + box.w + 12;
    const [r, g, bl] = JOINT_COLORS[k];
    doc.rect(lx, ly, 10, 8).fillAndStroke(`rgb(${r},${g},${bl})`, INK);
    doc.font('R').fontSize(7.2).fillColor(INK).text(t, lx + 14, ly, { width: 70 });
    ly += 14;
  });
  doc.y = box.y + box.h + 22;
  doc.fontSize(9);
}

/** The joint-check page of a unit PDF; draws nothing for a unit without joint checks. */
export function jointSection(doc: Doc, input: UnitReportInput, s: ReportSettings): void {
  beamCorrespondenceSection(doc, input);
  interBandSection(doc, input, s);
}
