import { SMALL_HOLE_SHARE } from '../../analysis/foldSmallHoles.js';
import { fmt, pct } from '../format.js';
import { contentWidth, heading, note, table, type Doc } from '../pdfDoc.js';
import type { UnitReportModel } from '../unitReportModel.js';

/** The sentence about the folded small holes ('' when none). */
function foldedText(model: UnitReportModel): string {
  const { small, smallShare } = model.holes;
  return small > 0 ? ` ${small} smaller hole${small === 1 ? '' : 's'} (each under ${fmt(100 * SMALL_HOLE_SHARE, 1)} % of 4π, about two cells of a 5° grid) together cover ${pct(smallShare, 3)} of 4π and are not listed.` : '';
}

/** The coverage holes at the analysis threshold (the map's contour), largest first, small ones folded into a count. */
export function holesSection(doc: Doc, model: UnitReportModel): void {
  const r = model.result;
  if (!r.holes) return;
  const { listed } = model.holes;
  heading(doc, 'Coverage holes', 40);
  const at = model.threshold === null ? '' : ` (${fmt(model.threshold)} ${r.valueUnit}, the map's contour)`;
  if (listed.length === 0) {
    note(doc, (model.holes.small > 0 ? `No hole of ${fmt(100 * SMALL_HOLE_SHARE, 1)} % of 4π or more is worse than the coverage threshold${at}.` : `No direction is worse than the coverage threshold${at}.`) + foldedText(model));
    return;
  }
  const w = contentWidth(doc);
  table(doc, [
    { header: 'Hole', width: 36 }, { header: 'Solid angle (sr)', width: 80, align: 'right' }, { header: 'Share of 4π', width: 70, align: 'right' },
    { header: 'Centre θ', width: 56, align: 'right' }, { header: 'Centre φ', width: 56, align: 'right' },
    { header: `Worst (${r.valueUnit})`, width: 70, align: 'right' }, { header: 'Best beam (mean over hole)', width: w - 368 },
  ], listed.map((h, k) => [`H${k + 1}`, fmt(h.solidAngleSr, 4), pct(h.solidAngleSr / (4 * Math.PI), 2), `${fmt(h.thetaDeg, 1)}°`, `${fmt(h.phiDeg, 1)}°`, fmt(h.worst), h.nearestBeam]), { fontSize: 7.4 });
  note(doc, `Connected regions where the total scan pattern is worse than the coverage threshold${at}, largest first; marked H1… on the map above. Best beam: the beam with the best solid-angle-weighted mean over the hole (the one that comes closest to filling all of it).` + foldedText(model));
}
