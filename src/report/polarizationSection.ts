/**
 * Report section for θ/φ value pairs: each polarization's total scan pattern side by side, the
 * rule that makes the verdict, and (EIS judged per polarization) every check in both
 * polarizations with the limiting one named. Data: UnitResult.polarizations
 * (src/batch/polarizationUnits.ts) and the component CDFs in UnitReportInput.polarizationCdfs.
 */
import type { Polarization, UnitResult } from '../types.js';
import { fmt, quantityLabel } from './format.js';
import { contentWidth, heading, INK, MARGIN, note, table, type Column, type Doc } from './pdfDoc.js';
import { drawCdfPlot, type CurveStyle } from './plots.js';
import type { UnitReportInput } from './reportTypes.js';

const POL_LABEL: Record<Polarization, string> = { theta: 'θ', phi: 'φ' };
const POL_COLOR: Record<Polarization, string> = { theta: '#1f5fa8', phi: '#b4451f' };

function ruleText(r: UnitResult): string {
  const lim = r.limitingPolarization ? POL_LABEL[r.limitingPolarization] : '';
  switch (r.polarizationRule) {
    case 'each':
      return 'Each polarization has its own total scan pattern (per direction the best beam for that polarization), CDF and checks; '
        + 'a check passes only when it passes in both polarizations, and its value in the checks table is the limiting polarization\'s. '
        + '3GPP TS 38.101-2 §7 states the receive requirements for each of two orthogonal polarizations (verify against the current release). '
        + `EIS values are never power-summed. The limiting polarization (${lim}) gives this report's maps, CDF, coverage and beam tables.`;
    case 'combined-sensitivity':
      return 'Combined-sensitivity view, chosen explicitly (--eis-polarizations combined): per beam and direction 1/EIS = 1/EISθ + 1/EISφ '
        + 'in linear power (the way total isotropic sensitivity adds polarizations), judged once. This is not the default: by default each '
        + 'polarization is judged on its own. Each polarization\'s own figures are listed for comparison.';
    default:
      return 'The verdict is on the total, the power sum of the θ and φ components (the transmit requirements use the total component). '
        + 'Each component\'s own total scan pattern is listed beside it (polarization balance); the components are not judged.';
  }
}

/** The levels the checks judge first, then the median and the tails; at most five columns. */
function tableLevels(r: UnitResult): number[] {
  const pols = r.polarizations ?? [];
  const have = new Set(pols.flatMap((p) => p.tsp.percentiles.map((x) => x.levelPct)));
  return [...new Set([...r.checks.flatMap((c) => (c.levelPct === undefined ? [] : [c.levelPct])), 50, 5, 95, 85])]
    .filter((l) => have.has(l)).slice(0, 5).sort((a, b) => a - b);
}

/** One row per polarization (and, unless each is judged, the verdict's own row first): best value, the levels, the verdict. */
function polarizationTable(doc: Doc, r: UnitResult): void {
  const pols = r.polarizations ?? [];
  const u = r.valueUnit;
  const levels = tableLevels(r);
  const cols: Column[] = [
    { header: 'Polarization', width: 100 },
    { header: `Best (${u})`, width: 60, align: 'right' },
    ...levels.map((l): Column => ({ header: `${fmt(l, l % 1 === 0 ? 0 : 1)} % (${u})`, width: 58, align: 'right' })),
    { header: 'Verdict', width: Math.max(70, contentWidth(doc) - 160 - 58 * levels.length) },
  ];
  const rows = pols.map((p) => [
    `${POL_LABEL[p.name]}${p.name === r.limitingPolarization ? ' (limiting)' : ''}`,
    fmt(p.tsp.peak.value),
    ...levels.map((l) => fmt(p.tsp.percentiles.find((x) => x.levelPct === l)?.value ?? null)),
    p.verdict === null ? 'not judged alone' : p.verdict === 'pass' ? '✓ pass' : p.verdict === 'fail' ? '✗ FAIL' : 'not judged',
  ]);
  if (r.polarizationRule !== 'each') {
    rows.unshift([r.polarizationRule === 'combined-sensitivity' ? 'combined (1/EIS sum)' : 'total (power sum)', fmt(r.tsp.peak.value),
      ...levels.map((l) => fmt(r.tsp.percentiles.find((x) => x.levelPct === l)?.value ?? null)),
      r.verdict === 'pass' ? '✓ pass' : r.verdict === 'fail' ? '✗ FAIL' : 'not judged']);
  }
  table(doc, cols, rows, { emphasis: (k) => rows[k][rows[k].length - 1].includes('FAIL') });
}

