import type { UnitResult, Warning } from '../../types.js';
import { WARNINGS } from '../../warnings.js';
import { regionText } from '../../sphere/gridWarnings.js';
import { fmt, pct } from '../format.js';
import { contentWidth, ensureSpace, INK, heading, keyValues, MARGIN, type Doc } from '../pdfDoc.js';

/** The grid facts as label/text pairs: kind, points, ranges and steps, measured solid angle, unmeasured regions, missing and merged samples. */
function gridFacts(r: UnitResult, warningCount: number): [string, string][] {
  const g = r.grid;
  const step = (s: number | null) => (s === null ? 'non-uniform' : `${fmt(s, 2)}°`);
  return [
    ['Grid kind', g.kind === 'regular' ? 'regular (constant θ/φ steps; exact cell weights)' : 'scattered (spherical Voronoi cell weights)'],
    ['Points', `${g.points}`],
    ['θ range / step', `${fmt(g.thetaRangeDeg[0], 1)}° … ${fmt(g.thetaRangeDeg[1], 1)}° / ${step(g.thetaStepDeg)}`],
    ['φ range / step', `${fmt(g.phiRangeDeg[0], 1)}° … ${fmt(g.phiRangeDeg[1], 1)}° / ${step(g.phiStepDeg)}`],
    ['Measured Ω', `${fmt(r.solidAngleSr, 4)} sr of 4π = 12.5664 sr (${pct(r.solidAngleSr / (4 * Math.PI), 2)}); ${g.fullSphere ? 'full sphere' : 'partial sphere: the rest counts as not covered'}`],
    ...(g.unmeasured ?? []).map((u, k): [string, string] => [`Unmeasured ${k + 1}`, regionText(u)]),
    ...(g.missing?.length ? [['Missing samples', `${g.missing.length}, absorbed by neighbouring cells (${g.missing.slice(0, 6).map((p) => `θ ${p.thetaDeg}° φ ${p.phiDeg}°`).join(', ')}${g.missing.length > 6 ? ', …' : ''})`] as [string, string]] : []),
    ['Samples merged', `${g.duplicatesMerged} per beam (φ seam, poles, repeated rows: coincident directions counted once)`],
    ['Beams resampled', `${g.beamsResampled}`],
    ['Warnings', warningCount === 0 ? 'none' : `${warningCount}`],
  ];
}

/** The typed warnings with their catalogue title and remedy; else the result's warning lines. */
function warningList(doc: Doc, r: UnitResult, typed: Warning[]): void {
  const w = contentWidth(doc);
  if (typed.length === 0) {
    for (const text of r.warnings) {
      ensureSpace(doc, 12);
      doc.font('R').fontSize(7.8).fillColor(INK).text(`• ${text}`, MARGIN.left, doc.y, { width: w });
    }
    return;
  }
  doc.moveDown(0.3);
  for (const wg of typed) {
    ensureSpace(doc, 22);
    const info = WARNINGS[wg.code];
    doc.font('B').fontSize(7.8).fillColor(INK).text(`• ${info?.title ?? wg.code}: `, MARGIN.left, doc.y, { continued: true, width: w })
      .font('R').text(`${wg.message}${wg.file ? ` (${wg.file}${wg.line ? `:${wg.line}` : ''})` : ''}. ${info?.remedy ?? ''}`);
  }
}

/** Data quality: the grid and its coverage of the sphere, merged and missing samples, and every warning. */
export function qualitySection(doc: Doc, r: UnitResult, typedWarnings: Warning[]): void {
  heading(doc, 'Data quality', 110);
  keyValues(doc, gridFacts(r, Math.max(r.warnings.length, typedWarnings.length)), MARGIN.left, contentWidth(doc), 100);
  warningList(doc, r, typedWarnings);
  doc.fontSize(9);
}
