import type { InputError } from '../types.js';

/** Longest quoted text in a message; longer text is cut with an ellipsis. */
const MAX_FOUND = 60;

/** Shorten a found text for a message (control characters shown escaped). */
export function clipText(text: string): string {
  const shown = text.replace(/\r/g, '\\r').replace(/\n/g, '\\n').replace(/\t/g, '\\t');
  return shown.length > MAX_FOUND ? `${shown.slice(0, MAX_FOUND)}…` : shown;
}

/**
 * Build an input error in the one grammar of the project:
 * `<file>:<line>:<col>: <column name>: found '<text>', expected <what>`.
 * `found` is quoted and clipped; pass `foundRaw` to show text without quotes (e.g. "binary data").
 */
export function inputError(
  file: string,
  line: number,
  column: number,
  columnName: string,
  found: string,
  expected: string,
  foundRaw = false,
): InputError {
  const shown = foundRaw ? found : `'${clipText(found)}'`;
  return {
    file,
    line,
    column,
    columnName,
    message: `${file}:${line}:${column}: ${columnName}: found ${shown}, expected ${expected}`,
  };
}

/** Collects errors of one file, keeping the first `max` and counting the rest. */
export class ErrorList {
  readonly errors: InputError[] = [];
  private dropped = 0;
  constructor(
    private readonly file: string,
    private readonly max = 20,
  ) {}

  add(e: InputError): void {
    if (this.errors.length < this.max) this.errors.push(e);
    else this.dropped++;
  }

  get count(): number {
    return this.errors.length + this.dropped;
  }

  /** The kept errors plus one summary line when some were dropped. */
  finish(): InputError[] {
    if (this.dropped === 0) return this.errors;
    return [
      ...this.errors,
      { file: this.file, message: `${this.file}: ${this.dropped} more errors not shown (first ${this.max} listed)` },
    ];
  }
}
