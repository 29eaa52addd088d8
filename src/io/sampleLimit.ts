import { ErrorList, inputError } from './inputError.js';
import type { RowBlock, RowLocator, RowSink } from './rowSink.js';

/**
 * Most samples (rows × value columns) one file may hold: 10⁸ samples are 800 MB of float64
 * values before angles and grid, so a larger file is refused while it streams, before memory
 * runs out, instead of failing later in an allocation. A 1 GB long-layout export holds about
 * 4–7·10⁷ samples (15–24 bytes a row).
 */
export const MAX_SAMPLES_PER_FILE = 100_000_000;

/**
 * Row sink guard: passes rows on until `max` samples, then records one error (at the first row
 * over the limit) and drops the rest, so memory stays bounded; reading still ends normally.
 * Cost O(1) a row.
 */
export class SampleLimit implements RowSink {
  private samples = 0;
  private tripped = false;
  /** Present when the inner sink takes blocks: a block within the limit passes on whole. */
  readonly rowBlock?: (block: RowBlock) => void;

  constructor(
    private readonly inner: RowSink,
    private readonly perRow: number,
    private readonly max: number,
    private readonly file: string,
    private readonly errors: ErrorList,
  ) {
    if (typeof inner.rowBlock === 'function') this.rowBlock = (block) => this.block(block);
  }

  private block(block: RowBlock): void {
    if (this.tripped) return;
    const add = block.count * this.perRow;
    if (this.samples + add <= this.max) {
      this.samples += add;
      (this.inner.rowBlock as (block: RowBlock) => void).call(this.inner, block);
      return;
    }
    // The block that crosses the limit: row by row, so the error names the first row over it.
    const nums = new Float64Array(block.numStride);
    const keys = new Int32Array(block.keyStride);
    for (let r = 0; r < block.count && !this.tripped; r++) {
      block.copyRow(r, nums, keys);
      this.row(block.line + r, nums, keys, block.locate(r));
    }
  }

  /** Would `samples` more (another thread's part of the file, readInParallel.ts) stay within the limit? */
  fits(samples: number): boolean {
    return !this.tripped && this.samples + samples <= this.max;
  }

  /** Count samples that another thread passed on (after `fits`). */
  add(samples: number): void {
    this.samples += samples;
  }

  /** Samples passed on so far. */
  get count(): number {
    return this.samples;
  }

  row(line: number, nums: Float64Array, keys: Int32Array, loc: RowLocator): void {
    if (this.tripped) return;
    if (this.samples + this.perRow > this.max) {
      this.tripped = true;
      this.errors.add(inputError(this.file, line, 1, 'data', `more than ${this.max} samples`,
        `at most ${this.max} samples (rows × value columns) in one file; split the export by beam or unit`, true));
      return;
    }
    this.samples += this.perRow;
    this.inner.row(line, nums, keys, loc);
  }
}
