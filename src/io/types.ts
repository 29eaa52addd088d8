import type { UncertaintySpec } from '../analysis/uncertainty/uncertaintySpec.js';
/**
 * Types of the readers (src/io): what one file read gives, the job file, and the inspect report.
 */
import type { GridSummary, InputError, Polarization, Quantity, ValueUnit, Warning } from '../types.js';

/** Export layouts the readers know (src/io/layouts/registry.ts). */
export type LayoutName = 'long' | 'matrix' | 'wide';

/** Column roles a header cell (or a job-file `columns:` entry) can take. */
export type ColumnRole =
  | 'theta'
  | 'phi'
  | 'azimuth'
  | 'elevation'
  | 'value'
  | 'valueTheta'
  | 'valuePhi'
  | 'power'
  | 'pol'
  | 'unit'
  | 'beam'
  | 'frequency';

/** One calibration point: offset added to received power (dBm) to give EIRP (dBm). */
export interface CalibrationPoint {
  frequencyHz: number;
  offsetDb: number;
}

/**
 * What the job file declares. Keys other stages read (limits, checks, percentiles,
 * coverageThresholds, report, reference) are validated only for their outer shape here.
 */
export interface JobSpec {
  /** Absolute path of the job file this came from. */
  source: string;
  /** Role → header name (matched case-insensitively, surrounding spaces ignored). */
  columns?: Partial<Record<ColumnRole, string>>;
  /** Regular expressions matched against the file path relative to the input root; group 1 is the value. */
  identity?: { unit?: string; beam?: string; frequencyGhz?: string };
  quantity?: Quantity;
  /** Unit of value columns that carry none in the header. */
  valueUnit?: 'dBm' | 'dBi' | 'mW' | 'W';
  angles?: { convention?: 'theta-phi' | 'az-el'; unit?: 'deg' | 'rad' };
  /** Unit of a frequency column without one in its header. */
  frequencyUnit?: 'Hz' | 'MHz' | 'GHz';
  /** How coincident samples are merged (src/sphere/mergeConflicts.ts); default power average. */
  mergeRule?: 'power-average' | 'first' | 'last' | 'refuse';
  /** 1-based line of the header row, when detection below a preamble cannot settle it. */
  headerLine?: number;
  /**
   * Cell texts that stand for a missing sample in a value column (`OVLD`, `NaN`, `--`, '' for an
   * empty cell), compared case-insensitively after trimming. Absent: strict (every such cell is an error).
   */
  dropoutTokens?: string[];
  calibration?: { table: CalibrationPoint[] };
  limits?: string;
  checks?: Record<string, unknown>[];
  percentiles?: number[];
  coverageThresholds?: number[];
  report?: Record<string, unknown>;
  reference?: string;
  /** Measurement uncertainty and decision rule (src/analysis/uncertainty/uncertaintySpec.ts). */
  uncertainty?: UncertaintySpec;
  /** Test metadata (`test_info:`), key → text as written, shown in the reports and results.json. */
  testInfo?: Record<string, string>;
}

export interface ReadContext {
  /** Folder the file paths are reported relative to. */
  inputRoot: string;
  job?: JobSpec;
  quantityOverride?: Quantity;
  /** Force a parser path (tests and benchmarks); default 'auto'. */
  parser?: 'auto' | 'fast' | 'general';
  /** Most samples one file may hold (default MAX_SAMPLES_PER_FILE; tests set it low). */
  maxSamples?: number;
  /** Fast-path chunk size in bytes (tests use tiny chunks to exercise lines cut by chunk boundaries). */
  chunkBytes?: number;
  /**
   * Threads one read may use (default 1). With 2, a large long-layout file is read on two
   * threads (src/io/readInParallel.ts); the batch sets it from --jobs and the number of groups.
   */
  readThreads?: number;
  /** Smallest data part read on two threads (default PARALLEL_MIN_BYTES; tests set it low). */
  parallelMinBytes?: number;
  /** Share of the data bytes the main thread reads on two threads (default MAIN_SHARE; tests move the split). */
  parallelShare?: number;
  /** Told whether a read ran on one thread, on two, or fell back to one after starting two (tests, benchmark). */
  onParallel?: (how: 'single' | 'merged' | 'fallback', why?: string) => void;
  /** On two threads, the worker hashes the file after its part (default true); false: this thread does (tests). */
  workerHashes?: boolean;
}

