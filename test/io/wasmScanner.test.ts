import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { lineScanner, type LineScanner, type ScanState } from '../../src/io/compiledScan.js';
import { addField, fieldPlan, KEY, NUM, SKIP, type FieldPlan } from '../../src/io/fieldPlan.js';
import { KeyTable } from '../../src/io/keyTable.js';
import type { RowLocator } from '../../src/io/rowSink.js';
import { readExportFile } from '../../src/io/readExportFile.js';
import { wasmReader } from '../../src/io/wasm/wasmScanner.js';

const ROOT = path.resolve(import.meta.dirname, '..', '..');
const FIXTURES = path.join(ROOT, 'fixtures');

/** Both tools of scripts/build-wasm.sh, or null: the rebuild check then skips (CI needs no C compiler). */
function tools(): string | null {
  try {
    execFileSync('clang', ['--version'], { stdio: 'ignore' });
    execFileSync('wasm-ld', ['--version'], { stdio: 'ignore' });
    return 'ok';
  } catch {
    return null;
  }
}

describe('the committed WebAssembly scanner is built from scan.c', () => {
  it.skipIf(tools() === null)('scripts/build-wasm.sh gives the bytes of src/io/wasm/scanWasm.ts (skipped without clang and wasm-ld)', () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'spherecov-wasm-'));
    try {
      const out = path.join(dir, 'scanWasm.ts');
      execFileSync(path.join(ROOT, 'scripts', 'build-wasm.sh'), [out], { stdio: 'ignore' });
      expect(readFileSync(out, 'utf8')).toBe(readFileSync(path.join(ROOT, 'src', 'io', 'wasm', 'scanWasm.ts'), 'utf8'));
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

/** Everything a scanner does that anyone can see: rows, interned keys, where it stops, line numbers. */
type Trace = (string | number)[][];

/**
 * Read `text` the way fastTokenize's `lines` loop does (scan; at a stop, skip that line and note
 * it; stop at a halt), recording every effect. `halfAfter`: the sink halts after that many rows.
 */
function run(scanOf: (fp: FieldPlan, halts: boolean) => { scan: LineScanner; buf: Buffer }, fp: FieldPlan, text: Buffer, haltAfter: number | null): Trace {
  const trace: Trace = [];
  const keys = new KeyTable(fp.keyCount);
  const intern = keys.intern.bind(keys);
  // New keys only: a repeated intern of a known key has no effect (the wasm path may repeat one
  // when it leaves a line with a key longer than its memo to the JS scanner, whose memo is apart).
  keys.intern = (slot, t) => {
    const known = keys.names[slot].length;
    const id = intern(slot, t);
    if (id === known) trace.push(['intern', slot, t, id]);
    return id;
  };
  const halt = haltAfter === null ? null : { now: false };
  let rows = 0;
  const s: ScanState = {
    line: 1, nums: new Float64Array(fp.numCount), keyIds: new Int32Array(fp.keyCount), keys, halt,
    sink: {
      row: (line, nums, keyIds, loc) => {
        // Object.is: -0 and NaN bits matter; the locator must point at this row.
        trace.push(['row', line, ...Array.from(nums, (v) => (Object.is(v, -0) ? '-0' : v)), ...keyIds, loc.rowText()]);
        if (halt !== null && ++rows >= (haltAfter as number)) halt.now = true;
      },
    },
    loc: null as unknown as RowLocator,
    memoBytes: Array.from({ length: fp.keyCount }, () => Buffer.alloc(256)),
    memoLen: new Int32Array(fp.keyCount).fill(-1), memoId: new Int32Array(fp.keyCount).fill(-1),
    rowBuf: Buffer.alloc(0), rowStart: 0, rowEnd: 0, rowChanged: false,
  };
  s.loc = { text: () => '', col: () => 0, end: () => 0, rowText: () => s.rowBuf.toString('utf8', s.rowStart, s.rowEnd) };
  const { scan, buf } = scanOf(fp, halt !== null);
  if (text.length > buf.length) throw new Error('test text longer than the scan buffer');
  text.copy(buf);
  const b = buf.subarray(0, text.length);
  for (let i = 0; i < b.length;) {
    i = scan(b, i, b.length, s);
    trace.push(['stop', i, s.line]);
    if (halt !== null && halt.now) break;
    if (i >= b.length) break;
    i = b.indexOf(10, i) + 1;
    s.line++;
  }
  return trace;
}

const js = (fp: FieldPlan, halts: boolean) => ({ scan: lineScanner(fp.kinds, fp.slots, ',', false, halts), buf: Buffer.alloc(1 << 18) });
const wasm = (fp: FieldPlan, halts: boolean) => {
  const w = wasmReader(fp, ',', false, 1 << 18, halts);
  if (w === null) throw new Error('no WebAssembly in this Node');
  return { scan: w.scan, buf: w.bufs[0] };
};

/**
 * Digit strings of every length up to `max` alike, exponents with leading zeros: the edges at 15
 * significant digits, 4 exponent digits and |exponent| 22 are each met often.
 */
const digit = fc.constantFrom(...'0123456789');
const digits = (max: number) => fc.integer({ min: 0, max }).chain((n) => fc.array(digit, { minLength: n, maxLength: n }).map((d) => d.join('')));
const number = fc
  .tuple(fc.constantFrom('', '-', '+'), digits(17), fc.option(digits(8)), fc.option(fc.tuple(fc.constantFrom('e', 'E'), fc.constantFrom('', '-', '+'), fc.constantFrom('', '0', '00', '000', '0000'), digits(2))))
  .map(([s, i, f, e]) => `${s}${i}${f === null ? '' : `.${f}`}${e === null ? '' : e.join('')}`);
const field = fc.oneof(
  { weight: 6, arbitrary: number },
  { weight: 3, arbitrary: fc.constantFrom('B1', 'B1', 'B2', ' B2', '', ' ', 'x"y', 'NaN', '1,5', 'k'.repeat(300), 'é') },
);
const line = fc.oneof(
  { weight: 8, arbitrary: fc.array(field, { minLength: 3, maxLength: 5 }).map((f) => f.join(',')) },
  { weight: 1, arbitrary: fc.constantFrom('', '# note', '\r', '1,2,B1,3\r', '1,2,B1\r3', '"1",2,B1,3') },
);
const layout = fc.array(fc.constantFrom(NUM, KEY, SKIP), { minLength: 2, maxLength: 4 });

describe('the WebAssembly scanner does what the JS scanner does (compiledScan.ts rules)', () => {
  it('is available in this Node (else fastTokenize would silently use the JS scanner)', () => {
    const fp = fieldPlan(2, ['a', 'b']);
    addField(fp, 0, NUM);
    expect(wasmReader(fp, ',', false, 1024, false)).not.toBeNull();
  });

  it('plain rows: every row parsed in wasm, none left to the text routine', () => {
    const fp = fieldPlan(4, ['t', 'p', 'b', 'v']);
    [NUM, NUM, KEY, NUM].forEach((k, i) => addField(fp, i, k === NUM ? NUM : KEY));
    const text = Buffer.from('0,0,B1,-3.25\n0,15,B1,1e-3\r\n5,0,B2,-0\n');
    const trace = run(wasm, fp, text, null);
    expect(trace).toEqual(run(js, fp, text, null));
    expect(trace.filter((t) => t[0] === 'stop')).toEqual([['stop', text.length, 4]]);
    expect(trace.filter((t) => t[0] === 'row').map((t) => t.slice(1, 6))).toEqual([[1, 0, 0, -3.25, 0], [2, 0, 15, 0.001, 0], [3, 5, 0, '-0', 1]]);
  });

  it('the number rule\'s edges (15 digits, 4 exponent digits, 10^±22, bare sign or point)', () => {
    const fp = fieldPlan(2, ['v', 'b']);
    addField(fp, 0, NUM);
    addField(fp, 1, KEY);
    const edges = ['1e-22', '1e-23', '1e22', '1e23', '0.1e-21', '0.1e-22', '12345678901234.5e8', '123456789012345', '1234567890123456',
      '1e0001', '1e00001', '1e', '.5', '5.', '.', '-', '+.e1', '-0', '+7', '9007199254740993', '4.35', '1E+2', '00000000000000000001'];
    const text = Buffer.from(edges.map((e) => `${e},B\n`).join(''));
    const trace = run(wasm, fp, text, null);
    expect(trace).toEqual(run(js, fp, text, null));
    // Not a test of itself: the lines the rule sends to the text routine are the ones expected.
    const stops = trace.filter((t) => t[0] === 'stop' && (t[1] as number) < text.length).map((t) => edges[(t[2] as number) - 1]);
    expect(stops).toEqual(['1e-23', '1e23', '0.1e-22', '1234567890123456', '1e00001', '1e', '.', '-', '+.e1', '9007199254740993', '00000000000000000001']);
  });

  it('more rows than one call\'s output area, and a Buffer outside the wasm memory (left to the JS scanner)', () => {
    const fp = fieldPlan(3, ['t', 'b', 'v']);
    [NUM, KEY, NUM].forEach((k, i) => addField(fp, i, k === NUM ? NUM : KEY));
    const text = Buffer.from(Array.from({ length: 9000 }, (_, i) => `${i / 8},B${i >> 11},${-i}e-2\n`).join(''));
    const trace = run(wasm, fp, text, null);
    expect(trace.filter((t) => t[0] === 'row')).toHaveLength(9000);
    expect(trace).toEqual(run(js, fp, text, null));
    const outside = (f: FieldPlan, h: boolean) => ({ scan: wasm(f, h).scan, buf: Buffer.alloc(1 << 18) });
    expect(run(outside, fp, text, null)).toEqual(trace);
  });

  it('random layouts and lines: the same rows, keys, stops and line numbers, with and without halting', () => {
    fc.assert(
      fc.property(layout, fc.array(line, { minLength: 1, maxLength: 40 }), fc.option(fc.integer({ min: 1, max: 10 })), (kinds, lines, haltAfter) => {
        const fp = fieldPlan(kinds.length, kinds.map((_, i) => `f${i}`));
        kinds.forEach((k, i) => { if (k !== SKIP) addField(fp, i, k === NUM ? NUM : KEY); });
        const text = Buffer.from(`${lines.join('\n')}\n`);
        expect(run(wasm, fp, text, haltAfter)).toEqual(run(js, fp, text, haltAfter));
      }),
      { seed: 11, numRuns: 400 },
    );
  });
});

describe('without WebAssembly the fast path reads with the JS scanner', () => {
  it('node --jitless (no WebAssembly object) reads fixtures/io/long.csv and a bad fixture as with WebAssembly (runs dist/)', async () => {
    // dist/, like test/io/readInParallel.test.ts: a child Node cannot run the .ts sources.
    const files = [path.join(FIXTURES, 'io', 'long.csv'), path.join(FIXTURES, 'bad', 'non_numeric.csv')];
    const script = `const { readExportFile } = await import(${JSON.stringify(path.join(ROOT, 'dist', 'io', 'readExportFile.js'))});
      const out = [];
      for (const f of ${JSON.stringify(files)}) {
        const r = await readExportFile(f, { inputRoot: ${JSON.stringify(FIXTURES)}, parser: 'fast', chunkBytes: 64 });
        out.push({ sha256: r.sha256, errors: r.errors, beams: r.beams.map((b) => [b.beam, Array.from(b.values)]) });
      }
      console.log(JSON.stringify({ wasm: typeof WebAssembly, out }));`;
    const child = JSON.parse(execFileSync(process.execPath, ['--jitless', '--input-type=module', '-e', script], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'] })) as { wasm: string; out: unknown[] };
    expect(child.wasm).toBe('undefined');
    const here = [];
    for (const f of files) {
      const r = await readExportFile(f, { inputRoot: FIXTURES, parser: 'fast', chunkBytes: 64 });
      here.push({ sha256: r.sha256, errors: r.errors, beams: r.beams.map((b) => [b.beam, Array.from(b.values)]) });
    }
    expect(JSON.parse(JSON.stringify(here))).toEqual(child.out);
    expect((here[1] as { errors: unknown[] }).errors.length).toBeGreaterThan(0);
  });
});
