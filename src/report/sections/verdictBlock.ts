import type { CheckResult, UnitResult } from '../../types.js';
import { pct, verdictText } from '../format.js';
import { contentWidth, ensureSpace, INK, MARGIN, type Doc } from '../pdfDoc.js';
import { checkValue } from './checksSection.js';

const FILL = { pass: '#dcebdc', fail: '#f3d6d6', none: '#e8e8e8' } as const;
const MARK = { pass: '✓', fail: '✗', none: '–' } as const;

/** The count line and the smallest margin line beside the verdict. */
function verdictLines(r: UnitResult): [string, string] {
  const passed = r.checks.filter((c) => c.status === 'pass').length;
  const failed = r.checks.filter((c) => c.status === 'fail').length;
  const open = r.checks.length - passed - failed;
  const line1 = r.checks.length === 0 ? 'No limit set: metrics reported, not judged.' : `${r.checks.length} checks: ${passed} passed, ${failed} failed, ${open} not evaluable.`;
  const worst: CheckResult | undefined = r.checks.find((c) => c.name === r.worstCheck?.name);
  const line2 = r.worstCheck && worst ? `Smallest margin: ${r.worstCheck.name}, ${checkValue(worst, r.worstCheck.margin, 'dB')}.` : '';
  return [line1, line2];
}

/** The verdict box: PASS / FAIL / NOT JUDGED, the check counts, the smallest margin, and a partial-sphere flag. */
export function verdictBlock(doc: Doc, r: UnitResult): void {
  ensureSpace(doc, 60);
  const w = contentWidth(doc);
  const y = doc.y + 2;
  doc.rect(MARGIN.left, y, w, 40).fill(FILL[r.verdict]);
  doc.rect(MARGIN.left, y, 5, 40).fill(INK);
  doc.font('B').fontSize(20).fillColor(INK).text(`${MARK[r.verdict]} ${verdictText(r.verdict)}`, MARGIN.left + 14, y + 10, { lineBreak: false });
  const [line1, line2] = verdictLines(r);
  doc.font('R').fontSize(8.6).text(line1, MARGIN.left + 190, y + 9, { width: w - 200 });
  doc.text(line2, MARGIN.left + 190, y + 21, { width: w - 200 });
  if (!r.grid.fullSphere && r.verdict !== 'none') {
    // A verdict reached without part of the sphere is never a bare pass (issue 12).
    doc.font('B').fontSize(7.6).text(`Judged on a partial sphere: ${pct(1 - r.solidAngleSr / (4 * Math.PI), 2)} of 4π unmeasured (see Data quality).`, MARGIN.left + 190, y + 31, { width: w - 200, lineBreak: false });
  }
  doc.y = y + 48;
}
