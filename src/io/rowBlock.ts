import { splitLocator, type RowBlock, type RowLocator } from './rowSink.js';

/**
 * The RowBlock (src/io/rowSink.ts) over the WebAssembly scanner's output area, reused for every
 * batch of a read: the scanner sets where this batch's rows lie (row r's text at
 * buf[bounds[startsAt + r], bounds[endsAt + r])) and hands it to the sink.
 */
export class OutputRows implements RowBlock {
  count = 0;
  line = 0;
  numsAt = 0;
  keysAt = 0;
  startsAt = 0;
  endsAt = 0;
  buf: Buffer = Buffer.alloc(0);
  private row = -1;
  private split: RowLocator | null = null;
  private readonly lazy: RowLocator = {
    text: (f: number) => this.fields().text(f),
    col: (f: number) => this.fields().col(f),
    end: () => this.fields().end(),
    rowText: () => this.fields().rowText(),
  };

  constructor(
    readonly nums: Float64Array,
    readonly numStride: number,
    readonly keys: Int32Array,
    readonly keyStride: number,
    /** Row starts and ends (in `buf`); the same array may hold both at different offsets. */
    readonly bounds: Int32Array,
    private readonly delimiter: string,
  ) {}

  /** Row r's numbers and keys copied into the per-row interface's arrays. */
  copyRow(r: number, nums: Float64Array, keys: Int32Array): void {
    const n0 = this.numsAt + r * this.numStride;
    const k0 = this.keysAt + r * this.keyStride;
    for (let k = 0; k < this.numStride; k++) nums[k] = this.nums[n0 + k];
    for (let k = 0; k < this.keyStride; k++) keys[k] = this.keys[k0 + k];
  }

  /**
   * Row r's locator, split only when asked (error paths): one object, rebound on every call, so
   * it is valid until the next call, like the per-row interface's.
   */
  locate(r: number): RowLocator {
    this.row = r;
    this.split = null;
    return this.lazy;
  }

  private fields(): RowLocator {
    if (this.split === null) {
      const r = this.row;
      const text = this.buf.toString('utf8', this.bounds[this.startsAt + r], this.bounds[this.endsAt + r]);
      this.split = splitLocator(text.split(this.delimiter), this.delimiter);
    }
    return this.split;
  }
}
