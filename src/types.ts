/**
 * Core types shared by every pipeline stage (see DESIGN.md, "Core types").
 *
 * Conventions, fixed once for the whole code base:
 * - angles in degrees, θ from +z in [0, 180], φ in [0, 360);
 * - values in dB (dBm for eirp/eis, dBi for gain); linear views are derived, never stored;
 * - solid angles in steradians; every fraction of the sphere is relative to 4π.
 */

import type { Quantity, ValueUnit } from './quantity.js';

/** The quantity and its unit are owned by src/quantity.ts (list, unit, label, sense, resolution order). */
export type { Quantity, ValueUnit };

export type GridKind = 'regular' | 'scattered';

/**
 * One polarization component of a θ/φ value pair. EIS components are judged each on its own
 * (3GPP TS 38.101-2 §7: receive requirements hold in each of two orthogonal polarizations);
 * EIRP/gain components are reported beside the total (power sum), which carries the verdict.
 */
export type Polarization = 'theta' | 'phi';

/** A direction on the unit sphere, θ ∈ [0, 180], φ ∈ [0, 360). */
export interface Direction {
  thetaDeg: number;
  phiDeg: number;
}

/** Structure of a regular (θ-row × φ-column) grid, kept for bilinear resampling and neighbours. */
export interface RegularLayout {
  /** Distinct θ rows, ascending (poles included when measured). */
  thetaRowsDeg: Float64Array;
  /** Distinct φ columns in [0, 360), ascending. */
  phiColsDeg: Float64Array;
  /**
   * Grid point index of (row r, column c): rowStart[r] + c for ordinary rows; a pole row
   * (θ = 0 or 180) holds one merged point, so rowLength[r] = 1 there.
   */
  rowStart: Int32Array;
  rowLength: Int32Array;
  /** True when the φ columns cover the whole circle (the φ seam wraps). */
  phiWraps: boolean;
}

/** The sampled sphere shared by every beam of one measurement. Point order is canonical (θ, then φ). */
export interface SphereGrid {
  kind: GridKind;
  thetaDeg: Float64Array;
  phiDeg: Float64Array;
  /** Solid angle each point stands for, sr. */
  weightSr: Float64Array;
  /** Σ weightSr (compensated sum): 4π for a full sphere. */
  solidAngleSr: number;
  /** Present when kind === 'regular'. */
  regular: RegularLayout | null;
  /**
   * Regions the scan leaves unmeasured (src/sphere/unmeasuredRule.ts): empty when the points
   * cover the whole sphere. Σ solidAngleSr = 4π − Σ weightSr. Absent on hand-built grids.
   */
  unmeasured?: UnmeasuredRegion[];
  /** Lattice points of a regular grid that were not measured and were absorbed by neighbours. */
  missing?: MissingSample[];
}

/** A part of the sphere that the scan does not measure (empty cap, cut θ range, φ wedge, missing block). */
export interface UnmeasuredRegion {
  /** Unmeasured solid angle, sr. */
  solidAngleSr: number;
  /** Centre of the region (weighted by the empty caps that make it up). */
  centre: Direction;
  /** Largest angle from the centre to the region's edge, degrees. */
  radiusDeg: number;
  /** θ span of the region, degrees. */
  thetaRangeDeg: [number, number];
  /** φ span, degrees, counter-clockwise from the first to the second value (the second may be smaller: it wraps); [0, 360] for all φ. */
  phiRangeDeg: [number, number];
}

/** A lattice point of a regular grid without a sample, absorbed by its measured neighbours. */
export interface MissingSample extends Direction {
  /** Exact cell solid angle the neighbours absorbed, sr. */
  absorbedSr: number;
}

/** One beam of the codebook on the measurement's grid. */
export interface BeamPattern {
  id: string;
  /** dB values, one per grid point (same order as the grid). */
  values: Float64Array;
}

export interface SourceFile {
  /** Path relative to the analyzed input. */
  path: string;
  sha256: string;
}

