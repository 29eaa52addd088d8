/**
 * The check-kind registry: every part of a check kind in one entry, typed
 * `{ [K in CheckKind]: CheckKindDef<K> }` so that a kind cannot ship without its keys and
 * validation, the quantities it applies to, its sense (bound), what it needs computed, its
 * evaluation, its description and its default name. validateLimitSet, metricNeeds,
 * evaluateCheck, checkSense and formatLimitSet all dispatch here.
 *
 * Direction convention (limitSet.ts): "better" is larger for eirp/gain and smaller for eis
 * (src/quantity.ts owns it). A 'lower' bound passes for value ≥ limit, an 'upper' bound for
 * value ≤ limit. Coverage kinds judge a fraction of 4π (always a lower bound, margin in fraction).
 *
 * Adding a kind: its name in `CheckKind` (src/types.ts), its shape in `LimitCheck`
 * (limitSet.ts), and its entry here. Its `fields` (a zod shape of the keys a limit file writes, in
 * snake_case) are the kind's whole validation: src/config/limitSetSchema.ts builds the limit-set
 * schema and the published JSON Schema from them. See DEVELOPERS.md "How to add a check kind".
 */
import type { z } from 'zod';
import type { CheckKind, CheckResult, CoverageMetrics, Quantity } from '../types.js';
import { fraction, frequencyRangeMhz, level, num, percent, text } from '../config/fields.js';
import { zod } from '../config/zod.js';
import type { CheckDraft, LimitCheck } from './limitSet.js';
import { betterByDb, isLowerBetter, quantityLabelInText, quantityUnit, worsenedBy } from '../quantity.js';

/** The check of one kind (a shape shared by several kinds, like PeakCheck, narrowed to K). */
export type CheckOf<K extends CheckKind> = LimitCheck extends infer C ? (C extends { kind: infer CK } ? (K extends CK ? C & { kind: K } : never) : never) : never;
/** The check of one kind before its name is settled. */
export type DraftOf<K extends CheckKind> = CheckDraft extends infer C ? (C extends { kind: infer CK } ? (K extends CK ? C & { kind: K } : never) : never) : never;

/** Levels and thresholds are matched to the computed metrics within this (they are decimal inputs). */
export const MATCH_EPS = 1e-9;
/** Round to 1e-9 so that limit ± tolerance arithmetic cannot flip a verdict by float noise. */
export const snap = (x: number): number => Math.round(x * 1e9) / 1e9;

/** What the batch must compute for a check (merged over the limit set by metricNeeds). */
export interface CheckNeeds {
  percentilesPct?: number[];
  thresholds?: number[];
  /** Thresholds relative to the TSP peak, dB towards worse. */
  relativeDb?: number[];
}

/** What an evaluation found: a value (and extra fields for the result), or why it cannot be judged. */
export type Evaluation = { value: number; extra?: Partial<CheckResult> } | { notEvaluable: string; extra?: Partial<CheckResult> };

/** Everything a check kind is made of. */
export interface CheckKindDef<K extends CheckKind> {
  /**
   * The kind's own keys in a limit file (beside kind, name, tolerance_db, source), snake_case, with
   * their validation (src/config/fields.ts builders: each says what it expects). The parsed values,
   * camelized (src/config/naming.ts), are the kind's fields of `DraftOf<K>`. A function, called
   * when the limit-set schema is built (zod loads then, not with the registry).
   */
  fields: () => Record<string, z.ZodType>;
  /** The quantities the kind means something for. */
  appliesTo(q: Quantity): boolean;
  /** Which side of the limit passes. */
  bound(q: Quantity): 'lower' | 'upper';
  /** The margin's unit: dB, or a fraction of 4π (coverage kinds: the limit is the required fraction). */
  marginUnit: 'dB' | 'fraction';
  /** The number judged against (limit or required fraction). */
  limitOf(c: CheckOf<K>): number;
  /** Levels and thresholds the batch must compute so the check can be judged. */
  needs(c: CheckOf<K>, q: Quantity): CheckNeeds;
  /** The value of the check for one unit's metrics (or why it cannot be had). */
  evaluate(c: CheckOf<K>, m: CoverageMetrics, ctx: { quantity: Quantity; fullSphere: boolean; bound: 'lower' | 'upper' }): Evaluation;
  /** The rule in words (for `spherecov limits` and the reports). */
  describe(c: CheckOf<K>, q: Quantity): string;
  /** Name when the file gives none (stable: a metric key in build statistics). */
  defaultName(c: DraftOf<K>, q: Quantity): string;
}

