import { lazySchema, zod } from './zod.js';
import { QUANTITIES } from '../quantity.js';
import { DECISION_RULES, K95, type UncertaintySpec } from '../analysis/uncertainty/uncertaintySpec.js';
import type { DecisionRule } from '../types.js';
import { num, oneOf, whole } from './fields.js';

const quantityBlock = () => zod().strictObject({
  expanded_db: num('the expanded uncertainty U (95 %) in dB, between 0 and 30', 0, 30)
    .describe('Expanded uncertainty U at 95 % (k = 1.96, normal model) of the whole measurement, dB'),
  per_direction_db: num('the per-direction standard uncertainty u_r in dB, between 0 and 30', 0, 30)
    .describe('Standard uncertainty u_r of the part independent from direction to direction, dB'),
}, { error: 'a mapping {expanded_db, per_direction_db}' }).optional();

/**
 * The `uncertainty:` block of a job file or limit set (one schema for both; see
 * src/analysis/uncertainty/uncertaintySpec.ts for what the numbers mean). Strict: the decision
 * rule must be named (no silent default), every quantity block gives U and u_r, u_r ≤ U/1.96.
 */
export const uncertaintySchema = lazySchema(() => zod().strictObject({
  decision_rule: oneOf(DECISION_RULES as unknown as [DecisionRule, ...DecisionRule[]]),
  guard_band_db: num('a guard band in dB between 0 and 30', 0, 30).optional(),
  draws: whole('a whole number of Monte-Carlo draws between 20 and 1000000', 20, 1e6).optional(),
  seed: whole('a whole-number seed between 0 and 4294967295', 0, 2 ** 32 - 1).optional(),
  power_class: whole('a 3GPP FR2 power class 1 to 7', 1, 7).optional(),
  eirp: quantityBlock(),
  eis: quantityBlock(),
  gain: quantityBlock(),
}, { error: 'a mapping with decision_rule and per-quantity uncertainties (eirp: {expanded_db, per_direction_db})' })
  .superRefine((u, ctx) => {
    if (u.guard_band_db !== undefined && u.decision_rule !== 'guarded') {
      ctx.addIssue({ code: 'custom', path: ['guard_band_db'], message: 'no guard band unless decision_rule is guarded' });
    }
    for (const q of QUANTITIES) {
      const b = u[q];
      if (b && b.per_direction_db > b.expanded_db / K95 + 1e-12) {
        ctx.addIssue({ code: 'custom', path: [q, 'per_direction_db'],
          message: `at most U/1.96 = ${+(b.expanded_db / K95).toFixed(4)} dB (the per-direction part cannot exceed the whole)` });
      }
    }
    if (!QUANTITIES.some((q) => u[q])) {
      ctx.addIssue({ code: 'custom', path: [], params: { found: u }, message: 'at least one of eirp, eis, gain with {expanded_db, per_direction_db}' });
    }
  })
  .transform((u): UncertaintySpec => {
    // Key order as results.json's settings.uncertainty has always written it.
    const spec: UncertaintySpec = { decisionRule: u.decision_rule, quantities: {} };
    if (u.guard_band_db !== undefined) spec.guardBandDb = u.guard_band_db;
    if (u.draws !== undefined) spec.draws = u.draws;
    if (u.seed !== undefined) spec.seed = u.seed;
    if (u.power_class !== undefined) spec.powerClass = u.power_class;
    for (const q of QUANTITIES) {
      const b = u[q];
      if (b) spec.quantities[q] = { expandedDb: b.expanded_db, perDirectionDb: b.per_direction_db };
    }
    return spec;
  }));