/** One beam of one unit (at one frequency) as found in one file, before grid building. */
export interface RawBeam {
  unit: string;
  beam: string;
  frequencyHz: number | null;
  quantity: Quantity;
  valueUnit: ValueUnit;
  /** Degrees, θ ∈ [0, 180]; φ as read (degrees, −180..360), normalized by the grid builder. */
  thetaDeg: Float64Array;
  phiDeg: Float64Array;
  /** dB values (dBm or dBi), one per sample. Emptied by assembleMeasurements with consumeRaw. */
  values: Float64Array;
  /** File relative to the input root. */
  file: string;
  /** `# key: value` lines of the file. */
  metadata?: Record<string, string>;
  /** 1-based line of the first row of this beam. */
  firstLine?: number;
  /** The file had dropout cells read as missing samples (job file dropout_tokens). */
  hasDropouts?: boolean;
  /** One component of a θ/φ value pair (src/io/polarizationBeams.ts); absent for a total or single value. */
  polarization?: Polarization;
}

export type IdentitySource = 'column' | 'metadata' | 'job' | 'folder' | 'file-name' | 'none';

export interface ColumnInfo {
  index: number;
  name: string;
  /** Role, or null when the column is ignored. */
  role: ColumnRole | 'matrix-angle' | null;
  /** Unit from the header (deg, rad, dBm, dBi, mW, W, Hz, MHz, GHz), or null. */
  unit: string | null;
  /** Wide layout: the beam this value column belongs to (from its header). */
  beam?: string;
}

/** How a file was understood (for `spherecov inspect`). */
export interface FileInfo {
  layout: LayoutName | null;
  delimiter: ',' | ';' | '\t' | null;
  decimalComma: boolean;
  bom: boolean;
  lineEnding: 'LF' | 'CRLF' | null;
  parser: 'fast' | 'general' | null;
  columns: ColumnInfo[];
  quantity: Quantity | null;
  valueUnit: ValueUnit | null;
  /** Unit of the values as written in the file (dBm, dBi, mW, W). */
  fileValueUnit: string | null;
  angleConvention: 'theta-phi' | 'az-el' | null;
  angleUnit: 'deg' | 'rad' | null;
  /** Data rows read (excluding header, comments and blank lines). */
  rows: number;
  metadata: Record<string, string>;
  identity: { unit: IdentitySource; beam: IdentitySource; frequency: IdentitySource };
  /** Matrix layout: the column angles. */
  matrixColumnsDeg?: number[];
  /**
   * The header row: its line, and how it was chosen (the first row; detected below a free-text
   * preamble of `preambleLines` rows; or the job file's header_line).
   */
  header?: { line: number; chosen: 'first-row' | 'detected' | 'job'; preambleLines: number };
  calibrated: boolean;
}

export interface FileReadResult {
  /** Relative to the input root, '/'-separated. */
  file: string;
  sha256: string;
  info: FileInfo;
  beams: RawBeam[];
  errors: InputError[];
  warnings: Warning[];
}

/** Grid facts of an inspected measurement: the same summary results.json carries. */
export type InspectGrid = GridSummary;

export interface InspectMeasurement {
  unit: string;
  frequencyHz: number | null;
  quantity: Quantity;
  valueUnit: ValueUnit;
  beams: string[];
  files: string[];
  grid: InspectGrid;
  warnings: Warning[];
  /** A θ/φ pair's component (the total, for EIRP/gain, has none). */
  polarization?: Polarization;
}

export interface InspectReport {
  input: string;
  /** The job file: its errors, and its deprecation notices (keys in an old spelling, read; analyze prints the same on stderr). */
  job: { path: string | null; errors: InputError[]; notices: InputError[] };
  /** Symbolic links not followed (broken, or pointing outside the input folder), relative POSIX paths; analyze lists the same in results.json settings.skippedLinks. */
  skippedLinks: string[];
  files: (FileReadResult['info'] & {
    /** The decimal separator found in the first data rows (point, comma, both, none); null when the file was not understood. */
    decimalSeparator: 'point' | 'comma' | 'both' | 'none' | null;
    file: string;
    sha256: string;
    units: string[];
    beams: string[];
    frequenciesHz: (number | null)[];
    errors: InputError[];
    warnings: Warning[];
  })[];
  measurements: InspectMeasurement[];
  errors: InputError[];
  warnings: Warning[];
}
