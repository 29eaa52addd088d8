import type { UnitResult } from '../../types.js';
import { fmt, pct } from '../format.js';
import { contentWidth, heading, note, table, type Column, type Doc } from '../pdfDoc.js';

type Beam = UnitResult['beams'][number];

const neverBest = (b: Beam): boolean => b.bestShare === 0 || b.neverBest === true;

/** One beam's row: peak and direction, TRP, best share, what it fails, and (with removal) what losing it costs. */
function beamRow(r: UnitResult, b: Beam, hasRemoval: boolean): string[] {
  const failing = r.checks.filter((c) => c.beam === b.id && c.status === 'fail').map((c) => `fails ${c.name}`);
  const row = [b.id, fmt(b.peak.value), `${fmt(b.peak.thetaDeg, 1)}°`, `${fmt(b.peak.phiDeg, 1)}°`, fmt(b.trpDbm), pct(b.bestShare), [...failing, neverBest(b) ? 'never best' : ''].filter(Boolean).join('; ')];
  if (hasRemoval) row.push(fmt(b.removal?.percentileLossDb), b.removal?.coverageLoss == null ? '—' : fmt(100 * b.removal.coverageLoss, 1));
  return row;
}

/** Every beam of the codebook; beams that fail a per-beam check or are never best in bold; the smallest subset below. */
export function beamsSection(doc: Doc, r: UnitResult): void {
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
  const failing = (b: Beam) => r.checks.some((c) => c.beam === b.id && c.status === 'fail');
  table(doc, cols, r.beams.map((b) => beamRow(r, b, hasRemoval)), { fontSize: 7.4, emphasis: (k) => r.beams[k].bestShare === 0 || failing(r.beams[k]) });
  const trpNote = r.grid.fullSphere ? 'TRP from the solid-angle-weighted power mean over 4π.' : 'TRP is not reported: the grid does not cover the full sphere.';
  note(doc, `Peak: the beam's best value and its direction. Best share: fraction of 4π where the beam is the best one. ${trpNote}` +
    (hasRemoval ? ' Δ pct / Δ cov: how much the judged percentile (dB) and the coverage share (percentage points) drop if that beam is taken out of the codebook.' : ''));
  if (r.subset) note(doc, `Smallest subset keeping the ${fmt(r.subset.levelPct, 0)} % value within ${fmt(r.subset.toleranceDb, 1)} dB: ${r.subset.beams.length} beams (${r.subset.beams.join(', ')}).`);
}
