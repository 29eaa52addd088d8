import type { CheckResult, CoverageMetrics, Quantity } from '../types.js';
import type { LimitCheck } from './limitSet.js';
import { checkBound, kindAllowed } from './checkSense.js';
import { betterByDb, isLowerBetter, quantityUnit, worsenedBy } from '../quantity.js';

/** Levels and thresholds are matched to the computed metrics within this (they are decimal inputs). */
const MATCH_EPS = 1e-9;
/** Margins are rounded to 1e-9 (a nano-dB) so float noise of limit − tolerance cannot flip a verdict at the limit. */
/** Round to 1e-9 so that limit ± tolerance arithmetic cannot flip a verdict by float noise. */
export const snap = (x: number): number => Math.round(x * 1e9) / 1e9;

/**
 * Judge one check against a unit's metrics.
 *
 * Effective limit (Eq. L1): lower-bound checks limit − tol, upper-bound checks limit + tol;
 * margin (Eq. L2): value − effectiveLimit (lower) or effectiveLimit − value (upper);
 * pass ⇔ margin ≥ 0 (at the limit passes). min-coverage instead relaxes the threshold by the
 * tolerance (Eq. L3: t − tol for eirp/gain, t + tol for eis) and judges the efficiency there
 * against minEfficiency, margin in fraction of 4π. A value that cannot be had (partial sphere
 * for TRP, a percentile in the unmeasured part, a level or threshold not computed, a beam
 * missing, a quantity mismatch) gives status 'not-evaluable', pass null — never a pass.
 *
 * Cost O(beams + percentiles + coverage points).
 * @example evaluateCheck({ kind: 'min-peak', name: 'p', limit: 20, toleranceDb: 1 }, m, 'eirp', true)
 *   // m.peak.value 19.5 → effectiveLimit 19, margin 0.5, pass
 */
export function evaluateCheck(check: LimitCheck, metrics: CoverageMetrics, quantity: Quantity,
  fullSphere: boolean, limitSetQuantity: Quantity = quantity): CheckResult {
  const bound = checkBound(check.kind, quantity);
  const tol = check.toleranceDb;
  const isCoverage = check.kind === 'min-coverage';
  const limit = isCoverage ? check.minEfficiency : check.limit;
  const effectiveLimit = isCoverage ? limit : snap(bound === 'lower' ? limit - tol : limit + tol); // Eq. L1
  const base: CheckResult = {
    name: check.name, kind: check.kind, value: null, limit, toleranceDb: tol, effectiveLimit,
    margin: null, pass: null, status: 'not-evaluable', bound, marginUnit: isCoverage ? 'fraction' : 'dB',
    ...(check.source ? { source: check.source } : {}),
  };
  const notEvaluable = (note: string): CheckResult => ({ ...base, note });
  if (limitSetQuantity !== quantity) return notEvaluable(`limit set is for ${limitSetQuantity}, measurement is ${quantity}`);
  if (!kindAllowed(check.kind, quantity)) return notEvaluable(`${check.kind} does not apply to ${quantity}`);
  const unit = quantityUnit(quantity);
  let value: number;
  let extra: Partial<CheckResult> = {};
  switch (check.kind) {
    case 'min-peak':
    case 'max-peak':
      value = metrics.peak.value;
      break;
    case 'percentile': {
      extra = { levelPct: check.levelPct };
      const p = metrics.percentiles.find((x) => Math.abs(x.levelPct - check.levelPct) < MATCH_EPS);
      if (!p) return { ...notEvaluable(`the ${check.levelPct} % level was not computed`), ...extra };
      if (p.value === null) return { ...notEvaluable(`the ${check.levelPct} % level falls in the unmeasured part of the sphere`), ...extra };
      value = p.value;
      break;
    }
    case 'min-coverage': {
      const t = snap(worsenedBy(quantity, check.threshold, tol)); // Eq. L3
      extra = { threshold: t };
      const c = metrics.coverage.find((x) => Math.abs(x.threshold - t) < MATCH_EPS)
        ?? metrics.curve.find((x) => Math.abs(x.threshold - t) < MATCH_EPS);
      if (!c) return { ...notEvaluable(`coverage at ${t} ${unit} was not computed`), ...extra };
      value = c.efficiency;
      if (tol > 0) extra.note = `threshold ${check.threshold} ${unit} relaxed by ${tol} dB to ${t} ${unit}`;
      // Coverage ≥ e at t ⇔ the value at CDF level (1 − e) reaches t (eirp/gain); for eis the value
      // at level e stays at or below t (Eq. L4; equal up to the step of the CDF at the boundary).
      const level = coverageLevelPct(check.minEfficiency, quantity);
      const v = metrics.percentiles.find((x) => Math.abs(x.levelPct - level) < MATCH_EPS)?.value ?? null;
      extra.marginDb = v === null ? null : snap(betterByDb(quantity, v, t)); // Eq. L4
      break;
    }
    case 'min-beam-peak':
    case 'max-trp': {
      const beams = check.kind === 'min-beam-peak' && check.beams
        ? check.beams.map((id) => metrics.beams.find((b) => b.id === id) ?? id)
        : metrics.beams;
      const missing = beams.filter((b): b is string => typeof b === 'string');
      if (missing.length) return notEvaluable(`beam ${missing.join(', ')} not in the measurement`);
      if (beams.length === 0) return notEvaluable('no beams');
      const found = beams.filter((b) => typeof b !== 'string');
      if (check.kind === 'max-trp') {
        if (!fullSphere || found.some((b) => b.trpDbm === null)) return notEvaluable('TRP needs a full-sphere measurement');
        const worst = found.reduce((a, b) => ((b.trpDbm as number) > (a.trpDbm as number) ? b : a));
        value = worst.trpDbm as number;
        extra = { beam: worst.id };
      } else {
        // The worst beam peak decides: lowest for eirp/gain, highest for eis.
        const worse = (a: number, b: number): boolean => (bound === 'lower' ? a < b : a > b);
        const worst = found.reduce((a, b) => (worse(b.peak.value, a.peak.value) ? b : a));
        value = worst.peak.value;
        extra = { beam: worst.id };
      }
      break;
    }
  }
  const margin = snap(bound === 'lower' ? value - effectiveLimit : effectiveLimit - value); // Eq. L2
  const pass = margin >= 0;
  return { ...base, ...extra, value, margin, pass, status: pass ? 'pass' : 'fail' };
}

/**
 * The CDF level that a min-coverage check is equivalent to (Eq. L4): (1 − e)·100 % for eirp/gain
 * (the value there must reach the threshold), e·100 % for eis (the value there must not exceed it).
 * @example coverageLevelPct(0.55, 'eirp') // 45
 */
export function coverageLevelPct(minEfficiency: number, quantity: Quantity): number {
  return snap(100 * (isLowerBetter(quantity) ? minEfficiency : 1 - minEfficiency));
}
