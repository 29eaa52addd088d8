import type { CheckDecision, CheckResult, ConformityStatement, CoverageMetrics, Quantity, SphereGrid, TotalScanPattern, UnitConfidence } from '../../types.js';
import type { LimitCheck, LimitSet } from '../../limits/limitSet.js';
import { betterSign } from '../../quantity.js';
import { summarizeChecks, type JudgeResult } from '../../limits/judge.js';
import { weightedCdf } from '../../coverage/weightedCdf.js';
import { coverageEfficiency } from '../../coverage/coverageEfficiency.js';
import { percentile } from '../../coverage/percentile.js';
import type { ResolvedUncertainty } from './uncertaintySpec.js';
import { monteCarloMetrics, type MonteCarloDraws } from './monteCarloMetrics.js';
import { decideCoverage, decideValue } from './decisionRule.js';
import { binomialStdErr } from './binomialStdErr.js';
import { drawSummary } from './drawSummary.js';

/** Levels of the report's uncertainty band: 1 %, 3.5 % … 98.5 % (every 2.5 %) and the ends. */
const BAND_LEVELS_PCT = [0, ...Array.from({ length: 40 }, (_, i) => 1 + 2.5 * i), 100];

const SEVERITY: ConformityStatement[] = ['pass', 'conditional pass', 'conditional fail', 'fail'];

/**
 * Everything "how sure is this verdict" says about one unit, given its measurement uncertainty:
 * 1. a seeded Monte-Carlo of the metrics (monteCarloMetrics: common + per-direction draws,
 *    rebuilt total scan pattern, re-read percentiles and coverage, beam peaks, TRP);
 * 2. per check, the probability of conformance: the share of draws whose bias-corrected value
 *    2v − v*_k (drawSummary, Eq. S2) meets the limit as written (the requirement, without test
 *    tolerance or guard band) — Eq. (P1) — with its binomial standard error;
 * 3. the decision rule (decideValue / decideCoverage): shared-risk leaves the check as judged;
 *    guarded and non-binary re-judge it (acceptance limit, margin, pass) and the verdict and
 *    worst check follow (summarizeChecks, the judge's own rule);
 * 4. per unit, the joint probability that every check is met (the share of draws in which all
 *    are), the worst statement, and per reported percentile and coverage value the bias and
 *    spread of the re-read value.
 * Units: dB (coverage: fraction of 4π). Boundary rule: a not-evaluable check gets a decision
 * with null statement and probability, and makes the unit probability null.
 * Cost: one monteCarloMetrics run, O(draws · (pairs + n log n)).
 * @example assessConfidence({ grid, beams, quantity: 'eirp', tsp, metrics, limitSet, judged, uncertainty })
 */
