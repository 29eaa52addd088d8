import { KEY_MEMO, lineScanner, type LineScanner, type ScanState } from '../compiledScan.js';
import type { FieldPlan } from '../fieldPlan.js';
import { SCAN_WASM_BASE64 } from './scanWasm.js';
import { OutputRows } from '../rowBlock.js';
import type { RowBlock } from '../rowSink.js';

/** The few WebAssembly JS-API members used here (the project's lib and @types/node do not declare them). */
interface WasmApi {
  Module: new (bytes: Uint8Array) => object;
  Memory: new (d: { initial: number; maximum: number }) => { buffer: ArrayBuffer };
  Instance: new (m: object, imports: object) => { exports: Record<string, unknown> };
}
interface ScanExports {
  configure(...args: number[]): number;
  scan(b: number, i: number, stop: number): number;
  __heap_base: { value: number };
}

/** Rows one scan() call may write before JS hands them on (the output area's size). */
const CAPACITY = 4096;
/** Why scan() returned (scan.c); the fourth, FULL (1), means: hand the rows on and call again. */
const END = 0, SLOW = 2, NEWKEY = 3;
const PAGE = 65536;

let module: object | null | undefined;
let heapBase = 0;

/** The compiled module, or null where WebAssembly is missing (e.g. node --jitless) or refuses it. */
function scanModule(): object | null {
  if (module === undefined) {
    const api = (globalThis as { WebAssembly?: WasmApi }).WebAssembly;
    try {
      if (api === undefined) return (module = null);
      module = new api.Module(Buffer.from(SCAN_WASM_BASE64, 'base64'));
      // Where the module's own data and stack end (a constant of the build): the reader's areas follow.
      heapBase = (new api.Instance(module, { env: { memory: new api.Memory({ initial: 1, maximum: 1 }) } }).exports as unknown as ScanExports).__heap_base.value;
    } catch {
      module = null;
    }
  }
  return module;
}

/**
 * A reader's WebAssembly line scanner and its memory: the two chunk buffers and the stitch area
 * live in that memory, so a chunk is parsed where it was read, without a copy. The memory never
 * grows, so the Buffers over it stay valid.
 */
export interface WasmReader {
  /** The chunk buffers (fastTokenize reads into them). */
  bufs: [Buffer, Buffer];
  /** Where a line cut by a chunk boundary is copied to be scanned; longer ones go to the JS scanner. */
  stitch: Buffer;
  /** A LineScanner (same contract as compiledScan.ts's): wasm over this memory, else the JS scanner. */
  scan: LineScanner;
}

/**
 * A WasmReader for one fastTokenize call (its own instance and memory: about 2 chunks plus
 * ~150 KiB), or null when WebAssembly is not available, so the caller keeps the JS scanner.
 * `js` is the JS scanner for the same layout: it reads what the wasm one does not take in
 * memory (lines longer than the stitch area, keys longer than KEY_MEMO bytes).
 */
