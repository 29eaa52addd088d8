/**
 * Units whose exports carry a θ/φ value pair: which measurement carries the verdict and how the
 * polarization components are judged (the reader keeps the components apart:
 * src/io/polarizationBeams.ts).
 *
 * - EIS, view 'each' (the default): each polarization gets its own total scan pattern (best beam
 *   per direction for that polarization), metrics and checks; a check passes only when it passes
 *   in both polarizations, and its value is the limiting polarization's. 3GPP TS 38.101-2 §7
 *   states the receive requirements for each of two orthogonal polarizations (reference notes
 *   "Receive requirements and polarization"; verify against the current release).
 * - EIS, view 'combined': the explicit combined-sensitivity view, 1/EIS = 1/EIS_θ + 1/EIS_φ
 *   (src/coverage/combinedSensitivity.ts), judged once; both components are still reported.
 * - EIRP/gain: the total (power sum) carries the verdict; the components are reported beside it.
 */
import type {
  CheckResult, InputError, Measurement, Polarization, PolarizationResult, PolarizationRule, TotalScanPattern, UnitResult,
} from '../types.js';
import { computeMetrics } from '../coverage/computeMetrics.js';
import { combinedSensitivityArrays } from '../coverage/combinedSensitivity.js';
import { createMeasurement } from '../measurement.js';
import { summarizeChecks } from '../limits/judge.js';
import { componentResultMetrics, metricsOfUnit } from '../metrics/catalogue.js';

/** How an EIS θ/φ pair is judged: each polarization on its own (default) or the combined-sensitivity view. */
export type EisPolarizationView = 'each' | 'combined';

export const EIS_POLARIZATION_VIEWS: readonly EisPolarizationView[] = ['each', 'combined'];

/** What to measure for one unit and frequency. */
export interface PolarizationPlan {
  /** The measurement that carries the verdict; for 'each' the θ component (replaced by the limiting one). */
  main: Measurement;
  /** The θ/φ components (empty for a single-value export). */
  components: Measurement[];
  rule: PolarizationRule | null;
}

export interface MeasuredUnit {
  m: Measurement;
  result: UnitResult;
  tsp: TotalScanPattern;
  /** Each polarization component's TSP values on its grid (for the report's per-polarization CDFs). */
  componentTsps?: ComponentTsp[];
  /** The θ/φ component measurements (for checks joining two measurements, e.g. beam correspondence). */
  components?: Measurement[];
}

export interface ComponentTsp {
  name: Polarization;
  values: Float64Array;
  weightSr: Float64Array;
}

export interface MetricSettings {
  percentilesPct: number[];
  thresholds: number[];
  relativeDb: number[];
}

const sameKey = (a: Measurement, b: Measurement): boolean =>
  a.unit === b.unit && a.frequencyHz === b.frequencyHz && a.quantity === b.quantity;
const POL_ORDER: Record<Polarization, number> = { theta: 0, phi: 1 };

/**
 * Group assembled measurements into plans, in the order of their main measurement.
 * Cost O(measurements²) (a handful per group).
 */
export function planPolarizations(ms: Measurement[], view: EisPolarizationView): { plans: PolarizationPlan[]; errors: InputError[] } {
  const plans: PolarizationPlan[] = [];
  const errors: InputError[] = [];
  const used = new Set<Measurement>();
  for (const m of ms) {
    if (used.has(m)) continue;
    const components = ms.filter((c) => c.polarization !== undefined && sameKey(c, m))
      .sort((a, b) => POL_ORDER[a.polarization as Polarization] - POL_ORDER[b.polarization as Polarization]);
    const total = m.polarization === undefined ? m : ms.find((t) => t.polarization === undefined && sameKey(t, m));
    for (const c of components) used.add(c);
    if (total) {
      used.add(total);
      plans.push({ main: total, components, rule: components.length ? 'total-power-sum' : null });
      continue;
    }
    // Components without a total: an EIS pair.
    if (view === 'combined' && components.length === 2) {
      const combined = combineSensitivity(components[0], components[1]);
      if (typeof combined === 'string') {
        errors.push({ file: components[0].sources[0]?.path ?? components[0].unit, message: `unit '${m.unit}': ${combined}; judged per polarization instead` });
      } else {
        plans.push({ main: combined, components, rule: 'combined-sensitivity' });
        continue;
      }
    }
    plans.push({ main: components[0], components, rule: 'each' });
  }
  return { plans, errors };
}

/**
 * The combined-sensitivity measurement of two EIS components (same grid, same beams), per beam
 * and direction Eq. (S1) of combinedSensitivity.ts; a plain-words reason when they cannot combine.
 */
