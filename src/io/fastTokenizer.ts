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

  /** Parse one line [s, e) fully; false when it needs the text routine. */
  function fastLine(b: Buffer, s: number, e: number): boolean {
    let p = s;
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
        while (p < e) {
          const d = b[p] - 48;
          if (d < 0 || d > 9) break;
          m = m * 10 + d;
          nd++;
          p++;
        }
        if (p < e) {
          c = b[p];
          if (c === 46 || (dc && c === 44)) {
            p++;
            while (p < e) {
              const d = b[p] - 48;
              if (d < 0 || d > 9) break;
              m = m * 10 + d;
              nd++;
              frac++;
              p++;
            }
          }
        }
        if (nd === 0 || nd > 15) return false;
        let exp = 0;
        if (p < e && (b[p] === 101 || b[p] === 69)) {
          p++;
          let eneg = false;
          if (b[p] === 45) {
            eneg = true;
            p++;
          } else if (b[p] === 43) p++;
          let ed = 0;
          while (p < e) {
            const d = b[p] - 48;
            if (d < 0 || d > 9) break;
            exp = exp * 10 + d;
            ed++;
            p++;
            if (ed > 4) return false;
          }
          if (ed === 0) return false;
          if (eneg) exp = -exp;
        }
        const e10 = exp - frac;
        if (e10 < -22 || e10 > 22) return false;
        const v = e10 >= 0 ? m * POW10[e10] : m / POW10[-e10];
        nums[slots[f]] = neg ? -v : v;
      } else {
        const q0 = p;
        while (p < e) {
          const c = b[p];
          if (c === delim) break;
          if (c === 34) return false;
          p++;
        }
        if (kind === KEY) {
          const slot = slots[f];
          const mm = memo[slot];
          const len = p - q0;
          if (len === 0) return false;
          let same = len === mm.len;
          for (let i = 0; same && i < len; i++) if (b[q0 + i] !== mm.bytes[i]) same = false;
          if (same) keyIds[slot] = mm.id;
          else {
            const text = b.toString('utf8', q0, p).trim();
            if (text === '') return false;
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
        if (p >= e || b[p] !== delim) return false;
        p++;
      }
    }
    if (p !== e) return false;
    lb = b;
    ls = s;
    le = e;
    cached = null;
    t.sink.row(line, nums, keyIds, loc);
    return true;
  }

  // Double buffering: the next chunk is read (thread pool) while this one is parsed; a line cut
  // by a chunk boundary is stitched from the kept tail and the next chunk's first line.
  const bufs = [Buffer.allocUnsafe(chunkBytes), Buffer.allocUnsafe(chunkBytes)];
  let which = 0;
  const readAt = (buf: Buffer, pos: number) => fh.read(buf, 0, Math.max(0, Math.min(chunkBytes, end - pos)), pos);
  let pending = readAt(bufs[0], filePos);
  let tail: Buffer | null = null;
  const halt = t.halt ?? null;
  const lineAt = (view: Buffer, i: number, nl: number): boolean => {
    let e = nl;
    if (e > i && view[e - 1] === 13) e--;
    if (e > i && view[i] !== 35 && !fastLine(view, i, e)) {
      if (view.subarray(i, e).includes(34)) return false;
      const fields = view.toString('utf8', i, e).split(t.delimiter);
      processTextRow(fields, line, splitLocator(fields, t.delimiter), t);
    }
    line++;
    return true;
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
      const stitched = eof ? tail : Buffer.concat([tail, view.subarray(0, nl)]);
      tail = null;
      if (!lineAt(stitched, 0, stitched.length)) return { outcome: 'quote', line };
      i = eof ? 0 : nl + 1;
    }
    if (eof) break;
    for (;;) {
      if (halt !== null && halt.now) {
        await pending;
        return { outcome: 'halt', line };
      }
      const nl = view.indexOf(10, i);
      if (nl < 0) break;
      if (!lineAt(view, i, nl)) return { outcome: 'quote', line };
      i = nl + 1;
    }
    if (i < view.length) tail = Buffer.from(view.subarray(i));
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