/** Catalogue of warning codes; each has its text and remedy in src/warnings.ts. */
export type WarningCode =
  | 'duplicate-merged'
  | 'duplicate-differs'
  | 'beam-resampled'
  | 'partial-sphere'
  | 'missing-points'
  | 'column-ignored'
  | 'unit-converted'
  | 'quantity-assumed'
  | 'frequency-missing'
  | 'calibration-applied'
  | 'trp-partial-sphere'
  | 'few-points'
  | 'beam-never-best'
  | 'identity-from-path'
  | 'angle-convention'
  | 'scattered-grid'
  | 'frequency-unit-assumed'
  | 'dropout-samples'
  | 'grid-below-pc3-minimum'
  | 'grid-pc1-systematic-error';

export interface Warning {
  code: WarningCode;
  message: string;
  file?: string;
  line?: number;
}

/** An input problem: a value, never an exception. `line` is the 1-based physical line. */
export interface InputError {
  file: string;
  line?: number;
  column?: number;
  columnName?: string;
  message: string;
}

/** One unit at one frequency, normalized: the only thing downstream stages see. */
export interface Measurement {
  unit: string;
  frequencyHz: number | null;
  quantity: Quantity;
  valueUnit: ValueUnit;
  grid: SphereGrid;
  beams: BeamPattern[];
  sources: SourceFile[];
  warnings: Warning[];
  metadata: Record<string, string>;
  /** Raw samples per beam merged into another sample's grid point (φ seam, poles, repeated rows). */
  mergedSamples?: number;
  /** Set when this measurement is one polarization component of a θ/φ pair (not the total). */
  polarization?: Polarization;
}

/** Total scan pattern: per grid point the best beam's value and that beam's index. */
export interface TotalScanPattern {
  values: Float64Array;
  bestBeam: Int32Array;
}

export interface PeakValue extends Direction {
  value: number;
}

/** value is null when the level is not evaluable (it falls in the unmeasured part of 4π). */
export interface PercentileValue {
  levelPct: number;
  value: number | null;
}

export interface CoveragePoint {
  /** Absolute threshold in the value's unit. */
  threshold: number;
  /** Fraction of 4π at or better than the threshold. */
  efficiency: number;
}

export interface RelativeCoveragePoint extends CoveragePoint {
  /** Threshold expressed as dB below the TSP peak (positive number). */
  dbBelowPeak: number;
}

export interface BeamMetrics {
  id: string;
  peak: PeakValue;
  /** null unless the grid covers the full sphere. For eirp: dBm; gain: dBi (efficiency-weighted mean gain); eis: null. */
  trpDbm: number | null;
  /** Fraction of 4π where this beam is the best one. */
  bestShare: number;
  /** Main-lobe pointing direction, finer than the grid (−3 dB centroid; src/coverage/beamPointing.ts). */
  pointing?: Direction;
}

/** A CDF level and the value a requirement asks it to reach (limits/impliedChoices.ts percentileLimit). */
export interface LevelLimit {
  levelPct: number;
  /** The level's limit as written, in the value unit (dBm, dBi). */
  threshold: number;
}

/** Coverage efficiency at the value a limit set's percentile check asks its level to reach. */
export interface LevelLimitCoverage extends LevelLimit {
  /** Fraction of 4π at or better than `threshold` (coverageEfficiency). */
  efficiency: number;
}

export interface CoverageMetrics {
  peak: PeakValue;
  percentiles: PercentileValue[];
  coverage: CoveragePoint[];
  relativeCoverage: RelativeCoveragePoint[];
  /** Coverage efficiency at the limit set's percentile limit; absent without a percentile check. */
  coverageAtLevelLimit?: LevelLimitCoverage;
  /** The whole coverage-efficiency curve, thresholds ascending. */
  curve: CoveragePoint[];
  solidAngleSr: number;
  beams: BeamMetrics[];
}

export type CheckKind =
  | 'min-peak'
  | 'percentile'
  | 'min-coverage'
  | 'min-relative-coverage'
  | 'min-beam-peak'
  | 'max-trp'
  | 'max-peak'
  | 'beam-correspondence'
  | 'inter-band-coverage';

export type CheckStatus = 'pass' | 'fail' | 'not-evaluable';

