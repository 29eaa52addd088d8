import type { Quantity } from '../types.js';
import type { UncertaintySpec } from '../analysis/uncertainty/uncertaintySpec.js';

/**
 * The data model of a limit set (the file format is described in formatLimitSet.ts and the
 * project README): a named list of checks for one quantity.
 *
 * Direction convention, fixed once: "better" is larger for eirp/gain and smaller for eis.
 * - `min-peak`, `percentile`, `min-beam-peak`: the value must be at least as good as the limit
 *   (eirp/gain: value ≥ limit; eis: value ≤ limit, so min-peak on eis means the best, i.e.
 *   lowest, EIS ≤ REFSENS).
 * - `min-coverage`: coverage efficiency at the threshold ≥ minEfficiency (any quantity).
 * - `min-relative-coverage`: coverage efficiency within dbBelowPeak dB of the TSP peak ≥ minEfficiency.
 * - `max-peak`, `max-trp`: eirp/gain only (max-trp eirp only): value ≤ limit.
 */
interface CheckCommon {
  /** Unique within the set; a default is generated from the kind when omitted. */
  name: string;
  /** Test tolerance in dB, ≥ 0. Relaxes the limit (or the threshold for min-coverage). Default 0. */
  toleranceDb: number;
  /** Where the limit comes from (standard, clause, table; or the programme's document). */
  source?: string;
}

export interface PeakCheck extends CheckCommon {
  kind: 'min-peak' | 'max-peak' | 'max-trp';
  /** dBm (eirp/eis) or dBi (gain). */
  limit: number;
}

export interface PercentileCheck extends CheckCommon {
  kind: 'percentile';
  /** CDF level in percent, 0..100 (levelPct p: p % of 4π at or below the value). */
  levelPct: number;
  limit: number;
}

export interface CoverageCheck extends CheckCommon {
  kind: 'min-coverage';
  /** Absolute threshold in the value's unit. */
  threshold: number;
  /** Required fraction of 4π at or better than the threshold, 0..1. */
  minEfficiency: number;
}

/** Coverage within a window below the TSP peak (a threshold relative to the best value). */
export interface RelativeCoverageCheck extends CheckCommon {
  kind: 'min-relative-coverage';
  /** Window in dB towards worse from the TSP peak (eirp/gain: peak − d; eis: best + d), ≥ 0. */
  dbBelowPeak: number;
  /** Required fraction of 4π within the window, 0..1. */
  minEfficiency: number;
}

export interface BeamPeakCheck extends CheckCommon {
  kind: 'min-beam-peak';
  limit: number;
  /** Beam ids to judge; all beams when omitted. */
  beams?: string[];
}

/**
 * Beam correspondence (3GPP TS 38.101-2 §6.6.4): ΔEIRP_BC = EIRP2 − EIRP1 per direction over the
 * upper topSharePct % of EIRP2 by solid angle, read at levelPct of its CDF, ≤ limit (dB). Needs
 * the unit's receive (EIS) export of the same codebook at the same frequency
 * (src/coverage/beamCorrespondence.ts, src/batch/jointChecks.ts). eirp only.
 */
export interface BeamCorrespondenceCheck extends CheckCommon {
  kind: 'beam-correspondence';
  /** Maximum ΔEIRP_BC at levelPct, dB. */
  limit: number;
  /** CDF level of ΔEIRP_BC judged, % (85 in TS 38.101-2 Table 6.6.4.2-1). */
  levelPct: number;
  /** Upper share of EIRP2 by solid angle the directions come from, % (50). */
  topSharePct: number;
}

/** One band of an inter-band combination: which measurement it is and its coverage level. */
export interface InterBandBand {
  name: string;
  frequencyRangeMHz: [number, number];
  /** The band's spherical-coverage EIRP level (its Table 6.2.1.x-3 value), dBm. */
  limit: number;
}

/**
 * Inter-band coverage (3GPP TS 38.101-2 §6.2A.1): per band the region where EIRP ≥ the band's
 * level − deltaDb (ΔT_IB,S,n); the share of 4π where both hold must reach (100 − levelPct) %.
 * Needs the unit measured in both bands (src/coverage/jointCoverage.ts). eirp only.
 */
export interface InterBandCheck extends CheckCommon {
  kind: 'inter-band-coverage';
  /** The percentile rank of the bands' spherical-coverage requirement (PC3: 50). */
  levelPct: number;
  /** ΔT_IB,S,n, dB. */
  deltaDb: number;
  bands: [InterBandBand, InterBandBand];
}

export type LimitCheck = PeakCheck | PercentileCheck | CoverageCheck | RelativeCoverageCheck | BeamPeakCheck | BeamCorrespondenceCheck | InterBandCheck;

/** A check before its name is settled (Omit distributed over the union). */
export type CheckDraft = LimitCheck extends infer C ? (C extends LimitCheck ? Omit<C, 'name'> : never) : never;

export interface LimitSet {
  name: string;
  description: string;
  source: string;
  quantity: Quantity;
  /** Operating band name, e.g. 'n257' (informative). */
  band?: string;
  /** Frequency range the set applies to, MHz [low, high] (informative; see frequencyInRange). */
  frequencyRangeMHz?: [number, number];
  checks: LimitCheck[];
  /** Measurement uncertainty and decision rule for this set (a job file's `uncertainty` wins). */
  uncertainty?: UncertaintySpec;
  /** File the set was read from (absolute path), when loaded from disk. */
  file?: string;
}

/** One shipped profile, as listed by `spherecov limits`. */
export interface ProfileInfo {
  name: string;
  description: string;
  quantity: Quantity;
  band?: string;
  checks: number;
  source: string;
  file: string;
}