const betterSide = (q: Quantity): 'lower' | 'upper' => (isLowerBetter(q) ? 'upper' : 'lower');
const opOf = (bound: 'lower' | 'upper'): string => (bound === 'lower' ? '≥' : '≤');
const tolText = (c: { toleranceDb: number }): string => (c.toleranceDb > 0 ? ` (test tolerance ${c.toleranceDb} dB)` : '');
const limitField = () => ({ limit: level() });

/**
 * The CDF level that a min-coverage check is equivalent to (Eq. L4): (1 − e)·100 % for eirp/gain
 * (the value there must reach the threshold), e·100 % for eis (the value there must not exceed it).
 * @example coverageLevelPct(0.55, 'eirp') // 45
 */
export function coverageLevelPct(minEfficiency: number, quantity: Quantity): number {
  return snap(100 * (isLowerBetter(quantity) ? minEfficiency : 1 - minEfficiency));
}

/** Worst judged beam (lowest peak for a lower bound, highest for an upper), or why there is none. */
function judgedBeams(m: CoverageMetrics, ids: string[] | undefined): CoverageMetrics['beams'] | string {
  const beams = ids ? ids.map((id) => m.beams.find((b) => b.id === id) ?? id) : m.beams;
  const missing = beams.filter((b): b is string => typeof b === 'string');
  if (missing.length) return `beam ${missing.join(', ')} not in the measurement`;
  if (beams.length === 0) return 'no beams';
  return beams as CoverageMetrics['beams'];
}

const BANDS = 'a list of two bands, each { name, frequency_range_mhz: [low, high], limit }';
const interBandBand = () => zod().strictObject({ name: text(), frequency_range_mhz: frequencyRangeMhz(), limit: level() }, { error: BANDS });

