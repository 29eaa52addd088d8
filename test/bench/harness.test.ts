// Tests of the benchmark harness itself (bench/): no timing assertions, only that the pieces
// measure and report what they claim.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { readAndCount, countNewlines } from '../../bench/floor.mjs';
import { generate } from '../../bench/gen.mjs';
import { parseArgs, wants } from '../../bench/lib/args.mjs';
import { comparePeer } from '../../bench/lib/compare.mjs';
import { alternate, runMeasured } from '../../bench/lib/proc.mjs';
import { median, pairedRatio } from '../../bench/lib/stats.mjs';
import { renderTable, row } from '../../bench/lib/table.mjs';

const dir = mkdtempSync(join(tmpdir(), 'bench-test-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('stats', () => {
  it('median of odd and even counts, ignoring non-finite values', () => {
    expect(median([3, 1, 2])).toBe(2);
    expect(median([4, 1, 3, 2])).toBe(2.5);
    expect(median([NaN, 5])).toBe(5);
    expect(median([])).toBeNull();
  });
  it('paired ratio is the median of per-rep ratios, not the ratio of medians', () => {
    // ratios 0.5, 0.5, 4 → median 0.5; ratio of medians would be 2/2 = 1
    expect(pairedRatio([1, 2, 8], [2, 4, 2])).toBe(0.5);
    expect(pairedRatio([1, NaN], [2, 1])).toBe(0.5);
  });
});

describe('alternate', () => {
  it('rotates the order each repetition and keeps results by rep', async () => {
    const seen: string[] = [];
    const mk = (n: string) => async () => (seen.push(n), n + seen.length);
    const out = await alternate(3, { a: mk('a'), b: mk('b') });
    expect(seen).toEqual(['a', 'b', 'b', 'a', 'a', 'b']);
    expect(out.a).toEqual(['a1', 'a4', 'a5']);
    expect(out.b).toEqual(['b2', 'b3', 'b6']);
  });
});

describe('args', () => {
  it('defaults and options', () => {
    expect(parseArgs([])).toMatchObject({ quick: false, peer: false, reps: 3, build: true });
    expect(parseArgs(['--quick']).reps).toBe(1);
    expect(parseArgs(['--reps', '5', '--peer']).reps).toBe(5);
    expect(parseArgs(['--reps=2']).reps).toBe(2);
    expect(wants(parseArgs([]), 'peer')).toBe(false);
    expect(wants(parseArgs(['--peer']), 'peer')).toBe(true);
    expect(wants(parseArgs(['--only', 'floor']), 'cli')).toBe(false);
  });
  it('rejects bad values in the project grammar', () => {
    expect(() => parseArgs(['--reps', 'x'])).toThrow("--reps: found 'x', expected a whole number >= 1");
    expect(() => parseArgs(['--only', 'nope'])).toThrow("--only: found 'nope'");
    expect(() => parseArgs(['--fast'])).toThrow("unknown option '--fast'");
  });
});

describe('table', () => {
  it('marks targets and lists misses as TARGET MISSED lines', () => {
    const rows = [
      row('cli', 'wall / floor', 2.1, { target: { op: '<=', limit: 3.5 }, digits: 2 }),
      row('cli', 'peak RSS', 180, { target: { op: '<=', limit: 150 }, unit: 'MiB', digits: 1 }),
      row('read', 'readExportFile', null, { note: 'not available yet' }),
    ];
    expect(rows.map((r) => r.status)).toEqual(['ok', 'NOT OK', 'n/a']);
    const text = renderTable(rows);
    expect(text).toContain('TARGET MISSED: cli / peak RSS: 180.0 MiB (target <= 150 MiB)');
    expect(text).not.toContain('TARGET MISSED: cli / wall');
    expect(text).toContain('not measured: read / readExportFile: not available yet');
  });
  it('strict and non-strict limits', () => {
    expect(row('g', 'ratio', 2, { target: { op: '<', limit: 2 } }).status).toBe('NOT OK');
    expect(row('g', 'ratio', 2, { target: { op: '<=', limit: 2 } }).status).toBe('ok');
  });
});

describe('floor', () => {
  it('counts newlines across 1 MiB chunk boundaries', async () => {
    const line = 'x'.repeat(99) + '\n'; // 100 bytes a line
    const n = 30_000; // 3 MB: several stream chunks
    const p = join(dir, 'lines.txt');
    writeFileSync(p, line.repeat(n) + 'tail without newline');
    const r = await readAndCount(p);
    expect(r.newlines).toBe(n);
    expect(r.bytes).toBe(n * 100 + 20);
    expect(countNewlines(Buffer.from('\n\na\n'))).toBe(3);
  });
});