export function assessConfidence(a: {
  grid: SphereGrid;
  beams: { id: string; values: Float64Array }[];
  quantity: Quantity;
  tsp: TotalScanPattern;
  metrics: CoverageMetrics;
  limitSet: LimitSet | null;
  judged: JudgeResult;
  uncertainty: ResolvedUncertainty;
}): { judged: JudgeResult; confidence: UnitConfidence } {
  const { grid, quantity, metrics, uncertainty: u } = a;
  const ls = a.limitSet;
  const sense = betterSign(quantity);
  const reported = metrics.percentiles.map((p) => p.levelPct);
  const levels = [...reported, ...BAND_LEVELS_PCT];
  const thresholds = metrics.coverage.map((c) => c.threshold);
  for (const c of ls?.checks ?? []) if (c.kind === 'min-coverage' && !thresholds.includes(c.threshold)) thresholds.push(c.threshold);
  const hasTrp = ls?.checks.some((c) => c.kind === 'max-trp') ?? false;
  // Windows relative to the peak move with each draw's own peak.
  const windows = (ls?.checks ?? []).flatMap((c) => (c.kind === 'min-relative-coverage' ? [c.dbBelowPeak] : []));
  const mc = monteCarloMetrics(grid.weightSr, a.beams.map((b) => b.values), quantity, u, {
    levelsPct: levels,
    thresholds,
    beamPeaks: ls?.checks.some((c) => c.kind === 'min-beam-peak') ?? false,
    trpDbm: hasTrp ? metrics.beams.map((b) => b.trpDbm) : undefined,
    relativeDb: windows,
  });
  const cdf = weightedCdf(a.tsp.values, grid.weightSr);
  const efficiencyAt = (t: number): number => coverageEfficiency(cdf, t, quantity);
  const N = mc.draws;
  const allMet = new Uint8Array(N).fill(1);
  let jointDefined = a.judged.checks.length > 0;
  const checks = a.judged.checks.map((c, idx) => {
    const spec = ls?.checks.find((x) => x.name === c.name) ?? ls?.checks[idx];
    // Checks joining two measurements (beam correspondence, inter-band) are judged later from both: not assessed here.
    if (!spec || spec.kind === 'beam-correspondence' || spec.kind === 'inter-band-coverage'
      || c.status === 'not-evaluable' || c.value === null) {
      jointDefined = false;
      const decision: CheckDecision = { rule: u.decisionRule, acceptanceLimit: c.effectiveLimit, guardBandDb: u.decisionRule === 'guarded' ? u.guardBandDb : null,
        statement: null, probabilityOfConformance: null, probabilityStdErr: null, valueStdDev: null, bias: null };
      return { ...c, decision };
    }
    const series = checkSeries(spec, c, mc, levels, thresholds, metrics, efficiencyAt, windows);
    const isShare = spec.kind === 'min-coverage' || spec.kind === 'min-relative-coverage';
    let met = 0;
    const bound = c.bound ?? 'lower';
    for (let k = 0; k < N; k++) {
      const x = series.draws[k];
      const corrected = 2 * series.value - x; // Eq. (S2)
      const ok = !Number.isNaN(x) && (isShare ? corrected >= spec.minEfficiency
        : bound === 'lower' ? corrected >= spec.limit : corrected <= spec.limit); // Eq. (P1)
      if (ok) met++; else allMet[k] = 0;
    }
    const p = met / N;
    const sum = drawSummary(series.value, series.draws, isShare ? undefined : mc.common);
    const params = { rule: u.decisionRule, toleranceDb: spec.toleranceDb, guardBandDb: u.guardBandDb, expandedDb: u.expandedDb };
    const rejudged: CheckResult = { ...c };
    let statement: ConformityStatement;
    if (spec.kind === 'min-relative-coverage') {
      // The window's edge t = peak − d (eirp; + d for eis) is judged like a coverage threshold.
      const d = decideCoverage(efficiencyAt, metrics.peak.value - sense * spec.dbBelowPeak, spec.minEfficiency, sense, params);
      statement = d.statement;
      if (u.decisionRule !== 'shared-risk') Object.assign(rejudged, { value: d.value, margin: d.margin, pass: d.pass, status: d.pass ? 'pass' : 'fail' });
    } else if (spec.kind === 'min-coverage') {
      const d = decideCoverage(efficiencyAt, spec.threshold, spec.minEfficiency, sense, params);
      statement = d.statement;
      if (u.decisionRule !== 'shared-risk') {
        const shift = u.decisionRule === 'guarded' ? u.guardBandDb + spec.toleranceDb : spec.toleranceDb;
        Object.assign(rejudged, { value: d.value, threshold: d.threshold, margin: d.margin, pass: d.pass, status: d.pass ? 'pass' : 'fail',
          marginDb: c.marginDb == null ? c.marginDb : snap(u.decisionRule === 'guarded' ? c.marginDb - shift : c.marginDb + shift) });
      }
    } else {
      const d = decideValue(c.value, spec.limit, bound, params);
      statement = d.statement;
      if (u.decisionRule !== 'shared-risk') {
        Object.assign(rejudged, { effectiveLimit: d.acceptanceLimit, margin: d.margin, pass: d.pass, status: d.pass ? 'pass' : 'fail' });
      }
    }
    if (u.decisionRule !== 'shared-risk') {
      const how = u.decisionRule === 'guarded'
        ? `guarded acceptance (ILAC-G8 §4.2.2): the limit as written tightened by the guard band ${u.guardBandDb} dB`
        : `non-binary statement (ILAC-G8 §4.2.3) with U = ${u.expandedDb} dB; pass/fail is simple acceptance at the limit as written`;
      rejudged.note = [c.note, spec.toleranceDb > 0 ? `${how}; the test tolerance ${spec.toleranceDb} dB is not applied under this rule` : how].filter(Boolean).join('; ');
    }
    rejudged.decision = {
      rule: u.decisionRule,
      acceptanceLimit: isShare ? spec.minEfficiency : (rejudged.effectiveLimit),
      guardBandDb: u.decisionRule === 'guarded' ? u.guardBandDb : null,
      statement,
      probabilityOfConformance: p,
      probabilityStdErr: binomialStdErr(p, N),
      valueStdDev: sum.stdDev,
      bias: sum.bias,
    };
    return rejudged;
  });
  const judged = u.decisionRule === 'shared-risk' ? { ...a.judged, checks } : summarizeChecks(checks);
  let unitP: number | null = null;
  if (jointDefined) {
    let k = 0;
    for (let i = 0; i < N; i++) k += allMet[i];
    unitP = k / N;
  }
  const statements = checks.map((c) => c.decision?.statement ?? null);
  const statement = statements.length === 0 || statements.includes(null) ? (statements.includes('fail') ? 'fail' : null)
    : SEVERITY[Math.max(...statements.map((s) => SEVERITY.indexOf(s as ConformityStatement)))];
  const confidence: UnitConfidence = {
    decisionRule: u.decisionRule,
    expandedDb: u.expandedDb,
    commonDb: u.commonDb,
    perDirectionDb: u.perDirectionDb,
    guardBandDb: u.guardBandDb,
    draws: N,
    seed: u.seed,
    probabilityOfConformance: unitP,
    probabilityStdErr: unitP === null ? null : binomialStdErr(unitP, N),
    statement,
    percentiles: metrics.percentiles.map((p, l) => {
      const s = p.value === null ? null : drawSummary(p.value, mc.percentiles[l], mc.common);
      return { levelPct: p.levelPct, value: p.value, biasDb: s?.bias ?? null, stdDevDb: s?.stdDev ?? null, low95: s?.low95 ?? null, high95: s?.high95 ?? null };
    }),
    coverage: metrics.coverage.map((c) => {
      const s = drawSummary(c.efficiency, mc.coverage[thresholds.indexOf(c.threshold)]);
      return { threshold: c.threshold, efficiency: c.efficiency, bias: s.bias, stdDev: s.stdDev };
    }),
    pairsPerDraw: mc.pairsPerDraw,
    band: BAND_LEVELS_PCT.map((levelPct, j) => {
      const l = reported.length + j;
      const v = percentile(cdf, levelPct, quantity);
      const s = v === null ? null : drawSummary(v, mc.percentiles[l]);
      return { levelPct, low95: s?.low95 ?? null, high95: s?.high95 ?? null };
    }),
  };
  return { judged, confidence };
}