export const CHECK_KIND_DEFS: { [K in CheckKind]: CheckKindDef<K> } = {
  'min-peak': {
    fields: limitField, marginUnit: 'dB', limitOf: (c) => c.limit, needs: () => ({}),
    bound: betterSide,
    evaluate: (_c, m) => ({ value: m.peak.value }),
    appliesTo: () => true,
    describe: (c, q) => `best value over the sphere (TSP peak) ${opOf(betterSide(q))} ${c.limit} ${quantityUnit(q)}${tolText(c)}`,
    defaultName: (_c, q) => `peak ${quantityLabelInText(q)}`,
  },
  percentile: {
    fields: () => ({ level_pct: percent(), limit: level() }),
    appliesTo: () => true,
    bound: betterSide,
    marginUnit: 'dB',
    limitOf: (c) => c.limit,
    needs: (c) => ({ percentilesPct: [c.levelPct] }),
    evaluate: (c, m) => {
      const extra = { levelPct: c.levelPct };
      const p = m.percentiles.find((x) => Math.abs(x.levelPct - c.levelPct) < MATCH_EPS);
      if (!p) return { notEvaluable: `the ${c.levelPct} % level was not computed`, extra };
      if (p.value === null) return { notEvaluable: `the ${c.levelPct} % level falls in the unmeasured part of the sphere`, extra };
      return { value: p.value, extra };
    },
    describe: (c, q) => `TSP value at the ${c.levelPct} % CDF level ${opOf(betterSide(q))} ${c.limit} ${quantityUnit(q)}${tolText(c)}`,
    defaultName: (c, q) => `${quantityLabelInText(q)} at ${c.levelPct} %`,
  },
  'min-coverage': {
    fields: () => ({ threshold: level(), min_efficiency: fraction() }),
    appliesTo: () => true,
    bound: () => 'lower',
    marginUnit: 'fraction',
    limitOf: (c) => c.minEfficiency,
    needs: (c, q) => ({
      thresholds: [c.threshold, snap(worsenedBy(q, c.threshold, c.toleranceDb))], // Eq. L3
      percentilesPct: [coverageLevelPct(c.minEfficiency, q)], // for the check's margin in dB (Eq. L4)
    }),
    evaluate: (c, m, { quantity }) => {
      const unit = quantityUnit(quantity);
      const tol = c.toleranceDb;
      const t = snap(worsenedBy(quantity, c.threshold, tol)); // Eq. L3
      const extra: Partial<CheckResult> = { threshold: t };
      const found = m.coverage.find((x) => Math.abs(x.threshold - t) < MATCH_EPS) ?? m.curve.find((x) => Math.abs(x.threshold - t) < MATCH_EPS);
      if (!found) return { notEvaluable: `coverage at ${t} ${unit} was not computed`, extra };
      if (tol > 0) extra.note = `threshold ${c.threshold} ${unit} relaxed by ${tol} dB to ${t} ${unit}`;
      // Coverage ≥ e at t ⇔ the value at CDF level (1 − e) reaches t (eirp/gain); for eis the value
      // at level e stays at or below t (Eq. L4; equal up to the step of the CDF at the boundary).
      const level = coverageLevelPct(c.minEfficiency, quantity);
      const v = m.percentiles.find((x) => Math.abs(x.levelPct - level) < MATCH_EPS)?.value ?? null;
      extra.marginDb = v === null ? null : snap(betterByDb(quantity, v, t)); // Eq. L4
      return { value: found.efficiency, extra };
    },
    describe: (c, q) => {
      const u = quantityUnit(q);
      const relax = c.toleranceDb > 0
        ? ` (threshold relaxed by the ${c.toleranceDb} dB test tolerance to ${worsenedBy(q, c.threshold, c.toleranceDb)} ${u})`
        : '';
      return `share of 4π with TSP ${isLowerBetter(q) ? '≤' : '≥'} ${c.threshold} ${u} ≥ ${(c.minEfficiency * 100).toFixed(1)} %${relax}`;
    },
    defaultName: (c, q) => `coverage at ${c.threshold} ${quantityUnit(q)}`,
  },
  'min-relative-coverage': {
    fields: () => ({
      db_below_peak: num('dB below the TSP peak between 0 and 100 (3 = within 3 dB of the best value)', 0, 100),
      min_efficiency: fraction(),
    }),
    appliesTo: () => true,
    bound: () => 'lower',
    marginUnit: 'fraction',
    limitOf: (c) => c.minEfficiency,
    // The tolerance widens the window: the threshold moves d + tol dB from the best value (as Eq. L3).
    needs: (c) => ({ relativeDb: [c.dbBelowPeak, snap(c.dbBelowPeak + c.toleranceDb)] }),
    evaluate: (c, m, { quantity }) => {
      const d = snap(c.dbBelowPeak + c.toleranceDb);
      const found = m.relativeCoverage.find((x) => Math.abs(x.dbBelowPeak - d) < MATCH_EPS);
      const extra: Partial<CheckResult> = {};
      if (!found) return { notEvaluable: `coverage within ${d} dB of the peak was not computed` };
      extra.threshold = snap(found.threshold);
      if (c.toleranceDb > 0) extra.note = `window ${c.dbBelowPeak} dB widened by the ${c.toleranceDb} dB tolerance to ${d} dB (threshold ${extra.threshold} ${quantityUnit(quantity)})`;
      return { value: found.efficiency, extra };
    },
    describe: (c, q) => `share of 4π with TSP within ${c.dbBelowPeak} dB of the ${isLowerBetter(q) ? 'best (lowest) EIS' : 'TSP peak'} ≥ ${(c.minEfficiency * 100).toFixed(1)} %${tolText(c)}`,
    defaultName: (c) => `coverage within ${c.dbBelowPeak} dB of peak`,
  },
  'min-beam-peak': {
    fields: () => ({
      limit: level(),
      beams: zod().array(zod().union([zod().string(), zod().number()], { error: 'a beam id' }), { error: 'a non-empty list of beam ids' })
        .min(1, { error: 'a non-empty list of beam ids' }).transform((b) => b.map(String)).optional(),
    }),
    appliesTo: () => true,
    bound: betterSide,
    marginUnit: 'dB',
    limitOf: (c) => c.limit,
    needs: () => ({}),
    evaluate: (c, m, { bound }) => {
      const beams = judgedBeams(m, c.beams);
      if (typeof beams === 'string') return { notEvaluable: beams };
      // The worst beam peak decides: lowest for eirp/gain, highest for eis.
      const worse = (a: number, b: number): boolean => (bound === 'lower' ? a < b : a > b);
      const worst = beams.reduce((a, b) => (worse(b.peak.value, a.peak.value) ? b : a));
      return { value: worst.peak.value, extra: { beam: worst.id } };
    },
    describe: (c, q) => `peak of ${c.beams ? `beams ${c.beams.join(', ')}` : 'every beam'} ${opOf(betterSide(q))} ${c.limit} ${quantityUnit(q)}${tolText(c)}`,
    defaultName: (_c, q) => `beam peak ${quantityLabelInText(q)}`,
  },
  'max-trp': {
    fields: limitField, marginUnit: 'dB', limitOf: (c) => c.limit, needs: () => ({}),
    // TRP of a gain pattern is a mean gain (not a power), and EIS has no TRP: eirp only.
    appliesTo: (q) => q === 'eirp',
    bound: () => 'upper',
    evaluate: (_c, m, { fullSphere }) => {
      const beams = judgedBeams(m, undefined);
      if (typeof beams === 'string') return { notEvaluable: beams };
      if (!fullSphere || beams.some((b) => b.trpDbm === null)) return { notEvaluable: 'TRP needs a full-sphere measurement' };
      const worst = beams.reduce((a, b) => ((b.trpDbm as number) > (a.trpDbm as number) ? b : a));
      return { value: worst.trpDbm as number, extra: { beam: worst.id } };
    },
    describe: (c) => `TRP of every beam ≤ ${c.limit} dBm (full sphere only)${tolText(c)}`,
    defaultName: () => 'max TRP',
  },
  'max-peak': {
    fields: limitField, marginUnit: 'dB', limitOf: (c) => c.limit, needs: () => ({}),
    bound: () => 'upper',
    evaluate: (_c, m) => ({ value: m.peak.value }),
    // A maximum EIRP has no EIS meaning.
    appliesTo: (q) => !isLowerBetter(q),
    describe: (c, q) => `maximum over the sphere (TSP peak) ≤ ${c.limit} ${quantityUnit(q)}${tolText(c)}`,
    defaultName: (_c, q) => `max ${quantityLabelInText(q)}`,
  },
  // Checks joining two measurements of a unit: one measurement's metrics cannot judge them, so they
  // start not evaluable here and src/batch/jointChecks.ts judges them once the partner is found.
  'beam-correspondence': {
    fields: () => ({
      limit: num('a maximum ΔEIRP_BC in dB', 0, 100),
      level_pct: percent().default(85),
      top_share_pct: num('a share of the sphere in percent between 1 and 100', 1, 100).default(50),
    }),
    appliesTo: (q) => q === 'eirp',
    bound: () => 'upper',
    marginUnit: 'dB',
    limitOf: (c) => c.limit,
    needs: () => ({}),
    evaluate: (c) => ({ notEvaluable: 'needs the receive (EIS) export of this unit at this frequency, with the same beam ids', extra: { levelPct: c.levelPct } }),
    describe: (c) => `ΔEIRP_BC (best EIRP minus the EIRP of the beam chosen from the receive side) at the ${c.levelPct} % level over the upper ${c.topSharePct} % of the TSP ≤ ${c.limit} dB${tolText(c)} (needs the unit's EIS export)`,
    defaultName: (c) => `beam correspondence ΔEIRP_BC at ${c.levelPct} %`,
  },
  'inter-band-coverage': {
    fields: () => ({
      level_pct: percent('the percentile rank in percent between 0 and 100'),
      delta_db: num('ΔT_IB,S,n in dB between 0 and 30', 0, 30),
      bands: zod().tuple([interBandBand(), interBandBand()], { error: BANDS }),
    }),
    appliesTo: (q) => q === 'eirp',
    bound: () => 'lower',
    marginUnit: 'fraction',
    limitOf: (c) => snap(1 - c.levelPct / 100),
    needs: () => ({}),
    evaluate: (c) => ({ notEvaluable: `needs this unit measured in both ${c.bands.map((b) => b.name).join(' and ')}`, extra: { levelPct: c.levelPct } }),
    describe: (c) => `share of 4π where ${c.bands.map((b) => `${b.name} EIRP ≥ ${b.limit} − ${c.deltaDb} dB`).join(' and ')} ≥ ${100 - c.levelPct} %${tolText(c)} (needs both bands measured)`,
    defaultName: (c) => `inter-band coverage ${c.bands.map((b) => b.name).join('+')}`,
  },
};

/** Every check kind, in listing order. */
export const CHECK_KINDS = Object.keys(CHECK_KIND_DEFS) as CheckKind[];

/** The registry entry of a check's kind (typed for that check). */
export function kindDef<K extends CheckKind>(kind: K): CheckKindDef<K> {
  return CHECK_KIND_DEFS[kind] as CheckKindDef<K>;
}
