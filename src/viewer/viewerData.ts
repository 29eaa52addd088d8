/**
 * What viewer.html carries: the build's numbers in a compact, self-describing JSON form (typed
 * arrays as deflate-compressed base64), shared by the writer (src/report/viewerHtml.ts, Node) and
 * the page (src/viewer/main.ts, browser). Plain data only.
 */
import type { GridKind, Quantity, UnitResult, ValueUnit } from '../types.js';
import type { LimitSet } from '../limits/limitSet.js';

/** A typed array, little-endian bytes, compressed with raw deflate (RFC 1951), base64. */
export interface PackedArray {
  type: 'f64' | 'i32' | 'u16';
  length: number;
  /** Delta-coded (each element stored as the difference to the previous one of its run). */
  delta?: { runLength: number };
  /** Bytes stored plane by plane (every element's byte 0, then every byte 1, …): deflate finds more repeats. */
  planes?: boolean;
  /** Signed numbers stored zig-zag (0, −1, 1, −2, … as 0, 1, 2, 3, …) so small deltas have zero high bytes. */
  zigzag?: boolean;
  b64: string;
}

/** A SphereGrid in packed form (every array lossless, so the weights are the tool's own). */
export interface PackedGrid {
  kind: GridKind;
  solidAngleSr: number;
  thetaDeg: PackedArray;
  phiDeg: PackedArray;
  weightSr: PackedArray;
  regular: {
    thetaRowsDeg: PackedArray;
    phiColsDeg: PackedArray;
    rowStart: PackedArray;
    rowLength: PackedArray;
    phiWraps: boolean;
  } | null;
}

/** One unit at one frequency. */
export interface ViewerUnit {
  /** Unique key of the unit entry (unit name and frequency). */
  key: string;
  unit: string;
  frequencyHz: number | null;
  quantity: Quantity;
  valueUnit: ValueUnit;
  grid: PackedGrid;
  beamIds: string[];
  /**
   * Every beam's values quantised to quantumDb (value = integer × quantumDb), beams one after
   * another in grid point order, delta-coded per beam; non-finite values listed apart.
   */
  beams: PackedArray;
  quantumDb: number;
  nonFinite: { index: number; value: 'nan' | 'inf' | '-inf' }[];
  /** The unit's results.json entry, without the coverage curve (the page recomputes it). */
  result: UnitResult;
}

export interface ViewerBuild {
  schemaVersion: 1;
  tool: { name: 'spherecov'; version: string };
  generatedAt: string;
  input: string;
  /** The run's settings that the page needs to recompute metrics the way the tool did. */
  percentilesPct: number[];
  thresholds: number[];
  relativeDb: number[];
  /** The limit set (with the job file's checks merged) or null. */
  limitSet: LimitSet | null;
  /** Beam-removal and subset level, and the hole threshold, as the tool chose them. */
  removalLevelPct: number;
  holeThreshold: number | null;
  /** The reference unit of the run (a unit of this build, or a golden unit measured elsewhere). */
  reference: string | null;
  colorMap: 'lumen' | 'grey';
  mapCenterPhiDeg: number;
  units: ViewerUnit[];
  /** A golden unit measured elsewhere (--reference <folder>): its total scan patterns only. */
  referenceUnits: ViewerUnit[];
}
