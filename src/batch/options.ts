import type { Quantity } from '../types.js';
import type { FailOnCondition } from './exitCode.js';

/** Everything `runAnalyze` needs, already parsed and validated by the CLI (or a library user). */
export interface AnalyzeOptions {
  input: string;
  outDir: string;
  /** Percentile levels, %; undefined = job file, else the default list. */
  percentilesPct?: number[];
  /** Absolute coverage thresholds in the value's unit; joined with the limit set's. */
  thresholds?: number[];
  /** Coverage thresholds in dB below the TSP peak. */
  relativeDb?: number[];
  /** Limit set file or profile name. */
  limits?: string;
  quantity?: Quantity;
  /** EIS θ/φ pairs: each polarization judged on its own (default) or the combined-sensitivity view. */
  eisPolarizations?: 'each' | 'combined';
  pdf?: boolean;
  /** Skip the optional analysis (holes, beam removal, smallest subset). */
  coreOnly?: boolean;
  /** Write viewer.html (default: when PDFs are written). */
  viewer?: boolean;
  /** Parallel units; default os.availableParallelism(). */
  jobs?: number | 'auto';
  /** Write results.json to stdout instead of the verdict table. */
  json?: boolean;
  /** No verdict table on stdout, no progress on stderr (errors still go to stderr). */
  quiet?: boolean;
  /** CI gate: conditions that also give exit code 1 (see exitCode.ts). */
  failOn?: FailOnCondition[];
  force?: boolean;
  /** Explicit job file; default: spherecov.yaml|yml|json in the input folder. */
  jobFile?: string;
  reference?: string;
  pageSize?: 'a4' | 'letter';
  /** ISO timestamp used for generatedAt and the PDFs. */
  creationDate?: string;
  /**
   * Stops the run when aborted (the CLI aborts it on SIGINT/SIGTERM): temporary files are
   * removed, the lock released, and runAnalyze throws InterruptedError saying how far it got.
   */
  signal?: AbortSignal;
  /** Where results and messages go (the CLI passes process streams; tests can capture). */
  io?: BatchIo;
}

export interface BatchIo {
  stdout(text: string): void;
  stderr(text: string): void;
  /** Progress is drawn only when this is true (stderr is a terminal). */
  stderrIsTTY: boolean;
}

/** Percentile levels used when neither the command line nor the job file names any (eirp, gain and eis alike). */
export const DEFAULT_PERCENTILES_PCT = [0, 5, 10, 20, 50, 60, 80, 85, 90, 95, 100];
