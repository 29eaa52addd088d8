import { RowBytesLocator, type RowBlock, type RowLocator } from './rowSink.js';

/**
 * The RowBlock (src/io/rowSink.ts) over the WebAssembly scanner's output area, one for a whole
 * read: the areas' places are fixed; each batch sets how many rows, their first line and the
 * buffer their text lies in (row r's text at buf[bounds[startsAt + r], bounds[endsAt + r])).
 */
export class OutputRows implements RowBlock {
  count = 0;
  line = 0;
  buf: Buffer = Buffer.alloc(0);
  private readonly loc: RowBytesLocator;

  constructor(
    readonly nums: Float64Array,
    readonly numsAt: number,
    readonly numStride: number,
    readonly keys: Int32Array,
    readonly keysAt: number,
    readonly keyStride: number,
    /** Row starts and ends (in `buf`): starts from startsAt on, ends from endsAt on. */
    private readonly bounds: Int32Array,
    private readonly startsAt: number,
    private readonly endsAt: number,
    delimiter: string,
  ) {
    this.loc = new RowBytesLocator(delimiter);
  }

  copyRow(r: number, nums: Float64Array, keys: Int32Array): void {
    const n0 = this.numsAt + r * this.numStride;
    const k0 = this.keysAt + r * this.keyStride;
    for (let k = 0; k < this.numStride; k++) nums[k] = this.nums[n0 + k];
    for (let k = 0; k < this.keyStride; k++) keys[k] = this.keys[k0 + k];
  }

  locate(r: number): RowLocator {
    return this.loc.at(this.buf, this.bounds[this.startsAt + r], this.bounds[this.endsAt + r]);
  }
}