describe('generator (Node port of gen.py)', () => {
  it('writes the long layout: header, beam-major rows, 2-decimal values', async () => {
    const p = join(dir, 'g.csv');
    const rows = await generate(p, { beams: 2, step: 10, seed: 3 });
    const lines = readFileSync(p, 'utf8').trimEnd().split('\n');
    expect(rows).toBe(2 * 19 * 36);
    expect(lines).toHaveLength(rows + 1);
    expect(lines[0]).toBe('theta_deg,phi_deg,beam,eirp_dbm');
    expect(lines[1]).toMatch(/^0,0,0,-?\d+\.\d\d$/);
    expect(lines[36 + 1]).toMatch(/^10,0,0,/);
    expect(lines[rows]).toMatch(/^180,350,1,/);
  });
});

describe('peak RSS of a child process', () => {
  const big = 'const b = Buffer.alloc(96 * 1024 * 1024, 1); console.log(b[5]);';
  it('node: the preload reports at least the memory the child touched', async () => {
    const r = await runMeasured('node', ['-e', big]);
    expect(r.code).toBe(0);
    expect(r.stdout.trim()).toBe('1');
    expect(r.maxRssKiB).toBeGreaterThan(96 * 1024);
    expect(r.wallS).toBeGreaterThan(0);
    expect(r.cpuS).toBeGreaterThan(0); // filling 96 MiB takes CPU; the preload reports it
  });
  it.skipIf(!existsSync('/usr/bin/time'))('node: agrees with GNU time %M within 10 % (outside cross-check)', async () => {
    const r = await runMeasured('node', ['-e', big]);
    const g = spawnSync('/usr/bin/time', ['-f', '%M', process.execPath, '-e', big], { encoding: 'utf8' });
    const gnuKiB = Number(g.stderr.trim().split('\n').pop());
    expect(Math.abs(r.maxRssKiB - gnuKiB) / gnuKiB).toBeLessThan(0.1);
  });
  it.skipIf(!existsSync('/usr/bin/python3'))('python: the wrapper reports ru_maxrss of the script run', async () => {
    const p = join(dir, 'alloc.py');
    writeFileSync(p, 'import sys\nb = bytearray(96 * 1024 * 1024)\nprint(len(sys.argv))\n');
    const r = await runMeasured('python', [p, 'x']);
    expect(r.code).toBe(0);
    expect(r.stdout.trim()).toBe('2'); // the script sees its own argv: [script, 'x']
    expect(r.maxRssKiB).toBeGreaterThan(96 * 1024);
  });
  it('a crashing child gives a null RSS and its exit code, not an exception', async () => {
    const r = await runMeasured('node', ['-e', 'process.kill(process.pid, "SIGKILL")']);
    expect(r.maxRssKiB).toBeNull();
    expect(r.signal).toBe('SIGKILL');
  });
});

describe('peer cross-check', () => {
  const peer = {
    solidAngleSr: 4 * Math.PI,
    points: 100,
    tspPeak: { value: 30.98 },
    percentiles: { '0': 19.74, '50': 26.84 },
    coverage: { '20': 0.9996 },
    trpDbm: { '0': 16.09, '1': 15.38 },
  };
  const unit = {
    solidAngleSr: 4 * Math.PI,
    tsp: {
      peak: { value: 30.98 },
      percentiles: [{ levelPct: 0, value: 19.74 }, { levelPct: 50, value: 26.84 }],
      coverage: [{ threshold: 20, efficiency: 0.99961 }],
    },
    beams: [{ id: '0', trpDbm: 16.09 }, { id: '1', trpDbm: 15.3801 }],
  };
  it('agrees on equal numbers (within the stated tolerances)', () => {
    expect(comparePeer(peer, unit).every((r: { agree: boolean | null }) => r.agree === true)).toBe(true);
  });
  it('flags a percentile off by more than one 0.01 dB step and a missing beam', () => {
    const off = structuredClone(unit);
    off.tsp.percentiles[1].value = 26.86;
    off.beams.pop();
    const rows = comparePeer(peer, off);
    expect(rows.find((r: { what: string }) => r.what.startsWith('percentile 50')).agree).toBe(false);
    expect(rows.find((r: { what: string }) => r.what.startsWith('TRP')).agree).toBe(false);
  });
});