export function wasmReader(fields: FieldPlan, delimiter: string, decimalComma: boolean, chunkBytes: number, halts: boolean): WasmReader | null {
  const mod = scanModule();
  if (mod === null) return null;
  const api = (globalThis as { WebAssembly?: WasmApi }).WebAssembly as WasmApi;
  const n = fields.kinds.length, nn = fields.numCount, nk = fields.keyCount;
  // Layout after the module's own data and stack (__heap_base): 8-aligned areas; the spare bytes
  // at the end are read, never used, by scan.c's 8-byte loads past a buffer's last line.
  const sizes = { kinds: n, slots: 4 * n, memo: nk * KEY_MEMO, memoLen: 4 * nk, memoId: 4 * nk, nums: 8 * nn * CAPACITY, keys: 4 * nk * CAPACITY, start: 4 * CAPACITY, end: 4 * CAPACITY, buf0: chunkBytes, buf1: chunkBytes, stitch: chunkBytes, spare: 16 };
  let at = heapBase;
  const addr = {} as Record<keyof typeof sizes, number>;
  for (const [k, size] of Object.entries(sizes) as [keyof typeof sizes, number][]) {
    at = (at + 7) & ~7;
    addr[k] = at;
    at += size;
  }
  const pages = Math.ceil(at / PAGE);
  const memory = new api.Memory({ initial: pages, maximum: pages });
  const x = new api.Instance(mod, { env: { memory } }).exports as unknown as ScanExports;
  const mem = memory.buffer;
  const u8 = new Uint8Array(mem);
  const i32 = new Int32Array(mem);
  const f64 = new Float64Array(mem);
  u8.set(fields.kinds, addr.kinds);
  i32.set(fields.slots, addr.slots >> 2);
  i32.fill(-1, addr.memoLen >> 2, (addr.memoLen >> 2) + nk);
  const res = x.configure(n, addr.kinds, addr.slots, delimiter.charCodeAt(0), decimalComma ? 1 : 0, nn, nk, addr.memo, KEY_MEMO, addr.memoLen, addr.memoId, CAPACITY, addr.nums, addr.keys, addr.start, addr.end) >> 2;
  const js = lineScanner(fields.kinds, fields.slots, delimiter, decimalComma, halts);
  const numsAt = addr.nums >> 3, keysAt = addr.keys >> 2, startAt = addr.start >> 2, endAt = addr.end >> 2, memoLenAt = addr.memoLen >> 2, memoIdAt = addr.memoId >> 2;

  /**
   * A key that differs from its slot's memo (compiledScan.ts newKey, which the JS scanner calls
   * at the same point of the same line): interned trimmed, written to the wasm memo when it fits;
   * false when it is blank or too long to memo (the caller then leaves the line to the JS scanner).
   */
  const newKey = (b: Buffer, from: number, to: number, s: ScanState, slot: number): boolean => {
    const text = b.toString('utf8', from, to).trim();
    if (text === '' || to - from > KEY_MEMO) return false;
    const id = s.keys.intern(slot, text);
    u8.set(b.subarray(from, to), addr.memo + slot * KEY_MEMO);
    i32[memoLenAt + slot] = to - from;
    i32[memoIdAt + slot] = id;
    return true;
  };

  const deliver = rowDeliverer(nn, nk, halts);
  // A sink that takes blocks gets each batch of parsed rows in one call, read straight from the
  // output area (no copy a row); a read that may halt after a row goes row by row.
  const block = halts ? null : new OutputRows(f64, numsAt, nn, i32, keysAt, nk, i32, startAt, endAt, delimiter);
  const scan: LineScanner = (b, i, stop, s) => {
    if (b.buffer !== mem) return js(b, i, stop, s);
    const halt = s.halt;
    const takesBlocks = block !== null && typeof s.sink.rowBlock === 'function';
    for (;;) {
      const why = x.scan(b.byteOffset, i, stop);
      const rows = i32[res + 2];
      const at = i32[res + 1];
      let handed = rows;
      if (!takesBlocks) handed = deliver(rows, b, s, f64, i32, numsAt, keysAt, startAt, endAt);
      else if (rows > 0) {
        block.count = rows;
        block.line = s.line;
        block.buf = b;
        (s.sink.rowBlock as (b: RowBlock) => void).call(s.sink, block);
        s.line += rows;
      }
      if (handed < rows) return i32[startAt + handed];
      if (halt !== null && halt.now) return at;
      i = at;
      if (why === END || why === SLOW) break;
      if (why === NEWKEY) {
        const slot = i32[res + 3], from = i32[res + 4], to = i32[res + 5];
        if (!newKey(b, from, to, s, slot)) {
          // Blank (the text routine reports it) or longer than the memo: this line is the JS scanner's.
          const nl = b.indexOf(10, i);
          const j = js(b, i, nl + 1, s);
          if (j <= nl || (halt !== null && halt.now)) return j;
          i = j;
        }
      }
      // FULL: hand on and go on.
    }
    return i;
  };
  const view = (k: 'buf0' | 'buf1' | 'stitch') => Buffer.from(mem, addr[k], sizes[k]);
  return { bufs: [view('buf0'), view('buf1')], stitch: view('stitch'), scan };
}

/** Hands `rows` parsed rows to the sink; returns how many (fewer when the sink halted the read). */
type RowDeliverer = (rows: number, b: Buffer, s: ScanState, f64: Float64Array, i32: Int32Array, numsAt: number, keysAt: number, startAt: number, endAt: number) => number;

const deliverers = new Map<string, RowDeliverer>();

/**
 * The loop that copies each parsed row from the wasm output area into the row arrays and calls
 * sink.row, compiled once per (numbers, keys, halts) like compiledScan.ts's scanners and for the
 * same reason: straight-line copies, and a sink.row call site that sees one sink in a run, so
 * V8 inlines it (a shared loop measured ~25 ns a row, as much as the wasm parse). Only integers
 * enter the source.
 */
function rowDeliverer(nn: number, nk: number, halts: boolean): RowDeliverer {
  const key = `${nn}|${nk}|${halts ? 1 : 0}`;
  let d = deliverers.get(key);
  if (d === undefined) {
    const copy = [
      ...Array.from({ length: nn }, (_, k) => `nums[${k}] = f64[numsAt + ${k}];`),
      ...Array.from({ length: nk }, (_, k) => `keyIds[${k}] = i32[keysAt + ${k}];`),
    ].join(' ');
    // eslint-disable-next-line @typescript-eslint/no-implied-eval -- integers only (see above)
    d = new Function(`return function deliverRows(rows, b, s, f64, i32, numsAt, keysAt, startAt, endAt) {
  const nums = s.nums, keyIds = s.keyIds, sink = s.sink, loc = s.loc${halts ? ', halt = s.halt' : ''};
  let line = s.line, r = 0;
  s.rowBuf = b;
  while (r < rows) {
    ${copy}
    numsAt += ${nn}; keysAt += ${nk};
    s.rowStart = i32[startAt + r]; s.rowEnd = i32[endAt + r]; s.rowChanged = true;
    sink.row(line, nums, keyIds, loc);
    line++; r++;
    ${halts ? 'if (halt.now) break;' : ''}
  }
  s.line = line;
  return r;
};`)() as RowDeliverer;
    deliverers.set(key, d);
  }
  return d;
}