export function combineSensitivity(theta: Measurement, phi: Measurement): Measurement | string {
  const g = theta.grid;
  const h = phi.grid;
  const sameGrid = g.thetaDeg.length === h.thetaDeg.length
    && g.thetaDeg.every((t, i) => t === h.thetaDeg[i] && g.phiDeg[i] === h.phiDeg[i]);
  if (!sameGrid) return 'the θ and φ components are on different grids, so the combined-sensitivity view cannot be formed';
  const ids = theta.beams.map((b) => b.id).join('\u0000');
  if (ids !== phi.beams.map((b) => b.id).join('\u0000')) return 'the θ and φ components have different beams, so the combined-sensitivity view cannot be formed';
  const { polarization: _p, ...rest } = theta;
  return createMeasurement({
    ...rest,
    beams: theta.beams.map((b, k) => ({ id: b.id, values: combinedSensitivityArrays(b.values, phi.beams[k].values) })), // Eq. (S1)
    sources: [...theta.sources, ...phi.sources.filter((s) => !theta.sources.some((t) => t.path === s.path))],
  });
}

/** One component's metrics, not judged (verdict on the total or the combined view), and its TSP. */
export function componentSummary(c: Measurement, settings: MetricSettings): { summary: PolarizationResult; tsp: ComponentTsp } {
  const { metrics, tsp } = computeMetrics(c, settings);
  return { tsp: { name: c.polarization as Polarization, values: tsp.values, weightSr: c.grid.weightSr }, summary: {
    name: c.polarization as Polarization,
    ...componentResultMetrics(metrics),
    checks: [],
    verdict: null,
  } };
}

/**
 * Measure one plan. `measure` is the batch's single-measurement analysis (unitTask's, which may
 * wait for the insight lane), passed in so this module does not depend on the task module; the
 * measurements are measured one after another, in plan order.
 */
export async function measurePlan(p: PolarizationPlan, settings: MetricSettings,
  measure: (m: Measurement) => Promise<{ result: UnitResult; tsp: TotalScanPattern }>): Promise<MeasuredUnit> {
  if (p.rule !== 'each') {
    const out = await measure(p.main);
    if (p.rule === null) return { m: p.main, ...out };
    const parts = p.components.map((c) => componentSummary(c, settings));
    out.result.polarizations = parts.map((x) => x.summary);
    out.result.polarizationRule = p.rule;
    out.result.limitingPolarization = null;
    return { m: p.main, ...out, componentTsps: parts.map((x) => x.tsp), components: p.components };
  }
  const each: MeasuredUnit[] = [];
  for (const c of p.components) each.push({ m: c, ...(await measure(c)) });
  return mergeEachPolarization(each);
}

/**
 * The unit result of an EIS pair judged per polarization: check k takes the limiting
 * polarization's result (a failure before a pass, not evaluable before a pass, else the smaller
 * margin), so it passes only when both pass; verdict and worst check by judge's rules; the unit's
 * TSP, beams, holes and maps are the limiting polarization's (the one of the worst check, or
 * without checks the one with the worse 50 % level).
 */
export function mergeEachPolarization(each: MeasuredUnit[]): MeasuredUnit {
  const polOf = (u: MeasuredUnit): Polarization => u.m.polarization as Polarization;
  const checks: CheckResult[] = each[0].result.checks.map((_, k) => {
    const cands = each.map((u) => ({ ...u.result.checks[k], polarization: polOf(u) }));
    return cands.reduce((a, b) => (worse(b, a) ? b : a));
  });
  const summary = summarizeChecks(checks);
  let limiting: Polarization;
  const worstName = summary.worstCheck?.name;
  const fromCheck = worstName === undefined ? undefined : checks.find((c) => c.name === worstName)?.polarization;
  if (fromCheck) limiting = fromCheck;
  else {
    const level = (u: MeasuredUnit): number => {
      const p = u.result.tsp.percentiles.find((x) => x.levelPct === 50) ?? u.result.tsp.percentiles[0];
      return p?.value ?? u.result.tsp.peak.value;
    };
    limiting = polOf(each.reduce((a, b) => (level(b) > level(a) ? b : a))); // EIS: higher is worse
  }
  const lim = each.find((u) => polOf(u) === limiting) as MeasuredUnit;
  const warnings = [...new Set(each.flatMap((u) => u.result.warnings))];
  const result: UnitResult = {
    ...lim.result,
    checks,
    verdict: summary.verdict,
    worstCheck: summary.worstCheck,
    warnings,
    polarizations: each.map((u) => ({
      name: polOf(u),
      ...componentResultMetrics(metricsOfUnit(u.result)),
      checks: u.result.checks,
      verdict: u.result.verdict,
    })),
    polarizationRule: 'each',
    limitingPolarization: limiting,
  };
  return { m: lim.m, result, tsp: lim.tsp, components: each.map((u) => u.m), componentTsps: each.map((u) => ({ name: polOf(u), values: u.tsp.values, weightSr: u.m.grid.weightSr })) };
}

/** a is a worse outcome than b for the same check: fail < not evaluable < pass, then the smaller margin. */
function worse(a: CheckResult, b: CheckResult): boolean {
  const rank = (c: CheckResult): number => (c.status === 'fail' ? 0 : c.status === 'not-evaluable' ? 1 : 2);
  if (rank(a) !== rank(b)) return rank(a) < rank(b);
  const m = (c: CheckResult): number => (c.marginDb ?? c.margin ?? Infinity);
  return m(a) < m(b);
}
