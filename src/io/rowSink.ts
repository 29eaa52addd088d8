/** Where a tokenizer's accepted row goes; the locator gives field text and column lazily (error paths). */
export interface RowLocator {
  /** Field text as written (unquoted). */
  text(field: number): string;
  /** 1-based character column where the field starts. */
  col(field: number): number;
  /** 1-based column just after the row's last character. */
  end(): number;
  /** The row as written. */
  rowText(): string;
}

/**
 * Consecutive data rows parsed by the fast path, handed to a sink in one call (RowSink.rowBlock):
 * row r (0 ≤ r < count) lies on line `line + r`, its numbers at nums[numsAt + r·numStride + slot],
 * its keys at keys[keysAt + r·keyStride + slot]. Valid only during the call (the arrays are the
 * WebAssembly scanner's output area): a sink keeps values, not views. Made by src/io/rowBlock.ts.
 */
export interface RowBlock {
  readonly count: number;
  readonly line: number;
  readonly nums: Float64Array;
  readonly numsAt: number;
  readonly numStride: number;
  readonly keys: Int32Array;
  readonly keysAt: number;
  readonly keyStride: number;
  /** Row r's numbers and keys copied into the per-row interface's arrays. */
  copyRow(r: number, nums: Float64Array, keys: Int32Array): void;
  /** Row r's locator, valid until the next call (split only when asked: error paths). */
  locate(r: number): RowLocator;
}

export interface RowSink {
  row(line: number, nums: Float64Array, keys: Int32Array, loc: RowLocator): void;
  /**
   * Optional: consecutive rows in one call, with exactly the effect of row() on each in order.
   * The WebAssembly fast path uses it when present and nobody asks to halt after a row.
   */
  rowBlock?(block: RowBlock): void;
}

/**
 * A RowLocator over the bytes of one row (no quotes), split at the delimiter only when asked
 * (error paths); at() points it at another row and returns it, so one object serves a whole read.
 */
export class RowBytesLocator implements RowLocator {
  private buf: Buffer = Buffer.alloc(0);
  private from = 0;
  private to = 0;
  private split: RowLocator | null = null;

  constructor(private readonly delimiter: string) {}

  /** The row at buf[from, to) (without its line break). */
  at(buf: Buffer, from: number, to: number): this {
    this.buf = buf;
    this.from = from;
    this.to = to;
    this.split = null;
    return this;
  }

  text(field: number): string {
    return this.fields().text(field);
  }

  col(field: number): number {
    return this.fields().col(field);
  }

  end(): number {
    return this.fields().end();
  }

  rowText(): string {
    return this.fields().rowText();
  }

  private fields(): RowLocator {
    this.split ??= splitLocator(this.buf.toString('utf8', this.from, this.to).split(this.delimiter), this.delimiter);
    return this.split;
  }
}

/** Locator over a row split at a delimiter without quotes: column = 1 + characters before the field. */
export function splitLocator(fields: string[], delimiter: string): RowLocator {
  return {
    text: (f) => fields[f] ?? '',
    col: (f) => {
      let c = 1;
      for (let i = 0; i < f && i < fields.length; i++) c += fields[i].length + 1;
      return c;
    },
    end: () => fields.join(delimiter).length + 1,
    rowText: () => fields.join(delimiter),
  };
}