function snap(x: number): number {
  return Math.round(x * 1e9) / 1e9;
}

/** The measured value of a check (as the requirement reads it) and its draws. */
function checkSeries(spec: Exclude<LimitCheck, { kind: 'beam-correspondence' | 'inter-band-coverage' }>, c: CheckResult, mc: MonteCarloDraws, levels: number[], thresholds: number[],
  metrics: CoverageMetrics, efficiencyAt: (t: number) => number, windows: number[]): { value: number; draws: Float64Array } {
  switch (spec.kind) {
    case 'percentile': {
      const l = levels.findIndex((x) => Math.abs(x - spec.levelPct) < 1e-9);
      return { value: c.value as number, draws: mc.percentiles[l] };
    }
    case 'min-coverage':
      return { value: efficiencyAt(spec.threshold), draws: mc.coverage[thresholds.indexOf(spec.threshold)] };
    case 'min-relative-coverage':
      return { value: c.value as number, draws: mc.relative[windows.indexOf(spec.dbBelowPeak)] };
    case 'min-peak':
    case 'max-peak':
      return { value: c.value as number, draws: mc.peak };
    case 'min-beam-peak':
    case 'max-trp': {
      const ids = spec.kind === 'min-beam-peak' && spec.beams ? spec.beams : metrics.beams.map((b) => b.id);
      const idx = ids.map((id) => metrics.beams.findIndex((b) => b.id === id));
      const src = spec.kind === 'max-trp' ? mc.trpDbm : mc.beamPeaks;
      const worse = (x: number, y: number): boolean => (c.bound === 'upper' ? x > y : x < y);
      const draws = new Float64Array(mc.draws);
      for (let k = 0; k < mc.draws; k++) {
        let w = NaN;
        for (const b of idx) { const x = src[b][k]; if (Number.isNaN(w) || worse(x, w)) w = x; }
        draws[k] = w;
      }
      return { value: c.value as number, draws };
    }
  }
}
