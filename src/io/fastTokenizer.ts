import type { FileHandle } from 'node:fs/promises';
import type { Hash } from 'node:crypto';
import { KEY, NUM } from './fieldPlan.js';
import type { RowLocator } from './rowSink.js';
import { splitLocator } from './rowSink.js';
import { processTextRow, type TokenContext } from './textRow.js';

const CHUNK = 1 << 20;
/** Exact powers of ten (all representable in binary64 up to 1e22). */
const POW10 = Array.from({ length: 23 }, (_, i) => Number(`1e${i}`));
const KEY_MEMO = 256;
const NEWLINE = Buffer.from('\n');

/**
 * Streaming byte-level reader for plain numeric rows: reads the file in 1 MiB chunks into two
 * alternating buffers (the next read overlaps parsing), splits lines with memchr-speed `indexOf`, parses numbers from the bytes, and
 * hands every row it does not fully understand (spaces, NaN, exotic numbers, wrong field count)
 * to the shared text routine, so results equal the general path's exactly.
 *
 * Numbers: up to 15 significant digits and a decimal exponent within ±22 are computed as
 * m·10^e or m/10^−e, both exact operands, so the single rounding gives the correctly rounded
 * double, the same as Number(text) (IEEE 754 §4.3 correct rounding of ×, ÷); anything else
 * goes through Number(text).
 *
 * Memory: the chunk buffer plus the sink's arrays; the text is never held whole. Hashes every
 * byte it reads into `hash`. Ends 'quote' (having consumed nothing irrevocable but the sink's rows)
 * when it meets a '"', so the caller restarts on the general path. Reads `range` only, so two
 * threads can each parse a part of one file (readInParallel.ts).
 */
