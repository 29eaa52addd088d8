/**
 * The library's high-level call: measured beams held in memory → the same UnitResult that
 * `spherecov analyze` writes to results.json (grid and solid-angle weights, total scan pattern,
 * percentiles, coverage, TRP, checks and verdict, holes, beam removal, smallest subset).
 */
import { collapseWarnings } from '../batch/collapseWarnings.js';
import { DEFAULT_PERCENTILES_PCT } from '../batch/options.js';
import { measureUnit } from '../batch/unitTask.js';
import { assembleMeasurements } from '../io/assembleMeasurements.js';
import type { RawBeam } from '../io/types.js';
import { loadLimitSet } from '../limits/loadLimitSet.js';
import type { LimitSet } from '../limits/limitSet.js';
import { metricLists } from '../limits/metricNeeds.js';
import { quantityUnit } from '../quantity.js';
import type { Measurement, Quantity, TotalScanPattern, UnitResult } from '../types.js';

/** Directions of the samples: θ/φ in degrees (θ from +z, 0–180; φ −180–360), or azimuth/elevation in degrees. */
export type SampleDirections =
  | { thetaDeg: ArrayLike<number>; phiDeg: ArrayLike<number> }
  | { azimuthDeg: ArrayLike<number>; elevationDeg: ArrayLike<number> };

export interface BeamsInput {
  /** Unit (DUT) name; default 'unit'. */
  unit?: string;
  /** Frequency in Hz, or null (default). */
  frequencyHz?: number | null;
  /** What the values are: eirp (dBm, default), eis (dBm) or gain (dBi). */
  quantity?: Quantity;
  /** One direction per sample, shared by every beam. */
  directions: SampleDirections;
  /** Per beam its id and one dB value per direction (dBm for eirp/eis, dBi for gain). */
  beams: { id: string; values: ArrayLike<number> }[];
  /** A limit set (from loadLimitSet or your own), a shipped profile name, or a limit-set file path. */
  limits?: LimitSet | string | null;
  /** CDF levels in %; default the CLI's list. The levels the limit set needs are added. */
  percentilesPct?: number[];
  /** Absolute coverage thresholds in the value's unit; those the limit set needs are added. */
  coverageThresholds?: number[];
  /** Coverage thresholds in dB below the total scan pattern's peak. */
  relativeDb?: number[];
  /** Skip holes, beam removal and the smallest subset (faster). */
  coreOnly?: boolean;
}

/** One analyzed unit: the result (as in results.json) and what its report is drawn from. */
export interface UnitAnalysis {
  result: UnitResult;
  measurement: Measurement;
  tsp: TotalScanPattern;
}

/** Input that cannot be analyzed; `problems` lists each one in words. */
export class BeamsInputError extends Error {
  constructor(readonly problems: string[]) {
    super(`analyzeBeams: ${problems.slice(0, 5).join('; ')}${problems.length > 5 ? `; and ${problems.length - 5} more` : ''}`);
    this.name = 'BeamsInputError';
  }
}

const MEMORY = '(memory)';

/** θ/φ arrays from the input's directions, and the problems found in them. */
function directionsOf(d: SampleDirections, problems: string[]): { thetaDeg: Float64Array; phiDeg: Float64Array } {
  const azEl = 'azimuthDeg' in d;
  const [a, b] = azEl ? [d.elevationDeg, d.azimuthDeg] : [d.thetaDeg, d.phiDeg];
  if (a.length !== b.length) problems.push(`directions: ${a.length} ${azEl ? 'elevations' : 'θ values'} but ${b.length} ${azEl ? 'azimuths' : 'φ values'}`);
  const n = Math.min(a.length, b.length);
  const thetaDeg = new Float64Array(n);
  const phiDeg = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const first = a[i];
    const second = b[i];
    const [lo, hi] = azEl ? [-90, 90] : [0, 180];
    if (!(first >= lo && first <= hi)) problems.push(`directions[${i}]: ${azEl ? 'elevation' : 'θ'} ${first} is not between ${lo} and ${hi} degrees`);
    if (!(second >= -180 && second <= 360)) problems.push(`directions[${i}]: ${azEl ? 'azimuth' : 'φ'} ${second} is not between -180 and 360 degrees`);
    thetaDeg[i] = azEl ? 90 - first : first; // θ = 90° − el, φ = az (CONTRACT.md "Angles")
    phiDeg[i] = second;
  }
  return { thetaDeg, phiDeg };
}