/** EIS judged per polarization: every check's value in both, the judged-at limit and the limiting one. */
function checksByPolarization(doc: Doc, r: UnitResult): void {
  const pols = r.polarizations ?? [];
  const u = r.valueUnit;
  const byPol = (p: Polarization, k: number) => pols.find((x) => x.name === p)?.checks[k];
  const cw: Column[] = [
    { header: 'Check', width: contentWidth(doc) - 300 }, { header: 'θ value', width: 62, align: 'right' }, { header: 'φ value', width: 62, align: 'right' },
    { header: 'Judged at', width: 62, align: 'right' }, { header: 'Limiting', width: 50, align: 'center' }, { header: 'Result', width: 64, align: 'center' },
  ];
  const val = (v: number | null | undefined, fraction: boolean) => (v === null || v === undefined ? '—' : fraction ? `${fmt(100 * v, 1)} %` : `${fmt(v)} ${u}`);
  table(doc, cw, r.checks.map((c, k) => {
    const fr = c.marginUnit === 'fraction';
    return [c.name, val(byPol('theta', k)?.value, fr), val(byPol('phi', k)?.value, fr), val(c.effectiveLimit, fr),
      c.polarization ? POL_LABEL[c.polarization] : '—', c.status === 'pass' ? '✓ both' : c.status === 'fail' ? '✗ FAIL' : 'not evaluable'];
  }), { emphasis: (k) => r.checks[k].status === 'fail' });
}

/** Each polarization's TSP CDF (and the verdict's own curve unless each is judged), keyed on the right. */
function polarizationCdfs(doc: Doc, input: UnitReportInput): void {
  const r = input.result;
  const curves: CurveStyle[] = (input.polarizationCdfs ?? []).map((c) => ({
    curve: c.curve, color: POL_COLOR[c.name], width: 1.2, dash: c.name === 'phi', label: POL_LABEL[c.name],
  }));
  if (curves.length === 0) return;
  if (r.polarizationRule !== 'each' && input.tspCdf) curves.unshift({ curve: input.tspCdf, color: INK, width: 1.5, label: 'verdict' });
  const box = { x: MARGIN.left + 44, y: doc.y + 8, w: contentWidth(doc) - 44 - 110, h: 170 };
  drawCdfPlot(doc, box, r.quantity, r.valueUnit, curves, [], [], []);
  let ly = box.y + 6;
  for (const c of curves) {
    const lx = box.x + box.w + 14;
    doc.moveTo(lx, ly + 3).lineTo(lx + 22, ly + 3);
    if (c.dash) doc.dash(2.5, { space: 1.5 });
    doc.lineWidth(c.width).strokeColor(c.color).stroke().undash();
    const text = c.label === 'verdict'
      ? (r.polarizationRule === 'combined-sensitivity' ? 'combined view' : 'total (power sum)')
      : `${c.label}${r.limitingPolarization && c.label === POL_LABEL[r.limitingPolarization] ? ' (limiting)' : ''}`;
    doc.font('R').fontSize(7.4).fillColor(INK).text(text, lx + 26, ly, { width: 80, lineBreak: false });
    ly += 13;
  }
  doc.y = box.y + box.h + 28;
  note(doc, 'Solid-angle-weighted distribution of each polarization\'s own total scan pattern over 4π (drawn as in the CDF section).');
}

/** Polarization page of a unit PDF; draws nothing for a unit without components. */
export function polarizationSection(doc: Doc, input: UnitReportInput): void {
  const r = input.result;
  if ((r.polarizations ?? []).length === 0) return;
  heading(doc, `Polarizations θ and φ (${quantityLabel(r.quantity)})`, 260);
  note(doc, ruleText(r));
  polarizationTable(doc, r);
  if (r.polarizationRule === 'each' && r.checks.length) checksByPolarization(doc, r);
  polarizationCdfs(doc, input);
}
