import type { LimitCheck, LimitSet } from './limitSet.js';

/**
 * A profile plus a programme's own checks (e.g. from a job file's `limits.extraChecks`, validated
 * with validateExtraChecks). An extra check whose name equals a profile check's name replaces it in
 * place (a programme tightening a limit or adding its tolerance); the others are appended in
 * order. The base set is not modified.
 *
 * Cost O(checks²) (a handful of checks).
 * @example mergeLimitSets(profile, [{ kind: 'min-peak', name: 'peak EIRP', limit: 24, toleranceDb: 1 }])
 */
export function mergeLimitSets(base: LimitSet, extraChecks: LimitCheck[]): LimitSet {
  const checks = base.checks.map((c) => extraChecks.find((e) => e.name === c.name) ?? c);
  for (const e of extraChecks) if (!base.checks.some((c) => c.name === e.name)) checks.push(e);
  const replaced = extraChecks.length - (checks.length - base.checks.length);
  return {
    ...base,
    name: extraChecks.length ? `${base.name} + programme checks` : base.name,
    description: extraChecks.length
      ? `${base.description}${base.description ? ' ' : ''}(${extraChecks.length} programme check(s) added, ${replaced} of them replacing a profile check of the same name.)`
      : base.description,
    checks,
  };
}
