import { createHash } from 'node:crypto';
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FileReadResult, ReadContext } from '../../src/io/types.js';
import { ensureBuilt, ROOT } from '../cli/buildOnce.js';
import { FIXTURES } from './readHelpers.js';

// The two-thread read (src/io/readInParallel.ts, src/io/rangeWorker.ts) must give exactly what one
// pass gives: the same beams (values, angles, which beams share angle arrays), warnings, errors
// with the same file:line:col, sha256 and file facts. The worker runs from the compiled dist/
// (a worker thread cannot run the .ts sources), so these tests read through dist/.

type Read = (absPath: string, ctx: ReadContext) => Promise<FileReadResult>;
let read: Read;
let dir: string;

beforeAll(async () => {
  ensureBuilt();
  read = (await import(pathToFileURL(path.join(ROOT, 'dist', 'io', 'readExportFile.js')).href)).readExportFile as Read;
  dir = mkdtempSync(path.join(tmpdir(), 'spherecov-par-'));
}, 120_000);
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** Deterministic values (a small LCG), two decimals like a chamber export. */
function values(seed: number): () => string {
  let s = seed >>> 0;
  return () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return ((s / 2 ** 32) * 40 - 5).toFixed(2);
  };
}

/** Rows `theta,phi,<keys…>,value` for every beam over a θ/φ grid (beam-major unless `interleave`). */
function longRows(beams: string[][], stepDeg: number, opts: { interleave?: boolean; freq?: boolean } = {}): string[] {
  const next = values(7);
  const dirs: [number, number][] = [];
  for (let t = 0; t <= 180; t += stepDeg) for (let p = 0; p < 360; p += stepDeg) dirs.push([t, p]);
  const row = (b: string[], [t, p]: [number, number]) => [t, p, ...b, ...(opts.freq ? ['28'] : []), next()].join(',');
  if (opts.interleave) return dirs.flatMap((d) => beams.map((b) => row(b, d)));
  return beams.flatMap((b) => dirs.map((d) => row(b, d)));
}

function write(name: string, text: string): string {
  const p = path.join(dir, name);
  writeFileSync(p, text);
  return p;
}

/** JSON of a read with typed arrays spelled out, plus which beams share their angle arrays. */
function shape(r: FileReadResult): string {
  const sharing = r.beams.map((b) => r.beams.findIndex((c) => c.thetaDeg === b.thetaDeg && c.phiDeg === b.phiDeg));
  return JSON.stringify({ r, sharing }, (_k, v: unknown) => (ArrayBuffer.isView(v) ? Array.from(v as Float64Array) : v));
}

/** One pass and two threads (split at `share` of the data) give the same result; returns how the two-thread read went. */
async function same(file: string, share: number, extra: Partial<ReadContext> = {}): Promise<string> {
  const ctx: ReadContext = { inputRoot: dir, ...extra };
  const one = await read(file, { ...ctx, readThreads: 1 });
  let how = 'none';
  const two = await read(file, {
    ...ctx, readThreads: 2, parallelMinBytes: 0, parallelShare: share,
    onParallel: (h, why) => void (how = why ? `${h}: ${why}` : h),
  });
  expect(shape(two)).toBe(shape(one));
  return how;
}

const SHARES = [0.4, 0.5, 0.77];