/** One judged check. margin > 0 means better than the (tolerance-relaxed) limit. */
export interface CheckResult {
  name: string;
  kind: CheckKind;
  value: number | null;
  limit: number;
  toleranceDb: number;
  /** The limit relaxed by the test tolerance, as used for the verdict. */
  effectiveLimit: number;
  margin: number | null;
  pass: boolean | null;
  status: CheckStatus;
  /** Why a check is not evaluable, or where its limit comes from. */
  note?: string;
  source?: string;
  /** 'lower': the value must be at or above the limit; 'upper': at or below (set by src/limits). */
  bound?: 'lower' | 'upper';
  /** Unit of value, limit and margin: dB (dBm/dBi) for most checks, 'fraction' of 4π for min-coverage. */
  marginUnit?: 'dB' | 'fraction';
  /**
   * min-coverage only: the same margin in dB, i.e. how far the threshold could move before the
   * efficiency falls to the minimum (the TSP value at the matching CDF level minus the relaxed
   * threshold); null when that level was not computed. Lets coverage checks be ranked with dB checks.
   */
  marginDb?: number | null;
  /** percentile checks: the CDF level judged. */
  levelPct?: number;
  /** min-coverage checks: the threshold actually used (the written one relaxed by the tolerance). */
  threshold?: number;
  /** min-beam-peak checks: the beam that set the value (the worst one judged). */
  beam?: string;
  /** EIS judged per polarization: the polarization whose result this is (the limiting one). */
  polarization?: Polarization;
  /** How sure the verdict is: present when a measurement uncertainty is given (src/analysis/uncertainty). */
  decision?: CheckDecision;
}

/** ILAC-G8:09/2019 §4.2.3 statements; the binary rules give 'pass' or 'fail'. */
export type ConformityStatement = 'pass' | 'conditional pass' | 'conditional fail' | 'fail';

/** The decision rule applied to one check, and the probability that the unit truly meets it. */
export interface CheckDecision {
  rule: 'shared-risk' | 'guarded' | 'non-binary';
  /** What the measured value was compared with (the check's unit; min-coverage: the efficiency). */
  acceptanceLimit: number;
  /** guarded: the guard band w, dB; null for the other rules. */
  guardBandDb: number | null;
  /** null when the check is not evaluable. */
  statement: ConformityStatement | null;
  /** P(true value meets the limit as written | measurement), Monte-Carlo; null when not evaluable. */
  probabilityOfConformance: number | null;
  /** Binomial standard error of that probability (its own sampling error). */
  probabilityStdErr: number | null;
  /** Standard deviation of the check value over the draws (its propagated standard uncertainty). */
  valueStdDev: number | null;
  /** Mean shift of the re-read value over the draws (max-over-noisy-beams bias; same unit). */
  bias: number | null;
}

/** How a measured value is turned into a verdict (ILAC-G8:09/2019 §4.2; 3GPP TS 38.101-2 §4.1). */
export type DecisionRule = 'shared-risk' | 'guarded' | 'non-binary';

/** A measurement uncertainty resolved for one quantity: the numbers the computations use. */
export interface ResolvedUncertainty {
  decisionRule: DecisionRule;
  /** U (95 %), dB. */
  expandedDb: number;
  /** u_c: standard uncertainty common to every direction of a unit (calibration, reference gain), dB. */
  commonDb: number;
  /** u_r: standard uncertainty independent per direction, dB. */
  perDirectionDb: number;
  /** w, dB (guarded); U for the other rules, where it sets the non-binary zones. */
  guardBandDb: number;
  draws: number;
  seed: number;
}

