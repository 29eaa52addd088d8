import type { FileHandle } from 'node:fs/promises';
import type { Hash } from 'node:crypto';
import { KEY_MEMO, lineScanner, type ScanState } from './compiledScan.js';
import { RowBytesLocator, splitLocator, type RowLocator } from './rowSink.js';
import { processTextRow, type TokenContext } from './textRow.js';
import { wasmReader } from './wasm/wasmScanner.js';

const CHUNK = 1 << 20;
const NEWLINE = Buffer.from('\n');

/**
 * Streaming byte-level reader for plain numeric rows: reads the file in 1 MiB chunks into two
 * alternating buffers (the next read overlaps parsing) and hands each chunk's whole lines to a
 * line scanner (the WebAssembly one where there is WebAssembly, else the JS one; the number
 * rule and what counts as plain are compiledScan.ts's); every line a scanner does not fully
 * understand (spaces, NaN, exotic numbers, wrong field count) goes to the shared text routine,
 * so results equal the general path's exactly.
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
  let filePos = range.readFrom;
  const end = range.end;
  let skipTo = range.parseFrom - range.readFrom;
  const keyCount = t.fields.keyCount;
  const s: ScanState = {
    line: startLine, nums: t.nums, keyIds: t.keyIds, sink: t.sink, loc: null as unknown as RowLocator, keys: t.keys,
    halt: t.halt ?? null,
    memoBytes: Array.from({ length: keyCount }, () => Buffer.alloc(KEY_MEMO)),
    memoLen: new Int32Array(keyCount).fill(-1), memoId: new Int32Array(keyCount).fill(-1),
    rowBuf: Buffer.alloc(0), rowStart: 0, rowEnd: 0, rowChanged: false,
  };
  // The row handed to the sink (the scanners set where it lies), split only when asked.
  const rowLoc = new RowBytesLocator(t.delimiter);
  const current = (): RowLocator => {
    if (s.rowChanged) {
      rowLoc.at(s.rowBuf, s.rowStart, s.rowEnd);
      s.rowChanged = false;
    }
    return rowLoc;
  };
  s.loc = {
    text: (f: number) => current().text(f),
    col: (f: number) => current().col(f),
    end: () => current().end(),
    rowText: () => current().rowText(),
  };
  // The WebAssembly scanner where there is WebAssembly (no JIT warm-up; its chunk buffers are in
  // its memory), else the JS one; both follow compiledScan.ts's rules and LineScanner contract.
  const wasm = wasmReader(t.fields, t.delimiter, t.decimalComma, chunkBytes, s.halt !== null);
  const scanLines = wasm?.scan ?? lineScanner(t.fields.kinds, t.fields.slots, t.delimiter, t.decimalComma, s.halt !== null);
  const halt = s.halt;

  // Double buffering: the next chunk is read (thread pool) while this one is parsed; a line cut
  // by a chunk boundary is stitched from the kept tail and the next chunk's first line.
  const bufs = wasm?.bufs ?? [Buffer.allocUnsafe(chunkBytes), Buffer.allocUnsafe(chunkBytes)];
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
      processTextRow(fields, s.line, splitLocator(fields, t.delimiter), t);
    }
    s.line++;
    return true;
  };
  /** Lines of [i, stop), every one ending with a newline before stop; false on a quote. */
  const lines = (view: Buffer, i: number, stop: number): boolean => {
    for (;;) {
      i = scanLines(view, i, stop, s);
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
      // The cut line with its newline (one added after a last line without one), in the wasm
      // memory when it fits, so the wasm scanner takes it too.
      let stitched: Buffer = Buffer.concat([tail, eof ? NEWLINE : view.subarray(0, nl + 1)]);
      if (wasm !== null && stitched.length <= wasm.stitch.length) {
        stitched.copy(wasm.stitch);
        stitched = wasm.stitch.subarray(0, stitched.length);
      }
      tail = null;
      if (!lines(stitched, 0, stitched.length)) return { outcome: 'quote', line: s.line };
      i = eof ? 0 : nl + 1;
    }
    if (eof) break;
    const stop = view.lastIndexOf(10) + 1;
    if (halt === null || !halt.now) {
      if (i < stop && !lines(view, i, stop)) return { outcome: 'quote', line: s.line };
    }
    if (halt !== null && halt.now) {
      await pending;
      return { outcome: 'halt', line: s.line };
    }
    if (Math.max(i, stop) < view.length) tail = Buffer.from(view.subarray(Math.max(i, stop)));
  }
  return { outcome: 'done', line: s.line };
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
