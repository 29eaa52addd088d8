import { mean as ssMean, sampleStandardDeviation } from 'simple-statistics';
import type { BuildConfidence, UnitResult } from '../../types.js';
import { processCapability } from '../../limits/processCapability.js';

/**
 * Yield with confidence across a build: beside the count of passes, the expected number of
 * truly conforming unit results E = Σ P_i (Eq. Y1: the sum of the units' probabilities of
 * conformance — linearity of expectation) with its Monte-Carlo standard error √Σ se_i² (the
 * units' draws are independent), in total and per check and frequency; and per check the Cpk
 * against the limit the decision rule uses (the acceptance limit: the relaxed limit for
 * shared-risk, the guarded limit, the limit as written for non-binary), Eq. C1 of
 * processCapability, from the values' mean and sample standard deviation.
 * Boundary rule: null when no unit result carries a measurement uncertainty; a check's Cpk is
 * null when its acceptance limit differs between units or fewer than two values exist.
 * Cost O(units · checks).
 * @example buildConfidence(units)?.expectedConforming // e.g. 7.4 beside 9 passes
 */
export function buildConfidence(units: UnitResult[]): BuildConfidence | null {
  const withP = units.filter((u) => u.confidence);
  if (withP.length === 0) return null;
  const judged = withP.filter((u) => u.confidence!.probabilityOfConformance !== null);
  let e = 0, v = 0;
  for (const u of judged) { e += u.confidence!.probabilityOfConformance!; v += u.confidence!.probabilityStdErr! ** 2; } // Eq. (Y1)
  const groups = new Map<string, { frequencyHz: number | null; name: string; values: number[]; passes: number; count: number; p: number; limits: Set<number>; bound: 'lower' | 'upper' | null }>();
  for (const u of withP) {
    for (const c of u.checks) {
      const key = JSON.stringify([u.frequencyHz, c.name]);
      let g = groups.get(key);
      if (!g) groups.set(key, (g = { frequencyHz: u.frequencyHz, name: c.name, values: [], passes: 0, count: 0, p: 0, limits: new Set(), bound: c.bound ?? null }));
      g.count++;
      if (c.status === 'pass') g.passes++;
      g.p += c.decision?.probabilityOfConformance ?? 0;
      if (c.value !== null && c.status !== 'not-evaluable' && c.kind !== 'min-coverage') g.values.push(c.value);
      if (c.decision && c.kind !== 'min-coverage') g.limits.add(c.decision.acceptanceLimit);
    }
  }
  return {
    decisionRule: withP[0].confidence!.decisionRule,
    judged: judged.length,
    passes: judged.filter((u) => u.verdict === 'pass').length,
    expectedConforming: e,
    expectedConformingStdErr: Math.sqrt(v),
    checks: [...groups.values()].map((g) => {
      const n = g.values.length;
      const mean = n ? ssMean(g.values) : null;
      const std = n >= 2 ? sampleStandardDeviation(g.values) : null;
      const limit = g.limits.size === 1 ? [...g.limits][0] : null;
      return { frequencyHz: g.frequencyHz, name: g.name, count: g.count, passes: g.passes, expectedConforming: g.p,
        acceptanceLimit: limit, bound: g.bound, mean, std,
        cpk: limit !== null && g.bound && mean !== null ? processCapability(mean, std, limit, g.bound) : null };
    }),
  };
}