/** Measurement-uncertainty summary of one unit (present when an uncertainty is given): the resolved numbers, then the results. */
export interface UnitConfidence extends ResolvedUncertainty {
  /** P(every check truly met), Monte-Carlo (joint over the checks); null without checks or with one not evaluable. */
  probabilityOfConformance: number | null;
  probabilityStdErr: number | null;
  /** Worst statement over the checks (non-binary rule), or pass/fail; null without checks. */
  statement: ConformityStatement | null;
  /** Per reported percentile: bias (mean shift of the re-read value) and spread; 95 % band of the bias-corrected value. */
  percentiles: { levelPct: number; value: number | null; biasDb: number | null; stdDevDb: number | null; low95: number | null; high95: number | null }[];
  coverage: { threshold: number; efficiency: number; bias: number | null; stdDev: number | null }[];
  /** Candidate (direction, beam) pairs drawn per trial (the cost driver). */
  pairsPerDraw: number;
  /** The 95 % band of the bias-corrected CDF at evenly spaced levels (for the report's band). */
  band: { levelPct: number; low95: number | null; high95: number | null }[];
}

/** Grid sufficiency of one unit, from re-reading it on sub-grids of itself (src/analysis/gridAdequacy). */
export interface GridAdequacy {
  /** 'four 2Δ sub-grids' (regular) or 'four thinned quarter sets' (scattered); null when the grid is too small. */
  method: string;
  /** Calibration factor applied to the sub-grid spread (see README, "How sure is the verdict"). */
  calibrationFactor: number;
  percentiles: { levelPct: number; adequacyDb: number | null; subGridSpreadDb: number | null; at1p5StepDb: number | null; at2StepDb: number | null }[];
  coverage: { threshold: number; adequacy: number | null; subGridSpread: number | null }[];
  /** Share of the points (test time) a grid 1.5× and 2× coarser would save. */
  coarser: { stepFactor: number; pointsSavedShare: number }[];
}

/** pass: every check evaluated and passed; fail: any failed; none: no limits, or some not evaluable. */
export type Verdict = 'pass' | 'fail' | 'none';

/**
 * How the polarization components of a θ/φ value pair enter the verdict:
 * - 'each': EIS, each polarization judged on its own; a check passes only when both pass;
 * - 'combined-sensitivity': EIS, the explicit combined view 1/EIS = 1/EIS_θ + 1/EIS_φ (linear);
 * - 'total-power-sum': EIRP/gain, the total 10·log10(10^(θ/10) + 10^(φ/10)) carries the verdict.
 */
export type PolarizationRule = 'each' | 'combined-sensitivity' | 'total-power-sum';

/** One polarization component of a unit: its own TSP (best beam per direction for it) and, for EIS, its own checks. */
export interface PolarizationResult {
  name: Polarization;
  tsp: {
    peak: PeakValue;
    percentiles: PercentileValue[];
    coverage: CoveragePoint[];
    relativeCoverage: RelativeCoveragePoint[];
  };
  beams: { id: string; peak: PeakValue; bestShare: number }[];
  /** Checks judged on this polarization alone ('each'); [] where the verdict is on the total or the combined view. */
  checks: CheckResult[];
  /** This polarization's own verdict ('each'); null where it is not judged on its own. */
  verdict: Verdict | null;
}

/** Grid facts reported with every unit (data quality section of the report). */
export interface GridSummary {
  kind: GridKind;
  points: number;
  thetaRangeDeg: [number, number];
  phiRangeDeg: [number, number];
  /** Step when uniform, else null (non-uniform or scattered). */
  thetaStepDeg: number | null;
  phiStepDeg: number | null;
  fullSphere: boolean;
  /** Σ weights, sr (4π for a full sphere). */
  solidAngleSr: number;
  /** The unmeasured regions (empty for a full sphere; always set by gridSummary). */
  unmeasured?: UnmeasuredRegion[];
  /** Lattice points without a sample that neighbours absorbed (always set by gridSummary). */
  missing?: MissingSample[];
  /** Raw samples per beam merged into another sample's point (φ seam, poles, repeated rows). */
  duplicatesMerged: number;
  beamsResampled: number;
}

/** Coverage holes, beam removal, subset, reference and frequency trend (issue 9). */
export interface CoverageHole extends Direction {
  solidAngleSr: number;
  worst: number;
  nearestBeam: string;
}

/**
 * The one coverage threshold of a unit's analysis (src/limits/impliedChoices.ts): the coverage
 * holes are found at it and the report's map contour is drawn at it, so both say the same thing.
 */
