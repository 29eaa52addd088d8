import { existsSync } from 'node:fs';
import { fmt, fmtFrequency, pct, quantityLabel } from '../format.js';
import { contentWidth, INK, keyValues, MARGIN, MUTED, type Doc } from '../pdfDoc.js';
import type { ReportSettings, UnitReportInput } from '../reportTypes.js';
import { testInfoBlock } from './testInfoBlock.js';

const PERCENTILE_RULE =
  'step rule: the smallest value whose solid-angle-weighted CDF over 4π reaches p; unmeasured solid angle counts as worst';

/** The logo top right; the batch hands it over as a data URL (read once, checked at the trust boundary). */
function logo(doc: Doc, s: ReportSettings): void {
  if (!s.logo || !(s.logo.startsWith('data:image/') || existsSync(s.logo))) return;
  try {
    doc.image(s.logo, MARGIN.left + contentWidth(doc) - 90, MARGIN.top - 6, { fit: [90, 36], align: 'right' });
  } catch {
    // An unreadable logo must not cost the report; the title block still names the organisation.
  }
}

/** Page 1's head: title, unit and frequency, the run's facts and the grid's, and the job file's test metadata. */
export function titleBlock(doc: Doc, input: UnitReportInput, s: ReportSettings): void {
  const r = input.result;
  const w = contentWidth(doc);
  logo(doc, s);
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
