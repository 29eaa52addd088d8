/**
 * The unit PDF's "How sure is this verdict" page (issue 17): the measurement uncertainty and the
 * decision rule, the probability that each check is truly met, the CDF with its 95 % band, the
 * grid-adequacy table and what a coarser grid would cost. Data from result.confidence (present
 * with an uncertainty) and result.gridAdequacy (every unit); nothing is computed here.
 */
import type { CheckResult, UnitResult } from '../types.js';
import type { CdfCurve } from './cdfCurve.js';
import { fmt, pct } from './format.js';
import { contentWidth, heading, keyValues, MARGIN, note, table, type Doc } from './pdfDoc.js';
import { drawCdfPlot, type CurveStyle } from './plots.js';
import { cdfLimitMarks } from './cdfLimitMarks.js';

const RULE_TEXT = {
  'shared-risk': 'shared risk (3GPP TS 38.101-2 §4.1): the limit relaxed by the test tolerance, the measured value compared as it is',
  guarded: 'guarded acceptance (ILAC-G8:09/2019 §4.2.2): the limit as written moved into the conforming zone by the guard band w',
  'non-binary': 'non-binary statement (ILAC-G8:09/2019 §4.2.3): pass, conditional pass, conditional fail, fail by U around the limit as written',
} as const;

/** A step curve through the band's levels (plot only). */
function bandCurve(points: { levelPct: number; x: number | null }[]): CdfCurve {
  const pts = points.filter((p): p is { levelPct: number; x: number } => p.x !== null).sort((a, b) => a.x - b.x || a.levelPct - b.levelPct);
  return { values: Float64Array.from(pts, (p) => p.x), fractions: Float64Array.from(pts, (p) => p.levelPct / 100), startFraction: 0 };
}

function checkRow(c: CheckResult, unit: string): string[] {
  const d = c.decision;
  const isCov = c.kind === 'min-coverage';
  const v = (x: number | null | undefined) => (x === null || x === undefined ? '—' : isCov ? pct(x) : `${fmt(x)} ${unit}`);
  return [
    c.name, v(c.value), v(c.limit), d ? v(d.acceptanceLimit) : v(c.effectiveLimit),
    d?.statement ?? (c.status === 'not-evaluable' ? 'not evaluable' : c.status),
    d?.probabilityOfConformance == null ? '—' : `${pct(d.probabilityOfConformance)} ± ${fmt(100 * (d.probabilityStdErr ?? 0), 1)}`,
    d?.valueStdDev == null ? '—' : isCov ? pct(d.valueStdDev) : fmt(d.valueStdDev),
    d?.bias == null ? '—' : isCov ? pct(d.bias) : fmt(d.bias),
  ];
}