export interface AnalysisThreshold {
  /** The threshold in the value unit (dBm, dBi). */
  value: number;
  /** Where it comes from: the limit set's first min-coverage check, else its first percentile check's limit, else the first requested coverage threshold. */
  source: 'min-coverage-check' | 'percentile-check' | 'requested';
  /** Whether the checks' test tolerance relaxes it (today never: the requirement as written). */
  toleranceApplied: boolean;
}

export interface BeamRemoval {
  percentileLossDb: number | null;
  coverageLoss: number | null;
}

export interface BeamSubset {
  levelPct: number;
  toleranceDb: number;
  beams: string[];
  curve: { count: number; value: number | null }[];
}

/** One entry of results.json `units` (CONTRACT.md fields first, extras after). */
export interface UnitResult {
  /** Unit name in Unicode NFC form (names that differ only in normalization are one unit). */
  unit: string;
  /**
   * The unit's name exactly as the files wrote it, when that differs from `unit` (another
   * Unicode normalization form): every distinct spelling, sorted. Absent otherwise.
   */
  unitAsWritten?: string[];
  frequencyHz: number | null;
  quantity: Quantity;
  valueUnit: ValueUnit;
  solidAngleSr: number;
  beams: (BeamMetrics & { removal?: BeamRemoval; neverBest?: boolean })[];
  tsp: {
    peak: PeakValue;
    percentiles: PercentileValue[];
    coverage: CoveragePoint[];
    relativeCoverage: RelativeCoveragePoint[];
    /** Coverage efficiency at the limit set's percentile limit; absent without a percentile check. */
    coverageAtLevelLimit?: LevelLimitCoverage;
    curve: CoveragePoint[];
  };
  checks: CheckResult[];
  verdict: Verdict;
  worstCheck: { name: string; margin: number; marginUnit?: 'dB' | 'fraction'; marginDb?: number | null } | null;
  warnings: string[];
  grid: GridSummary;
  sources: SourceFile[];
  limitSet: { name: string; source: string } | null;
  /** The threshold the holes below were found at and the map contour is drawn at; null: none in this run. */
  analysisThreshold?: AnalysisThreshold | null;
  holes?: CoverageHole[];
  subset?: BeamSubset | null;
  reference?: { unit: string; deltas: Record<string, number | null> } | null;
  frequencyTrend?: ({ frequencyHz: number } & Record<string, number | null>)[] | null;
  /** Measurement uncertainty and decision rule (issue 17); absent when no uncertainty is given. */
  confidence?: UnitConfidence | null;
  /** Grid sufficiency estimate (issue 17). */
  gridAdequacy?: GridAdequacy | null;
  /** Beam correspondence (3GPP TS 38.101-2 §6.6.4), when a beam-correspondence check found the unit's EIS export. */
  beamCorrespondence?: {
    levelPct: number;
    topSharePct: number;
    /** ΔEIRP_BC at levelPct over the region, dB. */
    valueDb: number;
    /** Solid angle of the upper topSharePct % of EIRP2, sr, and the EIRP2 value at its boundary, dBm. */
    regionSr: number;
    regionFloorDbm: number | null;
    /** What the receive beam choice was made from. */
    rxChoiceBasis: 'eis' | 'combined-sensitivity';
    resampled: boolean;
    /** Share of the region where the receive choice is not the best transmit beam (ΔEIRP_BC > 0). */
    otherBeamShareOfRegion: number;
    /** CDF of ΔEIRP_BC over the region (fractions of the region's solid angle), at most ~200 points. */
    cdf: { valuesDb: number[]; fractions: number[] };
  } | null;
  /** Inter-band coverage (3GPP TS 38.101-2 §6.2A.1), when an inter-band check found both bands. */
  interBand?: {
    bands: { name: string; frequencyHz: number; levelDbm: number; share: number }[];
    jointShare: number;
    requiredShare: number;
    resampled: boolean;
  } | null;
  /** θ/φ value pairs: each component's metrics (and, for EIS, its checks). */
  polarizations?: PolarizationResult[];
  /** How the components enter the verdict (set with `polarizations`). */
  polarizationRule?: PolarizationRule;
  /**
   * 'each': the polarization that limits the unit (its TSP, beams and checks are the unit's
   * top-level `tsp`, `beams`, maps and CDF); null otherwise.
   */
  limitingPolarization?: Polarization | null;
  /** Per beam, how far its peak direction moves across the measured frequencies (issue 9). */
  pointingDrift?: { beam: string; driftDeg: number; flagged: boolean; betweenHz: [number, number] | null }[] | null;
}