/**
 * Analyze one unit at one frequency from data in memory, exactly as `spherecov analyze` does for
 * a file with the same samples: coincident directions merged, solid-angle weights, the total
 * scan pattern, the solid-angle-weighted CDF, coverage efficiency, TRP per beam, the checks of
 * the limit set (with their test tolerances) and the verdict.
 * Cost: that of the CLI's analysis of one unit (O(beams · points · log points) for the metrics,
 * more for the optional analysis unless `coreOnly`).
 * @throws BeamsInputError when the input cannot be analyzed (lengths that differ, angles out of
 * range, values that are not finite numbers, a duplicate beam id, too few distinct directions, an
 * unknown limit profile); every problem is listed.
 * @example
 * const { result } = analyzeBeams({ directions: { thetaDeg, phiDeg }, beams: [{ id: '0', values }], limits: '3gpp-fr2-pc3-n257' });
 * result.verdict; // 'pass' | 'fail' | 'none'
 */
export function analyzeBeams(input: BeamsInput): UnitAnalysis {
  const problems: string[] = [];
  const quantity = input.quantity ?? 'eirp';
  const { thetaDeg, phiDeg } = directionsOf(input.directions, problems);
  if (input.beams.length === 0) problems.push('beams: none given, expected at least one beam');
  const seen = new Set<string>();
  const raw: RawBeam[] = [];
  for (const [k, b] of input.beams.entries()) {
    if (seen.has(b.id)) problems.push(`beams[${k}]: beam id '${b.id}' given twice`);
    seen.add(b.id);
    if (b.values.length !== thetaDeg.length) problems.push(`beams[${k}] ('${b.id}'): ${b.values.length} values for ${thetaDeg.length} directions`);
    const values = Float64Array.from(b.values);
    const bad = values.findIndex((v) => !Number.isFinite(v));
    if (bad >= 0) problems.push(`beams[${k}] ('${b.id}'): value ${values[bad]} at index ${bad} is not a finite number (dB)`);
    raw.push({
      unit: input.unit ?? 'unit', beam: b.id, frequencyHz: input.frequencyHz ?? null, quantity, valueUnit: quantityUnit(quantity),
      thetaDeg, phiDeg, values, file: MEMORY,
    });
  }
  let limitSet: LimitSet | null = null;
  if (typeof input.limits === 'string') {
    const loaded = loadLimitSet(input.limits);
    problems.push(...loaded.errors.map((e) => `limits: ${e.message}`));
    limitSet = loaded.limitSet;
  } else limitSet = input.limits ?? null;
  if (problems.length) throw new BeamsInputError(problems);

  const asm = assembleMeasurements(raw, [{ path: MEMORY, sha256: '' }]);
  if (asm.errors.length || asm.measurements.length !== 1) throw new BeamsInputError(asm.errors.map((e) => e.message.replace(/^\(memory\):\d+:\d+: /, '')));
  const assembled = asm.measurements[0];
  const measurement = { ...assembled, warnings: collapseWarnings(assembled.warnings) };
  const { result, tsp } = measureUnit(measurement, {
    ...metricLists({ percentilesPct: input.percentilesPct ?? DEFAULT_PERCENTILES_PCT, thresholds: input.coverageThresholds, relativeDb: input.relativeDb }, limitSet),
    limitSet,
    coreOnly: input.coreOnly,
    // A limit set's `uncertainty:` block applies here as in the CLI (src/analysis/uncertainty).
    uncertainty: limitSet?.uncertainty ?? null,
  });
  return { result, measurement, tsp };
}
