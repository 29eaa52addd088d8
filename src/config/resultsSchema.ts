import { lazySchema, zod } from './zod.js';
import { QUANTITIES } from '../quantity.js';
import { CHECK_KINDS } from '../limits/checkKinds.js';

/**
 * results.json as analyze writes it (CONTRACT.md fields and every addition), strict: a field the
 * writer adds without adding it here fails test/config/resultsSchema.test.ts, which checks the
 * demo's and every golden build's results.json (and the runs of the uncertainty, polarization and
 * receive tests) against it. The published schemas/results.schema.json is generated from it.
 * Keys are the writer's (camelCase): results.json is output, not configuration.
 */
export const resultsSchema = lazySchema(() => {
  const num = () => zod().number();
  const opt = () => zod().number().nullable();
  const obj = zod().strictObject;
  const direction = { thetaDeg: num(), phiDeg: num() };
  const peak = obj({ value: num(), ...direction }).describe('Best value (max for eirp/gain, min for eis) and its direction');
  const percentile = obj({ levelPct: num(), value: opt() }).describe('value: p % of 4π at or below it; null when the level falls in the unmeasured part');
  const coverage = obj({ threshold: num(), efficiency: num() });
  const relativeCoverage = obj({ threshold: num(), efficiency: num(), dbBelowPeak: num() });
  const quantity = zod().enum(QUANTITIES);
  const valueUnit = zod().enum(['dBm', 'dBi']);
  const polarization = zod().enum(['theta', 'phi']);
  const verdict = zod().enum(['pass', 'fail', 'none']);
  const range = zod().tuple([num(), num()]);
  const statement = zod().enum(['pass', 'conditional pass', 'conditional fail', 'fail']);
  const decisionRule = zod().enum(['shared-risk', 'guarded', 'non-binary']);
  const bound = zod().enum(['lower', 'upper']);
  const marginUnit = zod().enum(['dB', 'fraction']);

  const decision = obj({
    rule: decisionRule, acceptanceLimit: num(), guardBandDb: opt(), statement: statement.nullable(),
    probabilityOfConformance: opt(), probabilityStdErr: opt(), valueStdDev: opt(), bias: opt(),
  });

  const check = obj({
    name: zod().string(), kind: zod().enum(CHECK_KINDS as [string, ...string[]]), value: opt(), limit: num(), toleranceDb: num(),
    effectiveLimit: num(), margin: opt(), pass: zod().boolean().nullable(), status: zod().enum(['pass', 'fail', 'not-evaluable']),
    note: zod().string().optional(), source: zod().string().optional(), bound: bound.optional(), marginUnit: marginUnit.optional(),
    marginDb: opt().optional(), levelPct: num().optional(), threshold: num().optional(), beam: zod().string().optional(),
    polarization: polarization.optional(), decision: decision.optional(),
  });

  const unmeasured = obj({ solidAngleSr: num(), centre: obj(direction), radiusDeg: num(), thetaRangeDeg: range, phiRangeDeg: range });
  const missing = obj({ ...direction, absorbedSr: num() });

  const grid = obj({
    kind: zod().enum(['regular', 'scattered']), points: num(), thetaRangeDeg: range, phiRangeDeg: range, thetaStepDeg: opt(), phiStepDeg: opt(),
    fullSphere: zod().boolean(), solidAngleSr: num(), unmeasured: zod().array(unmeasured).optional(), missing: zod().array(missing).optional(),
    duplicatesMerged: num(), beamsResampled: num(),
  });

  const beam = obj({
    id: zod().string(), peak, trpDbm: opt(), bestShare: num(), pointing: obj(direction).optional(),
    removal: obj({ percentileLossDb: opt(), coverageLoss: opt() }).optional(), neverBest: zod().boolean().optional(),
  });

  const tsp = obj({
    peak, percentiles: zod().array(percentile), coverage: zod().array(coverage), relativeCoverage: zod().array(relativeCoverage),
    coverageAtLevelLimit: obj({ levelPct: num(), threshold: num(), efficiency: num() }).optional()
      .describe("Coverage efficiency at the limit set's percentile limit; absent without a percentile check"),
    curve: zod().array(coverage),
  });

  const confidence = obj({
    decisionRule, expandedDb: num(), commonDb: num(), perDirectionDb: num(), guardBandDb: num(), draws: num(), seed: num(),
    probabilityOfConformance: opt(), probabilityStdErr: opt(), statement: statement.nullable(),
    percentiles: zod().array(obj({ levelPct: num(), value: opt(), biasDb: opt(), stdDevDb: opt(), low95: opt(), high95: opt() })),
    coverage: zod().array(obj({ threshold: num(), efficiency: num(), bias: opt(), stdDev: opt() })),
    pairsPerDraw: num(),
    band: zod().array(obj({ levelPct: num(), low95: opt(), high95: opt() })),
  });

  const gridAdequacy = obj({
    method: zod().string(), calibrationFactor: num(),
    percentiles: zod().array(obj({ levelPct: num(), adequacyDb: opt(), subGridSpreadDb: opt(), at1p5StepDb: opt(), at2StepDb: opt() })),
    coverage: zod().array(obj({ threshold: num(), adequacy: opt(), subGridSpread: opt() })),
    coarser: zod().array(obj({ stepFactor: num(), pointsSavedShare: num() })),
  });

  const unit = obj({
    unit: zod().string(),
    unitAsWritten: zod().array(zod().string()).optional(),
    frequencyHz: opt(),
    quantity,
    valueUnit,
    solidAngleSr: num().describe('Measured solid angle, sr (4π for a full sphere)'),
    beams: zod().array(beam),
    tsp,
    checks: zod().array(check),
    verdict,
    worstCheck: obj({ name: zod().string(), margin: num(), marginUnit: marginUnit.optional(), marginDb: opt().optional() }).nullable(),
    warnings: zod().array(zod().string()),
    grid,
    sources: zod().array(obj({ path: zod().string(), sha256: zod().string() })),
    limitSet: obj({ name: zod().string(), source: zod().string() }).nullable(),
    holes: zod().array(obj({ ...direction, solidAngleSr: num(), worst: num(), nearestBeam: zod().string() })).optional(),
    analysisThreshold: obj({ value: num(), source: zod().enum(['min-coverage-check', 'percentile-check', 'requested']), toleranceApplied: zod().boolean() })
      .nullable().optional().describe('The one threshold holes and the map contour are found at, and where it comes from'),
    subset: obj({ levelPct: num(), toleranceDb: num(), beams: zod().array(zod().string()), curve: zod().array(obj({ count: num(), value: opt() })) }).nullable().optional(),
    reference: obj({ unit: zod().string(), deltas: zod().record(zod().string(), opt()) }).nullable().optional(),
    frequencyTrend: zod().array(zod().looseObject({ frequencyHz: num() }).catchall(opt())).nullable().optional(),
    confidence: confidence.nullable().optional(),
    gridAdequacy: gridAdequacy.nullable().optional(),
    beamCorrespondence: obj({
      levelPct: num(), topSharePct: num(), valueDb: num(), regionSr: num(), regionFloorDbm: opt(),
      rxChoiceBasis: zod().enum(['eis', 'combined-sensitivity']), resampled: zod().boolean(), otherBeamShareOfRegion: num(),
      cdf: obj({ valuesDb: zod().array(num()), fractions: zod().array(num()) }),
    }).nullable().optional(),
    interBand: obj({
      bands: zod().array(obj({ name: zod().string(), frequencyHz: num(), levelDbm: num(), share: num() })),
      jointShare: num(), requiredShare: num(), resampled: zod().boolean(),
    }).nullable().optional(),
    polarizations: zod().array(obj({
      name: polarization,
      tsp: obj({ peak, percentiles: zod().array(percentile), coverage: zod().array(coverage), relativeCoverage: zod().array(relativeCoverage) }),
      beams: zod().array(obj({ id: zod().string(), peak, bestShare: num() })),
      checks: zod().array(check),
      verdict: verdict.nullable(),
    })).optional(),
    polarizationRule: zod().enum(['each', 'combined-sensitivity', 'total-power-sum']).optional(),
    limitingPolarization: polarization.nullable().optional(),
    pointingDrift: zod().array(obj({ beam: zod().string(), driftDeg: num(), flagged: zod().boolean(), betweenHz: range.nullable() })).nullable().optional(),
  });

  const location = { file: zod().string(), line: num().optional(), column: num().optional() };

  const stats = obj({
    frequencyHz: opt(), quantity, metric: zod().string(), valueKind: marginUnit.optional(), count: num(), mean: opt(), std: opt(), min: opt(), max: opt(),
    yield: opt(), passedCount: opt().optional(), judged: opt().optional(), inBuild: opt().optional(), yieldInBuild: opt().optional(),
    lowerLimit: opt(), upperLimit: opt(), cpk: opt(),
  });

  const buildConfidence = obj({
    decisionRule, judged: num(), passes: num(), expectedConforming: num(), expectedConformingStdErr: num(),
    checks: zod().array(obj({
      frequencyHz: opt(), name: zod().string(), count: num(), passes: num(), expectedConforming: num(),
      acceptanceLimit: opt(), bound: bound.nullable(), mean: opt(), std: opt(), cpk: opt(),
    })),
  });

  /** The `uncertainty:` block as results.json's settings repeat it (code spelling). */
  const uncertaintySetting = obj({
    decisionRule, quantities: zod().partialRecord(quantity, obj({ expandedDb: num(), perDirectionDb: num() })),
    guardBandDb: num().optional(), draws: num().optional(), seed: num().optional(), powerClass: num().optional(),
  });

  return obj({
    schemaVersion: zod().literal(1),
    tool: obj({ name: zod().literal('spherecov'), version: zod().string() }),
    generatedAt: zod().string(),
    testInfo: zod().record(zod().string(), zod().string()).nullable().describe("The job file's test_info block as written (key → text)"),
    settings: obj({
      input: zod().string(),
      percentilesPct: zod().array(num()),
      coverageThresholds: zod().array(num()),
      relativeDb: zod().array(num()),
      limits: obj({ name: zod().string(), source: zod().string() }).nullable(),
      quantityOverride: quantity.nullable(),
      eisPolarizations: zod().enum(['each', 'combined']),
      jobFile: zod().string().nullable(),
      reference: zod().string().nullable(),
      uncertainty: uncertaintySetting.optional(),
      referenceFolder: zod().string().nullable(),
      pdf: zod().boolean(),
      pageSize: zod().enum(['a4', 'letter']),
      skippedLinks: zod().array(zod().string()),
      warnings: zod().array(zod().string()).describe('Run-level warnings, including configuration keys read in an old spelling'),
    }),
    units: zod().array(unit).describe('One entry per analyzed unit and frequency'),
    unitsNotAnalyzed: zod().array(obj({
      unit: zod().string(), frequencyHz: opt(), verdict: zod().literal('error'),
      error: obj({ ...location, message: zod().string() }), errorCount: num(), files: zod().array(zod().string()),
    })),
    build: obj({
      units: num(), unitsInBuild: num(), passed: num(), failed: num(), notJudged: num(), errored: num(),
      stats: zod().array(stats), confidence: buildConfidence.nullable().optional(),
    }).nullable(),
    errors: zod().array(obj({ ...location, columnName: zod().string().optional(), message: zod().string() }))
      .describe('Input errors; file relative to the input folder, 1-based line'),
  });
});