/** Per frequency, quantity and metric across the units of a build. */
export interface BuildMetricStats {
  frequencyHz: number | null;
  /** The quantity of the units pooled in this row (EIRP and EIS results are never pooled). */
  quantity: Quantity;
  metric: string;
  /** What mean/std/min/max/limits are in: dB (dBm, dBi, dB margins) or a fraction of 4π. */
  valueKind?: 'dB' | 'fraction';
  count: number;
  mean: number | null;
  std: number | null;
  min: number | null;
  max: number | null;
  /** Share of units whose check on this metric passes (of `judged`); null when the metric has no limit. */
  yield: number | null;
  /** Check rows: units that passed, units that carry the check (the yield's denominator), and
   * units in the build at this frequency (judged + not evaluable + could not be read). */
  passedCount?: number | null;
  judged?: number | null;
  inBuild?: number | null;
  /** Check rows: passed / inBuild, so that a unit that could not be read lowers the yield. */
  yieldInBuild?: number | null;
  lowerLimit: number | null;
  upperLimit: number | null;
  cpk: number | null;
}

export interface BuildSummary {
  /** Distinct units with at least one analyzed result (units[]). */
  units: number;
  /** Distinct units in the build: analyzed ones plus those that could not be read or analyzed. */
  unitsInBuild: number;
  passed: number;
  failed: number;
  notJudged: number;
  /** Distinct units with at least one part that could not be read or analyzed (verdict "error"). */
  errored: number;
  stats: BuildMetricStats[];
  /** Yield with confidence (issue 17); present when the units carry a measurement uncertainty. */
  confidence?: BuildConfidence | null;
}

/** Build-level confidence: expected conforming units beside the count of passes, Cpk against the decision rule's limit. */
export interface BuildConfidence {
  decisionRule: 'shared-risk' | 'guarded' | 'non-binary';
  /** Unit results (unit × frequency) with a probability of conformance. */
  judged: number;
  passes: number;
  /** Σ P(conformance) over those unit results. */
  expectedConforming: number;
  /** Its Monte-Carlo standard error: √Σ se². */
  expectedConformingStdErr: number;
  checks: { frequencyHz: number | null; name: string; count: number; passes: number; expectedConforming: number;
    acceptanceLimit: number | null; bound: 'lower' | 'upper' | null; mean: number | null; std: number | null; cpk: number | null }[];
}

/**
 * A unit (or one frequency of it) that could not be read or analyzed: results.json
 * `unitsNotAnalyzed`, a row with verdict "error" in every output, never silently left out.
 */
export interface UnitNotAnalyzed {
  unit: string;
  /** The frequency when the unit was read but could not be assembled there; else null (unknown). */
  frequencyHz: number | null;
  verdict: 'error';
  /** The first input error of this unit (file relative to the input, 1-based line). */
  error: { file: string; line?: number; column?: number; message: string };
  /** How many input errors belong to this unit. */
  errorCount: number;
  /** The unit's files (relative to the input). */
  files: string[];
}

/**
 * Test metadata from the job file's `test_info:` block (chamber, operator, date_measured, notes,
 * dut_description, or any other snake_case key), each value the text as written; key order as written.
 */
export type TestInfo = Record<string, string>;

export interface ResultsFile {
  schemaVersion: 1;
  tool: { name: 'spherecov'; version: string };
  generatedAt: string;
  /** The job file's `test_info:` block as written (key → text), null without one. */
  testInfo: TestInfo | null;
  settings: Record<string, unknown>;
  units: UnitResult[];
  /** Units that could not be read or analyzed, each with its first error (verdict "error"). */
  unitsNotAnalyzed: UnitNotAnalyzed[];
  build: BuildSummary | null;
  errors: InputError[];
}
