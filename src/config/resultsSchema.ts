import { z } from 'zod';
import { QUANTITIES } from '../quantity.js';
import { CHECK_KINDS } from '../limits/checkKinds.js';

/**
 * results.json as analyze writes it (CONTRACT.md fields and every addition), strict: a field the
 * writer adds without adding it here fails test/config/resultsSchema.test.ts, which checks the
 * demo's and every golden build's results.json (and the runs of the uncertainty, polarization and
 * receive tests) against it. The published schemas/results.schema.json is generated from it.
 * Keys are the writer's (camelCase): results.json is output, not configuration.
 */
const num = () => z.number();
const opt = () => z.number().nullable();
const obj = z.strictObject;
const direction = { thetaDeg: num(), phiDeg: num() };
const peak = obj({ value: num(), ...direction }).describe('Best value (max for eirp/gain, min for eis) and its direction');
const percentile = obj({ levelPct: num(), value: opt() }).describe('value: p % of 4π at or below it; null when the level falls in the unmeasured part');
const coverage = obj({ threshold: num(), efficiency: num() });
const relativeCoverage = obj({ threshold: num(), efficiency: num(), dbBelowPeak: num() });
const quantity = z.enum(QUANTITIES);
const valueUnit = z.enum(['dBm', 'dBi']);
const polarization = z.enum(['theta', 'phi']);
const verdict = z.enum(['pass', 'fail', 'none']);
const range = z.tuple([num(), num()]);
const statement = z.enum(['pass', 'conditional pass', 'conditional fail', 'fail']);
const decisionRule = z.enum(['shared-risk', 'guarded', 'non-binary']);
const bound = z.enum(['lower', 'upper']);
const marginUnit = z.enum(['dB', 'fraction']);

const decision = obj({
  rule: decisionRule, acceptanceLimit: num(), guardBandDb: opt(), statement: statement.nullable(),
  probabilityOfConformance: opt(), probabilityStdErr: opt(), valueStdDev: opt(), bias: opt(),
});

const check = obj({
  name: z.string(), kind: z.enum(CHECK_KINDS as [string, ...string[]]), value: opt(), limit: num(), toleranceDb: num(),
  effectiveLimit: num(), margin: opt(), pass: z.boolean().nullable(), status: z.enum(['pass', 'fail', 'not-evaluable']),
  note: z.string().optional(), source: z.string().optional(), bound: bound.optional(), marginUnit: marginUnit.optional(),
  marginDb: opt().optional(), levelPct: num().optional(), threshold: num().optional(), beam: z.string().optional(),
  polarization: polarization.optional(), decision: decision.optional(),
});

const unmeasured = obj({ solidAngleSr: num(), centre: obj(direction), radiusDeg: num(), thetaRangeDeg: range, phiRangeDeg: range });
const missing = obj({ ...direction, absorbedSr: num() });

const grid = obj({
  kind: z.enum(['regular', 'scattered']), points: num(), thetaRangeDeg: range, phiRangeDeg: range, thetaStepDeg: opt(), phiStepDeg: opt(),
  fullSphere: z.boolean(), solidAngleSr: num(), unmeasured: z.array(unmeasured).optional(), missing: z.array(missing).optional(),
  duplicatesMerged: num(), beamsResampled: num(),
});

const beam = obj({
  id: z.string(), peak, trpDbm: opt(), bestShare: num(), pointing: obj(direction).optional(),
  removal: obj({ percentileLossDb: opt(), coverageLoss: opt() }).optional(), neverBest: z.boolean().optional(),
});

const tsp = obj({
  peak, percentiles: z.array(percentile), coverage: z.array(coverage), relativeCoverage: z.array(relativeCoverage), curve: z.array(coverage),
});

const confidence = obj({
  decisionRule, expandedDb: num(), commonDb: num(), perDirectionDb: num(), guardBandDb: num(), draws: num(), seed: num(),
  probabilityOfConformance: opt(), probabilityStdErr: opt(), statement: statement.nullable(),
  percentiles: z.array(obj({ levelPct: num(), value: opt(), biasDb: opt(), stdDevDb: opt(), low95: opt(), high95: opt() })),
  coverage: z.array(obj({ threshold: num(), efficiency: num(), bias: opt(), stdDev: opt() })),
  pairsPerDraw: num(),
  band: z.array(obj({ levelPct: num(), low95: opt(), high95: opt() })),
});

const gridAdequacy = obj({
  method: z.string(), calibrationFactor: num(),
  percentiles: z.array(obj({ levelPct: num(), adequacyDb: opt(), subGridSpreadDb: opt(), at1p5StepDb: opt(), at2StepDb: opt() })),
  coverage: z.array(obj({ threshold: num(), adequacy: opt(), subGridSpread: opt() })),
  coarser: z.array(obj({ stepFactor: num(), pointsSavedShare: num() })),
});

