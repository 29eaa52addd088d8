import { KEY, NUM, SKIP } from './fieldPlan.js';
import type { KeyTable } from './keyTable.js';
import type { RowLocator, RowSink } from './rowSink.js';

/**
 * What a compiled line scanner reads and updates besides the bytes: the row arrays it fills,
 * the sink it hands rows to, the key memo, and where the last handed row lies (for the lazy
 * locator, which only error paths use).
 */
export interface ScanState {
  line: number;
  nums: Float64Array;
  keyIds: Int32Array;
  sink: RowSink;
  loc: RowLocator;
  keys: KeyTable;
  halt: { now: boolean } | null;
  /** Per key slot: the last key's bytes, length (−1: none) and id. */
  memoBytes: Buffer[];
  memoLen: Int32Array;
  memoId: Int32Array;
  /** The last row handed to the sink: buffer, start, end (without the line break). */
  rowBuf: Buffer;
  rowStart: number;
  rowEnd: number;
  /** Set to true when a row is handed on, so the locator splits that row afresh. */
  rowChanged: boolean;
}

/**
 * Parse whole lines of `b` from `i` on, each fully or not at all, while they are plain; returns
 * where it stopped: `stop`, or the start of a line it does not fully understand (a blank or '#'
 * line, spaces, NaN, a quote, exotic numbers, a wrong field count), which the caller hands to
 * the text routine. Every line in [i, stop) ends with a '\n' before `stop`.
 */
export type LineScanner = (b: Buffer, i: number, stop: number, s: ScanState) => number;

/** Longest key (bytes) the memo keeps; a longer key is looked up on every row. */
export const KEY_MEMO = 256;

/** Exact powers of ten (all representable in binary64 up to 1e22). */
const POW10 = Array.from({ length: 23 }, (_, i) => Number(`1e${i}`));

const compiled = new Map<string, LineScanner>();

/**
 * The line scanner for one field layout, compiled once per (kinds, delimiter, decimal comma) and
 * shared by every file of that layout: straight-line code for the row's fields in order, so
 * the per-field dispatch of a general loop is gone and V8 optimizes one small loop per layout.
 * Only integers (field kinds, the delimiter's char code, slot numbers) enter the generated
 * source, never text from a file. A scanner that may halt after a row (`halts`: the range
 * worker's first pass) is compiled apart, so the one that reads the bulk of a file sees a single
 * sink and V8 inlines its row().
 *
 * Numbers: up to 15 significant digits and a decimal exponent within ±22 are computed as m·10^e
 * or m/10^−e, both exact operands, so the single rounding gives the correctly rounded double,
 * the same as Number(text) (IEEE 754 §4.3 correct rounding of ×, ÷); anything else returns the
 * line to the text routine.
 */
export function lineScanner(kinds: Uint8Array, slots: Int32Array, delimiter: string, decimalComma: boolean, halts: boolean): LineScanner {
  const delim = delimiter.charCodeAt(0);
  const key = `${Array.from(kinds).join('')}|${Array.from(slots).join(',')}|${delim}|${decimalComma ? 1 : 0}|${halts ? 1 : 0}`;
  let scan = compiled.get(key);
  if (scan === undefined) {
    const source = scannerSource(kinds, slots, delim, decimalComma, halts);
    // eslint-disable-next-line @typescript-eslint/no-implied-eval -- integers only (see above)
    scan = new Function('POW10', 'newKey', source)(POW10, newKey) as LineScanner;
    compiled.set(key, scan);
  }
  return scan;
}