/** Draws the page on a fresh page of `doc`. */
export function confidencePage(doc: Doc, r: UnitResult, tspCurve: CdfCurve): void {
  const w = contentWidth(doc);
  const c = r.confidence;
  heading(doc, 'How sure is this verdict', 200);
  if (c) {
    keyValues(doc, [
      ['Decision rule', RULE_TEXT[c.decisionRule]],
      ['Uncertainty (your input)', `U = ${fmt(c.expandedDb)} dB (95 %, k = 1.96); common to all directions u_c = ${fmt(c.commonDb)} dB, independent per direction u_r = ${fmt(c.perDirectionDb)} dB` +
        (c.decisionRule === 'guarded' ? `; guard band w = ${fmt(c.guardBandDb)} dB` : '')],
      ['All checks truly met', c.probabilityOfConformance === null ? 'not known (a check is not evaluable, or no checks)'
        : `${pct(c.probabilityOfConformance)} ± ${fmt(100 * (c.probabilityStdErr ?? 0), 1)} % (Monte-Carlo, ${c.draws} draws, seed ${c.seed}; ± is its own standard error)`],
      ['Statement', c.statement ?? '—'],
    ], MARGIN.left, w, 130);
    doc.y += 4;
    if (r.checks.length) {
      table(doc, [
        { header: 'Check', width: 104 }, { header: 'Measured', width: 56, align: 'right' }, { header: 'Limit', width: 54, align: 'right' },
        { header: 'Judged at', width: 56, align: 'right' }, { header: 'Statement', width: 80 }, { header: 'P(truly met)', width: 66, align: 'right' },
        { header: 'Spread', width: 40, align: 'right' }, { header: 'Bias', width: w - 456, align: 'right' },
      ], r.checks.map((k) => checkRow(k, r.valueUnit)), { fontSize: 7.4, emphasis: (i) => r.checks[i].status === 'fail' });
    }
    const box = { x: MARGIN.left + 44, y: doc.y + 6, w: w - 60, h: 170 };
    const curves: CurveStyle[] = [
      { curve: bandCurve(c.band.map((b) => ({ levelPct: b.levelPct, x: b.low95 }))), color: '#7a8bb5', width: 0.9, dash: true },
      { curve: bandCurve(c.band.map((b) => ({ levelPct: b.levelPct, x: b.high95 }))), color: '#7a8bb5', width: 0.9, dash: true },
      { curve: tspCurve, color: '#1a1a1a', width: 1.4 },
    ];
    drawCdfPlot(doc, box, r.quantity, r.valueUnit, curves, [], r.tsp.percentiles, cdfLimitMarks(r.checks));
    doc.y = box.y + box.h + 26;
    note(doc, 'Solid line: the measured total scan pattern. Dashed: the 95 % band of the true CDF given the uncertainty (bias-corrected Monte-Carlo: each draw perturbs every beam by one common and one per-direction error, rebuilds the total scan pattern and re-reads the CDF). ' +
      'P(truly met): the share of draws in which the bias-corrected value meets the limit as written (no test tolerance or guard band). Judged at: the acceptance limit of the decision rule. Spread: one standard deviation of the re-read value. Bias: how far the re-read value moves on average — a maximum over noisy beams reads high (two equal beams: σ/√π ≈ 0.56σ).');
  } else {
    note(doc, 'No measurement uncertainty was given, so the verdict above is the shared-risk comparison of the measured values as they are. Give your lab\'s uncertainty (an `uncertainty:` block in the job file or limit set) to see the probability that each check is truly met.');
  }
  const g = r.gridAdequacy;
  if (!g) return;
  heading(doc, 'Was the grid fine enough', 120);
  const bias = (l: number) => c?.percentiles.find((p) => p.levelPct === l)?.biasDb ?? null;
  table(doc, [
    { header: 'Level', width: 50, align: 'right' }, { header: `Value (${r.valueUnit})`, width: 70, align: 'right' },
    { header: 'Grid adequacy', width: 80, align: 'right' }, { header: 'At 1.5× step', width: 80, align: 'right' },
    { header: 'At 2× step', width: 80, align: 'right' }, { header: 'Bias (uncertainty)', width: w - 360, align: 'right' },
  ], g.percentiles.map((p) => {
    const v = r.tsp.percentiles.find((x) => x.levelPct === p.levelPct)?.value ?? null;
    const pm = (x: number | null) => (x === null ? '—' : `± ${fmt(x)} dB`);
    return [`${fmt(p.levelPct, p.levelPct % 1 === 0 ? 0 : 1)} %`, fmt(v), pm(p.adequacyDb), pm(p.at1p5StepDb), pm(p.at2StepDb), bias(p.levelPct) === null ? '—' : `${fmt(bias(p.levelPct))} dB`];
  }), { fontSize: 7.4 });
  if (g.coverage.length) {
    table(doc, [{ header: 'Coverage at', width: 90, align: 'right' }, { header: 'Efficiency', width: 70, align: 'right' }, { header: 'Grid adequacy', width: 90, align: 'right' }],
      g.coverage.map((k) => [`${fmt(k.threshold)} ${r.valueUnit}`, pct(r.tsp.coverage.find((x) => x.threshold === k.threshold)?.efficiency ?? null), k.adequacy === null ? '—' : `± ${pct(k.adequacy)}`]), { fontSize: 7.4 });
  }
  const at = (f: number) => g.coarser.find((x) => x.stepFactor === f)?.pointsSavedShare ?? null;
  const level = r.checks.find((k) => k.kind === 'percentile')?.levelPct ?? 50;
  const row = g.percentiles.find((p) => p.levelPct === level);
  note(doc, `Test time: a grid 1.5× coarser would save ${pct(at(1.5), 0)} of the points and read the ${fmt(level, 0)} % level within ± ${fmt(row?.at1p5StepDb ?? null)} dB; ` +
    `2× coarser would save ${pct(at(2), 0)} and read it within ± ${fmt(row?.at2StepDb ?? null)} dB (this unit's data). ` +
    `Method: ${g.method}; each value is re-read on every sub-grid and ±x = ${fmt(g.calibrationFactor, 1)} × their root-mean-square deviation, a factor calibrated on known patterns (cosⁿ lobes, simulated arrays; truth on a 0.5° grid) so that about 9 readings in 10 fall within ±x. An estimate from the data, not a bound.`);
}