const unit = obj({
  unit: z.string(),
  unitAsWritten: z.array(z.string()).optional(),
  frequencyHz: opt(),
  quantity,
  valueUnit,
  solidAngleSr: num().describe('Measured solid angle, sr (4π for a full sphere)'),
  beams: z.array(beam),
  tsp,
  checks: z.array(check),
  verdict,
  worstCheck: obj({ name: z.string(), margin: num(), marginUnit: marginUnit.optional(), marginDb: opt().optional() }).nullable(),
  warnings: z.array(z.string()),
  grid,
  sources: z.array(obj({ path: z.string(), sha256: z.string() })),
  limitSet: obj({ name: z.string(), source: z.string() }).nullable(),
  holes: z.array(obj({ ...direction, solidAngleSr: num(), worst: num(), nearestBeam: z.string() })).optional(),
  analysisThreshold: obj({ value: num(), source: z.enum(['min-coverage-check', 'percentile-check', 'requested']), toleranceApplied: z.boolean() })
    .nullable().optional().describe('The one threshold holes and the map contour are found at, and where it comes from'),
  subset: obj({ levelPct: num(), toleranceDb: num(), beams: z.array(z.string()), curve: z.array(obj({ count: num(), value: opt() })) }).nullable().optional(),
  reference: obj({ unit: z.string(), deltas: z.record(z.string(), opt()) }).nullable().optional(),
  frequencyTrend: z.array(z.looseObject({ frequencyHz: num() }).catchall(opt())).nullable().optional(),
  confidence: confidence.nullable().optional(),
  gridAdequacy: gridAdequacy.nullable().optional(),
  beamCorrespondence: obj({
    levelPct: num(), topSharePct: num(), valueDb: num(), regionSr: num(), regionFloorDbm: opt(),
    rxChoiceBasis: z.enum(['eis', 'combined-sensitivity']), resampled: z.boolean(), otherBeamShareOfRegion: num(),
    cdf: obj({ valuesDb: z.array(num()), fractions: z.array(num()) }),
  }).nullable().optional(),
  interBand: obj({
    bands: z.array(obj({ name: z.string(), frequencyHz: num(), levelDbm: num(), share: num() })),
    jointShare: num(), requiredShare: num(), resampled: z.boolean(),
  }).nullable().optional(),
  polarizations: z.array(obj({
    name: polarization,
    tsp: obj({ peak, percentiles: z.array(percentile), coverage: z.array(coverage), relativeCoverage: z.array(relativeCoverage) }),
    beams: z.array(obj({ id: z.string(), peak, bestShare: num() })),
    checks: z.array(check),
    verdict: verdict.nullable(),
  })).optional(),
  polarizationRule: z.enum(['each', 'combined-sensitivity', 'total-power-sum']).optional(),
  limitingPolarization: polarization.nullable().optional(),
  pointingDrift: z.array(obj({ beam: z.string(), driftDeg: num(), flagged: z.boolean(), betweenHz: range.nullable() })).nullable().optional(),
});

const location = { file: z.string(), line: num().optional(), column: num().optional() };

const stats = obj({
  frequencyHz: opt(), metric: z.string(), valueKind: marginUnit.optional(), count: num(), mean: opt(), std: opt(), min: opt(), max: opt(),
  yield: opt(), passedCount: opt().optional(), judged: opt().optional(), inBuild: opt().optional(), yieldInBuild: opt().optional(),
  lowerLimit: opt(), upperLimit: opt(), cpk: opt(),
});

const buildConfidence = obj({
  decisionRule, judged: num(), passes: num(), expectedConforming: num(), expectedConformingStdErr: num(),
  checks: z.array(obj({
    frequencyHz: opt(), name: z.string(), count: num(), passes: num(), expectedConforming: num(),
    acceptanceLimit: opt(), bound: bound.nullable(), mean: opt(), std: opt(), cpk: opt(),
  })),
});

/** The `uncertainty:` block as results.json's settings repeat it (code spelling). */
const uncertaintySetting = obj({
  decisionRule, quantities: z.partialRecord(quantity, obj({ expandedDb: num(), perDirectionDb: num() })),
  guardBandDb: num().optional(), draws: num().optional(), seed: num().optional(), powerClass: num().optional(),
});

export const resultsSchema = obj({
  schemaVersion: z.literal(1),
  tool: obj({ name: z.literal('spherecov'), version: z.string() }),
  generatedAt: z.string(),
  testInfo: z.record(z.string(), z.string()).nullable().describe("The job file's test_info block as written (key → text)"),
  settings: obj({
    input: z.string(),
    percentilesPct: z.array(num()),
    coverageThresholds: z.array(num()),
    relativeDb: z.array(num()),
    limits: obj({ name: z.string(), source: z.string() }).nullable(),
    quantityOverride: quantity.nullable(),
    eisPolarizations: z.enum(['each', 'combined']),
    jobFile: z.string().nullable(),
    reference: z.string().nullable(),
    uncertainty: uncertaintySetting.optional(),
    referenceFolder: z.string().nullable(),
    pdf: z.boolean(),
    pageSize: z.enum(['a4', 'letter']),
    skippedLinks: z.array(z.string()),
    warnings: z.array(z.string()).describe('Run-level warnings, including configuration keys read in an old spelling'),
  }),
  units: z.array(unit).describe('One entry per analyzed unit and frequency'),
  unitsNotAnalyzed: z.array(obj({
    unit: z.string(), frequencyHz: opt(), verdict: z.literal('error'),
    error: obj({ ...location, message: z.string() }), errorCount: num(), files: z.array(z.string()),
  })),
  build: obj({
    units: num(), unitsInBuild: num(), passed: num(), failed: num(), notJudged: num(), errored: num(),
    stats: z.array(stats), confidence: buildConfidence.nullable().optional(),
  }).nullable(),
  errors: z.array(obj({ ...location, columnName: z.string().optional(), message: z.string() }))
    .describe('Input errors; file relative to the input folder, 1-based line'),
});
