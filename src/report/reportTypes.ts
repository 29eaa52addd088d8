import type { BuildSummary, Measurement, Polarization, TestInfo, TotalScanPattern, UnitNotAnalyzed, UnitResult } from '../types.js';
import type { CdfCurve } from './cdfCurve.js';
import type { ColorMapName } from './colorMap.js';

/** Report sections that can be switched off in templates/report/default.yaml or the job file. */
export interface ReportSections {
  checks: boolean;
  inputFiles: boolean;
  cdf: boolean;
  beamCdfs: boolean;
  tspMap: boolean;
  bestBeamMap: boolean;
  coverage: boolean;
  beams: boolean;
  quality: boolean;
  holes: boolean;
  reference: boolean;
  frequencyTrend: boolean;
}

export interface ReportSettings {
  title: string;
  organisation: string;
  /** Optional PNG/JPEG drawn top right of the first page. */
  logo: string | null;
  pageSize: 'A4' | 'Letter';
  colorMap: ColorMapName;
  /** Central meridian φ₀ of the maps, degrees. */
  mapCenterPhiDeg: number;
  /** Map raster width in pixels (height is half); ≈150 dpi at the drawn size by default. */
  mapWidthPx: number;
  /** Fixed PDF creation date (ISO 8601); when null, the run's generatedAt is used. */
  creationDate: string | null;
  sections: ReportSections;
}

/** Everything one unit's PDF needs; the Measurement and TSP give the per-direction data. */
export interface UnitReportInput {
  result: UnitResult;
  measurement: Measurement;
  tsp: TotalScanPattern;
  generatedAt: string;
  toolVersion: string;
  /** Per-beam CDFs drawn faintly behind the TSP; computed from the measurement when absent. */
  beamCdfs?: { id: string; curve: CdfCurve }[];
  /** Per grid point: this unit's TSP minus the reference unit's, dB (issue 9); drawn as a diverging map. */
  referenceDelta?: Float64Array;
  /** The TSP's CDF curve when the caller already made it (cdfCurve of tsp.values); made here otherwise. */
  tspCdf?: CdfCurve;
  /** θ/φ pairs: each polarization component's TSP CDF (src/report/polarizationSection.ts). */
  polarizationCdfs?: { name: Polarization; curve: CdfCurve }[];
  /** The job file's `test_info:` block, shown on page 1 as written. */
  testInfo?: TestInfo | null;
  /** Per-direction data of checks joining two measurements (src/batch/jointChecks.ts), e.g. the inter-band regions. */
  jointMaps?: { interBand?: { inA: Uint8Array; inB: Uint8Array; names: [string, string] } };
}

/** A small equal-area raster of a unit's TSP, plain data (transferable from a worker thread). */
export interface MapThumbnail {
  width: number;
  height: number;
  centerPhiDeg: number;
  /** Row-major, top row first; NaN where unmeasured or outside the ellipse. */
  values: Float32Array;
}

export type KeyedData<T> = Map<string, T> | Record<string, T>;

export interface BuildReportInput {
  units: UnitResult[];
  /** Units that could not be read or analyzed: rows with verdict ERROR, counted in the build. */
  unitsNotAnalyzed?: UnitNotAnalyzed[];
  /** Keyed by unitKey(unit, frequencyHz). */
  thumbnails: KeyedData<MapThumbnail>;
  /** TSP CDF of each unit, keyed by unitKey(unit, frequencyHz). */
  cdfs?: KeyedData<CdfCurve>;
  build: BuildSummary;
  generatedAt: string;
  toolVersion: string;
  limitSetName: string | null;
  /** The job file's `test_info:` block, shown on page 1 as written. */
  testInfo?: TestInfo | null;
}

/** The key of a unit at a frequency in BuildReportInput maps. */
export function unitKey(unit: string, frequencyHz: number | null, quantity?: string): string {
  // The quantity tells a unit's transmit and receive measurements at one frequency apart.
  return `${unit}@${frequencyHz ?? '-'}${quantity && quantity !== 'eirp' ? `#${quantity}` : ''}`;
}

export function getKeyed<T>(data: KeyedData<T> | undefined, key: string): T | undefined {
  if (!data) return undefined;
  return data instanceof Map ? data.get(key) : data[key];
}