describe('reading one file on two threads (issue 18)', () => {
  it('the sha256 is the whole file\'s whether the worker hashes it (default) or this thread does', async () => {
    const beams = Array.from({ length: 5 }, (_v, i) => [String(i)]);
    const text = `theta_deg,phi_deg,beam,eirp_dbm\n${longRows(beams, 15).join('\n')}\n`;
    const f = write('hashed.csv', text);
    const expected = createHash('sha256').update(text).digest('hex'); // node:crypto over the bytes written
    for (const workerHashes of [true, false]) {
      let how = 'none';
      const r = await read(f, { inputRoot: dir, readThreads: 2, parallelMinBytes: 0, parallelShare: 0.5, workerHashes, onParallel: (h) => void (how = h) });
      expect(how).toBe('merged');
      expect(r.sha256).toBe(expected);
    }
  });

  it('beam-major file, split inside a beam at several points: merged, identical', async () => {
    const beams = Array.from({ length: 6 }, (_v, i) => [String(i)]);
    const f = write('b6.csv', `theta_deg,phi_deg,beam,eirp_dbm\n${longRows(beams, 15).join('\n')}\n`);
    for (const share of SHARES) expect(await same(f, share)).toBe('merged');
    // Tiny chunks: lines cut by chunk boundaries on both threads.
    expect(await same(f, 0.41, { chunkBytes: 37 })).toBe('merged');
    // The first beam does not end before the split: the worker cannot know the template.
    expect(await same(f, 0.13)).toBe('fallback: the first group does not end before the split');
  });

  it('a read that may use two threads keeps the values in shared memory (the insight lane reads them without a copy); one thread does not', async () => {
    const beams = Array.from({ length: 6 }, (_v, i) => [String(i)]);
    const f = write('b6-shared.csv', `theta_deg,phi_deg,beam,eirp_dbm\n${longRows(beams, 15).join('\n')}\n`);
    const one = await read(f, { inputRoot: dir, readThreads: 1 });
    expect(one.beams.some((b) => b.values.buffer instanceof SharedArrayBuffer)).toBe(false);
    for (const parallelShare of [0.5, 0.77]) {
      const two = await read(f, { inputRoot: dir, readThreads: 2, parallelMinBytes: 0, parallelShare });
      expect(two.beams.map((b) => b.values.buffer instanceof SharedArrayBuffer)).toEqual(beams.map(() => true));
      expect(shape(two)).toBe(shape(one));
    }
    // Too small for the worker: one pass, still in shared memory for the lane.
    const small = await read(f, { inputRoot: dir, readThreads: 2 });
    expect(small.beams.every((b) => b.values.buffer instanceof SharedArrayBuffer)).toBe(true);
  });

  it('CRLF line ends, no newline after the last row, comment and blank lines in the second part', async () => {
    const beams = Array.from({ length: 5 }, (_v, i) => [`b${i}`]);
    const rows = longRows(beams, 20);
    rows.splice(Math.floor(rows.length * 0.8), 0, '# operator note', '');
    const f = write('crlf.csv', `theta_deg,phi_deg,beam,eirp_dbm\r\n${rows.join('\r\n')}`);
    for (const share of SHARES) expect(await same(f, share)).toBe('merged');
  });

  it('unit and beam columns, a beam seen again after others, a frequency column', async () => {
    const beams = [['U1', '0'], ['U1', '1'], ['U2', '0'], ['U2', '1']];
    const rows = longRows(beams, 20, { freq: true });
    const q = rows.length / 4;
    // U1/1 comes back at the end: the worker's group continues the main thread's.
    const text = [...rows.slice(0, q * 1.5), ...rows.slice(q * 2), ...rows.slice(q * 1.5, q * 2)];
    const f = write('units.csv', `theta,phi,unit,beam,freq_ghz,eirp_dbm\n${text.join('\n')}\n`);
    for (const share of SHARES) expect(await same(f, share)).toBe('merged');
  });

  it('a beam on other directions and a shorter beam in the second part (their own angles)', async () => {
    const beams = Array.from({ length: 4 }, (_v, i) => [String(i)]);
    const rows = longRows(beams, 15);
    const per = rows.length / 4;
    const other = longRows([['9']], 12);
    const short = rows.slice(0, per / 2).map((r) => r.replace(/^([^,]*,[^,]*),0,/, '$1,8,'));
    const f = write('mixed.csv', `theta_deg,phi_deg,beam,eirp_dbm\n${[...rows, ...other, ...short].join('\n')}\n`);
    for (const share of SHARES) expect(await same(f, share)).toBe('merged');
  });

  it('rows the fast path hands to the text routine (spaces, long numbers) are read by the worker too', async () => {
    const rows = longRows([['0'], ['1'], ['2']], 20).map((r, i) => (i % 97 === 0 ? r.replace(/,([^,]*)$/, ', $1 ') : i % 89 === 0 ? `${r}0000000000000001` : r));
    const f = write('text-rows.csv', `theta_deg,phi_deg,beam,eirp_dbm\n${rows.join('\n')}\n`);
    for (const share of SHARES) expect(await same(f, share)).toBe('merged');
  });

  it('falls back to one pass, with the same errors, on errors in either part', async () => {
    const rows = longRows([['0'], ['1'], ['2'], ['3']], 20);
    const late = [...rows];
    late[Math.floor(rows.length * 0.9)] = late[Math.floor(rows.length * 0.9)].replace(/[^,]*$/, 'n/a');
    late[Math.floor(rows.length * 0.95)] = '200,10,3,1.5';
    const f = write('late-errors.csv', `theta_deg,phi_deg,beam,eirp_dbm\n${late.join('\n')}\n`);
    expect(await same(f, 0.5)).toMatch(/^fallback/);
    const early = [...rows];
    early[5] = early[5].replace(/[^,]*$/, 'x1');
    const g = write('early-errors.csv', `theta_deg,phi_deg,beam,eirp_dbm\n${early.join('\n')}\n`);
    expect(await same(g, 0.5)).toMatch(/^fallback/);
    const one = await read(f, { inputRoot: dir });
    expect(one.errors.map((e) => `${e.line}:${e.column}`)).toHaveLength(2);
  });

  it('falls back on a quote, a dropout, the sample limit, an interleaved file', async () => {
    const rows = longRows([['0'], ['1'], ['2'], ['3']], 5); // larger than the sniffed head, which would see a quote
    const quoted = [...rows];
    quoted[Math.floor(rows.length * 0.8)] = quoted[Math.floor(rows.length * 0.8)].replace(/,(\d+),/, ',"$1",');
    expect(await same(write('quote.csv', `theta_deg,phi_deg,beam,eirp_dbm\n${quoted.join('\n')}\n`), 0.5)).toMatch(/^fallback: .*quote/);
    expect(await same(write('quote-early.csv', `theta_deg,phi_deg,beam,eirp_dbm\n${quoted.join('\n')}\n`), 0.9)).toBe('fallback: quote');
    const dropped = [...rows];
    dropped[Math.floor(rows.length * 0.7)] = dropped[Math.floor(rows.length * 0.7)].replace(/[^,]*$/, 'OVLD');
    const job = { dropoutTokens: ['OVLD'] } as ReadContext['job'];
    expect(await same(write('dropout.csv', `theta_deg,phi_deg,beam,eirp_dbm\n${dropped.join('\n')}\n`), 0.5, { job })).toMatch(/^fallback/);
    const f = write('limit.csv', `theta_deg,phi_deg,beam,eirp_dbm\n${rows.join('\n')}\n`);
    expect(await same(f, 0.5, { maxSamples: Math.floor(rows.length * 0.9) })).toMatch(/^fallback/);
    const inter = write('interleaved.csv', `theta_deg,phi_deg,beam,eirp_dbm\n${longRows([['0'], ['1'], ['2']], 20, { interleave: true }).join('\n')}\n`);
    expect(await same(inter, 0.5)).toMatch(/^fallback/);
  });

  it('every long fixture reads the same on two threads, and small files stay on one thread by default', async () => {
    const files = ['long.csv', 'long_semicolon_comma_bom_crlf.csv', 'long_tab_reordered.tsv', 'long_pol_column.csv', 'long_mw.csv', 'long_azel_rad.csv', 'long_pair_h_v.csv', 'preamble.csv'];
    for (const name of files) {
      for (const share of SHARES) await same(path.join(FIXTURES, 'io', name), share);
    }
    for (const name of readdirSync(path.join(FIXTURES, 'bad')).filter((n) => n.endsWith('.csv'))) {
      await same(path.join(FIXTURES, 'bad', name), 0.5);
    }
    let how = '';
    await read(path.join(FIXTURES, 'io', 'long.csv'), { inputRoot: dir, readThreads: 2, onParallel: (h) => void (how = h) });
    expect(how).toBe('single');
  });
});

