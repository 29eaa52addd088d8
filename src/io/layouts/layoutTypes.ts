/**
 * The layout interface: what one export layout (long, matrix, wide, …) provides to the generic
 * reader (readExportFile). A layout recognizes its header, plans the fields both tokenizers
 * read, and turns the accepted rows into raw beams. The registry (registry.ts) lists them.
 */
import type { InputError, Quantity, ValueUnit, Warning } from '../../types.js';
import type { FieldPlan } from '../fieldPlan.js';
import type { DropoutLog } from './dropoutLog.js';
import type { ErrorList } from '../inputError.js';
import type { KeyTable } from '../keyTable.js';
import type { RowSink } from '../rowSink.js';
import type { ColumnInfo, FileInfo, JobSpec, LayoutName, RawBeam } from '../types.js';

/** What every layout's plan says about a file (the reader copies these into FileInfo). */
export interface PlanFacts {
  layout: LayoutName;
  columns: ColumnInfo[];
  fields: FieldPlan;
  quantity: Quantity;
  valueUnit: ValueUnit;
  /** Unit of the values as written: dBm, dBi, mW or W. */
  fileValueUnit: 'dBm' | 'dBi' | 'mW' | 'W';
  angleConvention: 'theta-phi' | 'az-el';
  angleUnit: 'deg' | 'rad';
  /** Received power, to be calibrated into EIRP with the job file's table. */
  power: boolean;
}

/** What a layout may read while planning: the header, its position, metadata and the job file. */
export interface PlanContext {
  file: string;
  headerLine: number;
  /** 1-based character column where each header cell starts. */
  cellCols: number[];
  headerText: string;
  decimalComma: boolean;
  metadata: Record<string, string>;
  /** Line of each metadata key. */
  metadataLines: Record<string, number>;
  job?: JobSpec;
  quantityOverride?: Quantity;
}

/** One parse pass's shared objects. */
export interface SinkContext {
  file: string;
  errors: ErrorList;
  keys: KeyTable;
  /** Line of the first data row (just below the header). */
  firstDataLine: number;
  /** Where dropout cells (job file dropout_tokens) were read as missing samples. */
  dropouts: DropoutLog;
  /**
   * Keep the beams' values in shared memory, so a second thread of the unit (the insight lane,
   * src/batch/insightLane.ts) reads them without a copy; set when the read may use two threads.
   * Long layout only; the other layouts' values are copied once when a lane takes them.
   */
  sharedValues?: boolean;
}

/** What a finished sink needs to name its beams. */
export interface BeamContext {
  file: string;
  keys: KeyTable;
  base: Pick<RawBeam, 'quantity' | 'valueUnit' | 'file' | 'metadata'>;
  /** Identity from metadata or the path (used when no column names it). */
  fileUnit: string;
  fileBeam: string;
  fileFreqHz: number | null;
  /** Where the identity came from; a layout marks what its columns or headers named. */
  identity: FileInfo['identity'];
  warnings: Warning[];
}

/** Rows of one layout → raw beams. */
export interface LayoutSink extends RowSink {
  /** Data rows accepted. */
  readonly rows: number;
  beams(ctx: BeamContext): { beams: RawBeam[] } | { errors: InputError[] };
}

/** A header understood by one layout, ready to read rows. */
export interface PlannedLayout {
  facts: PlanFacts;
  /** Layout facts for inspect beyond PlanFacts (e.g. the matrix column angles). */
  info: Partial<FileInfo>;
  /** Samples one data row adds (the unit of the per-file sample limit). */
  samplesPerRow: number;
  /** Header problems found after planning (the file is refused, the facts still shown). */
  headerErrors: InputError[];
  /** A fresh sink for one parse pass. */
  newSink(s: SinkContext): LayoutSink;
}

export type PlanResult =
  | { planned: PlannedLayout; warnings: Warning[]; errors: [] }
  | { planned: null; warnings: Warning[]; errors: InputError[] };

/** One export layout. */
export interface LayoutReader {
  readonly name: LayoutName;
  /**
   * Does this row name a header of this layout (two angle roles and a value, or the matrix
   * corner)? Used to find the header below a free-text preamble. `cells` are raw header cells.
   */
  isHeader(cells: string[], job?: JobSpec): boolean;
  /** Plan a header of this layout; null when the header is not of this layout (the next is tried). */
  plan(cells: string[], ctx: PlanContext): PlanResult | null;
}

/** Long layout: num slots 0,1 = angles (θ,φ or el,az), 2(,3) = value(s), then frequency. */
export interface LongPlan extends PlanFacts {
  layout: 'long';
  pairValues: boolean;
  freqSlot: number;
  /** Multiply the frequency column by this to get Hz; null when the unit was assumed per value. */
  freqFactor: number | null;
  unitKey: number;
  beamKey: number;
  polKey: number;
}

/** Matrix layout: every field is a number; field 0 the row angle, the rest values at colAngles. */
export interface MatrixPlan extends PlanFacts {
  layout: 'matrix';
  colAnglesRaw: number[];
}