export async function fastTokenize(
  fh: FileHandle,
  range: ByteRange,
  startLine: number,
  t: TokenContext,
  hash: Hash | null,
  chunkBytes = CHUNK,
): Promise<TokenizeEnd> {
  const kinds = t.fields.kinds;
  const slots = t.fields.slots;
  const nFields = kinds.length;
  const delim = t.delimiter.charCodeAt(0);
  const dc = t.decimalComma;
  const nums = t.nums;
  const keyIds = t.keyIds;
  const memo = Array.from({ length: t.fields.keyCount }, () => ({ bytes: Buffer.alloc(KEY_MEMO), len: -1, id: -1 }));

  let filePos = range.readFrom;
  const end = range.end;
  let line = startLine;
  let skipTo = range.parseFrom - range.readFrom;
  // Where the row handed to the sink lies (for the locator, which only error paths use).
  let lb: Buffer = Buffer.alloc(0);
  let ls = 0;
  let le = 0;
  let cached: RowLocator | null = null;
  const loc: RowLocator = {
    text: (f) => lazy().text(f),
    col: (f) => lazy().col(f),
    end: () => lazy().end(),
    rowText: () => lazy().rowText(),
  };
  function lazy(): RowLocator {
    if (cached === null) cached = splitLocator(lb.toString('utf8', ls, le).split(t.delimiter), t.delimiter);
    return cached;
  }
  const sink = t.sink;
  const halt = t.halt ?? null;

  /**
   * Parse whole lines from `i` on, each fully or not at all, while they are plain: returns where
   * it stopped, `stop` or the start of a line it does not fully understand (a blank or '#' line,
   * spaces, NaN, a quote, exotic numbers, a wrong field count), which the caller hands to the
   * text routine. Every line in [i, stop) ends with a '\n' before `stop`, so no loop needs a
   * bound: each stops at that newline at the latest. One call parses a whole chunk's lines.
   */
  function scanLines(b: Buffer, i: number, stop: number): number {
    while (i < stop) {
      const c0 = b[i];
      if (c0 === 35 || c0 === 10 || c0 === 13) return i;
      let p = i;
      for (let f = 0; f < nFields; f++) {
        const kind = kinds[f];
        if (kind === NUM) {
          let neg = false;
          let c = b[p];
          if (c === 45) {
            neg = true;
            p++;
          } else if (c === 43) p++;
          let m = 0;
          let nd = 0;
          let frac = 0;
          for (;;) {
            const d = b[p] - 48;
            if (d < 0 || d > 9) break;
            m = m * 10 + d;
            nd++;
            p++;
          }
          c = b[p];
          if (c === 46 || (dc && c === 44)) {
            p++;
            for (;;) {
              const d = b[p] - 48;
              if (d < 0 || d > 9) break;
              m = m * 10 + d;
              nd++;
              frac++;
              p++;
            }
            c = b[p];
          }
          if (nd === 0 || nd > 15) return i;
          let exp = 0;
          if (c === 101 || c === 69) {
            p++;
            let eneg = false;
            if (b[p] === 45) {
              eneg = true;
              p++;
            } else if (b[p] === 43) p++;
            let ed = 0;
            for (;;) {
              const d = b[p] - 48;
              if (d < 0 || d > 9) break;
              exp = exp * 10 + d;
              ed++;
              p++;
              if (ed > 4) return i;
            }
            if (ed === 0) return i;
            if (eneg) exp = -exp;
          }
          const e10 = exp - frac;
          let v: number;
          if (e10 === 0) v = m;
          else if (e10 < 0 && e10 >= -22) v = m / POW10[-e10];
          else if (e10 > 0 && e10 <= 22) v = m * POW10[e10];
          else return i;
          nums[slots[f]] = neg ? -v : v;
        } else {
          const q0 = p;
          for (;;) {
            const c = b[p];
            if (c === delim || c === 10 || c === 13) break;
            if (c === 34) return i;
            p++;
          }
          if (kind === KEY) {
            const slot = slots[f];
            const mm = memo[slot];
            const len = p - q0;
            if (len === 0) return i;
            let same = len === mm.len;
            for (let k = 0; same && k < len; k++) if (b[q0 + k] !== mm.bytes[k]) same = false;
            if (same) keyIds[slot] = mm.id;
            else {
              const text = b.toString('utf8', q0, p).trim();
              if (text === '') return i;
              const id = t.keys.intern(slot, text);
              keyIds[slot] = id;
              if (len <= KEY_MEMO) {
                b.copy(mm.bytes, 0, q0, p);
                mm.len = len;
                mm.id = id;
              } else mm.len = -1;
            }
          }
        }
        if (f < nFields - 1) {
          if (b[p] !== delim) return i;
          p++;
        }
      }
      const e = p;
      if (b[p] === 13) p++;
      if (b[p] !== 10) return i;
      lb = b;
      ls = i;
      le = e;
      cached = null;
      sink.row(line, nums, keyIds, loc);
      line++;
      i = p + 1;
      if (halt !== null && halt.now) return i;
    }
    return i;
  }

  // Double buffering: the next chunk is read (thread pool) while this one is parsed; a line cut
  // by a chunk boundary is stitched from the kept tail and the next chunk's first line.
  const bufs = [Buffer.allocUnsafe(chunkBytes), Buffer.allocUnsafe(chunkBytes)];
  let which = 0;
  const readAt = (buf: Buffer, pos: number) => fh.read(buf, 0, Math.max(0, Math.min(chunkBytes, end - pos)), pos);
  let pending = readAt(bufs[0], filePos);
  let tail: Buffer | null = null;
  /** One line [i, nl) the scan did not take: skipped (blank, '#') or read by the text routine; false on a quote. */
  const slowLine = (view: Buffer, i: number, nl: number): boolean => {
    let e = nl;
    if (e > i && view[e - 1] === 13) e--;
    if (e > i && view[i] !== 35) {
      if (view.subarray(i, e).includes(34)) return false;
      const fields = view.toString('utf8', i, e).split(t.delimiter);
      processTextRow(fields, line, splitLocator(fields, t.delimiter), t);
    }
    line++;
    return true;
  };
  /** Lines of [i, stop), every one ending with a newline before stop; false on a quote. */
  const lines = (view: Buffer, i: number, stop: number): boolean => {
    for (;;) {
      i = scanLines(view, i, stop);
      if (i >= stop) return true;
      if (halt !== null && halt.now) return true;
      const nl = view.indexOf(10, i);
      if (!slowLine(view, i, nl)) return false;
      i = nl + 1;
      if (halt !== null && halt.now) return true;
    }
  };
  for (;;) {
    const { bytesRead } = await pending;
    const cur = bufs[which];
    filePos += bytesRead;
    const eof = bytesRead === 0;
    if (!eof) {
      which ^= 1;
      pending = readAt(bufs[which], filePos);
      hash?.update(cur.subarray(0, bytesRead));
    }
    let view = cur.subarray(0, bytesRead);
    if (skipTo > 0) {
      const skip = Math.min(skipTo, view.length);
      skipTo -= skip;
      view = view.subarray(skip);
      if (skipTo > 0) continue;
    }
    let i = 0;
    if (tail !== null) {
      const nl = view.indexOf(10);
      if (nl < 0 && !eof) {
        tail = Buffer.concat([tail, view]);
        continue;
      }
      // The cut line with its newline (one added after a last line without one).
      const stitched = Buffer.concat([tail, eof ? NEWLINE : view.subarray(0, nl + 1)]);
      tail = null;
      if (!lines(stitched, 0, stitched.length)) return { outcome: 'quote', line };
      i = eof ? 0 : nl + 1;
    }
    if (eof) break;
    const stop = view.lastIndexOf(10) + 1;
    if (halt === null || !halt.now) {
      if (i < stop && !lines(view, i, stop)) return { outcome: 'quote', line };
    }
    if (halt !== null && halt.now) {
      await pending;
      return { outcome: 'halt', line };
    }
    if (Math.max(i, stop) < view.length) tail = Buffer.from(view.subarray(Math.max(i, stop)));
  }
  return { outcome: 'done', line };
}

/**
 * The bytes one fastTokenize call reads: [readFrom, end), hashing all of them and parsing rows
 * from parseFrom on. `end` is a line start (just after a newline) or the end of the file
 * (Infinity: read until the file ends).
 */
export interface ByteRange {
  readFrom: number;
  parseFrom: number;
  end: number;
}

/**
 * How a fastTokenize call ended, and the line number of the next line: 'done' (the range is
 * read), 'quote' (a '"' was met: restart on the general path), 'halt' (TokenContext.halt was
 * set by the sink; the range is not finished).
 */
export interface TokenizeEnd {
  outcome: 'done' | 'quote' | 'halt';
  line: number;
}

/** Feed [from, end) of the file to `hash` (the part of a file another thread parses). */
export async function hashRange(fh: FileHandle, from: number, end: number, hash: Hash, chunkBytes = CHUNK): Promise<void> {
  const buf = Buffer.allocUnsafe(chunkBytes);
  for (let pos = from; pos < end;) {
    const { bytesRead } = await fh.read(buf, 0, Math.min(chunkBytes, end - pos), pos);
    if (bytesRead === 0) break;
    hash.update(buf.subarray(0, bytesRead));
    pos += bytesRead;
  }
}