describe('the read worker loads only what it needs (issue 18)', () => {
  it('imports no package and only the reader\'s own small modules', () => {
    // Runtime imports only: `import type` is erased by tsc.
    const spec = /^\s*import\s+(?!type\s)[^'";]*?from\s*['"]([^'"]+)['"]/gm;
    const seen = new Set<string>();
    const packages = new Set<string>();
    const visit = (file: string): void => {
      if (seen.has(file)) return;
      seen.add(file);
      for (const m of readFileSync(file, 'utf8').matchAll(spec)) {
        if (m[1].startsWith('.')) visit(path.resolve(path.dirname(file), m[1]).replace(/\.js$/, '.ts'));
        else if (!m[1].startsWith('node:')) packages.add(m[1]);
      }
    };
    const src = path.join(ROOT, 'src');
    visit(path.join(src, 'io', 'rangeWorker.ts'));
    expect([...packages]).toEqual([]);
    const outside = [...seen].map((f) => path.relative(src, f)).filter((f) => !f.startsWith('io/'));
    expect(outside.sort()).toEqual(['quantity.ts', 'units.ts']);
    // 19 before the WebAssembly scanner, whose loader and generated bytes are two more, and the
    // row block (src/io/rowBlock.ts) one more.
    expect(seen.size).toBeLessThanOrEqual(22);
  });
});

describe('the second reading thread started early (src/earlyThreads.ts)', () => {
  it('a worker started without a job reads the part it is sent by message, as one started with it', async () => {
    type EarlyApi = { offerEarlyThread: (script: string, w: import('node:worker_threads').Worker) => void; takeEarlyThread: (script: string) => unknown };
    const early = (await import(pathToFileURL(path.join(ROOT, 'dist', 'earlyWorkers.js')).href)) as EarlyApi;
    const { Worker } = await import('node:worker_threads');
    const script = path.join(ROOT, 'dist', 'io', 'rangeWorker.js');
    const beams = Array.from({ length: 6 }, (_v, i) => [String(i)]);
    const f = write('early.csv', `theta_deg,phi_deg,beam,eirp_dbm\n${longRows(beams, 15).join('\n')}\n`);
    early.offerEarlyThread(script, new Worker(script, { workerData: null }));
    expect(await same(f, 0.5)).toBe('merged');
    // The read took the offered worker: nothing is left to take.
    expect(early.takeEarlyThread(script)).toBeNull();
  });
});