/** The body of a scanner factory: `return function scanLines(b, i, stop, s) {…}`. */
function scannerSource(kinds: Uint8Array, slots: Int32Array, delim: number, dc: boolean, halts: boolean): string {
  const n = kinds.length;
  const parts: string[] = [];
  for (let f = 0; f < n; f++) {
    const k = kinds[f];
    if (k === NUM) parts.push(numberField(slots[f], dc));
    else if (k === KEY) parts.push(keyField(slots[f], delim));
    else if (k === SKIP) parts.push(skipField(delim));
    else throw new Error(`unknown field kind ${k}`);
    if (f < n - 1) parts.push(`if (b[p] !== ${delim}) break; p++;`);
  }
  return `return function scanLines(b, i, stop, s) {
  const nums = s.nums, keyIds = s.keyIds, sink = s.sink, loc = s.loc, halt = s.halt;
  const memoBytes = s.memoBytes, memoLen = s.memoLen, memoId = s.memoId;
  let line = s.line;
  while (i < stop) {
    const c0 = b[i];
    if (c0 === 35 || c0 === 10 || c0 === 13) break;
    let p = i;
    ${parts.join('\n    ')}
    const e = p;
    if (b[p] === 13) p++;
    if (b[p] !== 10) break;
    s.rowBuf = b; s.rowStart = i; s.rowEnd = e; s.rowChanged = true;
    sink.row(line, nums, keyIds, loc);
    line++;
    i = p + 1;
    ${halts ? 'if (halt.now) break;' : ''}
  }
  s.line = line;
  return i;
};`;
}

/** One number field (see lineScanner): sign, digits, fraction, exponent; stores nums[slot]. */
function numberField(slot: number, dc: boolean): string {
  const point = dc ? '(c === 46 || c === 44)' : 'c === 46';
  return `{
      let neg = false, c = b[p];
      if (c === 45) { neg = true; p++; } else if (c === 43) p++;
      let m = 0, nd = 0, frac = 0;
      for (;;) { const d = b[p] - 48; if (d < 0 || d > 9) break; m = m * 10 + d; nd++; p++; }
      c = b[p];
      if (${point}) {
        p++;
        for (;;) { const d = b[p] - 48; if (d < 0 || d > 9) break; m = m * 10 + d; nd++; frac++; p++; }
        c = b[p];
      }
      if (nd === 0 || nd > 15) break;
      let exp = 0;
      if (c === 101 || c === 69) {
        p++;
        let eneg = false, ed = 0;
        if (b[p] === 45) { eneg = true; p++; } else if (b[p] === 43) p++;
        for (;;) { const d = b[p] - 48; if (d < 0 || d > 9 || ed > 4) break; exp = exp * 10 + d; ed++; p++; }
        if (ed === 0 || ed > 4) break;
        if (eneg) exp = -exp;
      }
      const e10 = exp - frac;
      let v;
      if (e10 === 0) v = m;
      else if (e10 < 0 && e10 >= -22) v = m / POW10[-e10];
      else if (e10 > 0 && e10 <= 22) v = m * POW10[e10];
      else break;
      nums[${slot}] = neg ? -v : v;
    }`;
}

/** One key field: compared with the slot's memo byte by byte, interned on a change. */
function keyField(slot: number, delim: number): string {
  return `{
      const q0 = p;
      let quote = false;
      for (;;) { const c = b[p]; if (c === ${delim} || c === 10 || c === 13) break; if (c === 34) { quote = true; break; } p++; }
      if (quote || p === q0) break;
      const len = p - q0, mb = memoBytes[${slot}];
      let same = len === memoLen[${slot}];
      for (let k = 0; same && k < len; k++) if (b[q0 + k] !== mb[k]) same = false;
      if (same) keyIds[${slot}] = memoId[${slot}];
      else {
        const id = newKey(b, q0, p, s, ${slot});
        if (id < 0) break;
        keyIds[${slot}] = id;
      }
    }`;
}

/** A field nobody reads: skipped up to the delimiter (a quote sends the row to the text routine). */
function skipField(delim: number): string {
  return `{
      let quote = false;
      for (;;) { const c = b[p]; if (c === ${delim} || c === 10 || c === 13) break; if (c === 34) { quote = true; break; } p++; }
      if (quote) break;
    }`;
}

/**
 * A key that differs from the slot's memo: its id (interned, trimmed), remembered in the memo
 * when it fits; −1 when it is blank (the text routine reports it).
 */
function newKey(b: Buffer, from: number, to: number, s: ScanState, slot: number): number {
  const text = b.toString('utf8', from, to).trim();
  if (text === '') return -1;
  const id = s.keys.intern(slot, text);
  const len = to - from;
  if (len <= KEY_MEMO) {
    b.copy(s.memoBytes[slot], 0, from, to);
    s.memoLen[slot] = len;
    s.memoId[slot] = id;
  } else s.memoLen[slot] = -1;
  return id;
}
